/** Inscribed discs at thin void samples, bridged by convex hulls: fills the necks a closing leaves (docs/notes/repair.md). mm, y up. */
import type { Point, Ring } from '../types.js';
import { cellKey } from './cell-key.js';

/**
 * One ring per pair of neighbouring samples (hull of their discs of radii r[k], mm) and one per lone sample;
 * neighbours share 8-neighbouring squares of side `cell` mm anchored at (ox, oy). Chords within `arcTol` mm. O(n).
 */
export function discHulls(
  x: ArrayLike<number>,
  y: ArrayLike<number>,
  r: ArrayLike<number>,
  n: number,
  cell: number,
  ox: number,
  oy: number,
  arcTol: number,
): Ring[] {
  const key = cellKey;
  const at = new Map<number, number>();
  const ii = new Int32Array(n), jj = new Int32Array(n);
  for (let k = 0; k < n; k++) {
    ii[k] = Math.floor((x[k] - ox) / cell);
    jj[k] = Math.floor((y[k] - oy) / cell);
    at.set(key(ii[k], jj[k]), k);
  }
  const rings: Ring[] = [];
  const lonely = new Uint8Array(n).fill(1);
  for (let k = 0; k < n; k++) {
    for (const [di, dj] of [[1, 0], [0, 1], [1, 1], [-1, 1]] as const) {
      const m = at.get(key(ii[k] + di, jj[k] + dj));
      if (m === undefined || m === k) continue;
      rings.push(convexHull([...discPoints(x[k], y[k], r[k], arcTol), ...discPoints(x[m], y[m], r[m], arcTol)]));
      lonely[k] = 0;
      lonely[m] = 0;
    }
  }
  for (let k = 0; k < n; k++) if (lonely[k]) rings.push(discPoints(x[k], y[k], r[k], arcTol));
  return rings;
}

function discPoints(cx: number, cy: number, R: number, arcTol: number): Point[] {
  // sagitta R(1 − cos(π/m)) ≤ arcTol
  const c = 1 - Math.min(arcTol, R) / R;
  const m = Math.max(12, Math.min(720, Math.ceil(Math.PI / Math.acos(Math.max(-1, Math.min(1, c))))));
  const pts: Point[] = [];
  for (let k = 0; k < m; k++) {
    const t = (2 * Math.PI * k) / m;
    pts.push([cx + R * Math.cos(t), cy + R * Math.sin(t)]);
  }
  return pts;
}

/** Convex hull, CCW (A.M. Andrew, "Another efficient algorithm for convex hulls in two dimensions", IPL 9(5):216–219, 1979, DOI 10.1016/0020-0190(79)90072-3, from memory). */
function convexHull(points: Point[]): Ring {
  const p = [...points].sort((a, b) => a[0] - b[0] || a[1] - b[1]);
  const cross = (o: Point, a: Point, b: Point): number => (a[0] - o[0]) * (b[1] - o[1]) - (a[1] - o[1]) * (b[0] - o[0]);
  const lower: Point[] = [];
  for (const q of p) {
    while (lower.length >= 2 && cross(lower[lower.length - 2], lower[lower.length - 1], q) <= 0) lower.pop();
    lower.push(q);
  }
  const upper: Point[] = [];
  for (let k = p.length - 1; k >= 0; k--) {
    const q = p[k];
    while (upper.length >= 2 && cross(upper[upper.length - 2], upper[upper.length - 1], q) <= 0) upper.pop();
    upper.push(q);
  }
  lower.pop();
  upper.pop();
  return lower.concat(upper);
}
