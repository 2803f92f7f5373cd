/**
 * `volume-fraction`: relative error of the smoothed polygon area against the target volume fraction
 * (docs/threshold.md; docs/checks/volume-fraction.md). Unit '1' (a ratio); measured ≤ limit passes.
 *
 * Reads ctx.threshold: `achievedFraction` (smoothed polygon area / domain area, before passive regions
 * and repair) and `targetFraction`. No locations: the error belongs to the whole part.
 */
import type { CheckContext, CheckDefinition, Measurement } from './types.js';

/**
 * Rounding allowance of the measured ratio: the shoelace sum over up to ~10⁶ vertices carries a relative
 * rounding error of about n·2⁻⁵³ ≈ 10⁻¹⁰; 10⁻⁹ covers it with margin.
 */
export const VOLUME_RESOLUTION = 1e-9;

/**
 * |achieved − target| / target for a target > 0. For a target of 0 (an empty part asked for) a relative
 * error is undefined: the absolute error |achieved − 0| (a share of the domain area) is returned instead, 0 for
 * the empty part the tool then builds. Null when either fraction is not a finite number.
 */
export function volumeError(targetFraction: number, achievedFraction: number): number | null {
  if (!Number.isFinite(targetFraction) || !Number.isFinite(achievedFraction)) return null;
  const err = Math.abs(achievedFraction - targetFraction);
  return targetFraction > 0 ? err / targetFraction : err;
}

/** Measures the relative volume error of the smoothed outline (see {@link volumeError}). */
export function measureVolumeFraction(ctx: CheckContext, _limit: number): Measurement {
  const { targetFraction, achievedFraction, mode } = ctx.threshold;
  const measured = volumeError(targetFraction, achievedFraction);
  const how = targetFraction > 0
    ? '|achieved − target| / target, achieved = smoothed polygon area / domain area'
    : 'target 0: the achieved fraction itself (absolute error), achieved = smoothed polygon area / domain area';
  const why = mode === 'level' ? ' (fixed --level: the volume was not searched)' : mode === 'constant' ? ' (constant field: no search)' : '';
  return { measured, resolution: VOLUME_RESOLUTION, method: how + why, locations: [] };
}

export const volumeFraction: CheckDefinition = {
  id: 'volume-fraction',
  unit: '1',
  comparison: '<=',
  measure: measureVolumeFraction,
};
