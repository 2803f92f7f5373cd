/**
 * A direct reference solve for small grids, independent of the stencil storage, the multigrid and CG: the
 * global stiffness assembled as a dense matrix element by element (standard direct-stiffness assembly), fixed
 * dofs removed, and the reduced system solved by Gaussian elimination with partial pivoting.
 */
import { elementStiffness } from '../../src/fe/element.js';

export function denseSolve(ex: number, ey: number, hx: number, hy: number, nu: number, stiffness: Float64Array, fixed: Uint8Array, force: Float64Array): Float64Array {
  const ke = elementStiffness(hx, hy, nu);
  const nx = ex + 1;
  const n = 2 * nx * (ey + 1);
  const K = new Float64Array(n * n);
  for (let j = 0; j < ey; j++) {
    for (let i = 0; i < ex; i++) {
      const nodes = [j * nx + i, j * nx + i + 1, (j + 1) * nx + i + 1, (j + 1) * nx + i];
      const dofs = nodes.flatMap((m) => [2 * m, 2 * m + 1]);
      const w = stiffness[j * ex + i];
      for (let a = 0; a < 8; a++) for (let b = 0; b < 8; b++) K[dofs[a] * n + dofs[b]] += w * ke[a * 8 + b];
    }
  }
  const free: number[] = [];
  for (let d = 0; d < n; d++) if (!fixed[d]) free.push(d);
  const m = free.length;
  const A = new Float64Array(m * (m + 1));
  for (let r = 0; r < m; r++) {
    for (let c = 0; c < m; c++) A[r * (m + 1) + c] = K[free[r] * n + free[c]];
    A[r * (m + 1) + m] = force[free[r]];
  }
  for (let c = 0; c < m; c++) {
    let p = c;
    for (let r = c + 1; r < m; r++) if (Math.abs(A[r * (m + 1) + c]) > Math.abs(A[p * (m + 1) + c])) p = r;
    if (p !== c) for (let k = 0; k <= m; k++) [A[c * (m + 1) + k], A[p * (m + 1) + k]] = [A[p * (m + 1) + k], A[c * (m + 1) + k]];
    for (let r = c + 1; r < m; r++) {
      const f = A[r * (m + 1) + c] / A[c * (m + 1) + c];
      if (f === 0) continue;
      for (let k = c; k <= m; k++) A[r * (m + 1) + k] -= f * A[c * (m + 1) + k];
    }
  }
  const x = new Float64Array(m);
  for (let r = m - 1; r >= 0; r--) {
    let s = A[r * (m + 1) + m];
    for (let k = r + 1; k < m; k++) s -= A[r * (m + 1) + k] * x[k];
    x[r] = s / A[r * (m + 1) + r];
  }
  const u = new Float64Array(n);
  free.forEach((d, k) => (u[d] = x[k]));
  return u;
}

/** A deterministic SIMP-like density field with holes and grey edges (values in [0, 1]). */
export function holeyDesign(ex: number, ey: number, seed = 3): Float64Array {
  let s = seed >>> 0;
  const rnd = (): number => {
    s = (s * 1664525 + 1013904223) >>> 0;
    return s / 2 ** 32;
  };
  const v = new Float64Array(ex * ey).fill(1);
  const holes = Math.max(2, Math.round((ex * ey) / 60));
  for (let k = 0; k < holes; k++) {
    const cx = rnd() * ex;
    const cy = rnd() * ey;
    const r = 1 + rnd() * Math.min(ex, ey) * 0.12;
    for (let j = 0; j < ey; j++) {
      for (let i = 0; i < ex; i++) {
        const d = Math.hypot(i + 0.5 - cx, j + 0.5 - cy);
        v[j * ex + i] = Math.min(v[j * ex + i], Math.min(1, Math.max(0, d - r)));
      }
    }
  }
  return v;
}
