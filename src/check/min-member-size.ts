/**
 * `min-member-size`: the thinnest local width of the solid (docs/checks/min-member-size.md).
 *
 * Local width at a point = diameter of the largest disc inside the solid containing it, counted on the
 * θ-simplified medial axis so that sharp convex corners of thick parts are not thin (docs/checks/README.md).
 * Outside the domain is open space: a wall between a hole and the domain edge is as thin as it is.
 */
import { widthMeasurement } from './width.js';
import type { CheckDefinition } from './types.js';

export const minMemberSize: CheckDefinition = {
  id: 'min-member-size',
  unit: 'mm',
  comparison: '>=',
  measure: (ctx, limit) => widthMeasurement(ctx.morphology(), 'solid', limit),
};
