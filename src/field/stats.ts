/**
 * Summary statistics of a density field: range, mean, measure of non-discreteness, grey share, histogram.
 * Non-finite samples (NaN, ±Infinity) are counted and otherwise ignored, so inspecting never fails on them.
 */
import type { DensityGrid } from '../types.js';
import { mndPercent, mndTerm } from './mnd.js';

export interface FieldStats {
  readonly count: number;
  readonly nonFinite: number;
  /** Smallest and largest finite value (NaN when no finite value exists). */
  readonly min: number;
  readonly max: number;
  /** Mean of the finite values (NaN when none). */
  readonly mean: number;
  /** M_nd in % (./mnd.ts, Sigmund 2007) over the finite values clipped to [0, 1]. */
  readonly greyLevel: number;
  /** Share (0..1) of finite samples with 0.1 < ρ < 0.9. */
  readonly greyShare: number;
}

/**
 * Statistics of the raw values of a grid, or with `range` [lo, hi] of the values mapped to (x − lo) / (hi − lo)
 * as prepare maps them (computed on the fly: no mapped copy of the grid).
 */
export function fieldStats(grid: DensityGrid, range?: readonly [number, number]): FieldStats {
  const v = grid.values;
  const lo = range ? range[0] : 0;
  const scale = range ? 1 / (range[1] - range[0]) : 1;
  let n = 0;
  let nonFinite = 0;
  let min = Infinity;
  let max = -Infinity;
  let sum = 0;
  let mnd = 0;
  let grey = 0;
  for (let k = 0; k < v.length; k++) {
    const x = range ? (v[k] - lo) * scale : v[k];
    if (!Number.isFinite(x)) {
      nonFinite++;
      continue;
    }
    n++;
    if (x < min) min = x;
    if (x > max) max = x;
    sum += x;
    const c = x < 0 ? 0 : x > 1 ? 1 : x;
    mnd += mndTerm(c);
    if (x > 0.1 && x < 0.9) grey++;
  }
  return {
    count: v.length,
    nonFinite,
    min: n > 0 ? min : NaN,
    max: n > 0 ? max : NaN,
    mean: n > 0 ? sum / n : NaN,
    greyLevel: mndPercent(mnd, n),
    greyShare: n > 0 ? grey / n : NaN,
  };
}

export interface Histogram {
  /** Bin edges, length bins + 1, ascending. */
  readonly edges: number[];
  /** Sample count per bin; the last bin includes its upper edge. */
  readonly counts: number[];
}

/**
 * Histogram of the finite values over [lo, hi] in `bins` equal bins; values outside go to the end bins. With
 * `range` [a, b], of the values mapped to (x − a) / (b − a) (on the fly, as fieldStats).
 */
export function histogram(grid: DensityGrid, bins = 10, lo = 0, hi = 1, range?: readonly [number, number]): Histogram {
  if (!(bins >= 1) || !(hi > lo)) throw new RangeError(`histogram: bad bins ${bins} or range ${lo}..${hi}`);
  const counts = new Array<number>(bins).fill(0);
  const scale = bins / (hi - lo);
  const a = range ? range[0] : 0;
  const mapScale = range ? 1 / (range[1] - range[0]) : 1;
  const v = grid.values;
  for (let k = 0; k < v.length; k++) {
    const x = range ? (v[k] - a) * mapScale : v[k];
    if (!Number.isFinite(x)) continue;
    let b = Math.floor((x - lo) * scale);
    if (b < 0) b = 0;
    else if (b >= bins) b = bins - 1;
    counts[b]++;
  }
  const edges: number[] = [];
  for (let b = 0; b <= bins; b++) edges.push(lo + (b * (hi - lo)) / bins);
  return { edges, counts };
}
