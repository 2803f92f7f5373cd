/**
 * How far a simplified outline is from the raw contour: ring area and the sampled directed Hausdorff distance
 * from the final rings to the raw rings. mm, mm², y up; flat rings, implicitly closed.
 */

import { type FlatRings, SegmentGrid, sqSegDist } from '../geom/segments.js';

import { flatRingArea } from '../geom/area.js';
import { hypot } from '../geom/portable-math.js';
import type { SmoothScratch } from './scratch.js';

/** Sum of the signed areas (mm²) of all rings: material area when outers are CCW and holes CW. */
export function totalArea(rings: FlatRings): number {
  let a = 0;
  for (let r = 0; r + 1 < rings.start.length; r++) a += flatRingArea(rings.xy, rings.start[r], rings.start[r + 1]);
  return a;
}

/**
 * Segments of all rings as four coordinate arrays (each ring closed by its last segment), in `scratch`'s arrays
 * when given (valid until its next use).
 */
export function ringSegments(rings: FlatRings, scratch?: SmoothScratch): { x0: Float64Array; y0: Float64Array; x1: Float64Array; y1: Float64Array; ring: Int32Array } {
  const { xy, start } = rings;
  const n = start[start.length - 1];
  const { x0, y0, x1, y1, ring } = scratch
    ? scratch.segments(n)
    : { x0: new Float64Array(n), y0: new Float64Array(n), x1: new Float64Array(n), y1: new Float64Array(n), ring: new Int32Array(n) };
  for (let r = 0; r + 1 < start.length; r++) {
    const a = start[r], b = start[r + 1];
    for (let i = a; i < b; i++) {
      const j = i + 1 === b ? a : i + 1;
      x0[i] = xy[2 * i]; y0[i] = xy[2 * i + 1];
      x1[i] = xy[2 * j]; y1[i] = xy[2 * j + 1];
      ring[i] = r;
    }
  }
  return { x0, y0, x1, y1, ring };
}

/**
 * Directed Hausdorff distance (mm) from the final rings to the raw rings (any ring), sampled every `spacing`
 * or closer along each final segment: the true value is at most the result + spacing/2 (docs/notes/outline.md
 * §6). 0 when there is nothing to measure, Infinity when `raw` is empty and `final` is not.
 */
export function directedHausdorff(final: FlatRings, raw: FlatRings, spacing: number): number {
  const nf = final.start[final.start.length - 1];
  const nr = raw.start[raw.start.length - 1];
  if (nf === 0) return 0;
  if (nr === 0) return Infinity;
  const seg = ringSegments(raw);
  let len = 0;
  for (let s = 0; s < nr; s++) len += hypot(seg.x1[s] - seg.x0[s], seg.y1[s] - seg.y0[s]);
  const grid = new SegmentGrid(seg.x0, seg.y0, seg.x1, seg.y1, Math.max(2 * (len / nr), 1e-9));
  const step = spacing > 0 && Number.isFinite(spacing) ? spacing : Infinity;
  const q = new Query(grid);
  const { xy, start } = final;
  let worst = 0;
  for (let r = 0; r + 1 < start.length; r++) {
    const a = start[r], b = start[r + 1];
    for (let i = a; i < b; i++) {
      const j = i + 1 === b ? a : i + 1;
      const ax = xy[2 * i], ay = xy[2 * i + 1], bx = xy[2 * j], by = xy[2 * j + 1];
      const L = hypot(bx - ax, by - ay);
      const m = step === Infinity ? 2 : Math.max(1, Math.ceil(L / step));
      for (let k = 0; k < m; k++) {
        const t = k / m;
        const d = q.nearest(ax + (bx - ax) * t, ay + (by - ay) * t);
        if (d > worst) worst = d;
      }
    }
  }
  return worst;
}

/** Nearest-segment search on a {@link SegmentGrid} with a warm-start hint. */
class Query {
  private hint = 0;
  constructor(private readonly g: SegmentGrid) {}

  nearest(px: number, py: number): number {
    const g = this.g;
    const h = this.hint;
    let best = Math.sqrt(sqSegDist(px, py, g.x0[h], g.y0[h], g.x1[h], g.y1[h]));
    const c0 = Math.floor((px - g.minX) / g.cs), r0 = Math.floor((py - g.minY) / g.cs);
    const reach = Math.max(g.cols, g.rows) + Math.abs(c0) + Math.abs(r0) + 1;
    const cs = g.cs;
    for (let k = 0; k <= reach; k++) {
      // cells at Chebyshev distance k are at least (k − 1)·cs away from the query point
      if ((k - 1) * cs > best) break;
      for (let r = r0 - k; r <= r0 + k; r++) {
        if (r < 0 || r >= g.rows) continue;
        const cy0 = g.minY + r * cs;
        const dy = py < cy0 ? cy0 - py : py > cy0 + cs ? py - cy0 - cs : 0;
        if (dy > best) continue;
        const edge = r === r0 - k || r === r0 + k;
        for (let c = c0 - k; c <= c0 + k; c += edge || k === 0 ? 1 : 2 * k) {
          if (c < 0 || c >= g.cols) continue;
          // skip cells whose box is farther than the best distance so far
          const cx0 = g.minX + c * cs;
          const dx = px < cx0 ? cx0 - px : px > cx0 + cs ? px - cx0 - cs : 0;
          if (dx * dx + dy * dy > best * best) continue;
          const cell = r * g.cols + c;
          for (let p = g.cellStart[cell]; p < g.cellStart[cell + 1]; p++) {
            const s = g.items[p];
            const dd = sqSegDist(px, py, g.x0[s], g.y0[s], g.x1[s], g.y1[s]);
            if (dd < best * best) {
              best = Math.sqrt(dd);
              this.hint = s;
            }
          }
        }
      }
    }
    return best;
  }
}

/** Spans longer than this many raw segments are searched through a moving window of ±WINDOW segments. */
const BRUTE = 32;
const WINDOW = 8;

/**
 * Directed distance (mm) from the final rings to the raw rings, span by span: final vertex f is raw vertex
 * index[f], and final segment f → f+1 is measured against the raw segments it replaced (plus one each side),
 * by branch and bound down to `spacing`. Every value is an upper bound of the true distance, and the true
 * directed Hausdorff distance is at most the result + spacing/2 (docs/notes/outline.md §6). `final.start` and
 * `raw.start` list the same rings.
 */
export function spanDeviation(final: FlatRings, index: Int32Array, raw: FlatRings, spacing: number): number {
  const step = spacing > 0 && Number.isFinite(spacing) ? spacing : Infinity;
  const { xy, start } = final;
  const w = new SpanWork(start[start.length - 1]);
  for (let pass = 0; pass < 2; pass++) {
    for (let r = 0; r + 1 < start.length; r++) {
      const a = start[r], b = start[r + 1];
      const s0 = raw.start[r], n = raw.start[r + 1] - s0;
      if (b <= a || n === 0) continue;
      for (let f = a; f < b; f += SPANS) spans(xy, index, raw.xy, a, b, f, b - f > SPANS ? f + SPANS : b, s0, n, pass, step, w);
    }
  }
  return w.worst[0];
}

/**
 * Final segments per call of `spans`: short calls let V8 optimize it early, where one long loop ran in the
 * interpreter until on-stack replacement with every double boxed (docs/performance.md, "Cold code").
 */
const SPANS = 256;

/** spanDeviation's buffers and its running maximum (in a Float64Array, so that it stays unboxed). */
class SpanWork {
  span = new Float64Array(256);
  stack = new Float64Array(600);
  readonly near = new Near();
  readonly worst = new Float64Array(1);
  /** The first pass's distance of each vertex and the raw segment nearest to it, reused by the second. */
  readonly vertexDist: Float64Array;
  readonly vertexNear: Int32Array;
  constructor(vertices: number) {
    this.vertexDist = new Float64Array(vertices);
    this.vertexNear = new Int32Array(vertices);
  }
}

/**
 * spanDeviation's final segments f0 … f1 − 1 of the ring of vertices a … b − 1, whose raw ring is raw
 * vertices s0 … s0 + n − 1: pass 0 measures the vertices, pass 1 the segments between them.
 */
function spans(
  xy: Float64Array, index: Int32Array, R: Float64Array, a: number, b: number, f0: number, f1: number,
  s0: number, n: number, pass: number, step: number, w: SpanWork,
): void {
  let worst = w.worst[0];
  let span = w.span;
  let stack = w.stack;
  const near = w.near;
  const vertexDist = w.vertexDist;
  const vertexNear = w.vertexNear;
  const io = near.io;
  for (let f = f0; f < f1; f++) {
    const g = f + 1 === b ? a : f + 1;
    const ax = xy[2 * f], ay = xy[2 * f + 1], bx = xy[2 * g], by = xy[2 * g + 1];
    const ia = index[f] - s0;
    let gap = (index[g] - s0 - ia + n) % n;
    if (gap === 0) gap = n;
    const count = Math.min(gap + 2, n); // raw segments of the span, one extra on either side
    if (span.length < 2 * (count + 1)) span = w.span = new Float64Array(4 * (count + 1));
    let i = ia === 0 ? n - 1 : ia - 1; // raw vertex of the span's first segment, relative to s0
    for (let j = 0; j <= count; j++) {
      span[2 * j] = R[2 * (s0 + i)];
      span[2 * j + 1] = R[2 * (s0 + i) + 1];
      if (++i === n) i = 0;
    }
    near.reset(span, count);
    if (pass === 0) {
      // vertices first: a good lower bound prunes most of the sampling
      io[0] = ax;
      io[1] = ay;
      near.dist();
      const d = io[2];
      if (d > worst) worst = d;
      vertexDist[f] = d;
      vertexNear[f] = near.at;
      continue;
    }
    const da = vertexDist[f];
    const ja = vertexNear[f];
    near.at = ja;
    io[0] = bx;
    io[1] = by;
    near.dist();
    const db = io[2];
    const jb = near.at;
    const L = Math.sqrt((bx - ax) * (bx - ax) + (by - ay) * (by - ay));
    // pieces (t0, t1, d0, d1, j0, j1), six floats each, inline: a closure per segment cost a fifth of the time
    let top = 0;
    stack[0] = 0; stack[1] = 1; stack[2] = da; stack[3] = db; stack[4] = ja; stack[5] = jb;
    top = 6;
    while (top > 0) {
      top -= 6;
      const t0 = stack[top], t1 = stack[top + 1], d0 = stack[top + 2], d1 = stack[top + 3];
      const j0 = stack[top + 4], j1 = stack[top + 5];
      const len = (t1 - t0) * L;
      if ((d0 + d1 + len) / 2 <= worst || len <= step) continue;
      const x0 = ax + (bx - ax) * t0, y0 = ay + (by - ay) * t0, x1 = ax + (bx - ax) * t1, y1 = ay + (by - ay) * t1;
      // distance to one fixed raw segment is convex along the chord: its larger end value bounds the piece
      io[0] = x1;
      io[1] = y1;
      near.to(j0);
      if (Math.max(io[2], d0) <= worst) continue;
      io[0] = x0;
      io[1] = y0;
      near.to(j1);
      if (Math.max(io[2], d1) <= worst) continue;
      const tm = (t0 + t1) / 2;
      near.at = j0;
      io[0] = ax + (bx - ax) * tm;
      io[1] = ay + (by - ay) * tm;
      near.dist();
      const dm = io[2];
      const jm = near.at;
      if (dm > worst) worst = dm;
      if (top + 12 > stack.length) { const g2 = new Float64Array(stack.length * 2); g2.set(stack); stack = w.stack = g2; }
      stack[top] = tm; stack[top + 1] = t1; stack[top + 2] = dm; stack[top + 3] = d1; stack[top + 4] = jm; stack[top + 5] = j1;
      stack[top + 6] = t0; stack[top + 7] = tm; stack[top + 8] = d0; stack[top + 9] = dm; stack[top + 10] = j0; stack[top + 11] = jm;
      top += 12;
    }
  }
  w.worst[0] = worst;
}

/** Nearest distance (mm) from a point to a short polyline (count segments), windowed for long ones. */
class Near {
  at = 0;
  private p: Float64Array = new Float64Array(0);
  private count = 0;

  reset(p: Float64Array, count: number): void {
    this.p = p;
    this.count = count;
    this.at = 0;
  }

  /**
   * The query point (x, y) and the answer (mm) of the last call: typed slots, since a double passed to or
   * returned from a call V8 does not inline is boxed on the heap.
   */
  readonly io = new Float64Array(3);

  /** io[2] = distance (mm) from the point io[0], io[1] to segment j of the polyline. */
  to(j: number): void {
    const p = this.p, io = this.io;
    io[2] = Math.sqrt(sqSegDist(io[0], io[1], p[2 * j], p[2 * j + 1], p[2 * j + 2], p[2 * j + 3]));
  }

  /** io[2] = distance (mm) from the point io[0], io[1] to the polyline; `at` = its nearest segment. */
  dist(): void {
    const p = this.p, count = this.count, io = this.io;
    const px = io[0], py = io[1];
    let best = Infinity;
    let lo = 0, hi = count - 1;
    if (count > BRUTE) { lo = Math.max(0, this.at - WINDOW); hi = Math.min(count - 1, this.at + WINDOW); }
    for (;;) {
      let bestJ = this.at;
      for (let j = lo; j <= hi; j++) {
        const dd = sqSegDist(px, py, p[2 * j], p[2 * j + 1], p[2 * j + 2], p[2 * j + 3]);
        if (dd < best) { best = dd; bestJ = j; }
      }
      const moved = bestJ !== this.at;
      this.at = bestJ;
      if (count <= BRUTE || !moved || (bestJ > lo && bestJ < hi)) break;
      lo = Math.max(0, bestJ - WINDOW); hi = Math.min(count - 1, bestJ + WINDOW);
    }
    io[2] = Math.sqrt(best);
  }
}
