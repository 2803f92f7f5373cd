/**
 * Feature transform: for every pixel, the boundary segment nearest to its centre, and the exact distance.
 *
 * Frame: pixel units of raster.ts (pixel (i, j) centred at (i, j), y up). The boundary is the segment list of
 * segments.ts, shared by both phases, so one transform serves the solid and the void.
 *
 * Method: vector propagation in the spirit of P.-E. Danielsson, "Euclidean distance mapping", Computer Graphics
 * and Image Processing 14(3):227–248, 1980, DOI 10.1016/0146-664X(80)90054-4 — but what travels is the id of the
 * nearest *segment*, and every comparison uses the exact point–segment distance to the receiving pixel's centre,
 * so the result is exact wherever the nearest segment of a pixel is the nearest segment of one of its
 * neighbours (Danielsson's rare propagation failures stay, and are sub-pixel).
 * 1. Seed: each segment is walked in steps of ½ pixel; the 3×3 pixels around each step take the segment if it is
 *    closer than what they hold.
 * 2. Sweep: a forward raster pass (neighbours W, SW, S, SE, then E right-to-left) and its backward mirror
 *    (E, NE, N, NW, then W left-to-right): the 8-neighbour four-scan scheme; the pair of passes runs twice.
 * 3. Polish: each pixel walks along the ring of its segment (previous / next) while that is closer.
 */
import type { Frame } from './frame.js';
import { type SegmentSet, segDist2 } from './segments.js';

export interface NearestField {
  /** Nearest segment id per pixel; −1 when there is no boundary at all. */
  readonly seg: Int32Array;
  /** Vector from the pixel centre to its nearest boundary point, pixel units. */
  readonly vx: Float32Array;
  readonly vy: Float32Array;
  /** Unsigned distance from the pixel centre to the boundary, pixel units (Infinity without a boundary). */
  readonly dist: Float32Array;
}

/** Computes the nearest segment, the foot vector and the distance of every pixel of `frame`. */
export function nearestField(frame: Frame, set: SegmentSet): NearestField {
  const { nx, ny } = frame;
  const N = nx * ny;
  const seg = new Int32Array(N).fill(-1);
  const best = new Float64Array(N).fill(Infinity);
  const geo = set.geo;

  // 1. seeds
  for (let s = 0; s < set.n; s++) {
    const o = 5 * s;
    const ax = geo[o], ay = geo[o + 1], dx = geo[o + 2], dy = geo[o + 3];
    const steps = Math.ceil(2 * Math.sqrt(dx * dx + dy * dy)) + 1;
    for (let k = 0; k <= steps; k++) {
      const t = k / steps;
      const ci = Math.round(ax + t * dx);
      const cj = Math.round(ay + t * dy);
      const j0 = Math.max(0, cj - 1), j1 = Math.min(ny - 1, cj + 1);
      const i0 = Math.max(0, ci - 1), i1 = Math.min(nx - 1, ci + 1);
      for (let j = j0; j <= j1; j++) {
        for (let i = i0; i <= i1; i++) {
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
  if (set.n > 0) {
    for (let round = 0; round < 2; round++) sweep(nx, ny, seg, best, geo);
  }

  // 3. foot vectors and distances
  const vx = new Float32Array(N);
  const vy = new Float32Array(N);
  const dist = new Float32Array(N).fill(Infinity);
  const d2 = (s: number, i: number, j: number): number => segDist2(geo, s, i, j);
  const { prev, next } = set;
  for (let j = 0, p = 0; j < ny; j++) {
    for (let i = 0; i < nx; i++, p++) {
      let s = seg[p];
      if (s < 0) continue;
      // walk along the ring while a neighbouring segment is closer: short segments of a curve have Voronoi
      // wedges thinner than a pixel, which propagation between pixel centres can step over
      let b = best[p];
      for (let t = prev[s], e = d2(t, i, j); e < b && t !== s; t = prev[t], e = d2(t, i, j)) { s = t; b = e; }
      for (let t = next[s], e = d2(t, i, j); e < b && t !== s; t = next[t], e = d2(t, i, j)) { s = t; b = e; }
      seg[p] = s;
      const o = 5 * s;
      const ax = geo[o], ay = geo[o + 1], dx = geo[o + 2], dy = geo[o + 3];
      let u = ((i - ax) * dx + (j - ay) * dy) * geo[o + 4];
      u = u < 0 ? 0 : u > 1 ? 1 : u;
      const fx = ax + u * dx - i, fy = ay + u * dy - j;
      vx[p] = fx;
      vy[p] = fy;
      dist[p] = Math.sqrt(fx * fx + fy * fy);
    }
  }
  return { seg, vx, vy, dist };
}

/** One forward and one backward four-scan pass (8 neighbours). */
function sweep(nx: number, ny: number, seg: Int32Array, best: Float64Array, geo: Float64Array): void {
  // Takes segment seg[q] for pixel p = (i, j) when it is closer to p's centre.
  const take = (p: number, q: number, i: number, j: number): void => {
    const s = seg[q];
    if (s < 0 || s === seg[p]) return;
    const d2 = segDist2(geo, s, i, j);
    if (d2 < best[p]) {
      best[p] = d2;
      seg[p] = s;
    }
  };
  for (let j = 0; j < ny; j++) {
    const row = j * nx;
    for (let i = 0; i < nx; i++) {
      const p = row + i;
      if (i > 0) take(p, p - 1, i, j);
      if (j > 0) {
        if (i > 0) take(p, p - nx - 1, i, j);
        take(p, p - nx, i, j);
        if (i < nx - 1) take(p, p - nx + 1, i, j);
      }
    }
    for (let i = nx - 2; i >= 0; i--) take(row + i, row + i + 1, i, j);
  }
  for (let j = ny - 1; j >= 0; j--) {
    const row = j * nx;
    for (let i = nx - 1; i >= 0; i--) {
      const p = row + i;
      if (i < nx - 1) take(p, p + 1, i, j);
      if (j < ny - 1) {
        if (i < nx - 1) take(p, p + nx + 1, i, j);
        take(p, p + nx, i, j);
        if (i > 0) take(p, p + nx - 1, i, j);
      }
    }
    for (let i = 1; i < nx; i++) take(row + i, row + i - 1, i, j);
  }
}
