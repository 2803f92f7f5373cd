/** A passive polygon's validity: distinct points, non-zero area, no self-intersection. mm, y up. */
import { ringArea } from '../geom/area.js';
import { orient, segmentsIntersect } from '../geom/segments.js';
import type { Point } from '../types.js';

/** Without consecutive repeats (the closing one included), with input indices. */
export function dropRepeats(points: readonly Point[]): { points: Point[]; index: number[] } {
  const out: Point[] = [];
  const index: number[] = [];
  for (let k = 0; k < points.length; k++) {
    const p = points[k];
    const q = out[out.length - 1];
    if (q !== undefined && q[0] === p[0] && q[1] === p[1]) continue;
    out.push(p);
    index.push(k);
  }
  while (out.length > 1 && out[0][0] === out[out.length - 1][0] && out[0][1] === out[out.length - 1][1]) {
    out.pop();
    index.pop();
  }
  return { points: out, index };
}

/** Collinear relative to the set's size: area ≤ 1e-12 · span². */
export function allCollinear(points: readonly Point[]): boolean {
  const [x0, y0] = points[0];
  let far = 0;
  let best = -1;
  for (let k = 1; k < points.length; k++) {
    const d = (points[k][0] - x0) ** 2 + (points[k][1] - y0) ** 2;
    if (d > best) {
      best = d;
      far = k;
    }
  }
  const span2 = best;
  if (!(span2 > 0)) return true;
  const [x1, y1] = points[far];
  for (const [x, y] of points) if (Math.abs(orient(x0, y0, x1, y1, x, y)) > 1e-12 * span2) return false;
  return true;
}

/** The first pair of edges that cross, touch or overlap (folding back counts), or null; swept by smallest x. */
export function firstSelfIntersection(points: readonly Point[]): [number, number] | null {
  const n = points.length;
  if (n < 3) return null;
  // adjacent edges: a spike when collinear and turning back
  for (let k = 0; k < n; k++) {
    const a = points[k];
    const b = points[(k + 1) % n];
    const c = points[(k + 2) % n];
    if (orient(a[0], a[1], b[0], b[1], c[0], c[1]) === 0 && (b[0] - a[0]) * (c[0] - b[0]) + (b[1] - a[1]) * (c[1] - b[1]) < 0) {
      return [k, (k + 1) % n];
    }
  }
  const order = Array.from({ length: n }, (_, k) => k);
  const minX = (k: number): number => Math.min(points[k][0], points[(k + 1) % n][0]);
  const maxX = (k: number): number => Math.max(points[k][0], points[(k + 1) % n][0]);
  order.sort((a, b) => minX(a) - minX(b) || a - b);
  for (let u = 0; u < n; u++) {
    const e = order[u];
    const right = maxX(e);
    const [p1x, p1y] = points[e];
    const [p2x, p2y] = points[(e + 1) % n];
    for (let v = u + 1; v < n && minX(order[v]) <= right; v++) {
      const f = order[v];
      const gap = Math.abs(e - f);
      if (gap === 1 || gap === n - 1) continue; // adjacent: handled above
      const [q1x, q1y] = points[f];
      const [q2x, q2y] = points[(f + 1) % n];
      if (segmentsIntersect(p1x, p1y, p2x, p2y, q1x, q1y, q2x, q2y)) return e < f ? [e, f] : [f, e];
    }
  }
  return null;
}

export function absArea(points: readonly Point[]): number {
  return Math.abs(ringArea(points));
}
