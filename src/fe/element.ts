/**
 * The 4-node bilinear plane-stress element on an hx × hy mm cell, 2×2 Gauss; nodes CCW from the lower-left,
 * dofs (u, v) per node. Zienkiewicz & Taylor, The Finite Element Method vol. 1 ch. 6 (from memory); square cells
 * match Andreassen et al., SMO 43:1–16, 2011, DOI 10.1007/s00158-010-0594-7 (test/fe/element.test.ts).
 */

/** D (3×3, row-major) for E = 1: σ = E · D · ε, ε = (εxx, εyy, γxy). */
export function planeStressD(nu: number): Float64Array {
  const c = 1 / (1 - nu * nu);
  return Float64Array.of(c, c * nu, 0, c * nu, c, 0, 0, 0, (c * (1 - nu)) / 2);
}

const XI = [-1, 1, 1, -1];
const ETA = [-1, -1, 1, 1];

/** B (3×8, row-major) at (ξ, η) ∈ [−1, 1]². */
export function strainMatrix(hx: number, hy: number, xi: number, eta: number): Float64Array {
  const B = new Float64Array(24);
  for (let a = 0; a < 4; a++) {
    const dx = (XI[a] * (1 + ETA[a] * eta)) / (2 * hx); // ∂N_a/∂x = ∂N_a/∂ξ · 2/hx
    const dy = (ETA[a] * (1 + XI[a] * xi)) / (2 * hy);
    B[2 * a] = dx;
    B[8 + 2 * a + 1] = dy;
    B[16 + 2 * a] = dy;
    B[16 + 2 * a + 1] = dx;
  }
  return B;
}

/** 8×8, row-major, N/mm, for E = 1 MPa and t = 1 mm; scale by E·t. */
export function elementStiffness(hx: number, hy: number, nu: number): Float64Array {
  if (!(hx > 0 && hy > 0)) throw new RangeError(`element size must be > 0, found ${hx} × ${hy}`);
  if (!(nu > -1 && nu < 0.5)) throw new RangeError(`Poisson's ratio must lie in (−1, 0.5), found ${nu}`);
  const D = planeStressD(nu);
  const K = new Float64Array(64);
  const g = 1 / Math.sqrt(3);
  const detJ = (hx * hy) / 4;
  const DB = new Float64Array(24);
  for (const xi of [-g, g]) {
    for (const eta of [-g, g]) {
      const B = strainMatrix(hx, hy, xi, eta);
      for (let r = 0; r < 3; r++) {
        for (let c = 0; c < 8; c++) DB[r * 8 + c] = D[r * 3] * B[c] + D[r * 3 + 1] * B[8 + c] + D[r * 3 + 2] * B[16 + c];
      }
      for (let p = 0; p < 8; p++) {
        for (let q = 0; q < 8; q++) K[p * 8 + q] += detJ * (B[p] * DB[q] + B[8 + p] * DB[8 + q] + B[16 + p] * DB[16 + q]);
      }
    }
  }
  return K;
}
