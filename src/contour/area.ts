/** Enclosed area of the raw contour, cell by cell, without stitching (why this is exact: docs/notes/outline.md §3). */
import type { DensityGrid } from '../types.js';
import { cellPolyArea } from './cell-area.js';
import { checkLevel, fillRow, gridLattice } from './lattice.js';
import type { SaddleRule } from './saddle.js';

/** mm² enclosed by contourGrid(grid, level, saddle). One pass, O(one row) memory. */
export function regionArea(grid: DensityGrid, level: number, saddle: SaddleRule): number {
  checkLevel(level);
  const lat = gridLattice(grid);
  if (!lat) return 0;
  const xs = lat.x.coords;
  const ys = lat.y.coords;
  const cols = xs.length - 1;
  const rows = ys.length - 1;
  let lo = new Float64Array(cols + 1);
  let hi = new Float64Array(cols + 1);
  fillRow(grid, lat.x.sample, lat.y.sample[0], lo, 0);
  const L = level;
  let total = 0;
  for (let j = 0; j < rows; j++) {
    fillRow(grid, lat.x.sample, lat.y.sample[j + 1], hi, 0);
    const h = ys[j + 1] - ys[j];
    let row = 0;
    let full = 0;
    for (let i = 0; i < cols; i++) {
      const a = lo[i];
      const b = lo[i + 1];
      const c = hi[i];
      const d = hi[i + 1];
      const w = xs[i + 1] - xs[i];
      if (a >= L && b >= L && c >= L && d >= L) full += w;
      else if (a >= L || b >= L || c >= L || d >= L) row += cellPolyArea(a, b, c, d, L, w, h, saddle);
    }
    total += row + full * h;
    const t = lo;
    lo = hi;
    hi = t;
  }
  return total;
}
