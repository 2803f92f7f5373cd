/**
 * A raw grid made ready for thresholding: `valueRange` mapped to 0..1, the non-finite policy applied, small
 * overshoots (filter ringing, round-off) clipped with a warning and larger ones refused unless `clip`.
 * A new grid, and the input is not modified — unless `inPlace`, when the prepared values are written over the
 * input's (for a caller that owns them: a reader's fresh copy nobody else holds; docs/architecture.md).
 */
import { RhoformError } from '../errors.js';
import type { SamplePosition } from '../read/types.js';
import type { DensityGrid } from '../types.js';
import type { FieldStats } from './stats.js';
import { mndPercent } from './mnd.js';
import * as P from './prepare-pass.js';

import { RANGE_OVERSHOOT } from './prepare-pass.js';

export { RANGE_OVERSHOOT };

/** Samples per kernel call: short calls let V8 optimize the kernels early (prepare-pass.ts). */
const BLOCK = 2048;

export interface PrepareOptions {
  readonly valueRange: readonly [number, number];
  readonly clip: boolean;
  readonly nonFinite: 'error' | 'void';
  /**
   * Write the prepared values into `grid.values` instead of a new array (no fresh memory: ≈ 3 ms per MB on
   * first touch). Only for values the caller owns and will not read raw again; the result's grid then shares
   * them. Every result and message is the same as without it.
   */
  readonly inPlace?: boolean;
}

export interface PrepareResult {
  readonly grid: DensityGrid;
  /** Samples that were non-finite (set to 0 under 'void'). */
  readonly nonFinite: number;
  /** Samples clipped into [0, 1]. */
  readonly clipped: number;
  /** Smallest, largest and mean prepared value (cell grids: the mean is the volume fraction). */
  readonly min: number;
  readonly max: number;
  readonly mean: number;
  /** The input as `inspect` describes it (min and max raw, the rest of the mapped values), from the same pass. */
  readonly inputStats: FieldStats;
  readonly warnings: string[];
}

type Locate = (i: number, j: number) => SamplePosition;

/**
 * True when a grid-layout file holds the top grid row first (the default row order): read from the file
 * positions of the first and last row, which works for either row order.
 */
function topRowFirst(grid: DensityGrid, locate: Locate): boolean {
  return grid.ny < 2 || locate(0, grid.ny - 1).fileRow < locate(0, 0).fileRow;
}

function fmt(x: number): string {
  return Number.isFinite(x) ? String(+x.toPrecision(6)) : String(x);
}

/** Apply the range mapping, non-finite policy and clipping. Throws RhoformError (exit code 2) on refusal. */
export function prepareGrid(grid: DensityGrid, locate: Locate, options: PrepareOptions): PrepareResult {
  const [lo, hi] = options.valueRange;
  if (!Number.isFinite(lo) || !Number.isFinite(hi) || !(hi > lo)) {
    throw new RhoformError('E_USAGE', `--value-range: expected lo,hi with lo < hi, found ${lo},${hi}`);
  }
  const src = grid.values;
  const n = src.length;
  const out = options.inPlace === true ? src : new Float64Array(n);
  const scale = 1 / (hi - lo);
  const nx = grid.nx;
  const identity = lo === 0 && hi === 1;
  const st = P.newPassState();
  for (let k = 0; k < n; ) {
    const end = n - k > BLOCK ? k + BLOCK : n;
    k = P.prepareCommon(src, out, k, end, lo, scale, identity, st);
    if (k < end) k = P.prepareRare(src, out, k, end, lo, scale, identity, nx, st);
  }
  const nonFinite = st[P.S_NON_FINITE];
  // In file order the first non-finite sample is the grid-order first one (bottom row first) or the first one
  // of the highest grid row holding any (top row first); the pass keeps both, with their raw values, since
  // `inPlace` overwrites them.
  const firstNonFinite = st[P.S_FIRST_NF];
  const firstNonFiniteRaw = st[P.S_FIRST_NF_RAW];
  const topNonFinite = st[P.S_TOP_NF];
  const topNonFiniteRaw = st[P.S_TOP_NF_RAW];
  const over = st[P.S_OVER];
  const worst = st[P.S_WORST];
  const worstRaw = st[P.S_WORST_RAW];
  const clipped = st[P.S_CLIPPED];
  const min = st[P.S_MIN];
  let max = st[P.S_MAX];
  const sum = st[P.S_SUM];
  const rawMin = st[P.S_RAW_MIN];
  const rawMax = st[P.S_RAW_MAX];
  const mappedSum = st[P.S_MAPPED];
  const mnd = st[P.S_MND];
  const grey = st[P.S_GREY];
  if (nonFinite > 0 && 0 > max) max = 0;
  const finite = n - nonFinite;
  const inputStats: FieldStats = {
    count: n,
    nonFinite,
    min: finite > 0 ? rawMin : NaN,
    max: finite > 0 ? rawMax : NaN,
    mean: finite > 0 ? mappedSum / finite : NaN,
    greyLevel: mndPercent(mnd, finite),
    greyShare: finite > 0 ? grey / finite : NaN,
  };
  const warnings: string[] = [];
  if (nonFinite > 0) {
    if (options.nonFinite === 'error') {
      // Point at the first non-finite sample in file order, not grid order.
      const top = topRowFirst(grid, locate);
      const first = top ? topNonFinite : firstNonFinite;
      const pos = locate(first % nx, Math.floor(first / nx));
      throw new RhoformError(
        'E_GRID_NONFINITE',
        `expected finite densities, found ${fmt(top ? topNonFiniteRaw : firstNonFiniteRaw)} (${nonFinite} non-finite value${nonFinite === 1 ? '' : 's'} in all; use --non-finite void to treat them as void)`,
        pos.where,
      );
    }
    warnings.push(`${nonFinite} non-finite value${nonFinite === 1 ? '' : 's'} treated as void (--non-finite void)`);
  }
  if (over > 0) {
    if (!options.clip) {
      const pos = locate(worst % nx, Math.floor(worst / nx));
      throw new RhoformError(
        'E_GRID_RANGE',
        `expected values within ${fmt(lo)}..${fmt(hi)} (overshoot up to ${RANGE_OVERSHOOT} of the range is clipped), found ${fmt(worstRaw)} (${over} value${over === 1 ? '' : 's'} beyond that; use --clip to clip them, or --value-range)`,
        pos.where,
      );
    }
    warnings.push(`${clipped} value${clipped === 1 ? '' : 's'} outside ${fmt(lo)}..${fmt(hi)} clipped (--clip)`);
  } else if (clipped > 0) {
    warnings.push(`${clipped} value${clipped === 1 ? '' : 's'} slightly outside ${fmt(lo)}..${fmt(hi)} (≤ ${RANGE_OVERSHOOT} of the range) clipped`);
  }
  return { grid: { ...grid, values: out }, nonFinite, clipped, warnings, min, max, mean: n > 0 ? sum / n : 0, inputStats };
}
