/** Raw iso-contour of a density grid: marching squares with a hard domain edge (docs/contour.md). */
import type { DensityGrid, PolygonSet } from '../types.js';
import { NO_RINGS, nestedSet, type FlatPolygonSet } from './flat.js';
import { checkLevel, gridLattice } from './lattice.js';
import { march } from './march.js';
import { nest } from './nest.js';
import type { ContourScratch } from './scratch.js';
import type { SaddleRule } from './saddle.js';
import { stitch } from './stitch.js';

/**
 * Outline of {value ≥ level} (NaN void) by marching squares (Lorensen & Cline, SIGGRAPH '87,
 * DOI 10.1145/37401.37422), linear interpolation along lattice edges, saddles by `saddle`.
 *
 * - Frame: mm, y up, origin at grid.origin. 'cells' samples sit at cell centres, 'nodes' samples on corners.
 * - Hard edge: zero-gradient extension, clipped to the domain, so material at the edge reaches it exactly.
 * - Output: outer rings counter-clockwise, holes clockwise in the smallest outer ring containing them,
 *   implicitly closed, no repeated vertex, no self-intersection (rings may touch only where samples equal the
 *   level); polygons in bottom-up scan order. Its area equals regionArea(grid, level, saddle).
 */
export function contourGrid(grid: DensityGrid, level: number, saddle: SaddleRule): PolygonSet {
  return nestedSet(contourFlat(grid, level, saddle));
}

/**
 * contourGrid as flat rings, in the same order with the same coordinates. `scratch`: working arrays to reuse
 * from an earlier build (the result never aliases them); `straddling`: at most how many lattice cells straddle
 * the level, when known (sizes the crossing store; a wrong value costs only a regrowth).
 */
export function contourFlat(grid: DensityGrid, level: number, saddle: SaddleRule, scratch?: ContourScratch, straddling?: number): FlatPolygonSet {
  checkLevel(level);
  const lat = gridLattice(grid);
  if (!lat) return NO_RINGS;
  const cr = march(grid, lat, level, saddle, scratch, straddling);
  return nest(cr, stitch(cr, scratch));
}
