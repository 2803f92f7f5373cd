/**
 * Feature transform: for every pixel, the boundary segment nearest to its centre and the exact distance; the
 * foot vector on demand (footTo). One transform serves both phases (the segment list of segments.ts).
 *
 * Vector propagation after P.-E. Danielsson, "Euclidean distance mapping", Computer Graphics and Image
 * Processing 14(3):227–248, 1980, DOI 10.1016/0146-664X(80)90054-4, carrying segment ids and comparing exact
 * point–segment distances: seed, two rounds of the 8-neighbour four-scan sweep, polish along the rings
 * (docs/notes/morph.md, "Feature transform"). Frame: pixel units of frame.ts (pixel (i, j) centred at (i, j), y up).
 */
import type { Frame } from './frame.js';
import { bands, float32, float64, int32, runSplit } from '../parallel/lanes.js';
import { rasterLanes } from './split.js';
import { type SegmentSet, segDist2 } from './segments.js';

export interface NearestField {
  /** Nearest segment id per pixel; −1 when there is no boundary at all. */
  readonly seg: Int32Array;
  /** Unsigned distance from the pixel centre to the boundary, pixel units (Infinity without a boundary). */
  readonly dist: Float32Array;
}

/**
 * The feature transform of `frame`; seeding and polish split into row bands on large rasters, sweeps serial.
 * `best` (nx·ny values, shared memory when the raster is split; overwritten) holds the squared distances while
 * it runs: a scratch buffer the caller may reuse afterwards; a new one when not given.
 */
export function nearestField(frame: Frame, set: SegmentSet, best?: Float64Array): NearestField {
  const { nx, ny } = frame;
  const N = nx * ny;
  const lanes = rasterLanes(N);
  const shared = lanes > 1;
  if (best !== undefined && (best.length !== N || (shared && !(best.buffer instanceof SharedArrayBuffer)))) {
    throw new RangeError(`nearestField: expected a scratch of ${N} values${shared ? ' in shared memory' : ''}, found ${best.length}`);
  }
  const seg = int32(N, shared).fill(-1);
  best = (best ?? float64(N, shared)).fill(Infinity);
  const dist = float32(N, shared).fill(Infinity);
  const { geo, prev, next } = set;
  const rows = bands(ny, lanes);
  const here = import.meta.url;
  runSplit(here, 'seedRows', seedRows, rows.map(([a, b]) => [geo, set.n, seg, best, nx, ny, a, b] as const));
  if (set.n > 0) {
    for (let round = 0; round < 2; round++) sweep(nx, ny, seg, best, geo);
  }
  runSplit(here, 'polishRows', polishRows, rows.map(([a, b]) => [geo, prev, next, seg, best, dist, nx, a, b] as const));
  return { seg, dist };
}

/** Seeds rows j0 … j1 − 1: the 3×3 pixels around each ½-pixel step of each segment (in id order) take it when closer. */
export function seedRows(
  geo: Float64Array, n: number, seg: Int32Array, best: Float64Array, nx: number, ny: number, j0: number, j1: number,
): void {
  for (let s = 0; s < n; s++) {
    const o = 5 * s;
    const ax = geo[o], ay = geo[o + 1], dx = geo[o + 2], dy = geo[o + 3];
    if (Math.max(ay, ay + dy) < j0 - 2 || Math.min(ay, ay + dy) > j1 + 1) continue;
    const steps = Math.ceil(2 * Math.sqrt(dx * dx + dy * dy)) + 1;
    for (let k = 0; k <= steps; k++) {
      const t = k / steps;
      const ci = Math.round(ax + t * dx);
      const cj = Math.round(ay + t * dy);
      const ja = Math.max(j0, 0, cj - 1), jb = Math.min(j1 - 1, ny - 1, cj + 1);
      const ia = Math.max(0, ci - 1), ib = Math.min(nx - 1, ci + 1);
      for (let j = ja; j <= jb; j++) {
        for (let i = ia; i <= ib; i++) {
          const p = j * nx + i;
          if (seg[p] === s) continue;
          const d2 = segDist2(geo, s, i, j);
          if (d2 < best[p]) {
            best[p] = d2;
            seg[p] = s;
          }
        }
      }
    }
  }
}

/** Polishes rows j0 … j1 − 1: walk along the ring while a neighbouring segment is closer; then the distance. */
export function polishRows(
  geo: Float64Array, prev: Int32Array, next: Int32Array, seg: Int32Array, best: Float64Array,
  dist: Float32Array, nx: number, j0: number, j1: number,
): void {
  for (let j = j0, p = j0 * nx; j < j1; j++) {
    for (let i = 0; i < nx; i++, p++) {
      let s = seg[p];
      if (s < 0) continue;
      let b = best[p];
      for (let t = prev[s], e = segDist2(geo, t, i, j); e < b && t !== s; t = prev[t], e = segDist2(geo, t, i, j)) { s = t; b = e; }
      for (let t = next[s], e = segDist2(geo, t, i, j); e < b && t !== s; t = next[t], e = segDist2(geo, t, i, j)) { s = t; b = e; }
      seg[p] = s;
      const o = 5 * s;
      const ax = geo[o], ay = geo[o + 1], dx = geo[o + 2], dy = geo[o + 3];
      let u = ((i - ax) * dx + (j - ay) * dy) * geo[o + 4];
      u = u < 0 ? 0 : u > 1 ? 1 : u;
      const fx = ax + u * dx - i, fy = ay + u * dy - j;
      dist[p] = Math.sqrt(fx * fx + fy * fy);
    }
  }
}

/**
 * The vector from the centre of pixel (i, j) to its nearest point on segment s (pixel units; the foot the polish
 * measures `dist` from), rounded to single precision: out[k], out[k + 1]. Computed on demand rather than stored:
 * its readers need it at a small share of the pixels.
 */
export function footTo(geo: Float64Array, s: number, i: number, j: number, out: Float32Array, k: number): void {
  const o = 5 * s;
  const ax = geo[o], ay = geo[o + 1], dx = geo[o + 2], dy = geo[o + 3];
  let u = ((i - ax) * dx + (j - ay) * dy) * geo[o + 4];
  u = u < 0 ? 0 : u > 1 ? 1 : u;
  out[k] = ax + u * dx - i;
  out[k + 1] = ay + u * dy - j;
}

/** One forward and one backward four-scan pass (8 neighbours); a segment just tested for a pixel is not tested again. */
function sweep(nx: number, ny: number, seg: Int32Array, best: Float64Array, geo: Float64Array): void {
  for (let j = 0; j < ny; j++) {
    const row = j * nx;
    for (let i = 0; i < nx; i++) {
      const p = row + i;
      let cur = seg[p], b = best[p], last = cur;
      if (i > 0) {
        const s = seg[p - 1];
        if (s >= 0 && s !== last) { last = s; const d = segDist2(geo, s, i, j); if (d < b) { b = d; cur = s; } }
      }
      if (j > 0) {
        const q = p - nx;
        if (i > 0) {
          const s = seg[q - 1];
          if (s >= 0 && s !== last && s !== cur) { last = s; const d = segDist2(geo, s, i, j); if (d < b) { b = d; cur = s; } }
        }
        let s = seg[q];
        if (s >= 0 && s !== last && s !== cur) { last = s; const d = segDist2(geo, s, i, j); if (d < b) { b = d; cur = s; } }
        if (i < nx - 1) {
          s = seg[q + 1];
          if (s >= 0 && s !== last && s !== cur) { const d = segDist2(geo, s, i, j); if (d < b) { b = d; cur = s; } }
        }
      }
      seg[p] = cur;
      best[p] = b;
    }
    for (let i = nx - 2; i >= 0; i--) pull(row + i, row + i + 1, i, j, seg, best, geo);
  }
  for (let j = ny - 1; j >= 0; j--) {
    const row = j * nx;
    for (let i = nx - 1; i >= 0; i--) {
      const p = row + i;
      let cur = seg[p], b = best[p], last = cur;
      if (i < nx - 1) {
        const s = seg[p + 1];
        if (s >= 0 && s !== last) { last = s; const d = segDist2(geo, s, i, j); if (d < b) { b = d; cur = s; } }
      }
      if (j < ny - 1) {
        const q = p + nx;
        if (i < nx - 1) {
          const s = seg[q + 1];
          if (s >= 0 && s !== last && s !== cur) { last = s; const d = segDist2(geo, s, i, j); if (d < b) { b = d; cur = s; } }
        }
        let s = seg[q];
        if (s >= 0 && s !== last && s !== cur) { last = s; const d = segDist2(geo, s, i, j); if (d < b) { b = d; cur = s; } }
        if (i > 0) {
          s = seg[q - 1];
          if (s >= 0 && s !== last && s !== cur) { const d = segDist2(geo, s, i, j); if (d < b) { b = d; cur = s; } }
        }
      }
      seg[p] = cur;
      best[p] = b;
    }
    for (let i = 1; i < nx; i++) pull(row + i, row + i - 1, i, j, seg, best, geo);
  }
}

/** Pixel p = (i, j) takes the segment of pixel q when it is strictly closer to p's centre. */
function pull(p: number, q: number, i: number, j: number, seg: Int32Array, best: Float64Array, geo: Float64Array): void {
  const s = seg[q];
  if (s < 0 || s === seg[p]) return;
  const d = segDist2(geo, s, i, j);
  if (d < best[p]) {
    best[p] = d;
    seg[p] = s;
  }
}
