/** `min-hole-size`: the local width of the void phase (docs/checks/min-hole-size.md). */
import { widthMeasurement } from './width.js';
import type { CheckDefinition } from './types.js';

export const minHoleSize: CheckDefinition = {
  id: 'min-hole-size',
  unit: 'mm',
  comparison: '>=',
  measure: (ctx, limit) => widthMeasurement(ctx.morphology(), 'void', limit),
};
