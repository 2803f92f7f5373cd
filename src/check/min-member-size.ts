/** `min-member-size`: the thinnest local width of the solid on the θ-simplified medial axis (docs/checks/min-member-size.md). */
import { widthMeasurement } from './width.js';
import type { CheckDefinition } from './types.js';

export const minMemberSize: CheckDefinition = {
  id: 'min-member-size',
  unit: 'mm',
  comparison: '>=',
  measure: (ctx, limit) => widthMeasurement(ctx.morphology(), 'solid', limit),
};
