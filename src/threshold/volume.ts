/**
 * Volume-preserving threshold on the area of the smoothed polygons: a fixed point on the area smoothing adds
 * (docs/threshold.md, docs/notes/outline.md §2). After S. Xu, Y. Cai, G. Cheng, "Volume preserving nonlinear
 * density filter based on Heaviside functions", Struct. Multidisc. Optim. 41(4):495–505, 2010,
 * DOI 10.1007/s00158-009-0452-7 (β → ∞), applied to polygon area instead of cell count.
 */
import { LevelSolver, type LevelAreaModel } from './search.js';

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
  readonly builds: number;
  /** |smoothed area − target| / target at the answer. */
  readonly relativeError: number;
}

/** Builds the fixed point may use; it normally needs one or two (docs/threshold.md). */
export const FIXED_POINT_BUILDS = 6;

/**
 * The level whose smoothed area equals `targetArea` (mm²) within `relTol` (relative), one build at a time:
 * `next()` names the level to build at (undefined when done), `record()` takes that build, `result()` returns
 * the closest build. Up to `maxBuilds` fixed-point builds, then up to `refineBuilds` bisection builds on the
 * smoothed area between the closest builds either side of the target (for coarse grids, where the area jumps
 * with the level: docs/notes/outline.md §2).
 */
export class VolumeSearch<T> {
  private readonly solver: LevelSolver;
  private readonly scale: number;
  private aim: number;
  private best: { level: number; build: BuildAtLevel<T>; err: number } | undefined;
  private builds = 0;
  private extra = 0;
  private phase: 'fixed' | 'refine' | 'done' = 'fixed';
  private above: { level: number; area: number } | undefined;
  /** The level search's band at the level `next()` named last (LevelSolver's bandCells); undefined for a bisection level. */
  bandCells: number | undefined;
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

  next(): number | undefined {
    this.bandCells = undefined;
    if (this.phase === 'fixed') {
      if (this.builds < this.maxBuilds) {
        const r = this.solver.solve(this.aim, Math.min(1e-6, this.relTol / 100));
        this.bandCells = r.bandCells;
        return r.level;
      }
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
    // Aim the raw area so that the smoothed one hits the target.
    const nextAim = this.aim - (b.area - this.targetArea);
    if (!(Math.abs(nextAim - this.aim) > 1e-12 * this.scale)) this.phase = 'refine';
    else this.aim = nextAim;
  }

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
