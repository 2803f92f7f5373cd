/**
 * `grey-level`: M_nd = (100 % / n) Σ 4ρ(1 − ρ) of the input (docs/checks/grey-level.md); measured ≤ limit passes.
 * O. Sigmund, "Morphology-based black and white filters for topology optimization", SMO 33:401–424, 2007, DOI 10.1007/s00158-006-0087-x.
 */
import type { CheckContext, CheckDefinition, Measurement } from './types.js';

/** Rounding allowance of M_nd, % (docs/notes/check.md). */
export const GREY_RESOLUTION = 1e-9;

/** Reads ctx.greyLevel (%); null when the input has no finite value. */
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
