/** Located directed Hausdorff distance between flat closed rings (mm, y up); method: docs/notes/geom.md. */
import { type FlatRings, SegmentGrid, sqSegDist } from './segments.js';
import { hypot } from './portable-math.js';

export interface DeviationPlace {
  readonly x: number;
  readonly y: number;
  readonly distance: number;
}

export interface LocatedDeviation {
  /** Largest sampled distance, mm: max ≤ h(A, B) ≤ upper ≤ max + step/2; Infinity when B is empty. */
  readonly max: number;
  readonly upper: number;
  readonly at: DeviationPlace | null;
  /** One per stretch of A farther than `above`, at its farthest sample, in ring order. */
  readonly places: readonly DeviationPlace[];
  /** mm. */
  readonly step: number;
}

/** h(A, B) by branch and bound along A's segments, to within step/2 (`step`, `above` in mm). */
export function locatedDeviation(a: FlatRings, b: FlatRings, step: number, above: number): LocatedDeviation {
  if (!(step > 0)) throw new RangeError(`locatedDeviation: step must be > 0 mm, found ${step}`);
  const na = a.start[a.start.length - 1];
  const nb = b.start[b.start.length - 1];
  if (na === 0) return { max: 0, upper: 0, at: null, places: [], step };
  if (nb === 0) {
    return { max: Infinity, upper: Infinity, at: { x: a.xy[0], y: a.xy[1], distance: Infinity }, places: [{ x: a.xy[0], y: a.xy[1], distance: Infinity }], step };
  }
  const near = new Nearest(segmentGrid(b));
  const { xy, start } = a;
  let worst = -1, wx = 0, wy = 0, upper = 0;
  const places: DeviationPlace[] = [];
  const dv = new Float64Array(na);
  const sv = new Int32Array(na);
  for (let i = 0; i < na; i++) {
    dv[i] = near.dist(xy[2 * i], xy[2 * i + 1]);
    sv[i] = near.seg;
    if (dv[i] > worst) { worst = dv[i]; wx = xy[2 * i]; wy = xy[2 * i + 1]; }
  }
  let stack = new Float64Array(6 * 64);
  let top = 0;
  const push = (t0: number, t1: number, d0: number, d1: number, j0: number, j1: number): void => {
    if (top + 6 > stack.length) { const g = new Float64Array(stack.length * 2); g.set(stack); stack = g; }
    stack[top++] = t0; stack[top++] = t1; stack[top++] = d0; stack[top++] = d1; stack[top++] = j0; stack[top++] = j1;
  };
  let buf = new Float64Array(4 * 64); // samples of one segment: t, d, x, y
  for (let r = 0; r + 1 < start.length; r++) {
    const s0 = start[r], s1 = start[r + 1];
    if (s1 <= s0) continue;
    // a run open at both ends of a closed ring is one run
    let runD = -1, runX = 0, runY = 0, firstRun = -1;
    let openedAtStart = false;
    const sample = (x: number, y: number, d: number, isFirst: boolean): void => {
      if (d > above) {
        if (runD < 0 && isFirst) openedAtStart = true;
        if (d > runD) { runD = d; runX = x; runY = y; }
      } else if (runD >= 0) {
        if (openedAtStart && firstRun < 0) firstRun = places.length;
        places.push({ x: runX, y: runY, distance: runD });
        runD = -1;
      }
    };
    for (let i = s0; i < s1; i++) {
      const j = i + 1 === s1 ? s0 : i + 1;
      const ax = xy[2 * i], ay = xy[2 * i + 1], bx = xy[2 * j], by = xy[2 * j + 1];
      sample(ax, ay, dv[i], i === s0);
      const L = Math.sqrt((bx - ax) * (bx - ax) + (by - ay) * (by - ay));
      let nb2 = 0;
      top = 0;
      push(0, 1, dv[i], dv[j], sv[i], sv[j]);
      while (top > 0) {
        top -= 6;
        const t0 = stack[top], t1 = stack[top + 1], d0 = stack[top + 2], d1 = stack[top + 3];
        const j0 = stack[top + 4], j1 = stack[top + 5];
        const len = (t1 - t0) * L;
        const thr = Math.min(worst, above);
        const x0 = ax + (bx - ax) * t0, y0 = ay + (by - ay) * t0, x1 = ax + (bx - ax) * t1, y1 = ay + (by - ay) * t1;
        const bound = Math.min((d0 + d1 + len) / 2, Math.max(near.to(j0, x1, y1), d0), Math.max(near.to(j1, x0, y0), d1));
        if (bound <= thr || len <= step) {
          if (bound > upper) upper = bound;
          continue;
        }
        const tm = (t0 + t1) / 2;
        const xm = ax + (bx - ax) * tm, ym = ay + (by - ay) * tm;
        near.seg = j0;
        const dm = near.dist(xm, ym);
        const jm = near.seg;
        if (dm > worst) { worst = dm; wx = xm; wy = ym; }
        if (4 * (nb2 + 1) > buf.length) { const g = new Float64Array(buf.length * 2); g.set(buf); buf = g; }
        buf[4 * nb2] = tm; buf[4 * nb2 + 1] = dm; buf[4 * nb2 + 2] = xm; buf[4 * nb2 + 3] = ym;
        nb2++;
        push(tm, t1, dm, d1, jm, j1);
        push(t0, tm, d0, dm, j0, jm);
      }
      if (nb2 > 0 && above < Infinity) {
        const order = Array.from({ length: nb2 }, (_, k) => k).sort((p, q) => buf[4 * p] - buf[4 * q]);
        for (const k of order) sample(buf[4 * k + 2], buf[4 * k + 3], buf[4 * k + 1], false);
      }
    }
    if (runD >= 0) {
      if (openedAtStart && firstRun >= 0) {
        const f = places[firstRun];
        if (runD > f.distance) places[firstRun] = { x: runX, y: runY, distance: runD };
      } else {
        places.push({ x: runX, y: runY, distance: runD });
      }
    }
  }
  return { max: worst, upper: Math.max(upper, worst), at: { x: wx, y: wy, distance: worst }, places, step };
}

/** Cells about twice the mean segment length. */
function segmentGrid(rings: FlatRings): SegmentGrid {
  const { xy, start } = rings;
  const n = start[start.length - 1];
  const x0 = new Float64Array(n), y0 = new Float64Array(n), x1 = new Float64Array(n), y1 = new Float64Array(n);
  let len = 0;
  for (let r = 0; r + 1 < start.length; r++) {
    const s0 = start[r], s1 = start[r + 1];
    for (let i = s0; i < s1; i++) {
      const j = i + 1 === s1 ? s0 : i + 1;
      x0[i] = xy[2 * i]; y0[i] = xy[2 * i + 1]; x1[i] = xy[2 * j]; y1[i] = xy[2 * j + 1];
      len += hypot(x1[i] - x0[i], y1[i] - y0[i]);
    }
  }
  return new SegmentGrid(x0, y0, x1, y1, Math.max((2 * len) / n, 1e-9));
}

class Nearest {
  /** Nearest segment of the last query, the warm start of the next. */
  seg = 0;
  constructor(private readonly g: SegmentGrid) {}

  to(s: number, px: number, py: number): number {
    const g = this.g;
    return Math.sqrt(sqSegDist(px, py, g.x0[s], g.y0[s], g.x1[s], g.y1[s]));
  }

  dist(px: number, py: number): number {
    const g = this.g, cs = g.cs;
    let bestSq = sqSegDist(px, py, g.x0[this.seg], g.y0[this.seg], g.x1[this.seg], g.y1[this.seg]);
    let best = Math.sqrt(bestSq);
    const c0 = Math.floor((px - g.minX) / cs), r0 = Math.floor((py - g.minY) / cs);
    // cells at Chebyshev distance k lie at least (k − 1)·cs away
    const kMax = Math.max(g.cols, g.rows) + Math.abs(c0) + Math.abs(r0) + 1;
    for (let k = 0; k <= kMax && (k - 1) * cs <= best; k++) {
      const rLo = Math.max(0, r0 - k), rHi = Math.min(g.rows - 1, r0 + k);
      for (let r = rLo; r <= rHi; r++) {
        const cy0 = g.minY + r * cs;
        const dy = py < cy0 ? cy0 - py : py > cy0 + cs ? py - cy0 - cs : 0;
        if (dy > best) continue;
        const full = r === r0 - k || r === r0 + k;
        const stepC = full || k === 0 ? 1 : 2 * k;
        for (let c = c0 - k; c <= c0 + k; c += stepC) {
          if (c < 0 || c >= g.cols) continue;
          const cx0 = g.minX + c * cs;
          const dx = px < cx0 ? cx0 - px : px > cx0 + cs ? px - cx0 - cs : 0;
          if (dx * dx + dy * dy > bestSq) continue;
          const cell = r * g.cols + c;
          for (let p = g.cellStart[cell]; p < g.cellStart[cell + 1]; p++) {
            const s = g.items[p];
            const dd = sqSegDist(px, py, g.x0[s], g.y0[s], g.x1[s], g.y1[s]);
            if (dd < bestSq) { bestSq = dd; best = Math.sqrt(dd); this.seg = s; }
          }
        }
      }
    }
    return best;
  }
}
