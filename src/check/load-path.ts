/** `load-path`: supports and loads in void, and pieces no support holds (src/fe/reach.ts); measured ≤ 0 passes. */
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
