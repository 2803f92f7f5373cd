/**
 * Volume-preserving threshold on the area of the SMOOTHED polygons (docs/threshold.md).
 *
 * The raw region area A(L) is found cell by cell (./search.ts). Smoothing and simplification then change the
 * area by a small amount δ that hardly depends on the level near the answer, so the search aims the raw area at
 * target − δ and repeats with the δ measured on the smoothed result — a fixed-point iteration that needs one
 * full contour + smooth per step (normally one or two), never one per bisection step.
 *
 * The idea of choosing the threshold so that the binary design keeps the grey design's volume is that of
 * S. Xu, Y. Cai, G. Cheng, "Volume preserving nonlinear density filter based on Heaviside functions",
 * Struct. Multidisc. Optim. 41(4):495–505, 2010, DOI 10.1007/s00158-009-0452-7, in the limit β → ∞; here it is
 * applied to the polygon area rather than to the count of cells.
 */
import { LevelSolver, type LevelAreaModel } from './search.js';

/** What one full build at a level yields. */
export interface BuildAtLevel<T> {
  /** Area of the smoothed polygons, mm². */
  readonly area: number;
  /** Area of the raw region, mm² (the same quantity the search works on). */
  readonly rawArea: number;
  readonly value: T;
}

export interface VolumeLevelResult<T> {
  readonly level: number;
  readonly build: BuildAtLevel<T>;
  /** Full builds made (contour + smooth). */
  readonly builds: number;
  /** |smoothed area − target| / target at the answer. */
  readonly relativeError: number;
}

/**
 * Builds (contour + smooth) the fixed point on the smoothed area may use; it normally needs one or two
 * (docs/threshold.md), the rest is a margin before the closest build is kept.
 */
export const FIXED_POINT_BUILDS = 6;

/**
 * Choose the level so that the smoothed area equals `targetArea` within `relTol` (relative).
 * `build(level)` contours and smooths at a level. At most `maxBuilds` fixed-point builds; the best one is
 * returned.
 *
 * On coarse grids simplification can make the smoothed area jump by more than the tolerance as the level
 * moves (a vertex kept or dropped changes a small ring's area by a percent), so the fixed point may circle the
 * target without reaching it. Then, with up to `refineBuilds` more builds, the level is bisected on the
 * smoothed area itself between the closest builds on either side of the target (the area falls as the level
 * rises); it stops at the tolerance or when the bracket is a jump too narrow to split.
 */
export function volumeLevel<T>(
  model: LevelAreaModel,
  targetArea: number,
  relTol: number,
  build: (level: number) => BuildAtLevel<T>,
  maxBuilds = FIXED_POINT_BUILDS,
  refineBuilds = 0,
): VolumeLevelResult<T> {
  const solver = new LevelSolver(model);
  let aim = targetArea;
  let best: { level: number; build: BuildAtLevel<T>; err: number } | undefined;
  let builds = 0;
  const scale = targetArea > 0 ? targetArea : 1;
  // Closest builds with the smoothed area above (level too low) and below (level too high) the target.
  let above: { level: number; area: number } | undefined;
  let below: { level: number; area: number } | undefined;
  const record = (level: number, b: BuildAtLevel<T>): number => {
    builds++;
    const err = Math.abs(b.area - targetArea) / scale;
    if (!best || err < best.err) best = { level, build: b, err };
    if (b.area >= targetArea) {
      if (!above || level > above.level) above = { level, area: b.area };
    } else if (!below || level < below.level) below = { level, area: b.area };
    return err;
  };
  for (; builds < maxBuilds; ) {
    // The raw aim needs to be far more precise than the volume tolerance, not more.
    const raw = solver.solve(aim, Math.min(1e-6, relTol / 100));
    const b = build(raw.level);
    const err = record(raw.level, b);
    if (err <= relTol) break;
    // Smoothing changed the area by (b.area − b.rawArea): aim the raw area so that the smoothed one hits the target.
    const nextAim = aim - (b.area - targetArea);
    if (!(Math.abs(nextAim - aim) > 1e-12 * scale)) break;
    aim = nextAim;
  }
  for (let extra = 0; extra < refineBuilds && best && best.err > relTol && above && below; extra++) {
    if (!(below.level > above.level)) break; // not a bracket: the area did not fall with the level here
    const mid = 0.5 * (above.level + below.level);
    if (!(mid > above.level && mid < below.level) || below.level - above.level < 1e-12) break;
    if (record(mid, build(mid)) <= relTol) break;
  }
  if (!best) throw new Error('volumeLevel: no build made');
  return { level: best.level, build: best.build, builds, relativeError: best.err };
}
