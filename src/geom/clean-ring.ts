/** A ring as a file holds it: rounded to the written decimals in the output unit, no segment below a minimum (DESIGN §8). */
import type { Ring } from '../types.js';

/** Shortest segment written, mm (reasons: docs/notes/geom.md). */
export const MIN_SEGMENT_MM = 0.001;

/** In output units: flat x, y (n ≥ 3) and, with arcs, one bulge per edge i → i + 1. */
export interface CleanRing {
  readonly xy: Float64Array;
  readonly bulge: Float64Array | null;
}

const SCALES = [1, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6] as const;

/** Half away from zero, as src/write/number.ts formats. */
function roundTo(v: number, scale: number): number {
  const k = Math.round(Math.abs(v) * scale);
  return (v < 0 ? -k : k) / scale;
}

/**
 * Divides the ring (mm) by `div`, rounds to `decimals`, drops points within `minSegment` (output units) of the
 * last kept one; a dropped point's bulge passes on. Null when fewer than 3 points remain.
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
