/**
 * Snapping a medial sample onto a medial vertex: where a third segment e is closer to the sample than its two
 * segments a and b, the point equidistant from the three segment lines (σ·n_s·(x − a_s) = ρ, a 3 × 3 system by
 * Cramer's rule) replaces it when valid (docs/notes/morph.md, "Medial samples").
 * Frame: pixel units of frame.ts (pixel (i, j) centred at (i, j), y up).
 */
import type { SegmentSet } from './segments.js';
import { segDist2 } from './segments.js';
import { hypot } from '../geom/portable-math.js';

/** Closer than the sample radius by more than this (pixel units) counts as an intruder. */
const INTRUDE = 0.01;
/** Agreement asked of the snapped vertex (pixel units). */
const AGREE = 0.02;

export interface Snapped {
  x: number;
  y: number;
  r: number;
  cos: number;
}

/**
 * Checks the sample (x, y) of radius r between segments a and b against the segments held by the 3×3 pixels
 * around it; returns the medial vertex when a third segment intrudes and the vertex is valid, else null.
 */
export function snapToVertex(
  set: SegmentSet,
  seg: Int32Array,
  nx: number,
  ny: number,
  a: number,
  b: number,
  x: number,
  y: number,
  r: number,
  sigma: number,
): Snapped | null {
  const geo = set.geo;
  let e = -1;
  let de = (r - INTRUDE) * (r - INTRUDE);
  if (!(r > INTRUDE)) return null;
  const ci = Math.round(x), cj = Math.round(y);
  for (let j = Math.max(0, cj - 1); j <= Math.min(ny - 1, cj + 1); j++) {
    for (let i = Math.max(0, ci - 1); i <= Math.min(nx - 1, ci + 1); i++) {
      const s = seg[j * nx + i];
      if (s < 0 || s === a || s === b || s === e) continue;
      const d2 = segDist2(geo, s, x, y);
      if (d2 < de) {
        de = d2;
        e = s;
      }
    }
  }
  if (e < 0) return null;
  const n = set.normal;
  // rows: σ n_s · x − ρ = σ n_s · a_s
  const rows = [a, b, e].map((s) => {
    const ux = sigma * n[2 * s], uy = sigma * n[2 * s + 1];
    return [ux, uy, -1, ux * geo[5 * s] + uy * geo[5 * s + 1]];
  });
  const det3 = (c0: number, c1: number, c2: number): number =>
    rows[0][c0] * (rows[1][c1] * rows[2][c2] - rows[1][c2] * rows[2][c1]) -
    rows[0][c1] * (rows[1][c0] * rows[2][c2] - rows[1][c2] * rows[2][c0]) +
    rows[0][c2] * (rows[1][c0] * rows[2][c1] - rows[1][c1] * rows[2][c0]);
  const D = det3(0, 1, 2);
  if (!(Math.abs(D) > 1e-9)) return null;
  const vx = det3(3, 1, 2) / D, vy = det3(0, 3, 2) / D, rho = det3(0, 1, 3) / D;
  if (!(rho > 0) || hypot(vx - x, vy - y) > 2) return null;
  for (const s of [a, b, e]) if (Math.abs(Math.sqrt(segDist2(geo, s, vx, vy)) - rho) > AGREE) return null;
  const vi = Math.round(vx), vj = Math.round(vy);
  const lim = (rho - AGREE) * (rho - AGREE);
  for (let j = Math.max(0, vj - 1); j <= Math.min(ny - 1, vj + 1); j++) {
    for (let i = Math.max(0, vi - 1); i <= Math.min(nx - 1, vi + 1); i++) {
      const s = seg[j * nx + i];
      if (s >= 0 && rho > AGREE && segDist2(geo, s, vx, vy) < lim) return null;
    }
  }
  const dot = (s: number, t: number): number => n[2 * s] * n[2 * t] + n[2 * s + 1] * n[2 * t + 1];
  return { x: vx, y: vy, r: rho, cos: Math.min(dot(a, b), dot(a, e), dot(b, e)) };
}
