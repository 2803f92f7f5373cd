/** The contouring stage: raw iso-contours of density grids and their enclosed area (docs/contour.md). */
export { contourGrid, contourFlat } from './contour.js';
export { ContourScratch } from './scratch.js';
export { flatSet, nestedSet, NO_RINGS, type FlatPolygonSet } from './flat.js';
export { regionArea } from './area.js';
export { levelBandModel, cellRangeHistogram, packBand, bandCellBound, bandCellArea, BAND_STRIDE, type CellRangeHistogram, type PackedBand } from './band.js';
export { type SaddleRule, SADDLE_RULES } from './saddle.js';
