/**
 * What changed the outline after smoothing (symmetry, passive regions, repair): the area change and how far the
 * final outline lies from the raw iso-contour. Reported, never failed (DESIGN §4). mm, y up.
 */
import { polygonSetArea, polygonSetPerimeter } from '../geom/area.js';
import { flattenSet } from '../geom/flat.js';
import { locatedDeviation } from '../geom/hausdorff.js';
import type { PolygonSet, Report } from '../types.js';
import { samplingStep } from './outline-fidelity.js';

export type FinishingSummary = NonNullable<Report['finishing']>;

/**
 * The area change (mm²) and fraction change against the smoothed area, and the directed Hausdorff distance (mm)
 * from `final` to `raw`, sampled as outline-fidelity samples. maxDeviation is null without a raw contour.
 */
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
