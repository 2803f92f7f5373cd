/** Coarsening a cell field: area-weighted means over ⌈nx/c⌉ × ⌈ny/c⌉ coarse cells, the domain unchanged. O(fine cells). */

/** Overlaps of fine cells with coarse cells, as (first fine, weights) per coarse cell. */
function axisWeights(n: number, m: number): { start: Int32Array; count: Int32Array; w: Float64Array; stride: number } {
  const r = n / m;
  const stride = Math.ceil(r) + 1;
  const start = new Int32Array(m);
  const count = new Int32Array(m);
  const w = new Float64Array(m * stride);
  for (let I = 0; I < m; I++) {
    const a = I * r;
    const b = Math.min(n, (I + 1) * r);
    const i0 = Math.floor(a);
    start[I] = i0;
    let k = 0;
    for (let i = i0; i < n && i < b; i++) {
      const len = Math.min(b, i + 1) - Math.max(a, i);
      if (len > 0) w[I * stride + k] = len / r;
      k++;
    }
    count[I] = k;
  }
  return { start, count, w, stride };
}

/** `values` (nx × ny, values[j·nx + i]) coarsened by the integer factor c ≥ 1. */
export function coarsenCells(values: Float64Array, nx: number, ny: number, c: number): { values: Float64Array; nx: number; ny: number } {
  if (!(Number.isInteger(c) && c >= 1)) throw new RangeError(`coarsening factor must be an integer ≥ 1, found ${c}`);
  if (c === 1) return { values, nx, ny };
  const mx = Math.ceil(nx / c);
  const my = Math.ceil(ny / c);
  const ax = axisWeights(nx, mx);
  const ay = axisWeights(ny, my);
  const tmp = new Float64Array(mx * ny);
  for (let j = 0; j < ny; j++) {
    for (let I = 0; I < mx; I++) {
      let s = 0;
      for (let k = 0; k < ax.count[I]; k++) s += ax.w[I * ax.stride + k] * values[j * nx + ax.start[I] + k];
      tmp[j * mx + I] = s;
    }
  }
  const out = new Float64Array(mx * my);
  for (let J = 0; J < my; J++) {
    for (let k = 0; k < ay.count[J]; k++) {
      const w = ay.w[J * ay.stride + k];
      const row = (ay.start[J] + k) * mx;
      for (let I = 0; I < mx; I++) out[J * mx + I] += w * tmp[row + I];
    }
  }
  return { values: out, nx: mx, ny: my };
}

/** Nodal samples → the (N − 1) × (M − 1) cells between them, each the mean of its four corners (DESIGN §12). */
export function nodalToCells(values: Float64Array, nx: number, ny: number): { values: Float64Array; nx: number; ny: number } {
  if (!(nx >= 2 && ny >= 2)) throw new RangeError(`a nodal grid needs at least 2 × 2 samples, found ${nx} × ${ny}`);
  const ex = nx - 1;
  const ey = ny - 1;
  const out = new Float64Array(ex * ey);
  for (let j = 0; j < ey; j++) {
    for (let i = 0; i < ex; i++) {
      const k = j * nx + i;
      out[j * ex + i] = 0.25 * (values[k] + values[k + 1] + values[k + nx] + values[k + nx + 1]);
    }
  }
  return { values: out, nx: ex, ny: ey };
}
