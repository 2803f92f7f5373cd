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
 * Chooses the level so that the smoothed area equals `targetArea` within `relTol` (relative), one build at a
 * time: `next()` names the level to build at (undefined when done), `record()` takes that build's areas, and
 * `result()` returns the closest build. At most `maxBuilds` fixed-point builds.
 *
 * On coarse grids simplification can make the smoothed area jump by more than the tolerance as the level
 * moves (a vertex kept or dropped changes a small ring's area by a percent), so the fixed point may circle the
 * target without reaching it. Then, with up to `refineBuilds` more builds, the level is bisected on the
 * smoothed area itself between the closest builds on either side of the target (the area falls as the level
 * rises); it stops at the tolerance or when the bracket is a jump too narrow to split.
 */
export class VolumeSearch<T> {
  private readonly solver: LevelSolver;
  private readonly scale: number;
  private aim: number;
  private best: { level: number; build: BuildAtLevel<T>; err: number } | undefined;
  private builds = 0;
  private extra = 0;
  private phase: 'fixed' | 'refine' | 'done' = 'fixed';
  /** Closest builds with the smoothed area above (level too low) and below (level too high) the target. */
  private above: { level: number; area: number } | undefined;
  private below: { level: number; area: number } | undefined;

  constructor(
    model: LevelAreaModel,
    private readonly targetArea: number,
    private readonly relTol: number,
    private readonly maxBuilds = FIXED_POINT_BUILDS,
    private readonly refineBuilds = 0,
  ) {
    this.solver = new LevelSolver(model);
    this.aim = targetArea;
    this.scale = targetArea > 0 ? targetArea : 1;
  }

  /** The level of the next build, or undefined when the search is over. */
  next(): number | undefined {
    if (this.phase === 'fixed') {
      // The raw aim needs to be far more precise than the volume tolerance, not more.
      if (this.builds < this.maxBuilds) return this.solver.solve(this.aim, Math.min(1e-6, this.relTol / 100)).level;
      this.phase = 'refine';
    }
    if (this.phase === 'refine') {
      const { best, above, below } = this;
      if (this.extra < this.refineBuilds && best && best.err > this.relTol && above && below && below.level > above.level) {
        const mid = 0.5 * (above.level + below.level);
        if (mid > above.level && mid < below.level && below.level - above.level >= 1e-12) return mid;
      }
      this.phase = 'done';
    }
    return undefined;
  }

  /** The build at the level `next()` named. */
  record(level: number, b: BuildAtLevel<T>): void {
    this.builds++;
    const err = Math.abs(b.area - this.targetArea) / this.scale;
    if (!this.best || err < this.best.err) this.best = { level, build: b, err };
    if (b.area >= this.targetArea) {
      if (!this.above || level > this.above.level) this.above = { level, area: b.area };
    } else if (!this.below || level < this.below.level) this.below = { level, area: b.area };
    if (this.phase === 'refine') {
      this.extra++;
      if (err <= this.relTol) this.phase = 'done';
      return;
    }
    if (err <= this.relTol) {
      this.phase = 'done';
      return;
    }
    // Smoothing changed the area by (b.area − b.rawArea): aim the raw area so that the smoothed one hits the target.
    const nextAim = this.aim - (b.area - this.targetArea);
    if (!(Math.abs(nextAim - this.aim) > 1e-12 * this.scale)) this.phase = 'refine';
    else this.aim = nextAim;
  }

  /** The closest build. */
  result(): VolumeLevelResult<T> {
    if (!this.best) throw new Error('VolumeSearch: no build made');
    return { level: this.best.level, build: this.best.build, builds: this.builds, relativeError: this.best.err };
  }
}

/** VolumeSearch driven by a function that builds at a level (for callers that hold no state between builds). */
export function volumeLevel<T>(
  model: LevelAreaModel,
  targetArea: number,
  relTol: number,
  build: (level: number) => BuildAtLevel<T>,
  maxBuilds = FIXED_POINT_BUILDS,
  refineBuilds = 0,
): VolumeLevelResult<T> {
  const search = new VolumeSearch<T>(model, targetArea, relTol, maxBuilds, refineBuilds);
  for (let L = search.next(); L !== undefined; L = search.next()) search.record(L, build(L));
  return search.result();
}
