/**
 * The lattice that marching squares runs on, derived from a DensityGrid (docs/contour.md).
 *
 * Along each axis the lattice nodes are the sample positions plus, for cell-centred grids, the two domain
 * edges, which carry the edge sample again (zero-gradient extension past the domain):
 *
 * - placement 'cells' (n samples at (k + ½)·h): nodes x0, x0 + h/2, …, x0 + (n − ½)h, x0 + n·h  (n + 2 nodes;
 *   the first and last lattice cells are half as wide as the others);
 * - placement 'nodes' (n samples at k·h): nodes x0, x0 + h, …, x0 + (n − 1)h  (n nodes).
 *
 * This "area lattice" spans exactly the domain rectangle. The contour itself adds one more node at each end,
 * at the same coordinate as the domain edge and below every level (−∞), so every ring closes and runs
 * exactly along the domain edge where material touches it (lattice cells of zero width).
 */
import { RhoformError, show } from '../errors.js';
import type { DensityGrid } from '../types.js';

/** One axis of the area lattice. */
export interface LatticeAxis {
  /** Node coordinates in mm, non-decreasing; the first and last are the domain edges. */
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

/** Both axes of the area lattice of a grid. */
export interface GridLattice {
  readonly x: LatticeAxis;
  readonly y: LatticeAxis;
}

/**
 * Checks the grid's shape and returns its area lattice, or null when the domain has zero area
 * (a nodal grid with a single row or column): such a grid encloses nothing.
 */
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

/** Throws unless the level is a finite number. */
export function checkLevel(level: number): void {
  if (!Number.isFinite(level)) throw new RhoformError('E_USAGE', `level: expected a finite number, found ${show(level)}`);
}

/**
 * Sample value as the lattice sees it: NaN (void) becomes −∞, below every level; +∞ becomes the largest
 * finite number so that edge interpolation stays finite. Everything else is unchanged.
 */
export function latticeValue(v: number): number {
  if (v !== v) return -Infinity;
  return v === Infinity ? Number.MAX_VALUE : v;
}

/**
 * Fills out[offset + k] with the lattice values of lattice row `row` (an index into y.sample) for every
 * x node k.
 */
export function fillRow(grid: DensityGrid, xs: Int32Array, rowSample: number, out: Float64Array, offset: number): void {
  const base = rowSample * grid.nx;
  const v = grid.values;
  for (let k = 0; k < xs.length; k++) out[offset + k] = latticeValue(v[base + xs[k]]);
}
