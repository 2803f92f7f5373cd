/**
 * `stiffness-change`: how much stiffness the post-processing cost (docs/checks/stiffness-change.md). Measured:
 * the relative compliance increase of the checked outline over the input design under the `--loads` load case,
 * 100 % · (C_geometry / C_input − 1); measured ≤ limit (`--max-stiffness-loss`, default 10 %) passes. Negative
 * values: the outline is stiffer than the design. Compliance C = f·u, N·mm (docs/structure.md).
 *
 * When the limit is broken the one location is the outline's largest displacement (mm, y up): where the lost
 * stiffness shows.
 */
import type { CheckContext, CheckDefinition, Measurement } from './types.js';

/**
 * Resolution, %: both compliances come from solves to a relative residual of 1e-8, so their ratio is good to
 * far better than 1e-4 % (the energy error of CG is of the order of the squared residual). Discretisation is
 * the same for both designs and is not part of the comparison.
 */
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
