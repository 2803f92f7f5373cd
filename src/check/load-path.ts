/**
 * `load-path`: whether the checked outline still carries the `--loads` load case (docs/checks/load-path.md).
 * Measured: the number of findings — supports and loads whose nodes all sit in void, and pieces of the part
 * that no support holds (src/fe/reach.ts); measured ≤ limit (0) passes. Each finding is located (mm, y up):
 * a support or load at the mean of its nodes, a piece at a point inside it.
 */
import type { CheckContext, CheckDefinition, Measurement } from './types.js';

export function measureLoadPath(ctx: CheckContext, _limit: number): Measurement {
  const st = ctx.structure;
  const method = 'supports and loads whose nodes touch no element at least half full; pieces of the outline with no reached support node inside or within a cell diagonal';
  if (!st) return { measured: null, resolution: 0, method, locations: [] };
  return { measured: st.reach.length, resolution: 0, method, locations: st.reach.map((f) => ({ x: f.x, y: f.y, measured: 1 })) };
}

export const loadPath: CheckDefinition = {
  id: 'load-path',
  unit: '1',
  comparison: '<=',
  measure: measureLoadPath,
};
