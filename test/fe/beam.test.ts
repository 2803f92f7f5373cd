import { describe, expect, it } from 'vitest';
import { analyse } from '../../src/fe/analyse.js';
import { elementStiffness } from '../../src/fe/element.js';
import { parseLoads } from '../../src/loads/parse.js';

const spec = (o: object) => parseLoads(JSON.stringify({ rhoformLoads: 1, ...o }), 'case.json');
const solid = (n: number) => ({ kind: 'density' as const, values: new Float64Array(n).fill(1) });

describe('element', () => {
  it('the square element equals the closed form of the 88-line code', () => {
    // Andreassen, Clausen, Schevenels, Lazarov & Sigmund, "Efficient topology optimization in MATLAB using 88
    // lines of code", SMO 43:1–16, 2011, DOI 10.1007/s00158-010-0594-7: the element stiffness = 1/(1−ν²)/24 ([A11 A12; A12ᵀ A11]
    // + ν [B11 B12; B12ᵀ B11]), same node order (lower-left first, counter-clockwise, y up).
    const nu = 0.3;
    const A11 = [[12, 3, -6, -3], [3, 12, 3, 0], [-6, 3, 12, -3], [-3, 0, -3, 12]];
    const A12 = [[-6, -3, 0, 3], [-3, -6, -3, -6], [0, -3, -6, 3], [3, -6, 3, -6]];
    const B11 = [[-4, 3, -2, 9], [3, -4, -9, 4], [-2, -9, -4, -3], [9, 4, -3, -4]];
    const B12 = [[2, -3, 4, -9], [-3, 2, 9, -2], [4, 9, 2, 3], [-9, -2, 3, 2]];
    const block = (P: number[][], Q: number[][], r: number, c: number): number =>
      r < 4 ? (c < 4 ? P[r][c] : Q[r][c - 4]) : c < 4 ? Q[c][r - 4] : P[r - 4][c - 4];
    const ke = elementStiffness(3.7, 3.7, nu); // square: independent of the size
    for (let r = 0; r < 8; r++) {
      for (let c = 0; c < 8; c++) {
        const ref = (block(A11, A12, r, c) + nu * block(B11, B12, r, c)) / (1 - nu * nu) / 24;
        expect(ke[r * 8 + c]).toBeCloseTo(ref, 13);
      }
    }
  });
});

describe('patch test: a uniform bar in tension', () => {
  // Elementary strength of materials (Gere & Timoshenko, Mechanics of Materials, ch. 2): a prismatic bar under
  // an axial force F carries the uniform stress σ = F/A and stretches by δ = F·L/(E·A); the work of the load,
  // the compliance, is F·δ. Bilinear elements reproduce a linear displacement field exactly (the patch test,
  // Zienkiewicz & Taylor, vol. 1), so the match is to rounding.
  it('uniform stress F/A, end displacement FL/(EA), compliance F·u to 1e-9, on rectangular cells', () => {
    const L = 120;
    const H = 30;
    const t = 4;
    const E = 70000;
    const F = 5000;
    const nx = 24;
    const ny = 10;
    const s = spec({
      material: { E, nu: 0.33 },
      thickness: t,
      supports: [
        { fix: 'x', edge: 'left', name: 'symmetry plane' },
        { fix: 'y', point: [0, 0] },
      ],
      loads: [{ force: [F, 0], edge: 'right' }],
    });
    const r = analyse({ nx, ny, hx: L / nx, hy: H / ny }, solid(nx * ny), s, { tol: 1e-13 });
    const sigma = F / (H * t);
    for (const v of r.vonMises) expect(Math.abs(v - sigma) / sigma).toBeLessThan(1e-9);
    const delta = (F * L) / (E * H * t);
    for (let j = 0; j <= ny; j++) {
      const u = r.displacement[2 * (j * (nx + 1) + nx)];
      expect(Math.abs(u - delta) / delta).toBeLessThan(1e-9);
    }
    expect(Math.abs(r.compliance - F * delta) / (F * delta)).toBeLessThan(1e-9);
    expect(r.peakStress!.value).toBeCloseTo(sigma, 6);
  });
});

describe('cantilever with an end shear', () => {
  // Timoshenko beam theory (Gere & Timoshenko, Mechanics of Materials; shear correction κ = 5/6 for a
  // rectangle): tip deflection δ = P·L³/(3·E·I) + P·L/(κ·G·A), I = t·h³/12, A = t·h, G = E/(2(1 + ν)).
  // The brief's bar: within 1 % at 20 elements through the depth.
  it('depth h, length 10h, clamped face, 20 × 200 elements: tip deflection within 1 % of Timoshenko', () => {
    const h = 20;
    const L = 10 * h;
    const t = 2;
    const E = 200000;
    const nu = 0.3;
    const P = 1000;
    const s = spec({ material: { E, nu }, thickness: t, supports: [{ fix: 'xy', edge: 'left', name: 'clamped face' }], loads: [{ force: [0, -P], edge: 'right', name: 'end shear' }] });
    const nx = 200;
    const ny = 20;
    const r = analyse({ nx, ny, hx: L / nx, hy: h / ny }, solid(nx * ny), s);
    expect(r.solver.converged).toBe(true);
    const I = (t * h ** 3) / 12;
    const G = E / (2 * (1 + nu));
    const ref = (P * L ** 3) / (3 * E * I) + (P * L) / ((5 / 6) * G * t * h);
    const tip = -r.displacement[2 * ((ny / 2) * (nx + 1) + nx) + 1]; // the neutral axis at the loaded end
    expect(Math.abs(tip / ref - 1)).toBeLessThan(0.01);
    // the largest displacement sits at the free end
    expect(r.maxDisplacement.x).toBe(L);
    expect(Math.abs(r.maxDisplacement.value / ref - 1)).toBeLessThan(0.01);
    // and the compliance is the load's work P·δ (mean tip deflection under the uniform edge shear)
    expect(Math.abs(r.compliance / (P * ref) - 1)).toBeLessThan(0.01);
  });
});
