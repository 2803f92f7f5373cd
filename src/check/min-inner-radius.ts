/**
 * `min-inner-radius`: concave corners of the solid tighter than the milling tool's radius
 * (docs/checks/min-inner-radius.md). The tool disc sweeps the void; the corners it cannot reach deeper than
 * max(tolerance, 0.05 R) are findings, each with its own radius (docs/checks/README.md; docs/references.md §8.4).
 */
import { formatValue } from './format.js';
import type { CheckDefinition } from './types.js';

/**
 * How deep (mm) an uncut corner must be to count: max(tolerance, 0.05 R) for a tool of radius R and the outline
 * budget `tolerance` (DESIGN §5): shallower than the outline's own accuracy, or than a twentieth of the tool, is
 * not a corner the tool leaves. The check and the open-corners repair use the same depth.
 */
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
