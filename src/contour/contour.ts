/**
 * Raw iso-contour of a density grid: marching squares with a hard domain edge (docs/contour.md).
 */
import type { DensityGrid, PolygonSet } from '../types.js';
import { nestedSet, type FlatPolygonSet } from './flat.js';
import { checkLevel, gridLattice } from './lattice.js';
import { march } from './march.js';
import { nest } from './nest.js';
import type { SaddleRule } from './saddle.js';
import { stitch } from './stitch.js';

/**
 * Outline of the region {value ≥ level} of `grid` (values equal to the level count as solid; NaN counts as
 * void, below every level), by marching squares (Lorensen & Cline, SIGGRAPH '87, DOI 10.1145/37401.37422)
 * with linear interpolation along lattice edges, t = (L − v0)/(v1 − v0).
 *
 * - Frame: mm, y up, origin at the lower-left corner of the domain (grid.origin).
 * - Sample placement: 'cells' values sit at cell centres ((i + ½)hx, (j + ½)hy), domain [0, nx·hx]×[0, ny·hy];
 *   'nodes' values sit on cell corners (i·hx, j·hy), domain [0, (nx − 1)hx]×[0, (ny − 1)hy] (plus origin).
 * - Hard edge: the field continues past the domain with the edge values (zero gradient) and the outline is
 *   clipped to the domain rectangle, so material at the domain edge reaches it exactly, at any level.
 * - Saddle cells: `saddle` (see SaddleRule; 'decider' = asymptotic decider of Nielson & Hamann, IEEE
 *   Visualization '91, DOI 10.1109/VISUAL.1991.175782).
 * - Output: outer rings counter-clockwise (positive area), holes clockwise, each hole in the smallest outer
 *   ring containing it; rings implicitly closed, no duplicate consecutive vertices, no self-intersections
 *   (rings may touch at a vertex only where sample values equal the level exactly). Polygons come in
 *   bottom-up scan order.
 * The area of the result equals regionArea(grid, level, saddle).
 */
export function contourGrid(grid: DensityGrid, level: number, saddle: SaddleRule): PolygonSet {
  return nestedSet(contourFlat(grid, level, saddle));
}

const NO_RINGS: FlatPolygonSet = { xy: new Float64Array(0), start: new Int32Array(1), hole: new Uint8Array(0), owner: new Int32Array(0) };

/** contourGrid as flat rings, in the same order with the same coordinates. */
export function contourFlat(grid: DensityGrid, level: number, saddle: SaddleRule): FlatPolygonSet {
  checkLevel(level);
  const lat = gridLattice(grid);
  if (!lat) return NO_RINGS;
  const cr = march(grid, lat, level, saddle);
  return nest(cr, stitch(cr));
}
