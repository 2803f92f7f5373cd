/** The two local-width checks' shared measurement; a width just above the limit is located too, so its warning has a place. */
import type { Morphology, Phase } from '../morph/types.js';
import { formatValue } from './format.js';
import type { Measurement, RawLocation } from './types.js';

export function widthMeasurement(m: Morphology, phase: Phase, limit: number): Measurement {
  const survey = m.width(phase, limit);
  const locations: RawLocation[] = survey.places.map((p) => ({ x: p.x, y: p.y, measured: p.width }));
  if (survey.min !== null && survey.minAt !== null && survey.min >= limit && survey.min - limit <= survey.resolution) {
    locations.push({ x: survey.minAt.x, y: survey.minAt.y, measured: survey.min });
  }
  const what = phase === 'solid' ? 'solid' : 'void';
  return {
    measured: survey.min,
    resolution: survey.resolution,
    method: `local width of the ${what} on the θ-simplified medial axis (θ = 120°), exact distances to the outline on a ${formatValue(m.pixel, 3)} mm raster`,
    locations,
  };
}
