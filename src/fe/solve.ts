/**
 * Linear plane-stress solve on a structured grid: assemble the bilinear elements with per-element stiffness,
 * eliminate the fixed dofs, and solve K u = f by conjugate gradients preconditioned with one multigrid V-cycle
 * (multigrid.ts; Amir, Aage & Lazarov 2014).
 */
import { pcg, type CgOptions, type SolverStats } from './cg.js';
import { elementStiffness } from './element.js';
import { buildMultigrid } from './multigrid.js';
import { assemble, eliminate } from './stencil.js';

export interface ElasticProblem {
  /** Elements along x and y; each hx × hy mm. */
  readonly ex: number;
  readonly ey: number;
  readonly hx: number;
  readonly hy: number;
  readonly nu: number;
  /** E_e · t per element (N/mm), index ej·ex + ei; every value must be > 0. */
  readonly stiffness: Float64Array;
  /** 1 where a dof is fixed; dof 2n (u), 2n + 1 (v) of node n = j·(ex + 1) + i. */
  readonly fixed: Uint8Array;
  /** Nodal forces, N (ignored on fixed dofs). */
  readonly force: Float64Array;
}

export interface SolveOptions extends CgOptions {
  /** Coarsen until at most this many dofs are left for the direct solve (default COARSEST_DOFS). */
  coarsestDofs?: number;
  /** Storage for the fine-level stiffness, reused across solves on one grid (overwritten). */
  stencilBuffer?: Float64Array;
}

export interface ElasticSolution {
  /** Nodal displacements, mm (zero on fixed dofs). */
  readonly u: Float64Array;
  readonly stats: SolverStats;
  /** Multigrid levels used, the fine one included. */
  readonly levels: number;
  /** The fine-level stiffness storage used (pass it back as `stencilBuffer` to reuse it). */
  readonly stencil: Float64Array;
}

export function solveElastic(p: ElasticProblem, opts: SolveOptions = {}): ElasticSolution {
  const t0 = performance.now();
  const ke = elementStiffness(p.hx, p.hy, p.nu);
  const A = assemble(p.ex, p.ey, ke, p.stiffness, opts.stencilBuffer);
  eliminate(A, p.fixed);
  const f = p.force.slice();
  for (let d = 0; d < f.length; d++) if (p.fixed[d]) f[d] = 0;
  const mg = buildMultigrid(A, opts.coarsestDofs);
  const { u, stats } = pcg(A, f, mg.precondition, opts);
  stats.seconds = (performance.now() - t0) / 1000;
  return { u, stats, levels: mg.levels, stencil: A.s };
}
