/**
 * The volume-vs-level curve: for levels 0, 1/steps, …, 1 the share of samples ≥ L (NaN void). It counts
 * samples, not polygon area (docs/threshold.md).
 */
import type { DensityGrid } from '../types.js';

export interface LevelCurve {
  readonly levels: number[];
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
