/** Test helper: whether a polygon set's vertex set is invariant under a map (a mirror), to a tolerance. */
import type { Point, PolygonSet } from '../../src/types.js';

/**
 * The first vertex whose image under `map` is not among the vertices (within `tol` mm in x and y), or null when
 * every vertex has its image. O(n log n): binary search on x, then a scan of the neighbours within tol.
 */
export function missingImage(s: PolygonSet, map: (v: Point) => Point, tol: number): { v: Point; w: Point } | null {
  const vs = s.polygons.flatMap((p) => [p.outer, ...p.holes]).flat();
  const sorted = [...vs].sort((a, b) => a[0] - b[0]);
  for (const v of vs) {
    const w = map(v);
    let lo = 0;
    let hi = sorted.length;
    while (lo < hi) {
      const m = (lo + hi) >> 1;
      if (sorted[m][0] < w[0] - tol) lo = m + 1;
      else hi = m;
    }
    let found = false;
    for (let k = lo; k < sorted.length && sorted[k][0] <= w[0] + tol; k++) if (Math.abs(sorted[k][1] - w[1]) <= tol) found = true;
    if (!found) return { v, w };
  }
  return null;
}
