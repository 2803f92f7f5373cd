/**
 * validateRings' inner loops as small kernels over typed arrays, called per block of segments or per bucket of
 * the segment grid, so that V8 optimizes them as ordinary functions early instead of running one long call in
 * the interpreter (every double boxed; docs/performance.md, "Cold code"). Same tests in the same order.
 */
import { type SegmentGrid, orient, segmentsIntersect } from '../geom/segments.js';
import { hypot } from '../geom/portable-math.js';

const RUN = 1024;

/** Σ length (mm) of segments 0 … n − 1, added in order. */
export function totalLength(x0: Float64Array, y0: Float64Array, x1: Float64Array, y1: Float64Array, n: number): number {
  const acc = new Float64Array(1);
  for (let s = 0; s < n; s += RUN) lengthRun(x0, y0, x1, y1, s, n - s > RUN ? s + RUN : n, acc);
  return acc[0];
}

function lengthRun(x0: Float64Array, y0: Float64Array, x1: Float64Array, y1: Float64Array, s0: number, s1: number, acc: Float64Array): void {
  let len = acc[0];
  for (let s = s0; s < s1; s++) len += hypot(x1[s] - x0[s], y1[s] - y0[s]);
  acc[0] = len;
}

/**
 * Every pair of the segments items[p0 … p1 − 1] (one bucket), in order: adjacent segments of a ring are bad
 * when they fold back, others when they touch or cross; both get segmentHit = 1. Returns the segments newly
 * flagged. `start`: ring starts; `ring`: each segment's ring.
 */
export function bucketPairs(
  x0: Float64Array,
  y0: Float64Array,
  x1: Float64Array,
  y1: Float64Array,
  ring: Int32Array,
  start: Int32Array,
  items: Int32Array,
  p0: number,
  p1: number,
  segmentHit: Uint8Array,
): number {
  let problems = 0;
  for (let p = p0; p < p1; p++) {
    const s = items[p];
    const rs = ring[s];
    const nextS = s + 1 === start[rs + 1] ? start[rs] : s + 1;
    for (let q = p + 1; q < p1; q++) {
      const t = items[q];
      let bad: boolean;
      if (rs === ring[t] && nextS === t) bad = foldsBack(x0[s], y0[s], x1[s], y1[s], x1[t], y1[t]);
      else if (rs === ring[t] && (t + 1 === start[rs + 1] ? start[rs] : t + 1) === s) bad = foldsBack(x0[t], y0[t], x1[t], y1[t], x1[s], y1[s]);
      else bad = segmentsIntersect(x0[s], y0[s], x1[s], y1[s], x0[t], y0[t], x1[t], y1[t]);
      if (bad) {
        if (!segmentHit[s]) { segmentHit[s] = 1; problems++; }
        if (!segmentHit[t]) { segmentHit[t] = 1; problems++; }
      }
    }
  }
  return problems;
}

/** Segments a→v and v→b fold back when a, v, b are collinear and a and b lie on the same side of v. */
export function foldsBack(ax: number, ay: number, vx: number, vy: number, bx: number, by: number): boolean {
  if (orient(ax, ay, vx, vy, bx, by) !== 0) return false;
  return (ax - vx) * (bx - vx) + (ay - vy) * (by - vy) > 0;
}

/**
 * Winding number at (px, py) of the segments of every ring but r, from the ray towards +x (each crossing
 * counted once, in the grid column that holds its x): out[0] all of them, out[1] those of ring `own`.
 */
export function rayWinding(
  grid: SegmentGrid,
  x0: Float64Array,
  y0: Float64Array,
  x1: Float64Array,
  y1: Float64Array,
  ring: Int32Array,
  r: number,
  own: number,
  px: number,
  py: number,
  out: Int32Array,
): void {
  let total = 0, fromOwner = 0;
  const row = grid.row(py);
  for (let c = grid.col(px); c < grid.cols; c++) {
    const cell = row * grid.cols + c;
    for (let p = grid.cellStart[cell]; p < grid.cellStart[cell + 1]; p++) {
      const s = grid.items[p];
      if (ring[s] === r) continue;
      const up = y0[s] <= py && py < y1[s];
      const down = y1[s] <= py && py < y0[s];
      if (!up && !down) continue;
      const xc = x0[s] + ((py - y0[s]) * (x1[s] - x0[s])) / (y1[s] - y0[s]);
      if (!(xc > px)) continue;
      // count each crossing once: in the column that holds its x (within the segment's own columns)
      const lo = grid.col(Math.min(x0[s], x1[s])), hi = grid.col(Math.max(x0[s], x1[s]));
      let cc = grid.col(xc);
      cc = cc < lo ? lo : cc > hi ? hi : cc;
      if (cc !== c) continue;
      const w = up ? 1 : -1;
      total += w;
      if (ring[s] === own) fromOwner += w;
    }
  }
  out[0] = total;
  out[1] = fromOwner;
}
