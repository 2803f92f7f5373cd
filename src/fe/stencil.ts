/**
 * A symmetric operator on the nodes of a structured grid, stored as node stencils: each node couples to its
 * 3×3 node neighbourhood with 2×2 dof blocks (u, v). This is the exact sparsity of bilinear elements on the
 * grid's cells and of their Galerkin coarse operators under bilinear prolongation, so one layout serves every
 * multigrid level.
 *
 * Layout: node n = j·nx + i (i along x, j along y, y up); neighbour slot k = (dj + 1)·3 + (di + 1);
 * entry A[2n + a, 2m + b] (m the neighbour) at s[n·36 + k·4 + a·2 + b]. Slot 4 is the diagonal block.
 */

export interface Stencil {
  /** Nodes along x and y. */
  readonly nx: number;
  readonly ny: number;
  /** 36 values per node (see the module comment). */
  readonly s: Float64Array;
}

const LI = [0, 1, 1, 0];
const LJ = [0, 0, 1, 1];

/**
 * Assemble the global stiffness of an ex × ey grid of equal cells from the unit element matrix `ke`
 * (8×8, E = 1, t = 1; element.ts) scaled per element by `scale[ej·ex + ei]` (E_e · t, N/mm²·mm).
 * Nodes: (ex + 1) × (ey + 1).
 */
export function assemble(ex: number, ey: number, ke: Float64Array, scale: Float64Array): Stencil {
  const nx = ex + 1;
  const ny = ey + 1;
  const s = new Float64Array(nx * ny * 36);
  // for each of the 16 node-pair blocks of one element: its offset in s from the element's first node, and
  // where the block starts in ke
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

/**
 * Eliminate fixed dofs in place: their rows and columns become zero except the diagonal, which keeps its value
 * (a decoupled row with a stiffness of the right size, so the coarse levels still see a stiff support).
 * The right-hand side must be zero at those dofs; the solution then is zero there.
 */
export function eliminate(A: Stencil, fixed: Uint8Array): void {
  const { nx, ny, s } = A;
  for (let n = 0; n < nx * ny; n++) {
    for (let c = 0; c < 2; c++) {
      if (!fixed[2 * n + c]) continue;
      const i = n % nx;
      const j = (n - i) / nx;
      const d = s[n * 36 + 16 + c * 3];
      for (let k = 0; k < 9; k++) {
        const di = (k % 3) - 1;
        const dj = ((k / 3) | 0) - 1;
        const ii = i + di;
        const jj = j + dj;
        if (ii < 0 || jj < 0 || ii >= nx || jj >= ny) continue;
        const m = jj * nx + ii;
        s[n * 36 + k * 4 + c * 2] = 0;
        s[n * 36 + k * 4 + c * 2 + 1] = 0;
        s[m * 36 + (8 - k) * 4 + c] = 0;
        s[m * 36 + (8 - k) * 4 + 2 + c] = 0;
      }
      s[n * 36 + 16 + c * 3] = d > 0 ? d : 1;
    }
  }
}

/** y = A x. */
export function apply(A: Stencil, x: Float64Array, y: Float64Array): void {
  const { nx, ny, s } = A;
  for (let j = 0; j < ny; j++) {
    const j0 = j > 0 ? -1 : 0;
    const j1 = j < ny - 1 ? 1 : 0;
    for (let i = 0; i < nx; i++) {
      const i0 = i > 0 ? -1 : 0;
      const i1 = i < nx - 1 ? 1 : 0;
      const n = j * nx + i;
      let yu = 0;
      let yv = 0;
      for (let dj = j0; dj <= j1; dj++) {
        for (let di = i0; di <= i1; di++) {
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
  }
}

/**
 * One block Gauss–Seidel sweep on A x = b (2×2 node blocks), in place: forward (node 0 first) or backward.
 * A forward sweep before and a backward sweep after the coarse correction keep the V-cycle symmetric.
 */
export function gaussSeidel(A: Stencil, x: Float64Array, b: Float64Array, forward: boolean): void {
  const { nx, ny, s } = A;
  const N = nx * ny;
  for (let t = 0; t < N; t++) {
    const n = forward ? t : N - 1 - t;
    const i = n % nx;
    const j = (n - i) / nx;
    const j0 = j > 0 ? -1 : 0;
    const j1 = j < ny - 1 ? 1 : 0;
    const i0 = i > 0 ? -1 : 0;
    const i1 = i < nx - 1 ? 1 : 0;
    let ru = b[2 * n];
    let rv = b[2 * n + 1];
    for (let dj = j0; dj <= j1; dj++) {
      for (let di = i0; di <= i1; di++) {
        if (di === 0 && dj === 0) continue;
        const m = n + dj * nx + di;
        const o = n * 36 + ((dj + 1) * 3 + di + 1) * 4;
        const xu = x[2 * m];
        const xv = x[2 * m + 1];
        ru -= s[o] * xu + s[o + 1] * xv;
        rv -= s[o + 2] * xu + s[o + 3] * xv;
      }
    }
    const o = n * 36 + 16;
    const a = s[o];
    const bb = s[o + 1];
    const c = s[o + 2];
    const d = s[o + 3];
    const det = a * d - bb * c;
    x[2 * n] = (d * ru - bb * rv) / det;
    x[2 * n + 1] = (a * rv - c * ru) / det;
  }
}
