/** The morphology engine (local width of solid and void, tool corners, thickness picture): public entry points. */
export { buildMorphology } from './engine.js';
export { choosePixel } from './pixel.js';
export type * from './types.js';
