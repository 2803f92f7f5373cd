/** Capped distance queries to closed polylines through a segment grid. mm, y up. */
import type { Ring } from '../types.js';
import { type FlatRings, SegmentGrid, sqSegDist } from './segments.js';

/** Distance (mm) to the nearest segment, Infinity beyond `cap`; with `enough` > 0, the first segment within it (an upper bound). */
export function nearDistance(rings: FlatRings, cap: number, enough = 0): (x: number, y: number) => number {
  const { xy, start } = rings;
  const n = start[start.length - 1];
  if (n === 0) return () => Infinity;
  const seg = { x0: new Float64Array(n), y0: new Float64Array(n), x1: new Float64Array(n), y1: new Float64Array(n) };
  for (let r = 0; r + 1 < start.length; r++) {
    for (let i = start[r]; i < start[r + 1]; i++) {
      const j = i + 1 < start[r + 1] ? i + 1 : start[r];
      seg.x0[i] = xy[2 * i];
      seg.y0[i] = xy[2 * i + 1];
      seg.x1[i] = xy[2 * j];
      seg.y1[i] = xy[2 * j + 1];
    }
  }
  const grid = new SegmentGrid(seg.x0, seg.y0, seg.x1, seg.y1, Math.max(cap, 1e-9));
  const { cellStart, items, cols } = grid;
  const cap2 = cap * cap;
  const enough2 = enough * enough;
  return (x, y) => {
    const c0 = grid.col(x - cap), c1 = grid.col(x + cap), r0 = grid.row(y - cap), r1 = grid.row(y + cap);
    const cc = grid.col(x), rc = grid.row(y);
    let best = cap2;
    let found = false;
    for (let pass = 0; pass < 2; pass++) {
      for (let r = pass === 0 ? rc : r0; r <= (pass === 0 ? rc : r1); r++) {
        for (let c = pass === 0 ? cc : c0; c <= (pass === 0 ? cc : c1); c++) {
          if (pass === 1 && r === rc && c === cc) continue;
          const cell = r * cols + c;
          for (let k = cellStart[cell]; k < cellStart[cell + 1]; k++) {
            const s = items[k];
            const d = sqSegDist(x, y, seg.x0[s], seg.y0[s], seg.x1[s], seg.y1[s]);
            if (d <= best) {
              best = d;
              found = true;
              if (d <= enough2) return Math.sqrt(d);
            }
          }
        }
      }
    }
    return found ? Math.sqrt(best) : Infinity;
  };
}

/** The nearest point (px, py) of ring `r`'s boundary to (x, y) and its distance d, mm. O(vertices). */
export function nearestOnRing(r: Ring, x: number, y: number): { px: number; py: number; d: number } {
  let best = Infinity, bx = x, by = y;
  for (let i = 0, j = r.length - 1; i < r.length; j = i++) {
    const ax = r[j][0], ay = r[j][1], ex = r[i][0] - ax, ey = r[i][1] - ay;
    const l2 = ex * ex + ey * ey;
    let t = l2 > 0 ? ((x - ax) * ex + (y - ay) * ey) / l2 : 0;
    t = t < 0 ? 0 : t > 1 ? 1 : t;
    const qx = ax + t * ex, qy = ay + t * ey;
    const d2 = (x - qx) * (x - qx) + (y - qy) * (y - qy);
    if (d2 < best) { best = d2; bx = qx; by = qy; }
  }
  return { px: bx, py: by, d: Math.sqrt(best) };
}
