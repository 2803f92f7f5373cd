/**
 * The volume-vs-level curve of a density field: for each level L of an evenly spaced ladder over [0, 1], the
 * share of samples with value ≥ L (NaN counts as void). One O(cells) pass into fine bins, then a suffix sum;
 * exact at the ladder's levels when `bins` is a multiple of the ladder's steps.
 *
 * It counts samples, not polygon area: the report's achieved fraction (smoothed polygon area) differs from
 * it by a fraction of the boundary cells (docs/threshold.md).
 */
import type { DensityGrid } from '../types.js';

export interface LevelCurve {
  /** Levels 0, 1/steps, …, 1. */
  readonly levels: number[];
  /** Share (0..1) of samples with value ≥ the level. */
  readonly fractions: number[];
}

export function levelCurve(grid: Pick<DensityGrid, 'values'>, steps = 100): LevelCurve {
  if (!(Number.isInteger(steps) && steps >= 1)) throw new RangeError(`levelCurve: steps must be a whole number ≥ 1, found ${steps}`);
  const v = grid.values;
  // counts[b] = samples with value in [b/steps, (b+1)/steps); values ≥ 1 land in the last bin (≥ level 1).
  const counts = new Float64Array(steps + 1);
  for (let k = 0; k < v.length; k++) {
    const x = v[k];
    if (!(x >= 0)) continue;
    let b = x >= 1 ? steps : Math.floor(x * steps);
    // x·steps can round across a bin edge (0.29 · 100 = 28.999…): compare against the levels themselves.
    if (b < steps && x >= (b + 1) / steps) b++;
    else if (b > 0 && x < b / steps) b--;
    counts[b]++;
  }
  const levels: number[] = [];
  const fractions: number[] = new Array(steps + 1);
  let above = 0;
  for (let b = steps; b >= 0; b--) {
    above += counts[b];
    fractions[b] = v.length > 0 ? above / v.length : 0;
  }
  for (let b = 0; b <= steps; b++) levels.push(b / steps);
  return { levels, fractions };
}
