/**
 * The per-sample pass of prepareGrid as two small kernels over a block of samples, so that V8 compiles them as
 * ordinary functions with full type feedback and keeps every running sum in a register: a single long loop
 * runs in the interpreter until on-stack replacement and boxes each double it carries (≈ 50 bytes of garbage
 * a sample; docs/performance.md, "Cold code"). The sums are added in the same order as one loop would.
 */
/** Overshoot outside [0, 1] that is clipped with a warning rather than refused. */
export const RANGE_OVERSHOOT = 0.05;

/** Slots of the pass's state (one Float64Array; counts and indices are exact integers below 2⁵³). */
export const S_RAW_MIN = 0;
export const S_RAW_MAX = 1;
/** Σ mapped value of the finite samples. */
export const S_MAPPED = 2;
/** Finite samples whose mapped value is in (0.1, 0.9). */
export const S_GREY = 3;
/** Σ prepared value. */
export const S_SUM = 4;
/** Σ mndTerm of the unclipped values. */
export const S_MND = 5;
export const S_MIN = 6;
export const S_MAX = 7;
export const S_NON_FINITE = 8;
/** Index and raw value of the first non-finite sample in grid order, and of the first one of its highest row. */
export const S_FIRST_NF = 9;
export const S_FIRST_NF_RAW = 10;
export const S_TOP_NF = 11;
export const S_TOP_NF_RAW = 12;
export const S_CLIPPED = 13;
/** Samples beyond the clipping allowance; the worst of them (index, raw value, excess over [0, 1]). */
export const S_OVER = 14;
export const S_WORST = 15;
export const S_WORST_RAW = 16;
export const S_WORST_EXCESS = 17;
export const STATE_SLOTS = 18;

/** A fresh state: empty extremes, zero sums and counts, no index found yet. */
export function newPassState(): Float64Array {
  const s = new Float64Array(STATE_SLOTS);
  s[S_RAW_MIN] = Infinity;
  s[S_RAW_MAX] = -Infinity;
  s[S_MIN] = Infinity;
  s[S_MAX] = -Infinity;
  s[S_FIRST_NF] = -1;
  s[S_FIRST_NF_RAW] = NaN;
  s[S_TOP_NF] = -1;
  s[S_TOP_NF_RAW] = NaN;
  s[S_WORST] = -1;
  s[S_WORST_RAW] = NaN;
  return s;
}

/**
 * Samples k0, k1 − 1, … in order while their mapped value (raw − lo)·scale, or raw when `identity`, lies in
 * [0, 1] — which implies a finite raw value. Returns the index of the first other sample, or k1.
 */
export function prepareCommon(
  src: Float64Array,
  out: Float64Array,
  k0: number,
  k1: number,
  lo: number,
  scale: number,
  identity: boolean,
  st: Float64Array,
): number {
  let rawMin = st[S_RAW_MIN];
  let rawMax = st[S_RAW_MAX];
  let mapped = st[S_MAPPED];
  let grey = st[S_GREY];
  let sum = st[S_SUM];
  let mnd = st[S_MND];
  let min = st[S_MIN];
  let max = st[S_MAX];
  let k = k0;
  for (; k < k1; k++) {
    const raw = src[k];
    const v = identity ? raw : (raw - lo) * scale;
    if (!(v >= 0 && v <= 1)) break;
    if (raw < rawMin) rawMin = raw;
    if (raw > rawMax) rawMax = raw;
    mapped += v;
    if (v > 0.1 && v < 0.9) grey++;
    out[k] = v;
    sum += v;
    mnd += v * (1 - v); // mndTerm, written out
    if (v < min) min = v;
    if (v > max) max = v;
  }
  st[S_RAW_MIN] = rawMin;
  st[S_RAW_MAX] = rawMax;
  st[S_MAPPED] = mapped;
  st[S_GREY] = grey;
  st[S_SUM] = sum;
  st[S_MND] = mnd;
  st[S_MIN] = min;
  st[S_MAX] = max;
  return k;
}

/**
 * Samples k0, k0 + 1, … in order while they are non-finite (set to 0) or map outside [0, 1] (clipped to the
 * nearer bound, counted, and the worst overshoot beyond the allowance kept). Returns the index of the first
 * sample that prepareCommon takes, or k1. `nx`: samples per grid row.
 */
export function prepareRare(
  src: Float64Array,
  out: Float64Array,
  k0: number,
  k1: number,
  lo: number,
  scale: number,
  identity: boolean,
  nx: number,
  st: Float64Array,
): number {
  let k = k0;
  for (; k < k1; k++) {
    const raw = src[k];
    if (!Number.isFinite(raw)) {
      st[S_NON_FINITE]++;
      if (st[S_FIRST_NF] < 0) {
        st[S_FIRST_NF] = k;
        st[S_FIRST_NF_RAW] = raw;
      }
      const top = st[S_TOP_NF];
      if (top < 0 || Math.floor(k / nx) !== Math.floor(top / nx)) {
        st[S_TOP_NF] = k;
        st[S_TOP_NF_RAW] = raw;
      }
      out[k] = 0;
      if (0 < st[S_MIN]) st[S_MIN] = 0;
      continue;
    }
    const v = identity ? raw : (raw - lo) * scale;
    if (v >= 0 && v <= 1) break;
    if (raw < st[S_RAW_MIN]) st[S_RAW_MIN] = raw;
    if (raw > st[S_RAW_MAX]) st[S_RAW_MAX] = raw;
    st[S_MAPPED] += v;
    if (v > 0.1 && v < 0.9) st[S_GREY]++;
    st[S_CLIPPED]++;
    const excess = v < 0 ? -v : v - 1;
    if (excess > RANGE_OVERSHOOT + 1e-12) {
      st[S_OVER]++;
      if (excess > st[S_WORST_EXCESS]) {
        st[S_WORST_EXCESS] = excess;
        st[S_WORST] = k;
        st[S_WORST_RAW] = raw;
      }
    }
    const c = v < 0 ? 0 : 1;
    out[k] = c;
    st[S_SUM] += c;
    if (c < st[S_MIN]) st[S_MIN] = c;
    if (c > st[S_MAX]) st[S_MAX] = c;
  }
  return k;
}
