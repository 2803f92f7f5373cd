/**
 * Distance transform of a sampled function with the location of the minimum.
 *
 * D(p) = min_q |p − q|² + f(q) over the pixels q of an nx × ny raster (pixel units, row-major, j up), by the
 * separable lower-envelope-of-parabolas algorithm of P.F. Felzenszwalb & D.P. Huttenlocher, "Distance transforms
 * of sampled functions", Theory of Computing 8(19):415–428, 2012, DOI 10.4086/toc.2012.v008a019: a 1-D pass down
 * every column, then a 1-D pass along every row. f may be any finite value (negative too: with f = −ρ² it is the
 * power distance to discs of radius ρ) or +Infinity (no sample). Linear time.
 */

export interface SampledTransform {
  /** min_q |p − q|² + f(q); +Infinity where f is +Infinity everywhere. */
  readonly value: Float64Array;
  /** Index of the minimising pixel q; −1 where there is none. */
  readonly arg: Int32Array;
}

/** 2-D transform of `f` (length nx·ny). */
export function sampledTransform(f: Float64Array, nx: number, ny: number): SampledTransform {
  const m = Math.max(nx, ny);
  const v = new Int32Array(m);
  const z = new Float64Array(m + 1);
  const fin = new Float64Array(m);
  const out = new Float64Array(m);
  const argl = new Int32Array(m);
  const colVal = new Float64Array(nx * ny);
  const colArg = new Int32Array(nx * ny);
  for (let i = 0; i < nx; i++) {
    for (let j = 0; j < ny; j++) fin[j] = f[j * nx + i];
    envelope(fin, ny, out, argl, v, z);
    for (let j = 0; j < ny; j++) {
      colVal[j * nx + i] = out[j];
      colArg[j * nx + i] = argl[j];
    }
  }
  const value = new Float64Array(nx * ny);
  const arg = new Int32Array(nx * ny);
  for (let j = 0; j < ny; j++) {
    const row = j * nx;
    for (let i = 0; i < nx; i++) fin[i] = colVal[row + i];
    envelope(fin, nx, out, argl, v, z);
    for (let i = 0; i < nx; i++) {
      value[row + i] = out[i];
      const a = argl[i];
      arg[row + i] = a < 0 ? -1 : colArg[row + a] * nx + a;
    }
  }
  return { value, arg };
}

/** 1-D lower envelope: out[x] = min_q (x − q)² + f[q], argOut[x] = the minimising q (−1 if none). */
function envelope(f: Float64Array, n: number, out: Float64Array, argOut: Int32Array, v: Int32Array, z: Float64Array): void {
  let k = -1;
  for (let q = 0; q < n; q++) {
    const fq = f[q];
    if (!(fq < Infinity)) continue;
    let s = -Infinity;
    while (k >= 0) {
      const r = v[k];
      s = (fq + q * q - (f[r] + r * r)) / (2 * (q - r));
      if (s > z[k]) break;
      k--;
    }
    k++;
    v[k] = q;
    z[k] = k === 0 ? -Infinity : s;
    z[k + 1] = Infinity;
  }
  if (k < 0) {
    out.fill(Infinity, 0, n);
    argOut.fill(-1, 0, n);
    return;
  }
  let h = 0;
  for (let x = 0; x < n; x++) {
    while (z[h + 1] < x) h++;
    const r = v[h];
    out[x] = (x - r) * (x - r) + f[r];
    argOut[x] = r;
  }
}
