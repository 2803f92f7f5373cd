/** Signed area (shoelace) and perimeter of rings, mm, y up: CCW positive, CW (holes) negative. */
import type { Polygon, PolygonSet, Ring } from '../types.js';
import { hypot } from './portable-math.js';

/** Signed area, mm²: > 0 counter-clockwise, < 0 clockwise. */
export function ringArea(ring: Ring): number {
  const n = ring.length;
  if (n < 3) return 0;
  // relative to the first vertex, against cancellation far from the origin
  const [x0, y0] = ring[0];
  let s = 0;
  let px = ring[1][0] - x0;
  let py = ring[1][1] - y0;
  for (let k = 2; k < n; k++) {
    const qx = ring[k][0] - x0;
    const qy = ring[k][1] - y0;
    s += px * qy - qx * py;
    px = qx;
    py = qy;
  }
  return 0.5 * s;
}

/** Signed area (mm²) of vertices `from` … `to − 1` of flat `xy`; summed about the origin, as the smoothing stage measured it. */
export function flatRingArea(xy: Float64Array, from = 0, to = xy.length >> 1): number {
  let a = 0;
  if (to - from < 3) return 0;
  let px = xy[2 * (to - 1)], py = xy[2 * (to - 1) + 1];
  for (let i = from; i < to; i++) {
    const x = xy[2 * i], y = xy[2 * i + 1];
    a += px * y - x * py;
    px = x; py = y;
  }
  return a / 2;
}

/** Length in mm, closing edge included. */
export function ringPerimeter(ring: Ring): number {
  const n = ring.length;
  if (n < 2) return 0;
  let s = 0;
  let [px, py] = ring[n - 1];
  for (let k = 0; k < n; k++) {
    const [x, y] = ring[k];
    s += hypot(x - px, y - py);
    px = x;
    py = y;
  }
  return s;
}

/** Net area in mm²: the outer ring minus its holes. */
export function polygonArea(p: Polygon): number {
  let a = ringArea(p.outer);
  for (const h of p.holes) a += ringArea(h);
  return a;
}

export function polygonSetArea(set: PolygonSet): number {
  let a = 0;
  for (const p of set.polygons) a += polygonArea(p);
  return a;
}

/** Total boundary length in mm, outer rings and holes. */
export function polygonSetPerimeter(set: PolygonSet): number {
  let s = 0;
  for (const p of set.polygons) {
    s += ringPerimeter(p.outer);
    for (const h of p.holes) s += ringPerimeter(h);
  }
  return s;
}
