/**
 * `grey-level`: the measure of non-discreteness M_nd of the input densities (docs/checks/grey-level.md).
 * Unit %; measured ≤ limit passes. No locations: M_nd is a property of the whole field.
 *
 * M_nd = (100 % / n) Σ_e 4 ρ_e (1 − ρ_e): 0 % for a 0/1 design, 100 % when every ρ_e = 0.5.
 * O. Sigmund, "Morphology-based black and white filters for topology optimization", Struct. Multidisc. Optim.
 * 33(4–5):401–424, 2007, DOI 10.1007/s00158-006-0087-x.
 */
import type { CheckContext, CheckDefinition, Measurement } from './types.js';

/** Rounding allowance of M_nd (%): a sum of up to 5·10⁷ terms in double precision is good to far better. */
export const GREY_RESOLUTION = 1e-9;

/**
 * Reads M_nd (%) of the input from ctx.greyLevel (computed once over the finite input values,
 * clipped to [0, 1], by the input statistics). Null when the input has no finite value.
 */
export function measureGreyLevel(ctx: CheckContext, _limit: number): Measurement {
  const g = ctx.greyLevel;
  const measured = Number.isFinite(g) ? g : null;
  return {
    measured,
    resolution: GREY_RESOLUTION,
    method: 'measure of non-discreteness M_nd = 100 % · mean of 4ρ(1 − ρ) over the input densities (Sigmund 2007)',
    locations: [],
  };
}

export const greyLevel: CheckDefinition = {
  id: 'grey-level',
  unit: '%',
  comparison: '<=',
  measure: measureGreyLevel,
};
