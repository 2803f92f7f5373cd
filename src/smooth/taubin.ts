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
  const box = options.box;
  const par = new Float64Array(PARAMS);
  par[P_LAMBDA] = options.lambda;
  par[P_MU] = options.mu;
  const cap = options.maxShift;
  par[P_CAP] = cap;
  par[P_CAP_SQ] = cap * cap;
  if (box) for (let k = 0; k < 4; k++) par[P_BOX + k] = box[k];
  for (let it = 0; it < options.iterations; it++) {
    for (let step = P_LAMBDA; step <= P_MU; step++) {
      if (par[step] === 0) continue;
      taubinStep(xy, start, fixed, d, n, par, step, box ? true : false);
    }
  }
  return maxShiftOf(xy, start);
}

/** Slots of taubinStep's parameters: λ, μ, the cap and its square (mm, mm²), the box (minX, minY, maxX, maxY). */
const P_LAMBDA = 0;
const P_MU = 1;
const P_CAP = 2;
const P_CAP_SQ = 3;
const P_BOX = 4;
const PARAMS = 8;

/**
 * One λ (step = P_LAMBDA) or μ step of taubinRingInPlace over a ring of n vertices, `d` its scratch. A small
 * function called per step, its doubles in typed arrays: V8 optimizes it early and boxes none of them (a long
 * call runs in the interpreter until on-stack replacement; docs/performance.md, "Cold code").
 */
function taubinStep(
  xy: Float64Array,
  start: Float64Array,
  fixed: Uint8Array | null,
  d: Float64Array,
  n: number,
  par: Float64Array,
  step: number,
  hasBox: boolean,
): void {
  const f = par[step];
  const cap = par[P_CAP];
  const capSq = par[P_CAP_SQ];
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
    if (hasBox) {
      const x0 = par[P_BOX], y0 = par[P_BOX + 1], x1 = par[P_BOX + 2], y1 = par[P_BOX + 3];
      x = x < x0 ? x0 : x > x1 ? x1 : x;
      y = y < y0 ? y0 : y > y1 ? y1 : y;
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
