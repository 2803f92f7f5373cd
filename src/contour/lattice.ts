/**
 * The "area lattice" marching squares runs on: the sample positions plus, for cell-centred grids, the two
 * domain edges carrying the edge sample again; it spans exactly the domain (docs/contour.md,
 * docs/notes/outline.md §3).
 */
import { RhoformError, show } from '../errors.js';
import type { DensityGrid } from '../types.js';

/** One axis of the area lattice. */
export interface LatticeAxis {
  /** mm, non-decreasing; the first and last are the domain edges. */
  readonly coords: Float64Array;
  /** For each node, the grid column (or row) whose sample it carries. */
  readonly sample: Int32Array;
}

/** Node coordinates (mm) and sample indices along one axis with n samples, spacing h, domain start o. */
export function latticeAxis(n: number, h: number, o: number, placement: DensityGrid['placement']): LatticeAxis {
  if (placement === 'nodes') {
    const coords = new Float64Array(n);
    const sample = new Int32Array(n);
    for (let k = 0; k < n; k++) {
      coords[k] = o + k * h;
      sample[k] = k;
    }
    return { coords, sample };
  }
  const coords = new Float64Array(n + 2);
  const sample = new Int32Array(n + 2);
  coords[0] = o;
  sample[0] = 0;
  for (let k = 1; k <= n; k++) {
    coords[k] = o + (k - 0.5) * h;
    sample[k] = k - 1;
  }
  coords[n + 1] = o + n * h;
  sample[n + 1] = n - 1;
  return { coords, sample };
}

export interface GridLattice {
  readonly x: LatticeAxis;
  readonly y: LatticeAxis;
}

/** Checks the grid's shape; null when the domain has zero area (a nodal grid of one row or column). */
export function gridLattice(grid: DensityGrid): GridLattice | null {
  const { nx, ny, values, cellSize, origin, placement } = grid;
  if (!(Number.isInteger(nx) && nx >= 1 && Number.isInteger(ny) && ny >= 1)) {
    throw new RhoformError('E_GRID_SIZE', `expected a grid of at least 1×1 samples, found ${show(nx)}×${show(ny)}`);
  }
  if (values.length !== nx * ny) {
    throw new RhoformError('E_GRID_SIZE', `expected ${nx}×${ny} = ${nx * ny} values, found ${values.length}`);
  }
  const [hx, hy] = cellSize;
  if (!(hx > 0 && hy > 0 && hx < Infinity && hy < Infinity)) {
    throw new RhoformError('E_GRID_SIZE', `expected a positive finite cell size, found ${show(hx)}×${show(hy)} mm`);
  }
  if (!(Number.isFinite(origin[0]) && Number.isFinite(origin[1]))) {
    throw new RhoformError('E_GRID_SIZE', `expected a finite origin, found (${show(origin[0])}, ${show(origin[1])})`);
  }
  if (placement !== 'cells' && placement !== 'nodes') {
    throw new RhoformError('E_GRID_SIZE', `expected placement 'cells' or 'nodes', found ${show(placement)}`);
  }
  if (placement === 'nodes' && (nx < 2 || ny < 2)) return null;
  return { x: latticeAxis(nx, hx, origin[0], placement), y: latticeAxis(ny, hy, origin[1], placement) };
}

export function checkLevel(level: number): void {
  if (!Number.isFinite(level)) throw new RhoformError('E_USAGE', `level: expected a finite number, found ${show(level)}`);
}

/** Sample value as the lattice sees it: NaN (void) → −∞; +∞ → the largest finite number (finite crossings). */
export function latticeValue(v: number): number {
  if (v !== v) return -Infinity;
  return v === Infinity ? Number.MAX_VALUE : v;
}

/** out[offset + k] = lattice value of x node k in grid row `rowSample`. */
export function fillRow(grid: DensityGrid, xs: Int32Array, rowSample: number, out: Float64Array, offset: number): void {
  const base = rowSample * grid.nx;
  const v = grid.values;
  for (let k = 0; k < xs.length; k++) out[offset + k] = latticeValue(v[base + xs[k]]);
}
