export type { PassiveRegion, PassiveRegions, PassiveRole, PassiveShape } from './types.js';
export { parsePassive, MAX_COORDINATE, MAX_POLYGON_POINTS } from './parse.js';
export { passiveRings, shapeRing } from './rings.js';
export { applyPassiveToGrid } from './cells.js';
export { applyPassiveExact, type PassiveExactResult } from './exact.js';
