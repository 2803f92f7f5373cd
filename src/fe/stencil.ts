/**
 * A symmetric operator on grid nodes as 3×3 node stencils of 2×2 dof blocks (every multigrid level). Node
 * n = j·nx + i; slot k = (dj + 1)·3 + (di + 1); A[2n + a, 2m + b] at s[n·36 + k·4 + a·2 + b]; slot 4 diagonal.
 */

export interface Stencil {
  readonly nx: number;
  readonly ny: number;
  readonly s: Float64Array;
}

const LI = [0, 1, 1, 0];
const LJ = [0, 0, 1, 1];

/** Global stiffness of ex × ey cells from the unit `ke` (element.ts) scaled by `scale[ej·ex + ei]` (E_e · t, N/mm); reuses `into`. */
export function assemble(ex: number, ey: number, ke: Float64Array, scale: Float64Array, into?: Float64Array): Stencil {
  const nx = ex + 1;
  const ny = ey + 1;
  const s = into !== undefined && into.length === nx * ny * 36 ? into.fill(0) : new Float64Array(nx * ny * 36);
  // per node-pair block of one element: its offset in s and its start in ke
  const off = new Int32Array(16);
  const src = new Int32Array(16);
  for (let a = 0; a < 4; a++) {
    for (let b = 0; b < 4; b++) {
      off[a * 4 + b] = (LJ[a] * nx + LI[a]) * 36 + ((LJ[b] - LJ[a] + 1) * 3 + (LI[b] - LI[a] + 1)) * 4;
      src[a * 4 + b] = 2 * a * 8 + 2 * b;
    }
  }
  for (let ej = 0; ej < ey; ej++) {
    for (let ei = 0; ei < ex; ei++) {
      const w = scale[ej * ex + ei];
      const n36 = (ej * nx + ei) * 36;
      for (let p = 0; p < 16; p++) {
        const base = n36 + off[p];
        const r0 = src[p];
        s[base] += w * ke[r0];
        s[base + 1] += w * ke[r0 + 1];
        s[base + 2] += w * ke[r0 + 8];
        s[base + 3] += w * ke[r0 + 9];
      }
    }
  }
  return { nx, ny, s };
}

/** The node in slot k (0…8) of node (i, j)'s stencil, or −1 outside the grid. */
export function neighbourNode(nx: number, ny: number, i: number, j: number, k: number): number {
  const ii = i + (k % 3) - 1;
  const jj = j + ((k / 3) | 0) - 1;
  return ii < 0 || jj < 0 || ii >= nx || jj >= ny ? -1 : jj * nx + ii;
}

/** Fixed dofs in place: rows and columns zeroed but the diagonal (the coarse levels still see a stiff support); f must be 0 there. */
export function eliminate(A: Stencil, fixed: Uint8Array): void {
  const { nx, ny, s } = A;
  for (let n = 0; n < nx * ny; n++) {
    for (let c = 0; c < 2; c++) {
      if (!fixed[2 * n + c]) continue;
      const i = n % nx;
      const j = (n - i) / nx;
      const d = s[n * 36 + 16 + c * 3];
      for (let k = 0; k < 9; k++) {
        const m = neighbourNode(nx, ny, i, j, k);
        if (m < 0) continue;
        s[n * 36 + k * 4 + c * 2] = 0;
        s[n * 36 + k * 4 + c * 2 + 1] = 0;
        s[m * 36 + (8 - k) * 4 + c] = 0;
        s[m * 36 + (8 - k) * 4 + 2 + c] = 0;
      }
      s[n * 36 + 16 + c * 3] = d > 0 ? d : 1;
    }
  }
}

/** Row n of A x (neighbours outside the grid skipped). */
function applyNode(nx: number, ny: number, s: Float64Array, x: Float64Array, y: Float64Array, i: number, j: number): void {
  const n = j * nx + i;
  let yu = 0;
  let yv = 0;
  for (let dj = j > 0 ? -1 : 0; dj <= (j < ny - 1 ? 1 : 0); dj++) {
    for (let di = i > 0 ? -1 : 0; di <= (i < nx - 1 ? 1 : 0); di++) {
      const m = n + dj * nx + di;
      const b = n * 36 + ((dj + 1) * 3 + di + 1) * 4;
      const xu = x[2 * m];
      const xv = x[2 * m + 1];
      yu += s[b] * xu + s[b + 1] * xv;
      yv += s[b + 2] * xu + s[b + 3] * xv;
    }
  }
  y[2 * n] = yu;
  y[2 * n + 1] = yv;
}

/** y = A x. */
export function apply(A: Stencil, x: Float64Array, y: Float64Array): void {
  const { nx, ny, s } = A;
  const rowUp = 2 * nx;
  for (let j = 0; j < ny; j++) {
    if (j === 0 || j === ny - 1 || nx < 3) {
      for (let i = 0; i < nx; i++) applyNode(nx, ny, s, x, y, i, j);
      continue;
    }
    applyNode(nx, ny, s, x, y, 0, j);
    for (let i = 1; i < nx - 1; i++) {
      const n = j * nx + i;
      const o = n * 36;
      const d = 2 * n;
      // slots 0..8: (di, dj) = (−1,−1) (0,−1) (1,−1) (−1,0) (0,0) (1,0) (−1,1) (0,1) (1,1)
      let m = d - rowUp - 2;
      let yu = s[o] * x[m] + s[o + 1] * x[m + 1];
      let yv = s[o + 2] * x[m] + s[o + 3] * x[m + 1];
      m += 2;
      yu += s[o + 4] * x[m] + s[o + 5] * x[m + 1];
      yv += s[o + 6] * x[m] + s[o + 7] * x[m + 1];
      m += 2;
      yu += s[o + 8] * x[m] + s[o + 9] * x[m + 1];
      yv += s[o + 10] * x[m] + s[o + 11] * x[m + 1];
      m = d - 2;
      yu += s[o + 12] * x[m] + s[o + 13] * x[m + 1];
      yv += s[o + 14] * x[m] + s[o + 15] * x[m + 1];
      m += 2;
      yu += s[o + 16] * x[m] + s[o + 17] * x[m + 1];
      yv += s[o + 18] * x[m] + s[o + 19] * x[m + 1];
      m += 2;
      yu += s[o + 20] * x[m] + s[o + 21] * x[m + 1];
      yv += s[o + 22] * x[m] + s[o + 23] * x[m + 1];
      m = d + rowUp - 2;
      yu += s[o + 24] * x[m] + s[o + 25] * x[m + 1];
      yv += s[o + 26] * x[m] + s[o + 27] * x[m + 1];
      m += 2;
      yu += s[o + 28] * x[m] + s[o + 29] * x[m + 1];
      yv += s[o + 30] * x[m] + s[o + 31] * x[m + 1];
      m += 2;
      yu += s[o + 32] * x[m] + s[o + 33] * x[m + 1];
      yv += s[o + 34] * x[m] + s[o + 35] * x[m + 1];
      y[d] = yu;
      y[d + 1] = yv;
    }
    applyNode(nx, ny, s, x, y, nx - 1, j);
  }
}

/** Block Gauss–Seidel update of node (i, j) by its 2×2 diagonal block. */
function relaxNode(nx: number, ny: number, s: Float64Array, x: Float64Array, b: Float64Array, i: number, j: number): void {
  const n = j * nx + i;
  const o = n * 36;
  let ru = b[2 * n];
  let rv = b[2 * n + 1];
  if (i > 0 && j > 0 && i < nx - 1 && j < ny - 1) {
    const rowUp = 2 * nx;
    const d = 2 * n;
    let m = d - rowUp - 2;
    ru -= s[o] * x[m] + s[o + 1] * x[m + 1];
    rv -= s[o + 2] * x[m] + s[o + 3] * x[m + 1];
    m += 2;
    ru -= s[o + 4] * x[m] + s[o + 5] * x[m + 1];
    rv -= s[o + 6] * x[m] + s[o + 7] * x[m + 1];
    m += 2;
    ru -= s[o + 8] * x[m] + s[o + 9] * x[m + 1];
    rv -= s[o + 10] * x[m] + s[o + 11] * x[m + 1];
    m = d - 2;
    ru -= s[o + 12] * x[m] + s[o + 13] * x[m + 1];
    rv -= s[o + 14] * x[m] + s[o + 15] * x[m + 1];
    m = d + 2;
    ru -= s[o + 20] * x[m] + s[o + 21] * x[m + 1];
    rv -= s[o + 22] * x[m] + s[o + 23] * x[m + 1];
    m = d + rowUp - 2;
    ru -= s[o + 24] * x[m] + s[o + 25] * x[m + 1];
    rv -= s[o + 26] * x[m] + s[o + 27] * x[m + 1];
    m += 2;
    ru -= s[o + 28] * x[m] + s[o + 29] * x[m + 1];
    rv -= s[o + 30] * x[m] + s[o + 31] * x[m + 1];
    m += 2;
    ru -= s[o + 32] * x[m] + s[o + 33] * x[m + 1];
    rv -= s[o + 34] * x[m] + s[o + 35] * x[m + 1];
  } else {
    for (let dj = j > 0 ? -1 : 0; dj <= (j < ny - 1 ? 1 : 0); dj++) {
      for (let di = i > 0 ? -1 : 0; di <= (i < nx - 1 ? 1 : 0); di++) {
        if (di === 0 && dj === 0) continue;
        const m = n + dj * nx + di;
        const q = o + ((dj + 1) * 3 + di + 1) * 4;
        ru -= s[q] * x[2 * m] + s[q + 1] * x[2 * m + 1];
        rv -= s[q + 2] * x[2 * m] + s[q + 3] * x[2 * m + 1];
      }
    }
  }
  const a = s[o + 16];
  const bb = s[o + 17];
  const c = s[o + 18];
  const d = s[o + 19];
  const det = a * d - bb * c;
  x[2 * n] = (d * ru - bb * rv) / det;
  x[2 * n + 1] = (a * rv - c * ru) / det;
}

/** One block Gauss–Seidel sweep in place; forward before and backward after the coarse correction keeps the V-cycle symmetric. */
export function gaussSeidel(A: Stencil, x: Float64Array, b: Float64Array, forward: boolean): void {
  const { nx, ny, s } = A;
  if (forward) {
    for (let j = 0; j < ny; j++) for (let i = 0; i < nx; i++) relaxNode(nx, ny, s, x, b, i, j);
  } else {
    for (let j = ny - 1; j >= 0; j--) for (let i = nx - 1; i >= 0; i--) relaxNode(nx, ny, s, x, b, i, j);
  }
}

/** r = b − A x after one forward sweep from x = 0: r = −U x, slots 5…8 only. */
export function residualAfterForwardSweep(A: Stencil, x: Float64Array, r: Float64Array): void {
  const { nx, ny, s } = A;
  for (let j = 0; j < ny; j++) {
    const up = j < ny - 1;
    for (let i = 0; i < nx; i++) {
      const n = j * nx + i;
      const o = n * 36;
      let ru = 0;
      let rv = 0;
      if (i < nx - 1) {
        const m = 2 * (n + 1);
        ru -= s[o + 20] * x[m] + s[o + 21] * x[m + 1];
        rv -= s[o + 22] * x[m] + s[o + 23] * x[m + 1];
      }
      if (up) {
        if (i > 0) {
          const m = 2 * (n + nx - 1);
          ru -= s[o + 24] * x[m] + s[o + 25] * x[m + 1];
          rv -= s[o + 26] * x[m] + s[o + 27] * x[m + 1];
        }
        let m = 2 * (n + nx);
        ru -= s[o + 28] * x[m] + s[o + 29] * x[m + 1];
        rv -= s[o + 30] * x[m] + s[o + 31] * x[m + 1];
        if (i < nx - 1) {
          m += 2;
          ru -= s[o + 32] * x[m] + s[o + 33] * x[m + 1];
          rv -= s[o + 34] * x[m] + s[o + 35] * x[m + 1];
        }
      }
      r[2 * n] = ru;
      r[2 * n + 1] = rv;
    }
  }
}
