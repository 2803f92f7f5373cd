/**
 * The level search's view of the area lattice (src/threshold/search.ts), streamed row by row: cell areas
 * binned by corner range, and the cells that meet a level bracket, packed. Same lattice and rules as
 * regionArea: fullBase + Σ bandCellArea over the packed cells equals regionArea at every level in the bracket.
 */
import type { DensityGrid } from '../types.js';
import { BAND_STRIDE, bandArea, bandAreaOf, bandCellArea } from './band-area.js';
import { fillRow, gridLattice, latticeValue } from './lattice.js';
import type { SaddleRule } from './saddle.js';

export { BAND_STRIDE, bandArea, bandAreaOf, bandCellArea };

export interface CellRangeHistogram {
  /** Lattice value range (NaN samples count as −∞). */
  readonly gmin: number;
  readonly gmax: number;
  /** mm², the domain. */
  readonly total: number;
  /** mm² of the cells whose smallest (largest) corner value is in bin ⌊(v − gmin)·bins/(gmax − gmin)⌋; empty when the range is. */
  readonly minHist: Float64Array;
  readonly maxHist: Float64Array;
  /** The cells (not their area) binned the same way: they bound the cells a bracket packs (bandCellBound). */
  readonly minCount: Int32Array;
  readonly maxCount: Int32Array;
  /** All cells of the lattice. */
  readonly cells: number;
}

export interface PackedBand {
  /** mm² of the cells whose smallest corner value is ≥ hi. */
  readonly fullBase: number;
  /** count × BAND_STRIDE floats. */
  readonly buf: Float64Array;
  readonly count: number;
}

/** The area lattice two value rows at a time (`lo` bottom, `hi` top); callers loop over the cells themselves. */
class RowStream {
  readonly xs: Float64Array;
  readonly ys: Float64Array;
  readonly cols: number;
  lo: Float64Array;
  hi: Float64Array;
  private readonly lat: NonNullable<ReturnType<typeof gridLattice>>;

  constructor(private readonly grid: DensityGrid) {
    const lat = gridLattice(grid);
    if (!lat) throw new Error('RowStream: empty lattice');
    this.lat = lat;
    this.xs = lat.x.coords;
    this.ys = lat.y.coords;
    this.cols = this.xs.length - 1;
    this.lo = new Float64Array(this.cols + 1);
    this.hi = new Float64Array(this.cols + 1);
  }

  get rows(): number {
    return this.ys.length - 1;
  }

  /** Cell row j; call with j = 0, 1, 2, … in order. */
  load(j: number): void {
    if (j === 0) fillRow(this.grid, this.lat.x.sample, this.lat.y.sample[0], this.lo, 0);
    else {
      const t = this.lo;
      this.lo = this.hi;
      this.hi = t;
    }
    fillRow(this.grid, this.lat.x.sample, this.lat.y.sample[j + 1], this.hi, 0);
  }
}

/** Plain comparisons: much faster than Math.min with four arguments. */
function min4(a: number, b: number, c: number, d: number): number {
  const p = a < b ? a : b;
  const q = c < d ? c : d;
  return p < q ? p : q;
}
function max4(a: number, b: number, c: number, d: number): number {
  const p = a > b ? a : b;
  const q = c > d ? c : d;
  return p > q ? p : q;
}

/** Samples per call of boundsRun (short calls are optimized early: docs/performance.md, "Cold code"). */
const RUN = 1024;

/** Lattice value range; the edge nodes repeat edge samples, so the samples suffice. */
function valueBounds(grid: DensityGrid): [number, number] {
  const v = grid.values;
  const mm = new Float64Array(2);
  mm[0] = Infinity;
  mm[1] = -Infinity;
  for (let k = 0; k < v.length; k += RUN) boundsRun(v, k, v.length - k > RUN ? k + RUN : v.length, mm);
  return [mm[0], mm[1]];
}

/** mm[0], mm[1] = min, max of mm and the lattice values of v[k0 … k1 − 1]. */
function boundsRun(v: Float64Array, k0: number, k1: number, mm: Float64Array): void {
  let gmin = mm[0];
  let gmax = mm[1];
  for (let k = k0; k < k1; k++) {
    const x = latticeValue(v[k]);
    if (x < gmin) gmin = x;
    if (x > gmax) gmax = x;
  }
  mm[0] = gmin;
  mm[1] = gmax;
}

/** One pass. `bounds`: the sample range when the caller knows it (finite grids), saving a pass. */
export function cellRangeHistogram(grid: DensityGrid, bins: number, bounds?: readonly [number, number]): CellRangeHistogram {
  const none = { minHist: new Float64Array(0), maxHist: new Float64Array(0), minCount: new Int32Array(0), maxCount: new Int32Array(0) };
  if (!gridLattice(grid)) return { gmin: 0, gmax: 0, total: 0, cells: 0, ...none };
  const [gmin, gmax] = bounds ?? valueBounds(grid);
  const r = new RowStream(grid);
  const { xs, ys, cols } = r;
  const total = (xs[cols] - xs[0]) * (ys[r.rows] - ys[0]);
  const cells = cols * r.rows;
  if (!(gmax > gmin) || !Number.isFinite(gmin) || !Number.isFinite(gmax)) return { gmin, gmax, total, cells, ...none };
  const minHist = new Float64Array(bins + 1);
  const maxHist = new Float64Array(bins + 1);
  const minCount = new Int32Array(bins + 1);
  const maxCount = new Int32Array(bins + 1);
  const scale = bins / (gmax - gmin);
  for (let j = 0; j < r.rows; j++) {
    r.load(j);
    histogramRow(r.lo, r.hi, xs, cols, ys[j + 1] - ys[j], gmin, scale, bins, minHist, maxHist, minCount, maxCount);
  }
  return { gmin, gmax, total, minHist, maxHist, minCount, maxCount, cells };
}

/** cellRangeHistogram's cells of one row: `lo`, `hi` its bottom and top lattice values, `h` its height (mm). */
function histogramRow(
  lo: Float64Array,
  hi: Float64Array,
  xs: Float64Array,
  cols: number,
  h: number,
  gmin: number,
  scale: number,
  bins: number,
  minHist: Float64Array,
  maxHist: Float64Array,
  minCount: Int32Array,
  maxCount: Int32Array,
): void {
  for (let i = 0; i < cols; i++) {
    const a = lo[i];
    const b = lo[i + 1];
    const c = hi[i];
    const d = hi[i + 1];
    const mn = min4(a, b, c, d);
    const mx = max4(a, b, c, d);
    const area = (xs[i + 1] - xs[i]) * h;
    let kmin = ((mn - gmin) * scale) | 0;
    let kmax = ((mx - gmin) * scale) | 0;
    if (kmin > bins) kmin = bins;
    if (kmax > bins) kmax = bins;
    minHist[kmin] += area;
    maxHist[kmax] += area;
    minCount[kmin]++;
    maxCount[kmax]++;
  }
}

/**
 * At least as many cells as packBand(grid, lo, hi) packs, from the histogram of the same grid (the cells whose
 * smallest corner bins above `hi`, or whose largest bins below `lo`, are left out). Binning is monotone — a
 * subtraction, a positive scale and a truncation, each non-decreasing in floating point — so a cell whose
 * smallest corner bins above hi's bin has that corner > hi, and likewise below lo. Holds when every lattice
 * value lies in [gmin, gmax] or is −∞ (NaN samples), as the histogram's own binning assumes.
 */
export function bandCellBound(h: CellRangeHistogram, lo: number, hi: number): number {
  const bins = h.minCount.length - 1;
  if (bins < 1) return h.cells;
  const { gmin, gmax } = h;
  const scale = bins / (gmax - gmin);
  const bin = (v: number): number => {
    const x = v < gmin ? gmin : v > gmax ? gmax : v;
    const k = ((x - gmin) * scale) | 0;
    return k > bins ? bins : k;
  };
  let n = h.cells;
  for (let k = bin(hi) + 1; k <= bins; k++) n -= h.minCount[k];
  const kl = bin(lo);
  for (let k = 0; k < kl; k++) n -= h.maxCount[k];
  return n;
}

/**
 * The cells meeting [lo, hi], packed, and the area of those full on it. One pass. `capacity`: cells to make
 * room for at once, e.g. bandCellBound (fresh memory costs more than the pass: no doubling then); the buffer
 * still grows if it was too few.
 */
export function packBand(grid: DensityGrid, lo: number, hi: number, capacity?: number): PackedBand {
  if (!gridLattice(grid)) return { fullBase: 0, buf: new Float64Array(0), count: 0 };
  const r = new RowStream(grid);
  const { xs, ys, cols } = r;
  const room = capacity !== undefined && capacity >= 0 ? Math.min(capacity, cols * r.rows) : Math.max(1024, (cols * r.rows) >>> 4);
  let buf = new Float64Array(BAND_STRIDE * room);
  const acc = new Float64Array(2); // the full cells' area (mm²) and the next free float of buf
  for (let j = 0; j < r.rows; j++) {
    r.load(j);
    const h = ys[j + 1] - ys[j];
    for (let i = 0; ; ) {
      i = packRow(r.lo, r.hi, xs, cols, h, lo, hi, buf, i, acc);
      if (i === cols) break;
      // the buffer is full at cell i: rare when `capacity` bounds the band
      const bigger = new Float64Array(Math.max(2 * buf.length, 1024 * BAND_STRIDE));
      bigger.set(buf);
      buf = bigger;
    }
  }
  return { fullBase: acc[0], buf, count: acc[1] / BAND_STRIDE };
}

/**
 * packBand's cells i0 … cols − 1 of one row (`bot`, `top` its lattice values, `h` its height in mm); acc[0] the
 * full cells' area, acc[1] the next free float of buf. Returns cols, or the cell that did not fit into buf.
 */
function packRow(
  bot: Float64Array,
  top: Float64Array,
  xs: Float64Array,
  cols: number,
  h: number,
  lo: number,
  hi: number,
  buf: Float64Array,
  i0: number,
  acc: Float64Array,
): number {
  let fullBase = acc[0];
  let o = acc[1];
  let i = i0;
  for (; i < cols; i++) {
    const a = bot[i];
    const b = bot[i + 1];
    const c = top[i];
    const d = top[i + 1];
    const mn = min4(a, b, c, d);
    if (mn >= hi) {
      fullBase += (xs[i + 1] - xs[i]) * h;
      continue;
    }
    const mx = max4(a, b, c, d);
    if (mx < lo) continue;
    if (o + BAND_STRIDE > buf.length) break;
    buf[o] = a;
    buf[o + 1] = b;
    buf[o + 2] = c;
    buf[o + 3] = d;
    buf[o + 4] = xs[i + 1] - xs[i];
    buf[o + 5] = h;
    buf[o + 6] = mn;
    buf[o + 7] = mx;
    o += BAND_STRIDE;
  }
  acc[0] = fullBase;
  acc[1] = o;
  return i;
}

/** The level search's LevelAreaModel of a grid. `bounds`: the sample range, for NaN-free grids. */
export function levelBandModel(grid: DensityGrid, saddle: SaddleRule, bounds?: readonly [number, number]) {
  // the last histogram sizes the band the search packs next (bandCellBound)
  let hist: CellRangeHistogram | undefined;
  return {
    histogram: (bins: number) => (hist = cellRangeHistogram(grid, bins, bounds)),
    pack: (lo: number, hi: number) => packBand(grid, lo, hi, hist ? bandCellBound(hist, lo, hi) : undefined),
    packedArea: (buf: Float64Array, o: number, level: number) => bandCellArea(buf, o, level, saddle),
    bandArea: (buf: Float64Array, count: number, level: number, base: number) => bandArea(buf, count, level, base, saddle),
    bandAreaOf: (buf: Float64Array, index: Int32Array, count: number, level: number, base: number) =>
      bandAreaOf(buf, index, count, level, base, saddle),
  };
}
