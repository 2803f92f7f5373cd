/**
 * Medial samples between neighbouring pixels: where the nearest boundary segment changes between two pixels,
 * the point on the line between their centres equidistant from both segments, with its radius, separation angle
 * θ (Foskey, Lin & Manocha, "Efficient computation of a simplified medial axis", Proc. 8th ACM Symposium on Solid
 * Modeling and Applications, 2003, DOI 10.1145/781606.781623 — DOI from memory) and phase. Samples with θ ≥ 90°
 * inside the domain are kept. Steps and the reasons for them: docs/notes/morph.md, "Medial samples".
 * Frame: pixel units of frame.ts (pixel (i, j) centred at (i, j), y up).
 */
import { footTo, type NearestField } from './nearest.js';
import type { Frame } from './frame.js';
import { type SegmentSet, segDist2, sideOf } from './segments.js';
import { snapToVertex } from './vertex.js';
import { bands, runSplit } from '../parallel/lanes.js';
import type { RasterScratch } from './scratch.js';
import { rasterLanes } from './split.js';

/** Medial samples, pixel units. */
export interface MedialSamples {
  readonly n: number;
  readonly x: Float64Array;
  readonly y: Float64Array;
  /** Radius of the disc touching both segments, pixel units. */
  readonly r: Float64Array;
  /** cos θ of the separation angle at the sample. */
  readonly cos: Float32Array;
  /** 1 solid, 0 void. */
  readonly solid: Uint8Array;
}

/** cos 120°: samples at or below count for the width checks (θ-simplified medial axis, θ = 120°). */
export const COUNT_COS = -0.5;

/** Bytes of one sample: x, y, r (8 each), cos (4), solid (1). */
const SAMPLE_BYTES = 29;

/** A byte range of a buffer where a band writes its samples first (8-aligned offset). */
export interface SampleArea {
  readonly buffer: ArrayBufferLike;
  readonly offset: number;
  readonly bytes: number;
}

/**
 * Finds the medial samples of both phases, in raster order of the pair's first pixel. Each row's pairs are
 * independent of the others', so large rasters are split into row bands (src/parallel) and the bands' samples
 * joined in order: the same samples in the same order. With `scratch` (scratch.ts) the bands write into it and
 * only the joined samples take new memory.
 */
export function medialSamples(frame: Frame, set: SegmentSet, field: NearestField, phase: Uint8Array, scratch?: RasterScratch): MedialSamples {
  const parts = bands(frame.ny, rasterLanes(frame.nx * frame.ny));
  if (!scratch) return joinBands(frame, set, field, phase, parts, null);
  return scratch.use((f64) => {
    // each band its share of the buffer; lanes write into it only when it is shared memory
    const buffer = f64.buffer;
    if (parts.length > 1 && !(buffer instanceof SharedArrayBuffer)) return joinBands(frame, set, field, phase, parts, null);
    const share = 8 * Math.floor(f64.byteLength / parts.length / 8);
    const areas = parts.map((_, k): SampleArea => ({ buffer, offset: f64.byteOffset + k * share, bytes: share }));
    return joinBands(frame, set, field, phase, parts, areas);
  });
}

/** The samples of row bands `parts`, joined in order; band k writes into areas[k] first when given (then copied out). */
function joinBands(
  frame: Frame, set: SegmentSet, field: NearestField, phase: Uint8Array,
  parts: readonly (readonly [number, number])[], areas: readonly SampleArea[] | null,
): MedialSamples {
  const calls = parts.map(([a, b], k): Parameters<typeof medialRows> => [frame, set, field, phase, a, b, areas ? areas[k] : undefined]);
  if (parts.length === 1 && !areas) return medialRows(...calls[0]);
  const got = parts.length === 1 ? [medialRows(...calls[0])] : runSplit(import.meta.url, 'medialRows', medialRows, calls);
  const n = got.reduce((m, g) => m + g.n, 0);
  const X = new Float64Array(n), Y = new Float64Array(n), R = new Float64Array(n);
  const C = new Float32Array(n);
  const S = new Uint8Array(n);
  let o = 0;
  for (const g of got) {
    X.set(g.x, o); Y.set(g.y, o); R.set(g.r, o); C.set(g.cos, o); S.set(g.solid, o);
    o += g.n;
  }
  return { n, x: X, y: Y, r: R, cos: C, solid: S };
}

/**
 * The medial samples of the pairs whose first pixel lies in rows j0 … j1 − 1; written into `area` while they fit
 * (the result then views it), into new arrays beyond.
 */
export function medialRows(
  frame: Frame, set: SegmentSet, field: NearestField, phase: Uint8Array, j0: number, j1: number, area?: SampleArea,
): MedialSamples {
  const { nx, ny, box } = frame;
  const { seg, dist } = field;
  const foot = new Float32Array(4);
  const geo = set.geo;
  const fit = area ? Math.floor(area.bytes / SAMPLE_BYTES) : 0;
  let cap = fit > 0 ? fit : 1024;
  let X: Float64Array, Y: Float64Array, R: Float64Array, C: Float32Array, S: Uint8Array;
  if (area && fit > 0) {
    const { buffer, offset } = area;
    X = new Float64Array(buffer, offset, cap);
    Y = new Float64Array(buffer, offset + 8 * cap, cap);
    R = new Float64Array(buffer, offset + 16 * cap, cap);
    C = new Float32Array(buffer, offset + 24 * cap, cap);
    S = new Uint8Array(buffer, offset + 28 * cap, cap);
  } else {
    X = new Float64Array(cap); Y = new Float64Array(cap); R = new Float64Array(cap);
    C = new Float32Array(cap);
    S = new Uint8Array(cap);
  }
  let n = 0;
  const push = (x: number, y: number, r: number, c: number, s: number): void => {
    if (n === cap) {
      cap *= 2;
      const grow = <T extends Float64Array | Float32Array | Uint8Array>(a: T, b: T): T => (b.set(a), b);
      X = grow(X, new Float64Array(cap));
      Y = grow(Y, new Float64Array(cap));
      R = grow(R, new Float64Array(cap));
      C = grow(C, new Float32Array(cap));
      S = grow(S, new Uint8Array(cap));
    }
    X[n] = x; Y[n] = y; R[n] = r; C[n] = c; S[n] = s;
    n++;
  };
  const dist2 = (s: number, px: number, py: number): number => segDist2(geo, s, px, py);
  const g = (a: number, b: number, px: number, py: number): number =>
    Math.sqrt(dist2(a, px, py)) - Math.sqrt(dist2(b, px, py));

  const pair = (p: number, q: number, pi: number, pj: number, qi: number, qj: number): void => {
    const a = seg[p], b = seg[q];
    if (a === b || a < 0 || b < 0) return;
    const sp = phase[p] === 1 ? 1 : -1, sq = phase[q] === 1 ? 1 : -1;
    footTo(geo, a, pi, pj, foot, 0);
    footTo(geo, b, qi, qj, foot, 2);
    const dot = sp * sq * (foot[0] * foot[2] + foot[1] * foot[3]);
    if (dot > 0.5 * dist[p] * dist[q]) return;
    // root of g(t) = D_a − D_b along p → q; g(0) ≤ 0 ≤ g(1) when a, b are the nearest of p, q
    let t0 = 0, t1 = 1;
    let g0 = dist[p] - Math.sqrt(dist2(b, pi, pj));
    let g1 = Math.sqrt(dist2(a, qi, qj)) - dist[q];
    if (!(g0 <= 0 && g1 >= 0)) return;
    const ex = qi - pi, ey = qj - pj;
    let t = g1 === g0 ? 0.5 : g0 / (g0 - g1);
    for (let it = 0; it < 3; it++) {
      const gt = g(a, b, pi + t * ex, pj + t * ey);
      if (Math.abs(gt) < 1e-7) break;
      if (gt < 0) { t0 = t; g0 = gt; } else { t1 = t; g1 = gt; }
      t = t0 + ((t1 - t0) * g0) / (g0 - g1);
    }
    const cx = pi + t * ex, cy = pj + t * ey;
    if (cx < box[0] || cx > box[2] || cy < box[1] || cy > box[3]) return;
    // feet and separation angle
    const oa = 5 * a, ob = 5 * b;
    let ta = ((cx - geo[oa]) * geo[oa + 2] + (cy - geo[oa + 1]) * geo[oa + 3]) * geo[oa + 4];
    ta = ta < 0 ? 0 : ta > 1 ? 1 : ta;
    let tb = ((cx - geo[ob]) * geo[ob + 2] + (cy - geo[ob + 1]) * geo[ob + 3]) * geo[ob + 4];
    tb = tb < 0 ? 0 : tb > 1 ? 1 : tb;
    const ax = geo[oa] + ta * geo[oa + 2] - cx, ay = geo[oa + 1] + ta * geo[oa + 3] - cy;
    const bx = geo[ob] + tb * geo[ob + 2] - cx, by = geo[ob + 1] + tb * geo[ob + 3] - cy;
    const da = Math.sqrt(ax * ax + ay * ay), db = Math.sqrt(bx * bx + by * by);
    if (!(da > 1e-9 && db > 1e-9)) return;
    const cos = (ax * bx + ay * by) / (da * db);
    if (cos > 0) return;
    // the sides of a and b agree at a true medial point; where they do not, a third segment is closer
    const sa = sideOf(set, a, cx, cy), sb = sideOf(set, b, cx, cy);
    if ((sa > 0 && sb < 0) || (sa < 0 && sb > 0)) return;
    const solid = (sa !== 0 ? sa : sb) > 0 ? 1 : 0;
    const v = snapToVertex(set, seg, nx, ny, a, b, cx, cy, 0.5 * (da + db), solid === 1 ? 1 : -1);
    if (v && v.x >= box[0] && v.x <= box[2] && v.y >= box[1] && v.y <= box[3]) push(v.x, v.y, v.r, v.cos, solid);
    else push(cx, cy, 0.5 * (da + db), cos, solid);
  };

  for (let j = j0; j < j1; j++) {
    for (let i = 0; i < nx; i++) {
      const p = j * nx + i;
      if (i + 1 < nx) pair(p, p + 1, i, j, i + 1, j);
      if (j + 1 < ny) {
        pair(p, p + nx, i, j, i, j + 1);
        if (i + 1 < nx) pair(p, p + nx + 1, i, j, i + 1, j + 1);
        if (i > 0) pair(p, p + nx - 1, i, j, i - 1, j + 1);
      }
    }
  }
  return { n, x: X.subarray(0, n), y: Y.subarray(0, n), r: R.subarray(0, n), cos: C.subarray(0, n), solid: S.subarray(0, n) };
}
