/** What changed the outline after smoothing (symmetry, passive regions, repair); reported, never failed (DESIGN §4). mm, y up. */
import { polygonSetArea, polygonSetPerimeter } from '../geom/area.js';
import { flattenSet } from '../geom/flat.js';
import { locatedDeviation } from '../geom/hausdorff.js';
import type { PolygonSet, Report } from '../types.js';
import { samplingStep } from './outline-fidelity.js';

export type FinishingSummary = NonNullable<Report['finishing']>;

/** Area change (mm², fraction of the smoothed area) and directed Hausdorff distance (mm) from `final` to `raw`; null without `raw`. */
export function measureFinishing(final: PolygonSet, smoothedArea: number, raw: PolygonSet, domainArea: number, tolerance: number): FinishingSummary {
  const area = polygonSetArea(final);
  const step = samplingStep(polygonSetPerimeter(final), tolerance);
  const dev = locatedDeviation(flattenSet(final), flattenSet(raw), step, Infinity);
  return {
    areaChange: area - smoothedArea,
    fractionChange: domainArea > 0 ? (area - smoothedArea) / domainArea : 0,
    maxDeviation: Number.isFinite(dev.max) ? dev.max : null,
  };
}
