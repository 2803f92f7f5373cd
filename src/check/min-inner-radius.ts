/** `min-inner-radius`: concave corners tighter than the tool radius (docs/checks/min-inner-radius.md; docs/references.md §8.4). */
import { formatValue } from './format.js';
import type { CheckDefinition } from './types.js';

/** How deep (mm) an uncut corner must be to count, shared with the open-corners repair (docs/notes/check.md). */
export function cornerDepth(tolerance: number, toolRadius: number): number {
  return Math.max(tolerance, 0.05 * toolRadius);
}

export const minInnerRadius: CheckDefinition = {
  id: 'min-inner-radius',
  unit: 'mm',
  comparison: '>=',
  measure(ctx, limit) {
    const m = ctx.morphology();
    const depth = cornerDepth(ctx.tolerance, limit);
    const survey = m.corners(limit, depth);
    return {
      measured: survey.min,
      resolution: survey.resolution,
      method: `opening of the void by the tool disc (R = ${formatValue(limit)} mm); corners left uncut deeper than ${formatValue(depth, 3)} mm, each radius from the largest disc that reaches it`,
      locations: survey.places.map((p) => ({ x: p.x, y: p.y, measured: p.radius })),
    };
  },
};
