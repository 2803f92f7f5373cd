export { parseLoads, DEFAULT_MIN_STIFFNESS, DEFAULT_PENAL } from './parse.js';
export { entryLabel, resolveLoadCase, type FeGrid, type ResolvedEntry, type ResolvedLoadCase } from './resolve.js';
export type { Edge, Fix, Load, LoadsSpec, Selector, Support } from './types.js';
