/**
 * Taubin λ|μ smoothing of closed polylines with the umbrella (uniform) Laplacian.
 *
 * Method: G. Taubin, "Curve and surface smoothing without shrinkage", Proc. ICCV 1995 (IEEE Xplore document
 * 466848), DOI 10.1109/ICCV.1995.466848 [docs/references.md §4.1: link seen through a secondary source, DOI from
 * memory]. Also G. Taubin, "A signal processing approach to fair surface design", Proc. SIGGRAPH '95,
 * pp. 351–358, DOI 10.1145/218380.218473 [docs/references.md §4.1: DOI from memory].
 *
 * For a closed ring, Δx_i = ½(x_{i−1} + x_{i+1}) − x_i; one pair is x ← x + λΔx followed by x ← x + μΔx
 * (0 < λ < −μ), both steps computed from the positions before the step (Jacobi). A regular N-gon is an
 * eigenvector: one pair scales its radius by (1 − λk)(1 − μk), k = 1 − cos(2π/N).
 */

/** Settings for {@link taubinRingInPlace}. Lengths in mm. */
export interface TaubinOptions {
  /** Number of λ|μ pairs; 0 leaves the ring as it is. */
  readonly iterations: number;
  /** Positive shrinking factor λ (e.g. 0.33). */
  readonly lambda: number;
  /** Negative inflating factor μ (e.g. −0.34); 0 gives pure Laplacian smoothing with step λ. */
  readonly mu: number;
  /**
   * Largest allowed distance (mm) of a vertex from its own starting position; every step clamps the
   * displacement back to this radius. Infinity = unlimited.
   */
  readonly maxShift: number;
  /** Optional rectangle [minX, minY, maxX, maxY] (mm) that free vertices are clamped into. */
  readonly box?: readonly [number, number, number, number];
}

/**
 * Smooths one closed ring in place and returns the largest displacement (mm) of any vertex from `start`.
 *
 * @param xy interleaved coordinates of the ring (mm, y up), overwritten with the smoothed positions
 * @param start the positions the displacement budget is measured from (usually the raw ring; not modified)
 * @param fixed optional per-vertex flags; a vertex with fixed[i] ≠ 0 never moves (domain-edge vertices)
 * @param options λ, μ, number of pairs, displacement cap, clamping box
 * @param scratch optional buffer of at least xy.length numbers, reused between rings
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
      // umbrella Laplacian from the current positions
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

/**
 * Pure form of {@link taubinRingInPlace}: returns a smoothed copy of a closed ring (flat, mm) and the largest
 * vertex displacement (mm). The input is not modified.
 */
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
