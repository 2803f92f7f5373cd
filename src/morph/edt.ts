/**
 * Distance transform of a sampled function with the location of the minimum: D(p) = min_q |p − q|² + f(q) over
 * an nx × ny raster (pixel units, row-major, j up), f finite (negative too) or +Infinity (no sample). Separable
 * lower envelope of parabolas, columns then rows: P.F. Felzenszwalb & D.P. Huttenlocher, "Distance transforms of
 * sampled functions", Theory of Computing 8(19):415–428, 2012, DOI 10.4086/toc.2012.v008a019. Large rasters split
 * each pass into bands (src/parallel) with the same arithmetic.
 */
import { bands, float64, int32, runSplit } from '../parallel/lanes.js';
import { rasterLanes } from './split.js';

export interface SampledTransform {
  /** min_q |p − q|² + f(q); +Infinity where f is +Infinity everywhere. */
  readonly value: Float64Array;
  /** Index of the minimising pixel q; −1 where there is none. */
  readonly arg: Int32Array;
}

/** Columns gathered at once in the column pass (one cache line of each row per block). */
const BLOCK = 16;

/** The array to fill with f for an nx·ny transform (shared memory when the transform will be split). */
export function transformInput(n: number): Float64Array {
  return float64(n, rasterLanes(n) > 1);
}

/** 2-D transform of `f` (length nx·ny), computed in place: the result's `value` is `f` itself. */
export function sampledTransform(f: Float64Array, nx: number, ny: number): SampledTransform {
  const n = nx * ny;
  const lanes = rasterLanes(n);
  const split = lanes > 1 && typeof SharedArrayBuffer !== 'undefined' && f.buffer instanceof SharedArrayBuffer;
  const arg = int32(n, split);
  if (!split) {
    columnPass(f, arg, nx, ny, 0, nx);
    rowPass(f, arg, nx, ny, 0, ny);
  } else {
    const here = import.meta.url;
    runSplit(here, 'columnPass', columnPass, bands(nx, lanes).map(([a, b]) => [f, arg, nx, ny, a, b] as const));
    runSplit(here, 'rowPass', rowPass, bands(ny, lanes).map(([a, b]) => [f, arg, nx, ny, a, b] as const));
  }
  return { value: f, arg };
}

/** Column pass over columns i0 … i1 − 1, in place: f ← the 1-D transform down each column, arg ← its row. */
export function columnPass(f: Float64Array, arg: Int32Array, nx: number, ny: number, i0: number, i1: number): void {
  const buf = new Float64Array(BLOCK * ny);
  const bufOut = new Float64Array(BLOCK * ny);
  const bufArg = new Int32Array(BLOCK * ny);
  const v = new Int32Array(ny);
  const z = new Float64Array(ny + 1);
  for (let a = i0; a < i1; a += BLOCK) {
    const w = Math.min(BLOCK, i1 - a);
    for (let j = 0, p = a; j < ny; j++, p += nx) for (let b = 0; b < w; b++) buf[b * ny + j] = f[p + b];
    for (let b = 0; b < w; b++) envelope(buf, b * ny, ny, bufOut, b * ny, bufArg, b * ny, v, z);
    for (let j = 0, p = a; j < ny; j++, p += nx) {
      for (let b = 0; b < w; b++) {
        f[p + b] = bufOut[b * ny + j];
        arg[p + b] = bufArg[b * ny + j];
      }
    }
  }
}

/** Row pass over rows j0 … j1 − 1, in place: value ← the 2-D transform, arg ← the minimising pixel index. */
export function rowPass(value: Float64Array, arg: Int32Array, nx: number, ny: number, j0: number, j1: number): void {
  const fin = new Float64Array(nx);
  const colArg = new Int32Array(nx);
  const argl = new Int32Array(nx);
  const v = new Int32Array(nx);
  const z = new Float64Array(nx + 1);
  for (let j = j0; j < j1; j++) {
    const row = j * nx;
    fin.set(value.subarray(row, row + nx));
    colArg.set(arg.subarray(row, row + nx));
    envelope(fin, 0, nx, value, row, argl, 0, v, z);
    for (let i = 0; i < nx; i++) {
      const a = argl[i];
      arg[row + i] = a < 0 ? -1 : colArg[a] * nx + a;
    }
  }
}

/**
 * 1-D lower envelope of the n samples f[fo …]: out[oo + x] = min_q (x − q)² + f[fo + q], argOut[ao + x] = the
 * minimising q (−1 if none). `out` must not overlap the samples.
 */
function envelope(
  f: Float64Array, fo: number, n: number,
  out: Float64Array, oo: number, argOut: Int32Array, ao: number,
  v: Int32Array, z: Float64Array,
): void {
  let k = -1;
  for (let q = 0; q < n; q++) {
    const fq = f[fo + q];
    if (!(fq < Infinity)) continue;
    let s = -Infinity;
    while (k >= 0) {
      const r = v[k];
      s = (fq + q * q - (f[fo + r] + r * r)) / (2 * (q - r));
      if (s > z[k]) break;
      k--;
    }
    k++;
    v[k] = q;
    z[k] = k === 0 ? -Infinity : s;
    z[k + 1] = Infinity;
  }
  if (k < 0) {
    out.fill(Infinity, oo, oo + n);
    argOut.fill(-1, ao, ao + n);
    return;
  }
  let h = 0;
  for (let x = 0; x < n; x++) {
    while (z[h + 1] < x) h++;
    const r = v[h];
    out[oo + x] = (x - r) * (x - r) + f[fo + r];
    argOut[ao + x] = r;
  }
}
