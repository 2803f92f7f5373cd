/** The contouring stage: raw iso-contours of density grids and their enclosed area (docs/contour.md). */
export { contourGrid } from './contour.js';
export {
  regionArea,
  buildAreaLattice,
  cellArea,
  cellFullArea,
  levelAreaModel,
  type AreaLattice,
  type CellAreaModel,
} from './area.js';
export { type SaddleRule, SADDLE_RULES } from './saddle.js';
