import { describe, expect, it } from 'vitest';
import { elementStiffness } from '../../src/fe/element.js';
import { solveElastic } from '../../src/fe/solve.js';
import { assemble, apply } from '../../src/fe/stencil.js';
import { vonMises } from '../../src/fe/stress.js';
import { freeRigidModes } from '../../src/fe/rigid.js';
import { denseSolve, holeyDesign } from './dense.js';

const E = 1000;
const NU = 0.3;

/** SIMP stiffness E·(r + ρ³(1 − r)) per element (Andreassen et al. 2011, modified SIMP), thickness 1. */
function simp(rho: Float64Array, r = 1e-9): Float64Array {
  return rho.map((v) => E * (r + v ** 3 * (1 - r)));
}

/** Left edge clamped; returns the fixed-dof mask of an (ex + 1) × (ey + 1) node grid. */
function clampLeft(ex: number, ey: number): Uint8Array {
  const fixed = new Uint8Array(2 * (ex + 1) * (ey + 1));
  for (let j = 0; j <= ey; j++) fixed[2 * j * (ex + 1)] = fixed[2 * j * (ex + 1) + 1] = 1;
  return fixed;
}

function maxAbs(a: Float64Array): number {
  let m = 0;
  for (const v of a) m = Math.max(m, Math.abs(v));
  return m;
}

describe('multigrid-CG against a direct solve', () => {
  // Reference: the same discrete system solved by dense Gaussian elimination (test/fe/dense.ts), our own
  // direct solver; agreement to 1e-8 relative is the brief's bar for an iterative solve.
  for (const [ex, ey] of [
    [16, 8],
    [13, 9],
    [15, 6],
  ]) {
    it(`${ex} × ${ey} elements (odd sizes take the non-uniform coarsening), SIMP design with void 1e-9: displacements to 1e-8`, () => {
      const rho = holeyDesign(ex, ey);
      const stiffness = simp(rho);
      const fixed = clampLeft(ex, ey);
      const force = new Float64Array(fixed.length);
      force[2 * ((ey >> 1) * (ex + 1) + ex) + 1] = -1;
      force[2 * (ey * (ex + 1) + ex)] = 0.3;
      const ref = denseSolve(ex, ey, 1.5, 1, NU, stiffness, fixed, force);
      // a tiny coarsest level forces several multigrid levels even on these small grids
      const sol = solveElastic({ ex, ey, hx: 1.5, hy: 1, nu: NU, stiffness, fixed, force }, { tol: 1e-12, coarsestDofs: 20 });
      expect(sol.levels).toBeGreaterThanOrEqual(3);
      const scale = maxAbs(ref);
      let err = 0;
      for (let d = 0; d < ref.length; d++) err = Math.max(err, Math.abs(sol.u[d] - ref[d]));
      expect(err / scale).toBeLessThan(1e-8);
      expect(sol.stats.converged).toBe(true);
      expect(sol.stats.relativeResidual).toBeLessThanOrEqual(1e-12);
    });
  }

  it('reports a solve that does not reach its tolerance as not converged, with its residual', () => {
    const ex = 20;
    const ey = 10;
    const stiffness = simp(holeyDesign(ex, ey));
    const fixed = clampLeft(ex, ey);
    const force = new Float64Array(fixed.length);
    force[2 * (ex + 1) * (ey + 1) - 1] = -1;
    const sol = solveElastic({ ex, ey, hx: 1, hy: 1, nu: NU, stiffness, fixed, force }, { tol: 1e-14, maxIterations: 2, coarsestDofs: 20 });
    expect(sol.stats.iterations).toBe(2);
    expect(sol.stats.converged).toBe(false);
    expect(sol.stats.relativeResidual).toBeGreaterThan(1e-14);
  });
});

describe('Betti–Maxwell reciprocity', () => {
  // Maxwell's reciprocal theorem (J.C. Maxwell 1864; E. Betti 1872; e.g. Gere & Timoshenko, Mechanics of
  // Materials): for a linear elastic body, the displacement at B in direction b due to a unit force at A in
  // direction a equals the displacement at A in direction a due to a unit force at B in direction b.
  it('holds on a grey SIMP design to the solver tolerance', () => {
    const ex = 40;
    const ey = 20;
    const stiffness = simp(holeyDesign(ex, ey, 11), 1e-6);
    const fixed = clampLeft(ex, ey);
    const dofA = 2 * (10 * (ex + 1) + ex) + 1; // v at the middle of the right edge
    const dofB = 2 * (ey * (ex + 1) + 25); // u at a top node
    const fA = new Float64Array(fixed.length);
    fA[dofA] = 1;
    const fB = new Float64Array(fixed.length);
    fB[dofB] = 1;
    const p = { ex, ey, hx: 1, hy: 1, nu: NU, stiffness, fixed };
    const uA = solveElastic({ ...p, force: fA }, { tol: 1e-11 }).u;
    const uB = solveElastic({ ...p, force: fB }, { tol: 1e-11 }).u;
    expect(Math.abs(uA[dofB])).toBeGreaterThan(0);
    expect(Math.abs(uA[dofB] - uB[dofA]) / Math.abs(uA[dofB])).toBeLessThan(1e-7);
  });
});

describe('rigid-body motion', () => {
  // Elasticity (any textbook, e.g. Zienkiewicz & Taylor, The Finite Element Method, vol. 1): rigid-body
  // translations and the infinitesimal rotation produce no strain, so K·r = 0 and no stress.
  const ex = 9;
  const ey = 7;
  const hx = 2;
  const hy = 1.25;
  const nodes = (ex + 1) * (ey + 1);
  const modes: Float64Array[] = [0, 1, 2].map((m) => {
    const r = new Float64Array(2 * nodes);
    for (let n = 0; n < nodes; n++) {
      const x = (n % (ex + 1)) * hx + 3;
      const y = Math.floor(n / (ex + 1)) * hy - 5;
      r[2 * n] = m === 0 ? 1 : m === 1 ? 0 : -y;
      r[2 * n + 1] = m === 0 ? 0 : m === 1 ? 1 : x;
    }
    return r;
  });

  it('the assembled (unsupported) stiffness maps the three rigid modes to zero force', () => {
    const A = assemble(ex, ey, elementStiffness(hx, hy, NU), simp(holeyDesign(ex, ey), 1e-3));
    const y = new Float64Array(2 * nodes);
    for (const r of modes) {
      apply(A, r, y);
      expect(maxAbs(y) / (E * maxAbs(r))).toBeLessThan(1e-12);
    }
  });

  it('a rigid displacement field gives zero von Mises stress', () => {
    for (const r of modes) expect(maxAbs(vonMises(ex, ey, hx, hy, E, NU, r))).toBeLessThan(1e-10 * E);
  });

  it('supports that leave a rigid mode free are named; supports that hold the part give none', () => {
    const fix = (list: [number, number, 0 | 1][]): Uint8Array => {
      const f = new Uint8Array(2 * nodes);
      for (const [i, j, c] of list) f[2 * (j * (ex + 1) + i) + c] = 1;
      return f;
    };
    // a single pinned node: the part may spin about it
    expect(freeRigidModes(ex + 1, ey + 1, hx, hy, fix([[0, 0, 0], [0, 0, 1]]))).toEqual(['rotation']);
    // rollers (y fixed) only: it slides along x
    expect(freeRigidModes(ex + 1, ey + 1, hx, hy, fix([[0, 0, 1], [ex, 0, 1]]))).toEqual(['x']);
    // nothing in y, and x fixed on one vertical line only
    expect(freeRigidModes(ex + 1, ey + 1, hx, hy, fix([[0, 0, 0], [0, 3, 0]]))).toEqual(['y']);
    // y fixed along one vertical line, x at one node on it: rotation about that node is free
    expect(freeRigidModes(ex + 1, ey + 1, hx, hy, fix([[4, 0, 1], [4, 3, 1], [4, 7, 1], [4, 3, 0]]))).toEqual(['rotation']);
    // pin + roller (the simply supported beam): held
    expect(freeRigidModes(ex + 1, ey + 1, hx, hy, fix([[0, 0, 0], [0, 0, 1], [ex, 0, 1]]))).toEqual([]);
    // x fixed along a vertical line and y at one node: held (a clamped face without the y-dofs but one)
    expect(freeRigidModes(ex + 1, ey + 1, hx, hy, fix([[0, 0, 0], [0, 1, 0], [0, 2, 0], [0, 0, 1]]))).toEqual([]);
  });
});
