/** `stiffness-change`: compliance increase (%) over the input design under `--loads` (docs/checks/stiffness-change.md). */
import type { CheckContext, CheckDefinition, Measurement } from './types.js';

/** Resolution, %: both solves reach a relative residual of 1e-8 (docs/notes/check.md). */
export const STIFFNESS_RESOLUTION = 1e-4;

export function measureStiffnessChange(ctx: CheckContext, limit: number): Measurement {
  const st = ctx.structure;
  const method = 'compliance f·u of the outline (exact area fractions per element) over the input design (SIMP), plane-stress bilinear elements on the grid';
  if (!st) return { measured: null, resolution: STIFFNESS_RESOLUTION, method, locations: [] };
  const measured = 100 * (st.geometry.compliance / st.input.compliance - 1);
  const d = st.geometry.maxDisplacement;
  const locations = measured > limit - STIFFNESS_RESOLUTION ? [{ x: d.x, y: d.y, measured }] : [];
  return { measured, resolution: STIFFNESS_RESOLUTION, method, locations };
}

export const stiffnessChange: CheckDefinition = {
  id: 'stiffness-change',
  unit: '%',
  comparison: '<=',
  measure: measureStiffnessChange,
};
