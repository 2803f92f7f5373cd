/**
 * The iso-level whose raw marching-squares region has a given area, found without contouring: bracket from
 * binned corner ranges, pack the cells that meet the bracket, regula falsi on them (docs/notes/outline.md §1).
 */

import { BAND_STRIDE } from '../contour/band.js';

export { BAND_STRIDE };

/** Cell areas binned by corner range (src/contour/band.ts cellRangeHistogram). */
export interface BandHistogram {
  readonly gmin: number;
  readonly gmax: number;
  /** mm², the whole domain. */
  readonly total: number;
  /** Area (mm²) of the cells whose smallest / largest corner value is in bin k of [gmin, gmax], k = 0 … bins. */
  readonly minHist: Float64Array;
  readonly maxHist: Float64Array;
}

/** The cells that meet a bracket [lo, hi], packed BAND_STRIDE floats each, and the area of those full on it. */
export interface Band {
  readonly fullBase: number;
  readonly buf: Float64Array;
  readonly count: number;
}

/** What the search needs of the contour lattice (src/contour/band.ts levelBandModel). */
export interface LevelAreaModel {
  histogram(bins: number): BandHistogram;
  pack(lo: number, hi: number): Band;
  /** Area in mm² at `level` of the packed cell at buf[o] (0 if its max < level, full if its min ≥ level). */
  packedArea(buf: Float64Array, o: number, level: number): number;
  /** base + Σ packedArea over the first `count` packed cells, added in order (one call per evaluation). */
  bandArea?(buf: Float64Array, count: number, level: number, base: number): number;
  /** base + Σ packedArea over the packed cells index[0 … count − 1], added in that order. */
  bandAreaOf?(buf: Float64Array, index: Int32Array, count: number, level: number, base: number): number;
}

export interface RawLevelResult {
  /** The level found (value units, 0..1 after prepare). */
  readonly level: number;
  /** Raw region area at that level, mm². */
  readonly area: number;
  /** Root-finding steps taken (area evaluations after the bracket). */
  readonly steps: number;
  /**
   * Packed cells left in the band at the end: every lattice cell that straddles a level of the final bracket
   * (the level found normally lies in it). A size hint for contouring at that level; absent without a band.
   */
  readonly bandCells?: number;
}

const BINS = 1024;

function sumBand(model: LevelAreaModel, buf: Float64Array, count: number, level: number, base: number): number {
  if (model.bandArea) return model.bandArea(buf, count, level, base);
  let a = base;
  for (let k = 0; k < count; k++) a += model.packedArea(buf, BAND_STRIDE * k, level);
  return a;
}

function sumIndexed(model: LevelAreaModel, buf: Float64Array, index: Int32Array, count: number, level: number, base: number): number {
  if (model.bandAreaOf) return model.bandAreaOf(buf, index, count, level, base);
  let a = base;
  for (let k = 0; k < count; k++) a += model.packedArea(buf, BAND_STRIDE * index[k], level);
  return a;
}

/** Bracket [lo, hi] with A(lo) ≥ target ≥ A(hi), from binned bounds on A. */
function bracket(h: BandHistogram, targetArea: number): { lo: number; hi: number } {
  const bins = h.minHist.length - 1;
  const minS = Float64Array.from(h.minHist);
  const maxS = Float64Array.from(h.maxHist);
  for (let k = bins - 1; k >= 0; k--) {
    minS[k] += minS[k + 1];
    maxS[k] += maxS[k + 1];
  }
  const edge = (k: number) => h.gmin + (k * (h.gmax - h.gmin)) / bins;
  // A(e_k) ≥ (cells with min in bins ≥ k+1); the one-bin margin covers rounding at the bin edges.
  let lo = h.gmin;
  for (let k = bins - 1; k >= 1; k--) {
    if (minS[k + 1] >= targetArea) {
      lo = edge(k);
      break;
    }
  }
  // A(e_k) ≤ (cells with max in bins ≥ k−1).
  let hi = h.gmax;
  for (let k = 1; k < bins; k++) {
    if (maxS[k - 1] <= targetArea) {
      hi = edge(k);
      break;
    }
  }
  return hi > lo ? { lo, hi } : { lo: h.gmin, hi: h.gmax };
}

interface PackedBracket {
  readonly lo: number;
  readonly hi: number;
  readonly aLo: number;
  readonly aHi: number;
  /** mm²: the cells full on all of [lo, hi]. */
  readonly fullBase: number;
  readonly buf: Float64Array;
  readonly count: number;
}

function packBracket(model: LevelAreaModel, lo: number, hi: number): PackedBracket {
  const band = model.pack(lo, hi);
  const at = (level: number) => sumBand(model, band.buf, band.count, level, band.fullBase);
  return { lo, hi, aLo: at(lo), aHi: at(hi), fullBase: band.fullBase, buf: band.buf, count: band.count };
}

/**
 * Levels for raw region areas on one model. Later searches whose target lies in the first one's bracket (the
 * volume search asks two or three times for nearly the same area) reuse its packed cells.
 */
export class LevelSolver {
  private packed: PackedBracket | undefined;
  /** The packed cells still in the band after narrowing, as indices into the packed bracket (4 bytes a cell, not a copy of 64). */
  private kept = new Int32Array(0);
  /** Every (level, area) evaluated inside the packed bracket, for warm starts. */
  private known: { level: number; area: number }[] = [];

  constructor(private readonly model: LevelAreaModel) {}

  /**
   * Level L such that the raw region area A(L) equals `targetArea` (mm²) to `relTol` (relative to the target)
   * or until the bracket can no longer shrink. Returns the end of the value range when the target lies
   * outside [A(max), A(min)].
   *
   * Regula falsi with the Illinois modification (M. Dowell, P. Jarratt, "A modified regula falsi method for
   * computing the root of an equation", BIT 11:168–174, 1971, DOI 10.1007/BF01934364); a bisection step only
   * when rounding puts the interpolated level on an end of the bracket.
   */
  solve(targetArea: number, relTol = 1e-7): RawLevelResult {
    const model = this.model;
    let p = this.packed;
    if (!p || !(p.aLo >= targetArea && targetArea >= p.aHi)) {
      const h = model.histogram(BINS);
      if (!(h.gmax > h.gmin) || h.minHist.length < 2) return { level: h.gmin, area: h.total, steps: 0 };
      const br = bracket(h, targetArea);
      p = packBracket(model, br.lo, br.hi);
      this.packed = p;
      this.known = [
        { level: p.lo, area: p.aLo },
        { level: p.hi, area: p.aHi },
      ];
      if (targetArea >= p.aLo) return { level: p.lo, area: p.aLo, steps: 0, bandCells: p.count };
      if (targetArea <= p.aHi) return { level: p.hi, area: p.aHi, steps: 0, bandCells: p.count };
    }
    let { fullBase, count } = p;
    // A is non-increasing in the level: start from the tightest known pair around the target.
    let lo = p.lo;
    let aLo = p.aLo;
    let hi = p.hi;
    let aHi = p.aHi;
    for (const k of this.known) {
      if (k.area >= targetArea && k.level > lo) ({ level: lo, area: aLo } = k);
      if (k.area <= targetArea && k.level < hi) ({ level: hi, area: aHi } = k);
    }
    const known = this.known;
    const buf = p.buf;
    if (this.kept.length < count) this.kept = new Int32Array(count);
    const kept = this.kept;
    // all of the packed bracket until the first narrowing, then the cells kept[0 … count − 1]
    let indexed = false;
    const areaAt = (level: number): number =>
      indexed ? sumIndexed(model, buf, kept, count, level, fullBase) : sumBand(model, buf, count, level, fullBase);
    // Cells that no longer meet [lo, hi] leave the band, in order; full ones join fullBase.
    const narrow = () => {
      let keep = 0;
      for (let k = 0; k < count; k++) {
        const c = indexed ? kept[k] : k;
        const o = BAND_STRIDE * c;
        if (buf[o + 6] >= hi) fullBase += buf[o + 4] * buf[o + 5];
        else if (buf[o + 7] >= lo) kept[keep++] = c;
      }
      count = keep;
      indexed = true;
    };
    const tol = Math.abs(targetArea) * relTol;
    let narrowedWidth = p.hi - p.lo;
    if (hi - lo < 0.5 * narrowedWidth) {
      narrow();
      narrowedWidth = hi - lo;
    }
    // f = A − target: positive at lo, negative at hi. Illinois: halve f at the end that stays put.
    let fLo = aLo - targetArea;
    let fHi = aHi - targetArea;
    let side = 0;
    let steps = 0;
    let best = Math.abs(fLo) < Math.abs(fHi) ? { level: lo, area: aLo } : { level: hi, area: aHi };
    if (Math.abs(best.area - targetArea) <= tol) return { level: best.level, area: best.area, steps, bandCells: count };
    for (; steps < 200; steps++) {
      let mid = lo + (fLo / (fLo - fHi)) * (hi - lo);
      if (!(mid > lo && mid < hi)) mid = 0.5 * (lo + hi);
      if (!(mid > lo && mid < hi)) break;
      const a = areaAt(mid);
      known.push({ level: mid, area: a });
      const f = a - targetArea;
      if (Math.abs(f) < Math.abs(best.area - targetArea)) best = { level: mid, area: a };
      if (Math.abs(f) <= tol) break;
      if (f > 0) {
        lo = mid;
        fLo = f;
        if (side === 1) fHi *= 0.5;
        side = 1;
      } else {
        hi = mid;
        fHi = f;
        if (side === -1) fLo *= 0.5;
        side = -1;
      }
      // Re-pack only when the bracket has halved: each pass costs as much as an evaluation.
      if (hi - lo < 0.5 * narrowedWidth) {
        narrow();
        narrowedWidth = hi - lo;
      }
    }
    return { level: best.level, area: best.area, steps, bandCells: count };
  }
}

/** One search on its own (see LevelSolver.solve). */
export function levelForArea(model: LevelAreaModel, targetArea: number, relTol = 1e-7): RawLevelResult {
  return new LevelSolver(model).solve(targetArea, relTol);
}
