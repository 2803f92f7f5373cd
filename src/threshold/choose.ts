/**
 * Which level, and how it was chosen (docs/threshold.md):
 * - a constant field has no search: solid everywhere when its value is ≥ 0.5, else empty ('constant');
 * - `--level` fixes the level ('level');
 * - a target of 0 gives an empty part; any other target is searched for on the smoothed area ('volume').
 * Degenerate cases are answers with a warning, never errors.
 */
import { levelBandModel } from '../contour/index.js';
import type { SaddleRuleName } from '../settings.js';
import type { DensityGrid, PolygonSet, Report } from '../types.js';
import { FIXED_POINT_BUILDS, volumeLevel } from './volume.js';

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

/** Grids up to this many samples may spend up to REFINE_BUILDS more builds bisecting on the smoothed area (volume.ts). */
const REFINE_CELLS = 250_000;
/** Bisection builds on small grids: halving the bracket 12 times narrows it 4096-fold (docs/threshold.md). */
const REFINE_BUILDS = 12;

/**
 * Choose the level for a prepared grid. `buildAt(level)` contours and smooths at a level; `buildAt(null)`
 * returns the empty part.
 */
export function chooseThreshold<S extends { readonly areaBefore: number; readonly areaAfter: number }>(
  grid: DensityGrid,
  o: ThresholdOptions,
  buildAt: (level: number | null) => Candidate<S>,
): ThresholdChoice<S> {
  const warnings: string[] = [];
  if (o.min === o.max && o.level === null) {
    const solid = o.min >= 0.5;
    warnings.push(`the field is constant (${o.min}): the part is ${solid ? 'solid everywhere' : 'empty'}`);
    return { mode: 'constant', level: null, chosen: buildAt(solid ? o.min : null), warnings };
  }
  if (o.level !== null) {
    const chosen = buildAt(o.level);
    if (chosen.raw.polygons.length === 0) warnings.push(`the part is empty at level ${o.level}`);
    return { mode: 'level', level: o.level, chosen, warnings };
  }
  if (!(o.target > 0)) {
    warnings.push('the target volume fraction is 0: the part is empty');
    return { mode: 'volume', level: null, chosen: buildAt(null), warnings };
  }
  const targetArea = o.target * o.domainArea;
  // Bisection on the smoothed area is worth its builds where they are cheap (small grids are the coarse ones
  // whose simplification makes the area jump); large grids converge in the fixed point.
  const refine = grid.values.length <= REFINE_CELLS ? REFINE_BUILDS : 0;
  const found = volumeLevel(
    levelBandModel(grid, o.saddle, [o.min, o.max]),
    targetArea,
    o.volumeTolerance,
    (L) => {
      const c = buildAt(L);
      return { area: c.smoothed.areaAfter, rawArea: c.smoothed.areaBefore, value: c };
    },
    FIXED_POINT_BUILDS,
    refine,
  );
  if (found.relativeError > o.volumeTolerance) {
    const got = found.build.area / o.domainArea;
    warnings.push(
      `the volume search reached ${(100 * got).toFixed(3)} % against a target of ${(100 * o.target).toFixed(3)} % (relative error ${found.relativeError.toExponential(2)} > --volume-tolerance ${o.volumeTolerance}); the grid is too coarse or too binary for the area to vary smoothly with the level`,
    );
  }
  return { mode: 'volume', level: found.level, chosen: found.build.value, warnings };
}
