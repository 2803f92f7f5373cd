/**
 * A ring as a file holds it: every coordinate rounded to the written decimals in the output unit, and no
 * segment shorter than a minimum length, so that no written segment is zero-length or below a micrometre
 * (DESIGN §8). Coordinates: the model's mm (y up) divided by `div` (1 for mm, 25.4 for inches).
 */
import type { Ring } from '../types.js';

/**
 * The shortest segment written, in mm: 1 µm. A segment shorter than that carries no shape a cutting or milling
 * machine can follow (their positioning resolution is of the order of 1–10 µm: common practice, no source), is
 * a thousand rounding steps of the 6-decimal DXF in mm (so rounding can never make it zero-length), and is what
 * makes a CAD program's face-building slow on a repaired outline full of booleans' slivers.
 */
export const MIN_SEGMENT_MM = 0.001;

/** A cleaned ring in output units: n ≥ 3 points (flat x, y) and, when arcs are written, one bulge per edge. */
export interface CleanRing {
  readonly xy: Float64Array;
  /** bulge[i] belongs to the edge from point i to point i + 1 (mod n); null when every edge is straight. */
  readonly bulge: Float64Array | null;
}

const SCALES = [1, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6] as const;

/** Rounds half away from zero to `scale` steps, as src/write/number.ts formats numbers. */
function roundTo(v: number, scale: number): number {
  const k = Math.round(Math.abs(v) * scale);
  return (v < 0 ? -k : k) / scale;
}

/**
 * Cleans an implicitly closed ring (mm, y up; a repeated closing point is allowed): divides by `div`, rounds to
 * `decimals` (0…6), then walks the ring keeping a point only when it lies at least `minSegment` (output units)
 * from the last kept one, and finally drops kept points at the end that lie that close to the first. Measured on
 * the rounded values, so every written segment is at least `minSegment` long. A dropped point's edge bulge is
 * lost, the next edge's bulge moves to the kept start point (its arc shifts by under `minSegment`).
 * Returns null when fewer than 3 points remain (the ring encloses no area worth writing). Pure.
 */
export function cleanRing(
  ring: Ring,
  div: number,
  decimals: number,
  minSegment: number,
  bulges?: ArrayLike<number> | null,
): CleanRing | null {
  const scale = SCALES[decimals] ?? 1e6;
  let n = ring.length;
  if (n >= 2 && ring[0][0] === ring[n - 1][0] && ring[0][1] === ring[n - 1][1]) n--;
  if (n < 3) return null;
  const xs = new Float64Array(n);
  const ys = new Float64Array(n);
  const bs = bulges ? new Float64Array(n) : null;
  const sq = minSegment * minSegment;
  let m = 0;
  for (let i = 0; i < n; i++) {
    const x = roundTo(ring[i][0] / div, scale);
    const y = roundTo(ring[i][1] / div, scale);
    if (m > 0) {
      const dx = x - xs[m - 1];
      const dy = y - ys[m - 1];
      if (dx * dx + dy * dy < sq || (dx === 0 && dy === 0)) {
        // the edge from the kept point now ends where this point's edge ends: it takes that edge's bulge
        if (bs) bs[m - 1] = bulges![i];
        continue;
      }
    }
    xs[m] = x;
    ys[m] = y;
    if (bs) bs[m] = bulges![i];
    m++;
  }
  while (m > 1) {
    const dx = xs[m - 1] - xs[0];
    const dy = ys[m - 1] - ys[0];
    if (!(dx * dx + dy * dy < sq || (dx === 0 && dy === 0))) break;
    m--;
    // the closing edge now starts at the previous kept point and takes the dropped point's closing bulge
    if (bs && m > 0) bs[m - 1] = bs[m];
  }
  if (m < 3) return null;
  const xy = new Float64Array(2 * m);
  for (let i = 0; i < m; i++) {
    xy[2 * i] = xs[i];
    xy[2 * i + 1] = ys[i];
  }
  let bulge: Float64Array | null = null;
  if (bs) {
    bulge = bs.slice(0, m);
    for (let i = 0; i < m; i++) if (!Number.isFinite(bulge[i])) bulge[i] = 0;
  }
  return { xy, bulge };
}
