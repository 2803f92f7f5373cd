/**
 * Preconditioned conjugate gradients (M.R. Hestenes, E. Stiefel, "Methods of conjugate gradients for solving linear
 * systems", J. Res. Nat. Bur. Standards 49(6):409–436, 1952). A solve that did not converge is data, never silent.
 */
import { apply, type Stencil } from './stencil.js';

export interface SolverStats {
  iterations: number;
  relativeResidual: number;
  converged: boolean;
  seconds: number;
}

export interface CgOptions {
  /** Relative residual to reach (default 1e-8). */
  tol?: number;
  maxIterations?: number;
}

function dot(a: Float64Array, b: Float64Array): number {
  let s = 0;
  for (let k = 0; k < a.length; k++) s += a[k] * b[k];
  return s;
}

/** A u = f from u = 0; `precondition(r, z)` sets z = M⁻¹ r. The residual is recomputed from A u. */
export function pcg(
  A: Stencil,
  f: Float64Array,
  precondition: (r: Float64Array, z: Float64Array) => void,
  opts: CgOptions = {},
): { u: Float64Array; stats: SolverStats } {
  const t0 = performance.now();
  const tol = opts.tol ?? 1e-8;
  const maxIt = opts.maxIterations ?? 1000;
  const n = f.length;
  const u = new Float64Array(n);
  const r = f.slice();
  const z = new Float64Array(n);
  const p = new Float64Array(n);
  const q = new Float64Array(n);
  const fNorm = Math.sqrt(dot(f, f));
  if (fNorm === 0) return { u, stats: { iterations: 0, relativeResidual: 0, converged: true, seconds: (performance.now() - t0) / 1000 } };
  let it = 0;
  let rel = 1;
  // restart from the true residual when the recurrence claims a convergence it does not confirm
  for (let restart = 0; restart < 3; restart++) {
    precondition(r, z);
    p.set(z);
    let rz = dot(r, z);
    while (it < maxIt) {
      apply(A, p, q);
      const pq = dot(p, q);
      if (!(pq > 0)) break; // breakdown: the operator is not positive definite along p
      const alpha = rz / pq;
      let rr = 0;
      for (let k = 0; k < n; k++) {
        u[k] += alpha * p[k];
        r[k] -= alpha * q[k];
        rr += r[k] * r[k];
      }
      it++;
      if (Math.sqrt(rr) / fNorm <= tol) break;
      precondition(r, z);
      const rzNew = dot(r, z);
      const beta = rzNew / rz;
      rz = rzNew;
      for (let k = 0; k < n; k++) p[k] = z[k] + beta * p[k];
    }
    apply(A, u, q);
    let rr = 0;
    for (let k = 0; k < n; k++) {
      r[k] = f[k] - q[k];
      rr += r[k] * r[k];
    }
    rel = Math.sqrt(rr) / fNorm;
    if (rel <= tol || it >= maxIt || !Number.isFinite(rel)) break;
  }
  return { u, stats: { iterations: it, relativeResidual: rel, converged: rel <= tol, seconds: (performance.now() - t0) / 1000 } };
}
