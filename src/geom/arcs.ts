/**
 * Circular arcs and lines through a ring's vertices within `tolerance` mm of the raw contour (`--arcs`), greedy
 * on the segmentation of R. L. S. Drysdale, G. Rote and A. Sturm, "Approximation of an open polygonal curve with
 * a minimum number of circular arcs and biarcs", CGTA 41(1–2):31–47, 2008, doi:10.1016/j.comgeo.2007.10.009
 * (from memory). Feasibility rules: docs/notes/geom.md. mm, y up.
 */
import { extendByArc } from './bulge.js';
import { hypot } from './portable-math.js';

/** Runs shorter than this many edges stay as they are (an arc over two edges saves one segment at most). */
const MIN_ARC_EDGES = 3;

export interface ArcRingFit {
  readonly keep: Int32Array;
  /** bulge[m]: of the piece keep[m] → keep[m + 1] (mod), 0 for a line. */
  readonly bulge: Float64Array;
  /** Largest sampled distance (mm) of the pieces from the raw contour. */
  readonly maxDeviation: number;
}

function circle3(ax: number, ay: number, bx: number, by: number, cx: number, cy: number): [number, number, number] | null {
  const d = 2 * (ax * (by - cy) + bx * (cy - ay) + cx * (ay - by));
  const scale = Math.max(Math.abs(bx - ax), Math.abs(by - ay), Math.abs(cx - ax), Math.abs(cy - ay));
  if (!(Math.abs(d) > 1e-12 * scale * scale)) return null;
  const a2 = ax * ax + ay * ay;
  const b2 = bx * bx + by * by;
  const c2 = cx * cx + cy * cy;
  const ux = (a2 * (by - cy) + b2 * (cy - ay) + c2 * (ay - by)) / d;
  const uy = (a2 * (cx - bx) + b2 * (ax - cx) + c2 * (bx - ax)) / d;
  return [ux, uy, hypot(ax - ux, ay - uy)];
}

/**
 * Fits the closed flat ring `xy` (mm); `rawDistance` is mm, Infinity beyond the tolerance. A piece spans one
 * `label` only (passive boundaries, the domain edge); `allowed` vets an arc's bounding box.
 */
export function fitRingArcs(
  xy: Float64Array,
  tolerance: number,
  rawDistance: (x: number, y: number) => number,
  label: Int32Array | null,
  allowed: (box: readonly number[]) => boolean,
): ArcRingFit {
  // 1-Lipschitz sampling (docs/notes/geom.md): the next sample is tolerance − d on, at least minStep
  const minStep = tolerance / 16;
  const limit = tolerance - minStep;
  const n = xy.length >> 1;
  const X = (k: number) => xy[2 * (k % n)];
  const Y = (k: number) => xy[2 * (k % n) + 1];
  const L = (k: number) => (label ? label[k % n] : 0);
  let worst = 0;

  let px = 0;
  let py = 0;
  /** Largest sampled distance of the piece `at(u)` writes to (px, py), or Infinity when a sample is too far. */
  const sampled = (at: (u: number) => void, length: number): number => {
    let dev = 0;
    let run = 0;
    while (true) {
      at(Math.min(run / length, 1));
      const d = rawDistance(px, py);
      if (!(d <= limit)) return Infinity;
      if (d > dev) dev = d;
      if (run >= length) break;
      run = Math.min(run + Math.max(tolerance - d, minStep), length);
    }
    return dev;
  };

  const lineDev = (s: number, e: number): number => {
    const ax = X(s), ay = Y(s), bx = X(e), by = Y(e);
    const dx = bx - ax, dy = by - ay;
    const len2 = dx * dx + dy * dy;
    for (let k = s + 1; k < e; k++) {
      const vx = X(k), vy = Y(k);
      let t = len2 > 0 ? ((vx - ax) * dx + (vy - ay) * dy) / len2 : 0;
      t = t < 0 ? 0 : t > 1 ? 1 : t;
      if (!(hypot(vx - ax - t * dx, vy - ay - t * dy) <= tolerance)) return Infinity;
    }
    return sampled((u) => {
      px = ax + u * dx;
      py = ay + u * dy;
    }, Math.sqrt(len2));
  };

  const arcFit = (s: number, e: number): { bulge: number; dev: number } | null => {
    const m = (s + e) >> 1;
    const c = circle3(X(s), Y(s), X(m), Y(m), X(e), Y(e));
    if (!c) return null;
    const [ux, uy, r] = c;
    const turn = (X(m) - X(s)) * (Y(e) - Y(s)) - (Y(m) - Y(s)) * (X(e) - X(s));
    const dir = turn > 0 ? 1 : -1;
    const a0 = Math.atan2(Y(s) - uy, X(s) - ux);
    const along = (px: number, py: number): number => {
      let d = dir * (Math.atan2(py - uy, px - ux) - a0);
      d %= 2 * Math.PI;
      return d < 0 ? d + 2 * Math.PI : d;
    };
    const sweep = along(X(e), Y(e));
    if (!(sweep <= Math.PI + 1e-12) || !(sweep > 0)) return null;
    let prev = 0;
    for (let k = s + 1; k < e; k++) {
      const vx = X(k), vy = Y(k);
      if (!(Math.abs(hypot(vx - ux, vy - uy) - r) <= tolerance)) return null;
      const a = along(vx, vy);
      if (!(a >= prev && a <= sweep)) return null;
      prev = a;
    }
    const bulge = dir * Math.tan(sweep / 4);
    const box = [Infinity, Infinity, -Infinity, -Infinity];
    extendByArc(box, X(s), Y(s), X(e), Y(e), bulge);
    if (!allowed(box)) return null;
    const dev = sampled((u) => {
      const a = a0 + dir * u * sweep;
      px = ux + r * Math.cos(a);
      py = uy + r * Math.sin(a);
    }, r * sweep);
    return Number.isFinite(dev) ? { bulge, dev } : null;
  };

  const best = (s: number, e: number): { bulge: number; dev: number } | null => {
    for (let k = s + 1; k <= e; k++) if (L(k) !== L(s)) return null;
    if (e - s < 2) return null;
    const line = lineDev(s, e);
    if (Number.isFinite(line)) return { bulge: 0, dev: line };
    if (e - s < MIN_ARC_EDGES) return null;
    return arcFit(s, e);
  };

  // start where the label changes, so a run never straddles the ring's start
  let start = 0;
  if (label) for (let k = 0; k < n; k++) if (L(k) !== L(k + n - 1)) { start = k; break; }
  const keep: number[] = [];
  const bulge: number[] = [];
  let s = start;
  const end = start + n;
  while (s < end) {
    let good = s + 1;
    let goodFit = { bulge: 0, dev: 0 };
    let step = MIN_ARC_EDGES;
    let bad = -1;
    while (true) {
      const e = Math.min(s + step, end);
      const f = best(s, e);
      if (f) {
        good = e;
        goodFit = f;
        if (e === end) break;
        step *= 2;
      } else {
        bad = e;
        break;
      }
    }
    if (bad > 0) {
      let lo = good;
      let hi = bad;
      while (hi - lo > 1) {
        const mid = (lo + hi) >> 1;
        const f = best(s, mid);
        if (f) {
          lo = mid;
          goodFit = f;
        } else hi = mid;
      }
      good = lo;
      goodFit = (good > s + 1 ? best(s, good) : null) ?? { bulge: 0, dev: 0 };
    }
    keep.push(s % n);
    bulge.push(goodFit.bulge);
    if (goodFit.dev > worst) worst = goodFit.dev;
    s = good;
  }
  const order = keep.map((k, i) => [k, bulge[i]] as const).sort((a, b) => a[0] - b[0]);
  return { keep: Int32Array.from(order.map((o) => o[0])), bulge: Float64Array.from(order.map((o) => o[1])), maxDeviation: worst };
}
