/** Banded Cholesky A = L·Lᵀ of a node stencil, for the coarsest multigrid level; half bandwidth 2·(nx + 1) + 1. */
import { neighbourNode, type Stencil } from './stencil.js';

export interface BandedCholesky {
  readonly n: number;
  readonly w: number;
  readonly band: Float64Array;
}

/** Throws RangeError('not positive definite at dof d') on a pivot that is not > 0. */
export function factorBanded(A: Stencil): BandedCholesky {
  const { nx, ny, s } = A;
  const n = 2 * nx * ny;
  const w = Math.min(2 * (nx + 1) + 1, n - 1);
  const W = w + 1;
  const band = new Float64Array(n * W);
  for (let node = 0; node < nx * ny; node++) {
    const i = node % nx;
    const j = (node - i) / nx;
    for (let k = 0; k < 9; k++) {
      const m = neighbourNode(nx, ny, i, j, k);
      if (m < 0) continue;
      for (let a = 0; a < 2; a++) {
        for (let b = 0; b < 2; b++) {
          const r = 2 * node + a;
          const c = 2 * m + b;
          if (c > r) continue;
          band[r * W + (w - (r - c))] = s[node * 36 + k * 4 + a * 2 + b];
        }
      }
    }
  }
  for (let r = 0; r < n; r++) {
    const c0 = Math.max(0, r - w);
    for (let c = c0; c <= r; c++) {
      let sum = band[r * W + (w - (r - c))];
      const k0 = Math.max(c0, c - w);
      for (let k = k0; k < c; k++) sum -= band[r * W + (w - (r - k))] * band[c * W + (w - (c - k))];
      if (c === r) {
        if (!(sum > 0)) throw new RangeError(`not positive definite at dof ${r}`);
        band[r * W + w] = Math.sqrt(sum);
      } else {
        band[r * W + (w - (r - c))] = sum / band[c * W + w];
      }
    }
  }
  return { n, w, band };
}

/** L Lᵀ x = b in place (x holds b on entry). */
export function solveBanded(f: BandedCholesky, x: Float64Array): void {
  const { n, w, band } = f;
  const W = w + 1;
  for (let r = 0; r < n; r++) {
    let sum = x[r];
    for (let k = Math.max(0, r - w); k < r; k++) sum -= band[r * W + (w - (r - k))] * x[k];
    x[r] = sum / band[r * W + w];
  }
  for (let r = n - 1; r >= 0; r--) {
    let sum = x[r];
    for (let k = r + 1; k <= Math.min(n - 1, r + w); k++) sum -= band[k * W + (w - (k - r))] * x[k];
    x[r] = sum / band[r * W + w];
  }
}
