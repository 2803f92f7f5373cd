/**
 * `min-hole-size`: the narrowest hole or gap between members, the local width of the void phase
 * (docs/checks/min-hole-size.md). Void that opens to the domain edge is open space, not a hole, unless it is
 * a slot narrower than the limit (docs/checks/README.md).
 */
import { widthMeasurement } from './width.js';
import type { CheckDefinition } from './types.js';

export const minHoleSize: CheckDefinition = {
  id: 'min-hole-size',
  unit: 'mm',
  comparison: '>=',
  measure: (ctx, limit) => widthMeasurement(ctx.morphology(), 'void', limit),
};
