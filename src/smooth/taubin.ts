/**
 * Taubin λ|μ smoothing of closed polylines with the umbrella Laplacian Δx_i = ½(x_{i−1} + x_{i+1}) − x_i, each
 * step from the positions before it (Jacobi; a regular N-gon's behaviour: docs/notes/outline.md §7).
 * G. Taubin, "Curve and surface smoothing without shrinkage", Proc. ICCV 1995, DOI 10.1109/ICCV.1995.466848;
 * "A signal processing approach to fair surface design", SIGGRAPH '95, DOI 10.1145/218380.218473 (both DOIs
 * from memory, docs/references.md §4.1).
 */

/** Lengths in mm. */
export interface TaubinOptions {
  /** λ|μ pairs. */
  readonly iterations: number;
  /** Shrinking factor λ > 0 (e.g. 0.33). */
  readonly lambda: number;
  /** Inflating factor μ ≤ 0 (e.g. −0.34); 0 is plain Laplacian smoothing. */
  readonly mu: number;
  /** Largest distance of a vertex from its starting position, enforced at every step; Infinity = none. */
  readonly maxShift: number;
  /** [minX, minY, maxX, maxY] that free vertices are clamped into. */
  readonly box?: readonly [number, number, number, number];
}

/**
 * Smooths one closed ring (flat, mm, y up) in place; returns the largest displacement (mm) from `start`, the
 * positions the cap is measured from. Vertices with fixed[i] ≠ 0 never move. `scratch`: ≥ xy.length numbers.
 */
export function taubinRingInPlace(
  xy: Float64Array,
  start: Float64Array,
  fixed: Uint8Array | null,
  options: TaubinOptions,
  scratch?: Float64Array,
): number {
  const n = xy.length >> 1;
  if (n < 3 || !(options.iterations > 0)) return maxShiftOf(xy, start);
  const d = scratch && scratch.length >= xy.length ? scratch : new Float64Array(xy.length);
  const cap = options.maxShift;
  const capSq = cap * cap;
  const box = options.box;
  const steps = [options.lambda, options.mu];
  for (let it = 0; it < options.iterations; it++) {
    for (const f of steps) {
      if (f === 0) continue;
      let px = xy[2 * n - 2], py = xy[2 * n - 1];
      for (let i = 0; i < n; i++) {
        const j = i + 1 === n ? 0 : i + 1;
        const x = xy[2 * i], y = xy[2 * i + 1];
        d[2 * i] = 0.5 * (px + xy[2 * j]) - x;
        d[2 * i + 1] = 0.5 * (py + xy[2 * j + 1]) - y;
        px = x; py = y;
      }
      for (let i = 0; i < n; i++) {
        if (fixed !== null && fixed[i] !== 0) continue;
        let x = xy[2 * i] + f * d[2 * i];
        let y = xy[2 * i + 1] + f * d[2 * i + 1];
        if (box) {
          x = x < box[0] ? box[0] : x > box[2] ? box[2] : x;
          y = y < box[1] ? box[1] : y > box[3] ? box[3] : y;
        }
        const ox = start[2 * i], oy = start[2 * i + 1];
        const dx = x - ox, dy = y - oy;
        const dd = dx * dx + dy * dy;
        if (dd > capSq) {
          // pull back onto the budget circle; the box is convex and holds the start, so this stays inside
          const s = cap / Math.sqrt(dd);
          x = ox + dx * s;
          y = oy + dy * s;
        }
        xy[2 * i] = x;
        xy[2 * i + 1] = y;
      }
    }
  }
  return maxShiftOf(xy, start);
}

/** taubinRingInPlace on a copy. */
export function taubinRing(
  ring: Float64Array,
  options: TaubinOptions,
  fixed: Uint8Array | null = null,
): { xy: Float64Array; maxShift: number } {
  const xy = ring.slice();
  const maxShift = taubinRingInPlace(xy, ring, fixed, options);
  return { xy, maxShift };
}

function maxShiftOf(xy: Float64Array, start: Float64Array): number {
  let m = 0;
  for (let i = 0; i < xy.length; i += 2) {
    const dx = xy[i] - start[i], dy = xy[i + 1] - start[i + 1];
    const dd = dx * dx + dy * dy;
    if (dd > m) m = dd;
  }
  return Math.sqrt(m);
}
