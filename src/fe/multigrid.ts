/**
 * Geometric multigrid as the CG preconditioner (O. Amir, N. Aage, B.S. Lazarov, "On multigrid-CG for efficient
 * topology optimization", SMO 49:815–829, 2014, DOI 10.1007/s00158-013-1015-5); coarsening: docs/notes/fe.md.
 */
import { factorBanded, solveBanded, type BandedCholesky } from './banded.js';
import { gaussSeidel, residualAfterForwardSweep, type Stencil } from './stencil.js';

/** Fine i takes w0[i] of coarse p0[i] and 1 − w0[i] of p0[i] + 1. */
interface AxisMap {
  readonly nf: number;
  readonly nc: number;
  readonly p0: Int32Array;
  readonly w0: Float64Array;
}

function axisMap(nf: number): AxisMap {
  const p0 = new Int32Array(nf);
  const w0 = new Float64Array(nf);
  if (nf <= 3) {
    for (let i = 0; i < nf; i++) {
      p0[i] = i;
      w0[i] = 1;
    }
    return { nf, nc: nf, p0, w0 };
  }
  const oddCells = (nf - 1) % 2 === 1;
  const nc = Math.floor((nf - 1) / 2) + 1 + (oddCells ? 1 : 0);
  for (let i = 0; i < nf; i++) {
    if (i % 2 === 0) {
      p0[i] = i / 2;
      w0[i] = 1;
    } else if (i === nf - 1) {
      p0[i] = nc - 1;
      w0[i] = 1;
    } else {
      p0[i] = (i - 1) / 2;
      w0[i] = 0.5;
    }
  }
  return { nf, nc, p0, w0 };
}

interface Level {
  readonly A: Stencil;
  readonly mx?: AxisMap;
  readonly my?: AxisMap;
  readonly r: Float64Array;
  readonly b: Float64Array;
  readonly x: Float64Array;
}

/** Up to two (coarse index, weight) pairs per fine index. */
function parentLists(m: AxisMap): { idx: Int32Array; wt: Float64Array; cnt: Uint8Array } {
  const idx = new Int32Array(2 * m.nf);
  const wt = new Float64Array(2 * m.nf);
  const cnt = new Uint8Array(m.nf);
  for (let i = 0; i < m.nf; i++) {
    let k = 0;
    if (m.w0[i] !== 0) {
      idx[2 * i] = m.p0[i];
      wt[2 * i] = m.w0[i];
      k = 1;
    }
    if (m.w0[i] !== 1) {
      idx[2 * i + k] = m.p0[i] + 1;
      wt[2 * i + k] = 1 - m.w0[i];
      k++;
    }
    cnt[i] = k;
  }
  return { idx, wt, cnt };
}

/** Galerkin product Pᵀ A P for the bilinear prolongation. */
export function galerkin(A: Stencil, mx: AxisMap, my: AxisMap): Stencil {
  const { nx, ny, s } = A;
  const cx = mx.nc;
  const sc = new Float64Array(cx * my.nc * 36);
  const X = parentLists(mx);
  const Y = parentLists(my);
  for (let j = 0; j < ny; j++) {
    for (let i = 0; i < nx; i++) {
      const n = j * nx + i;
      for (let k = 0; k < 9; k++) {
        const ii = i + (k % 3) - 1;
        const jj = j + ((k / 3) | 0) - 1;
        if (ii < 0 || jj < 0 || ii >= nx || jj >= ny) continue;
        const o = n * 36 + k * 4;
        const a00 = s[o];
        const a01 = s[o + 1];
        const a10 = s[o + 2];
        const a11 = s[o + 3];
        if (a00 === 0 && a01 === 0 && a10 === 0 && a11 === 0) continue;
        for (let py = 0; py < Y.cnt[j]; py++) {
          const PJ = Y.idx[2 * j + py];
          const wpy = Y.wt[2 * j + py];
          for (let px = 0; px < X.cnt[i]; px++) {
            const PI = X.idx[2 * i + px];
            const wp = wpy * X.wt[2 * i + px];
            const rowBase = (PJ * cx + PI) * 36;
            for (let qy = 0; qy < Y.cnt[jj]; qy++) {
              const QJ = Y.idx[2 * jj + qy];
              const wpq = wp * Y.wt[2 * jj + qy];
              const slotRow = rowBase + (QJ - PJ + 1) * 12;
              for (let qx = 0; qx < X.cnt[ii]; qx++) {
                const w = wpq * X.wt[2 * ii + qx];
                const t = slotRow + (X.idx[2 * ii + qx] - PI + 1) * 4;
                sc[t] += w * a00;
                sc[t + 1] += w * a01;
                sc[t + 2] += w * a10;
                sc[t + 3] += w * a11;
              }
            }
          }
        }
      }
    }
  }
  return { nx: cx, ny: my.nc, s: sc };
}

/** rc = Pᵀ rf. */
function restrict(mx: AxisMap, my: AxisMap, rf: Float64Array, rc: Float64Array): void {
  rc.fill(0);
  const cx = mx.nc;
  for (let j = 0; j < my.nf; j++) {
    const yj = my.p0[j];
    const yw = my.w0[j];
    for (let i = 0; i < mx.nf; i++) {
      const xi = mx.p0[i];
      const xw = mx.w0[i];
      const u = rf[2 * (j * mx.nf + i)];
      const v = rf[2 * (j * mx.nf + i) + 1];
      for (let b = 0; b < 2; b++) {
        const wy = b === 0 ? yw : 1 - yw;
        if (wy === 0) continue;
        for (let a = 0; a < 2; a++) {
          const w = (a === 0 ? xw : 1 - xw) * wy;
          if (w === 0) continue;
          const c = (yj + b) * cx + xi + a;
          rc[2 * c] += w * u;
          rc[2 * c + 1] += w * v;
        }
      }
    }
  }
}

/** xf += P xc. */
function prolongAdd(mx: AxisMap, my: AxisMap, xc: Float64Array, xf: Float64Array): void {
  const cx = mx.nc;
  for (let j = 0; j < my.nf; j++) {
    const yj = my.p0[j];
    const yw = my.w0[j];
    for (let i = 0; i < mx.nf; i++) {
      const xi = mx.p0[i];
      const xw = mx.w0[i];
      let u = 0;
      let v = 0;
      for (let b = 0; b < 2; b++) {
        const wy = b === 0 ? yw : 1 - yw;
        if (wy === 0) continue;
        for (let a = 0; a < 2; a++) {
          const w = (a === 0 ? xw : 1 - xw) * wy;
          if (w === 0) continue;
          const c = (yj + b) * cx + xi + a;
          u += w * xc[2 * c];
          v += w * xc[2 * c + 1];
        }
      }
      const f = 2 * (j * mx.nf + i);
      xf[f] += u;
      xf[f + 1] += v;
    }
  }
}

/** Largest number of coarsest-level dofs solved directly. */
export const COARSEST_DOFS = 1500;

export interface Multigrid {
  readonly levels: number;
  /** z = M⁻¹ r by one V-cycle. */
  precondition(r: Float64Array, z: Float64Array): void;
}

/** `A` with the fixed dofs eliminated. */
export function buildMultigrid(A: Stencil, coarsestDofs = COARSEST_DOFS): Multigrid {
  const levels: Level[] = [];
  let cur = A;
  for (;;) {
    const dofs = 2 * cur.nx * cur.ny;
    const mx = axisMap(cur.nx);
    const my = axisMap(cur.ny);
    const done = dofs <= coarsestDofs || (mx.nc === cur.nx && my.nc === cur.ny);
    const vecs = { r: new Float64Array(dofs), b: new Float64Array(dofs), x: new Float64Array(dofs) };
    if (done) {
      levels.push({ A: cur, ...vecs });
      break;
    }
    levels.push({ A: cur, mx, my, ...vecs });
    cur = galerkin(cur, mx, my);
  }
  const coarse: BandedCholesky = factorBanded(levels[levels.length - 1].A);

  const vcycle = (l: number, b: Float64Array, x: Float64Array): void => {
    const L = levels[l];
    if (l === levels.length - 1) {
      x.set(b);
      solveBanded(coarse, x);
      return;
    }
    x.fill(0);
    gaussSeidel(L.A, x, b, true);
    residualAfterForwardSweep(L.A, x, L.r);
    const next = levels[l + 1];
    restrict(L.mx!, L.my!, L.r, next.b);
    vcycle(l + 1, next.b, next.x);
    prolongAdd(L.mx!, L.my!, next.x, x);
    gaussSeidel(L.A, x, b, false);
  };

  return {
    levels: levels.length,
    precondition(r, z) {
      vcycle(0, r, z);
    },
  };
}
