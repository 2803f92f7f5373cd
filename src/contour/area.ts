/**
 * Enclosed area of the raw contour, cell by cell, without stitching — for the volume-preserving level search.
 *
 * The area lattice (./lattice.ts) has its nodes at the sample positions plus, for cell-centred grids, the
 * domain edges; it spans exactly the domain rectangle. Its cells are the only places the contour encloses
 * area (the contour's extra zero-width cells along the edge enclose none), and inside each cell the enclosed
 * area depends only on the cell's four corner values (./cell-area.ts). Hence
 *
 *   A(L) = Σ_cells cellArea(cell, L),   cellArea = full area if cellMin ≥ L, 0 if cellMax < L,
 *
 * and a search over L only needs the cells whose corner range [cellMin, cellMax] meets its current bracket.
 */
import type { DensityGrid } from '../types.js';
import { cellPolyArea } from './cell-area.js';
import { checkLevel, fillRow, gridLattice, latticeValue } from './lattice.js';
import type { SaddleRule } from './saddle.js';

/**
 * Per-cell view of the area lattice. Cell id = j·cols + i, i counting along x (left to right), j along y
 * (bottom to top). Cell (i, j) spans [xs[i], xs[i+1]] × [ys[j], ys[j+1]] (mm).
 */
export interface AreaLattice {
  readonly cols: number;
  readonly rows: number;
  /** cols · rows. */
  readonly cellCount: number;
  /** Node coordinates in mm (cols + 1 and rows + 1 of them); the first and last are the domain edges. */
  readonly xs: Float64Array;
  readonly ys: Float64Array;
  /** Smallest and largest corner value of each cell (NaN counted as −∞). */
  readonly cellMin: Float64Array;
  readonly cellMax: Float64Array;
  /** The grid, and for each lattice node the grid column / row whose sample it carries. */
  readonly grid: DensityGrid;
  readonly colSample: Int32Array;
  readonly rowSample: Int32Array;
}

/**
 * Builds the area lattice of `grid` (sample placement and hard edge as in contourGrid). Memory: two
 * Float64Array of (cells) entries — about 16 bytes per grid sample.
 */
export function buildAreaLattice(grid: DensityGrid): AreaLattice {
  const lat = gridLattice(grid);
  const xs = lat ? lat.x.coords : new Float64Array(0);
  const ys = lat ? lat.y.coords : new Float64Array(0);
  const colSample = lat ? lat.x.sample : new Int32Array(0);
  const rowSample = lat ? lat.y.sample : new Int32Array(0);
  const cols = Math.max(0, xs.length - 1);
  const rows = Math.max(0, ys.length - 1);
  const cellMin = new Float64Array(cols * rows);
  const cellMax = new Float64Array(cols * rows);
  if (cols > 0 && rows > 0) {
    let lo = new Float64Array(cols + 1);
    let hi = new Float64Array(cols + 1);
    fillRow(grid, colSample, rowSample[0], lo, 0);
    for (let j = 0; j < rows; j++) {
      fillRow(grid, colSample, rowSample[j + 1], hi, 0);
      const base = j * cols;
      for (let i = 0; i < cols; i++) {
        const a = lo[i];
        const b = lo[i + 1];
        const c = hi[i];
        const d = hi[i + 1];
        cellMin[base + i] = Math.min(a, b, c, d);
        cellMax[base + i] = Math.max(a, b, c, d);
      }
      const t = lo;
      lo = hi;
      hi = t;
    }
  }
  return { cols, rows, cellCount: cols * rows, xs, ys, cellMin, cellMax, grid, colSample, rowSample };
}

/** Area in mm² of lattice cell `cell` when entirely solid. */
export function cellFullArea(lat: AreaLattice, cell: number): number {
  const i = cell % lat.cols;
  const j = (cell - i) / lat.cols;
  return (lat.xs[i + 1] - lat.xs[i]) * (lat.ys[j + 1] - lat.ys[j]);
}

/**
 * Area in mm² of the region {value ≥ level} inside lattice cell `cell`, as contourGrid encloses it (linear
 * edge crossings, the given saddle rule). Summed over all cells it equals regionArea.
 */
export function cellArea(lat: AreaLattice, cell: number, level: number, saddle: SaddleRule): number {
  const { cols, xs, ys, colSample, rowSample } = lat;
  const { nx, values } = lat.grid;
  const i = cell % cols;
  const j = (cell - i) / cols;
  const r0 = rowSample[j] * nx;
  const r1 = rowSample[j + 1] * nx;
  const c0 = colSample[i];
  const c1 = colSample[i + 1];
  return cellPolyArea(
    latticeValue(values[r0 + c0]),
    latticeValue(values[r0 + c1]),
    latticeValue(values[r1 + c0]),
    latticeValue(values[r1 + c1]),
    level,
    xs[i + 1] - xs[i],
    ys[j + 1] - ys[j],
    saddle,
  );
}

/**
 * Area in mm² of the region contourGrid(grid, level, saddle) encloses, summed cell by cell without stitching
 * (same conventions: values ≥ level solid, NaN void, hard domain edge). One pass over the grid, O(one row) memory.
 */
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
