/** `outline-fidelity`: directed Hausdorff distance (mm) from the smoothed outline to the raw contour (docs/checks/outline-fidelity.md). */
import { polygonSetPerimeter } from '../geom/area.js';
import { flattenSet } from '../geom/flat.js';
import { locatedDeviation } from '../geom/hausdorff.js';
import { formatValue } from './format.js';
import type { CheckContext, CheckDefinition, Measurement, RawLocation } from './types.js';

const STEPS_PER_LIMIT = 64;
/** Sample cap along the whole outline (bounds time and memory, and sets the step under `--tolerance 0`). */
const MAX_SAMPLES = 4e6;

/** Sampling step (mm): limit/64, no finer than perimeter/(4·10⁶). */
export function samplingStep(perimeter: number, limit: number): number {
  const byPerimeter = perimeter / MAX_SAMPLES;
  const byLimit = limit > 0 && Number.isFinite(limit) ? limit / STEPS_PER_LIMIT : 0;
  const s = Math.max(byPerimeter, byLimit);
  return s > 0 ? s : 1e-9;
}

/** A lower bound of h(final, raw), mm, certified to within `resolution` (docs/notes/check.md). */
export function measureOutlineFidelity(ctx: CheckContext, limit: number): Measurement {
  const outline = ctx.smoothed ?? ctx.polygons;
  const final = flattenSet(outline);
  const raw = flattenSet(ctx.raw);
  const n = final.start[final.start.length - 1];
  if (n === 0) {
    return { measured: null, resolution: 0, method: 'directed Hausdorff distance from the final outline to the raw iso-contour (no outline)', locations: [] };
  }
  // the smoothing stage's bound is clearly inside the limit: nothing to locate
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
