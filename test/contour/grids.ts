/** Grid builders for the contour tests (test-only helpers; every value is computed from a formula here). */
import type { DensityGrid } from '../../src/types.js';
import { rng } from '../support/random.js';

export function makeGrid(
  nx: number,
  ny: number,
  f: (x: number, y: number, i: number, j: number) => number,
  opts: { h?: number; hy?: number; origin?: [number, number]; placement?: 'cells' | 'nodes' } = {},
): DensityGrid {
  const hx = opts.h ?? 1;
  const hy = opts.hy ?? hx;
  const placement = opts.placement ?? 'cells';
  const off = placement === 'cells' ? 0.5 : 0;
  const values = new Float64Array(nx * ny);
  for (let j = 0; j < ny; j++) for (let i = 0; i < nx; i++) values[j * nx + i] = f((i + off) * hx, (j + off) * hy, i, j);
  return { nx, ny, cellSize: [hx, hy], origin: opts.origin ?? [0, 0], values, placement };
}

export { rng };

/** A smooth random field in [0, 1]: white noise blurred by `passes` 3×3 box filters, then rescaled to [0, 1]. */
export function smoothField(nx: number, ny: number, seed: number, passes = 4, voidBorder = 0): DensityGrid {
  const r = rng(seed);
  let v = new Float64Array(nx * ny);
  for (let k = 0; k < v.length; k++) v[k] = r();
  for (let p = 0; p < passes; p++) {
    const w = new Float64Array(nx * ny);
    for (let j = 0; j < ny; j++)
      for (let i = 0; i < nx; i++) {
        let s = 0;
        let c = 0;
        for (let dj = -1; dj <= 1; dj++)
          for (let di = -1; di <= 1; di++) {
            const ii = i + di;
            const jj = j + dj;
            if (ii < 0 || jj < 0 || ii >= nx || jj >= ny) continue;
            s += v[jj * nx + ii];
            c++;
          }
        w[j * nx + i] = s / c;
      }
    v = w;
  }
  let lo = Infinity;
  let hi = -Infinity;
  for (const x of v) {
    lo = Math.min(lo, x);
    hi = Math.max(hi, x);
  }
  for (let k = 0; k < v.length; k++) v[k] = (v[k] - lo) / (hi - lo);
  for (let j = 0; j < ny; j++)
    for (let i = 0; i < nx; i++)
      if (i < voidBorder || j < voidBorder || i >= nx - voidBorder || j >= ny - voidBorder) v[j * nx + i] = 0;
  return { nx, ny, cellSize: [1, 1], origin: [0, 0], values: v, placement: 'cells' };
}

/**
 * The corner values of every cell of a grid's area lattice, counted straight from the definition in
 * docs/contour.md: cell-centred samples with the edge samples repeated on the domain edges (zero-gradient
 * extension), nodal samples as they are; NaN counts as −∞. Independent of src/contour's row streaming; for the
 * small grids of the tests.
 */
export function latticeCellCorners(g: DensityGrid): number[][] {
  const axis = (n: number) => (g.placement === 'nodes' ? Array.from({ length: n }, (_, k) => k) : [0, ...Array.from({ length: n }, (_, k) => k), n - 1]);
  const xs = axis(g.nx);
  const ys = axis(g.ny);
  const at = (i: number, j: number) => {
    const v = g.values[ys[j] * g.nx + xs[i]];
    return Number.isNaN(v) ? -Infinity : v;
  };
  const cells: number[][] = [];
  for (let j = 0; j + 1 < ys.length; j++) {
    for (let i = 0; i + 1 < xs.length; i++) cells.push([at(i, j), at(i + 1, j), at(i, j + 1), at(i + 1, j + 1)]);
  }
  return cells;
}
