/**
 * Filling the narrow void places the hole check reports directly: the maximal inscribed discs at the thin void
 * medial samples, each enlarged by a margin, and the convex hulls of the discs of neighbouring samples (tapered
 * capsules), so that a neck fills as a band with no sliver between two discs.
 *
 * Frame: millimetres, y up, origin at the lower-left corner of the grid. Rings are counter-clockwise.
 *
 * Why: the closing by a disc of radius ρ (common.ts `closing`) fills only the void a disc of radius ρ cannot
 * enter. A neck between a sharp convex corner of the solid and a wall is narrower than the limit, yet a disc of
 * radius ρ passes beside the corner and covers the neck's medial samples, so the closing leaves it. The inscribed
 * disc at a sample touches the walls at its two feet (θ-simplified medial axis, Foskey, Lin & Manocha,
 * "Efficient computation of a simplified medial axis", Proc. 8th ACM Symposium on Solid Modeling and
 * Applications, 2003, DOI 10.1145/781606.781623 — DOI from memory); enlarged by δ it crosses both walls, so the
 * neck is bridged there.
 */
import type { Point, Ring } from '../types.js';
import { cellKey } from './cell-key.js';

/**
 * The regions to add for the samples (x[k], y[k]) with disc radii r[k] (mm; the caller adds its margin): one
 * ring per pair of neighbouring samples (the convex hull of their two discs) and one per lone sample (its disc).
 * Neighbours: samples in 8-neighbouring squares of side `cell` mm (squares anchored at (ox, oy)); the caller
 * keeps at most one sample per square. Discs are polygons with vertices on the circle, at most `arcTol` mm from
 * it (at least 12 vertices). O(n) with a hash of square keys.
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

/** Vertices of a regular polygon on the circle of centre (cx, cy) and radius R (mm), counter-clockwise, chords within `arcTol` mm of the circle. */
function discPoints(cx: number, cy: number, R: number, arcTol: number): Point[] {
  // sagitta of a chord turning by 2π/m: R(1 − cos(π/m)) ≤ arcTol
  const c = 1 - Math.min(arcTol, R) / R;
  const m = Math.max(12, Math.min(720, Math.ceil(Math.PI / Math.acos(Math.max(-1, Math.min(1, c))))));
  const pts: Point[] = [];
  for (let k = 0; k < m; k++) {
    const t = (2 * Math.PI * k) / m;
    pts.push([cx + R * Math.cos(t), cy + R * Math.sin(t)]);
  }
  return pts;
}

/** Convex hull, counter-clockwise (A.M. Andrew, "Another efficient algorithm for convex hulls in two dimensions", Information Processing Letters 9(5):216–219, 1979, DOI 10.1016/0020-0190(79)90072-3 — DOI from memory). */
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
