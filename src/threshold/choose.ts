/**
 * Which level, and how it was chosen (docs/threshold.md): 'constant' (solid when the value is ≥ 0.5, else
 * empty), 'level' (`--level`), 'volume' (a target of 0 is the empty part). Degenerate cases warn, never throw.
 */
import { levelBandModel } from '../contour/index.js';
import type { SaddleRuleName } from '../settings.js';
import type { DensityGrid, PolygonSet, Report } from '../types.js';
import { FIXED_POINT_BUILDS, VolumeSearch } from './volume.js';

/** One build at a level: the raw contour and what smoothing made of it (areas in mm²). */
export interface Candidate<S extends { readonly areaBefore: number; readonly areaAfter: number }> {
  readonly raw: PolygonSet;
  readonly smoothed: S;
}

export interface ThresholdOptions {
  /** Target solid fraction 0..1. */
  readonly target: number;
  /** Fixed level, or null for the volume-preserving search. */
  readonly level: number | null;
  readonly saddle: SaddleRuleName;
  /** Relative tolerance on the smoothed area. */
  readonly volumeTolerance: number;
  /** Smallest and largest prepared value. */
  readonly min: number;
  readonly max: number;
  /** mm². */
  readonly domainArea: number;
}

export interface ThresholdChoice<S extends { readonly areaBefore: number; readonly areaAfter: number }> {
  readonly mode: Report['threshold']['mode'];
  readonly level: number | null;
  readonly chosen: Candidate<S>;
  readonly warnings: string[];
}

/** Grids up to this many samples may bisect on the smoothed area (volume.ts); larger ones converge without. */
const REFINE_CELLS = 250_000;
/** Halving the bracket 12 times narrows it 4096-fold (docs/threshold.md). */
const REFINE_BUILDS = 12;

export interface LevelRequest {
  readonly level: number | null;
  /** At most how many lattice cells straddle the level, when the search knows (a size hint for contouring). */
  readonly straddling?: number;
}

/** Chooses the level one build at a time: `next()`, `record()` each build, then `finish()`. */
export class ThresholdSearch<S extends { readonly areaBefore: number; readonly areaAfter: number }> {
  readonly mode: Report['threshold']['mode'];
  private readonly warnings: string[] = [];
  private readonly volume: VolumeSearch<Candidate<S>> | null = null;
  private single: LevelRequest | null = null;
  private level: number | null = null;
  private pending: number | null = null;
  private chosen: Candidate<S> | undefined;

  constructor(
    grid: DensityGrid,
    private readonly o: ThresholdOptions,
  ) {
    const w = this.warnings;
    if (o.min === o.max && o.level === null) {
      const solid = o.min >= 0.5;
      w.push(`the field is constant (${o.min}): the part is ${solid ? 'solid everywhere' : 'empty'}`);
      this.mode = 'constant';
      this.single = { level: solid ? o.min : null };
    } else if (o.level !== null) {
      this.mode = 'level';
      this.level = o.level;
      this.single = { level: o.level };
    } else if (!(o.target > 0)) {
      w.push('the target volume fraction is 0: the part is empty');
      this.mode = 'volume';
      this.single = { level: null };
    } else {
      this.mode = 'volume';
      const refine = grid.values.length <= REFINE_CELLS ? REFINE_BUILDS : 0;
      const model = levelBandModel(grid, o.saddle, [o.min, o.max]);
      this.volume = new VolumeSearch(model, o.target * o.domainArea, o.volumeTolerance, FIXED_POINT_BUILDS, refine);
    }
  }

  next(): LevelRequest | undefined {
    if (this.volume) {
      const L = this.volume.next();
      this.pending = L ?? null;
      if (L === undefined) return undefined;
      const cells = this.volume.bandCells;
      return cells === undefined ? { level: L } : { level: L, straddling: cells };
    }
    return this.chosen ? undefined : (this.single ?? undefined);
  }

  record(c: Candidate<S>): void {
    if (this.volume) {
      if (this.pending === null) throw new Error('ThresholdSearch.record: no build was asked for');
      this.volume.record(this.pending, { area: c.smoothed.areaAfter, rawArea: c.smoothed.areaBefore, value: c });
      this.pending = null;
      return;
    }
    this.chosen = c;
    if (this.mode === 'level' && c.raw.polygons.length === 0) this.warnings.push(`the part is empty at level ${this.o.level}`);
  }

  finish(): ThresholdChoice<S> {
    if (!this.volume) {
      if (!this.chosen) throw new Error('ThresholdSearch.finish: the build was not made');
      return { mode: this.mode, level: this.level, chosen: this.chosen, warnings: this.warnings };
    }
    const found = this.volume.result();
    const o = this.o;
    if (found.relativeError > o.volumeTolerance) {
      const got = found.build.area / o.domainArea;
      this.warnings.push(
        `the volume search reached ${(100 * got).toFixed(3)} % against a target of ${(100 * o.target).toFixed(3)} % (relative error ${found.relativeError.toExponential(2)} > --volume-tolerance ${o.volumeTolerance}); the grid is too coarse or too binary for the area to vary smoothly with the level`,
      );
    }
    return { mode: 'volume', level: found.level, chosen: found.build.value, warnings: this.warnings };
  }
}

/** ThresholdSearch driven by `buildAt(level)` (contour + smooth; null: the empty part). */
export function chooseThreshold<S extends { readonly areaBefore: number; readonly areaAfter: number }>(
  grid: DensityGrid,
  o: ThresholdOptions,
  buildAt: (level: number | null) => Candidate<S>,
): ThresholdChoice<S> {
  const search = new ThresholdSearch<S>(grid, o);
  for (let q = search.next(); q; q = search.next()) search.record(buildAt(q.level));
  return search.finish();
}
