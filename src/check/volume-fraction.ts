/** `volume-fraction`: relative area error against the target fraction (docs/checks/volume-fraction.md; docs/notes/check.md). */
import { polygonArea } from '../geom/area.js';
import type { CheckContext, CheckDefinition, Measurement } from './types.js';

/** Rounding allowance of the ratio (docs/notes/check.md). */
export const VOLUME_RESOLUTION = 1e-9;

/** |achieved − target| / target; for target 0 the absolute error; null unless both are finite. */
export function volumeError(targetFraction: number, achievedFraction: number): number | null {
  if (!Number.isFinite(targetFraction) || !Number.isFinite(achievedFraction)) return null;
  const err = Math.abs(achievedFraction - targetFraction);
  return targetFraction > 0 ? err / targetFraction : err;
}

function percent(f: number): string {
  return `${(100 * f).toFixed(2)} %`;
}

/** Written solid area over the domain area; 0 for an empty domain. */
export function writtenFraction(ctx: Pick<CheckContext, 'polygons' | 'domain' | 'writtenArea'>): number {
  const [x0, y0, x1, y1] = ctx.domain;
  const domainArea = (x1 - x0) * (y1 - y0);
  let area = ctx.writtenArea ?? 0;
  if (ctx.writtenArea === undefined) for (const p of ctx.polygons.polygons) area += polygonArea(p);
  return domainArea > 0 ? area / domainArea : 0;
}

/** Of the smoothed outline before repair; of the outline written after it (ctx.repaired). */
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
