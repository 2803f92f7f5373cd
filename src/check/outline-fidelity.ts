/**
 * `outline-fidelity`: how far the final outline (after smoothing and simplification) strays from the raw
 * iso-contour it came from — the directed Hausdorff distance from the smoothed outline (ctx.smoothed, else
 * ctx.polygons) to ctx.raw, located. Passive regions, symmetry and repair move the outline on purpose; their
 * change is reported by the pipeline (`finishing`), not failed here.
 * docs/checks/outline-fidelity.md.
 *
 * Frame: mm, y up, origin at the lower-left corner of the grid. Unit mm; measured ≤ limit passes.
 */
import { polygonSetPerimeter } from '../geom/area.js';
import { flattenSet } from '../geom/flat.js';
import { locatedDeviation } from '../geom/hausdorff.js';
import { formatValue } from './format.js';
import type { CheckContext, CheckDefinition, Measurement, RawLocation } from './types.js';

/** Samples per limit length: the sampling step is limit / STEPS_PER_LIMIT (or finer; see `samplingStep`). */
const STEPS_PER_LIMIT = 64;
/**
 * At most about this many samples along the whole outline: bounds time and memory on huge outlines and when
 * the limit is 0 (`--tolerance 0`), where the limit gives no step at all.
 */
const MAX_SAMPLES = 4e6;

/**
 * Sampling step (mm) along the final outline: limit/64, but no finer than perimeter/(4·10⁶); when the limit is
 * 0 the perimeter rule alone.
 */
export function samplingStep(perimeter: number, limit: number): number {
  const byPerimeter = perimeter / MAX_SAMPLES;
  const byLimit = limit > 0 && Number.isFinite(limit) ? limit / STEPS_PER_LIMIT : 0;
  const s = Math.max(byPerimeter, byLimit);
  return s > 0 ? s : 1e-9;
}

/**
 * Directed Hausdorff distance (mm) from the final outline to the raw contour, h(final, raw) = the largest
 * distance from a point of the final rings to the nearest point of any raw ring. Vertices are measured
 * exactly; segments by branch and bound on the 1-Lipschitz distance (src/geom/hausdorff.ts), so the result is
 * a lower bound of h and the certified upper bound exceeds it by `resolution` (at most step/2).
 * Locations: one per stretch of the outline farther than limit − resolution, at its farthest point,
 * measured = that distance. Null when there is no outline.
 */
export function measureOutlineFidelity(ctx: CheckContext, limit: number): Measurement {
  const outline = ctx.smoothed ?? ctx.polygons;
  const final = flattenSet(outline);
  const raw = flattenSet(ctx.raw);
  const n = final.start[final.start.length - 1];
  if (n === 0) {
    return { measured: null, resolution: 0, method: 'directed Hausdorff distance from the final outline to the raw iso-contour (no outline)', locations: [] };
  }
  // Fast path: the smoothing stage already bounds the distance from above; when that bound is clearly inside
  // the limit (beyond the bound's own resolution, so the runner's verdict is a plain pass) nothing needs locating.
  const sd = ctx.smoothingDeviation;
  if (sd !== undefined && Number.isFinite(sd.max) && limit - sd.max > sd.resolution) {
    return {
      measured: sd.max,
      resolution: sd.resolution,
      method: `directed Hausdorff distance from the final outline to the raw iso-contour, from the smoothing stage's bounded measure (samples every ${formatValue(2 * sd.resolution)} mm); clearly within the limit, so not located`,
      locations: [],
    };
  }
  const step = samplingStep(polygonSetPerimeter(outline), limit);
  // report stretches above limit − step/2: the most the resolution can be (the runner's band)
  const res = locatedDeviation(final, raw, step, limit - step / 2);
  const resolution = Number.isFinite(res.upper) ? res.upper - res.max : 0;
  const low = limit - resolution;
  const locations: RawLocation[] = [];
  for (const p of res.places) if (p.distance > low) locations.push({ x: p.x, y: p.y, measured: p.distance });
  const measured = Number.isFinite(res.max) ? res.max : null;
  return {
    measured,
    resolution,
    method: `directed Hausdorff distance from the final outline to the raw iso-contour: vertices exact, edges by branch and bound to a ${formatValue(step)} mm step`,
    locations: measured === null ? [] : locations,
  };
}


export const outlineFidelity: CheckDefinition = {
  id: 'outline-fidelity',
  unit: 'mm',
  comparison: '<=',
  measure: measureOutlineFidelity,
};
