/** Plane-stress solve on a structured grid: assemble, eliminate fixed dofs, CG with a multigrid V-cycle. */
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
  /** E_e · t per element (N/mm), > 0. */
  readonly stiffness: Float64Array;
  readonly fixed: Uint8Array;
  /** N. */
  readonly force: Float64Array;
}

export interface SolveOptions extends CgOptions {
  coarsestDofs?: number;
  /** Reused across solves on one grid (overwritten). */
  stencilBuffer?: Float64Array;
}

export interface ElasticSolution {
  /** mm. */
  readonly u: Float64Array;
  readonly stats: SolverStats;
  readonly levels: number;
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
