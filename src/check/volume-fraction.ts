/**
 * `volume-fraction`: relative error of the part's area against the target volume fraction (docs/threshold.md;
 * docs/checks/volume-fraction.md). Unit '1' (a ratio); measured ≤ limit passes.
 *
 * Before repair it reads ctx.threshold: `achievedFraction` (smoothed polygon area / domain area, before passive
 * regions and repair) and `targetFraction`. After `--repair` (ctx.repaired) it measures the outline written:
 * final = its polygon area / domain area; when the threshold met the target and the repair moved the area beyond
 * the limit, the check warns (at most) and says so — the change is reported, not failed (DESIGN §4). No
 * locations: the error belongs to the whole part.
 */
import { polygonArea } from '../geom/area.js';
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

/** A fraction as a percentage with two decimals: 0.39881 → "39.88 %". */
function percent(f: number): string {
  return `${(100 * f).toFixed(2)} %`;
}

/** Solid area written (ctx.writtenArea, else the polygon area of `ctx.polygons`) over the domain area; 0 for an empty domain. */
export function writtenFraction(ctx: Pick<CheckContext, 'polygons' | 'domain' | 'writtenArea'>): number {
  const [x0, y0, x1, y1] = ctx.domain;
  const domainArea = (x1 - x0) * (y1 - y0);
  let area = ctx.writtenArea ?? 0;
  if (ctx.writtenArea === undefined) for (const p of ctx.polygons.polygons) area += polygonArea(p);
  return domainArea > 0 ? area / domainArea : 0;
}

/**
 * Measures the relative volume error (see {@link volumeError}): of the smoothed outline before repair, of the
 * outline written after it (ctx.repaired).
 */
export function measureVolumeFraction(ctx: CheckContext, limit: number): Measurement {
  const { targetFraction, achievedFraction, mode } = ctx.threshold;
  const why = mode === 'level' ? ' (fixed --level: the volume was not searched)' : mode === 'constant' ? ' (constant field: no search)' : '';
  if (!ctx.repaired) {
    const measured = volumeError(targetFraction, achievedFraction);
    const how = targetFraction > 0
      ? '|achieved − target| / target, achieved = smoothed polygon area / domain area'
      : 'target 0: the achieved fraction itself (absolute error), achieved = smoothed polygon area / domain area';
    return { measured, resolution: VOLUME_RESOLUTION, method: how + why, locations: [] };
  }
  const final = writtenFraction(ctx);
  const measured = volumeError(targetFraction, final);
  const how = targetFraction > 0
    ? '|final − target| / target, final = area of the part written (after repair) / domain area'
    : 'target 0: the final fraction itself (absolute error), final = area of the part written (after repair) / domain area';
  const before = volumeError(targetFraction, achievedFraction);
  const moved = measured !== null && measured > limit + VOLUME_RESOLUTION;
  if (!moved || before === null) return { measured, resolution: VOLUME_RESOLUTION, method: how + why, locations: [] };
  const held = `the part written holds ${percent(final)} against the target ${percent(targetFraction)}, the threshold's outline ${percent(achievedFraction)}`;
  if (before <= limit) {
    return {
      measured,
      resolution: VOLUME_RESOLUTION,
      method: how + why,
      locations: [],
      atMost: 'warn',
      note: `${held}; the repair moved it (reported, not failed: re-analyse the part written)`,
    };
  }
  return { measured, resolution: VOLUME_RESOLUTION, method: how + why, locations: [], note: `${held}; the threshold already missed the target` };
}

export const volumeFraction: CheckDefinition = {
  id: 'volume-fraction',
  unit: '1',
  comparison: '<=',
  measure: measureVolumeFraction,
};
