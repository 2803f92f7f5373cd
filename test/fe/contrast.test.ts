import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { analyse, coarseningFactor } from '../../src/fe/analyse.js';
import { factorBanded, solveBanded } from '../../src/fe/banded.js';
import { elementStiffness } from '../../src/fe/element.js';
import { coarsenCells, nodalToCells } from '../../src/fe/resample.js';
import { assemble, eliminate } from '../../src/fe/stencil.js';
import { parseLoads } from '../../src/loads/parse.js';
import { resolveLoadCase } from '../../src/loads/resolve.js';
import { DEFAULT_READ_OPTIONS } from '../../src/read/types.js';
import { readNpy } from '../../src/read/npy.js';

describe('high contrast: a thresholded optimized design, void 1e-9·E', () => {
  // fixtures/grids/realistic-cantilever-100x50.npy (written by numpy; fixtures/make/optimize_demo.py), thresholded
  // at 0.5: black and white, void at 1e-9. Reference: the same system factored directly (banded Cholesky of the
  // whole fine matrix, no iteration).
  it('multigrid-CG converges in few iterations and matches the direct solve', () => {
    const g = readNpy(new Uint8Array(readFileSync(new URL('../../fixtures/grids/realistic-cantilever-100x50.npy', import.meta.url))), { ...DEFAULT_READ_OPTIONS }).grid;
    const values = g.values.map((v) => (v >= 0.5 ? 1 : 0));
    // the optimizer's load case (optimize_demo.py cantilever()): left edge clamped, unit load down at mid-height of the right edge
    const spec = parseLoads(JSON.stringify({ rhoformLoads: 1, material: { E: 1, nu: 0.3 }, thickness: 1, supports: [{ fix: 'xy', edge: 'left' }], loads: [{ force: [0, -1], point: [100, 25] }] }), 'c.json');
    const grid = { nx: g.nx, ny: g.ny, hx: 1, hy: 1 };
    const r = analyse(grid, { kind: 'coverage', values }, spec);
    expect(r.solver.converged).toBe(true);
    expect(r.solver.iterations).toBeLessThan(60);

    const lc = resolveLoadCase(spec, { ex: g.nx, ey: g.ny, hx: 1, hy: 1 });
    const A = assemble(g.nx, g.ny, elementStiffness(1, 1, 0.3), values.map((v) => 1e-9 + v * (1 - 1e-9)));
    eliminate(A, lc.fixed);
    const u = Float64Array.from(lc.force);
    solveBanded(factorBanded(A), u);
    let c = 0;
    for (let d = 0; d < u.length; d++) c += lc.force[d] * u[d];
    expect(Math.abs(r.compliance / c - 1)).toBeLessThan(1e-7);
    // displacements of the material's nodes (void nodes move by amounts that mean nothing)
    const ref = r.maxDisplacement;
    const n = Math.round(ref.y) * (g.nx + 1) + Math.round(ref.x);
    expect(Math.abs(Math.hypot(u[2 * n], u[2 * n + 1]) / ref.value - 1)).toBeLessThan(1e-6);
  });
});

describe('coarsening above the element limit', () => {
  it('block means when the factor divides the size, area-weighted means otherwise (the mean is kept)', () => {
    const v = Float64Array.from({ length: 6 * 4 }, (_, k) => k % 5);
    const c = coarsenCells(v, 6, 4, 2);
    expect([c.nx, c.ny]).toEqual([3, 2]);
    // cell (0, 0) of the coarse grid: fine (0,0) (1,0) (0,1) (1,1) = values 0, 1, 6 % 5, 7 % 5 → (0 + 1 + 1 + 2)/4
    expect(c.values[0]).toBeCloseTo(1, 14);
    const odd = coarsenCells(v, 6, 4, 4); // 2 × 1 coarse cells, each 3 × 4 fine cells
    expect([odd.nx, odd.ny]).toEqual([2, 1]);
    const mean = (a: Float64Array): number => a.reduce((s, x) => s + x, 0) / a.length;
    expect(mean(odd.values)).toBeCloseTo(mean(v), 14);
    expect(coarseningFactor(1000, 500, 500_000)).toBe(1);
    expect(coarseningFactor(1001, 500, 500_000)).toBe(2);
    expect(coarseningFactor(4000, 2000, 500_000)).toBe(4);
  });

  it('a nodal grid becomes the cells between its samples, each the mean of its corners — the exact mean of the bilinear field (DESIGN §12)', () => {
    // a bilinear field f = 1 + 2x + 3y + xy sampled on a 4 × 3 node grid of unit cells: the exact cell mean of
    // f over [i, i+1] × [j, j+1] is 1 + 2(i + ½) + 3(j + ½) + (i + ½)(j + ½) (analytic: f is bilinear)
    const f = (x: number, y: number): number => 1 + 2 * x + 3 * y + x * y;
    const v = Float64Array.from({ length: 12 }, (_, k) => f(k % 4, Math.floor(k / 4)));
    const c = nodalToCells(v, 4, 3);
    expect([c.nx, c.ny]).toEqual([3, 2]);
    for (let j = 0; j < 2; j++) for (let i = 0; i < 3; i++) expect(c.values[j * 3 + i]).toBeCloseTo(f(i + 0.5, j + 0.5), 13);
  });

  it('a coarsened bar in tension still gives FL/(EA) (Gere & Timoshenko), and the factor is reported', () => {
    const spec = parseLoads(JSON.stringify({ rhoformLoads: 1, material: { E: 1000, nu: 0.3 }, thickness: 2, supports: [{ fix: 'x', edge: 'left' }, { fix: 'y', point: [0, 0] }], loads: [{ force: [100, 0], edge: 'right' }] }), 'b.json');
    const r = analyse({ nx: 90, ny: 30, hx: 1, hy: 1 }, { kind: 'density', values: new Float64Array(2700).fill(1) }, spec, { maxElements: 400, tol: 1e-12 });
    expect(r.coarsened).toBe(3);
    expect(r.elements).toEqual([30, 10]);
    const delta = (100 * 90) / (1000 * 30 * 2);
    expect(Math.abs(r.compliance / (100 * delta) - 1)).toBeLessThan(1e-9);
  });
});
