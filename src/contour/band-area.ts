/**
 * The packed band's area at a level (src/contour/band.ts packs it): per cell, and summed over the band in order.
 */
import { CELL_AREA, cellPolyArea, cellPolyAreaAt } from './cell-area.js';
import type { SaddleRule } from './saddle.js';

/** Floats per packed cell: v00, v10, v01, v11 (corner values), w, h (mm), min, max (of the corners). */
export const BAND_STRIDE = 8;

/** mm² at `level` of the packed cell at buf[o]. */
export function bandCellArea(buf: Float64Array, o: number, level: number, saddle: SaddleRule): number {
  if (buf[o + 6] >= level) return buf[o + 4] * buf[o + 5];
  if (buf[o + 7] < level) return 0;
  return cellPolyArea(buf[o], buf[o + 1], buf[o + 2], buf[o + 3], level, buf[o + 4], buf[o + 5], saddle);
}

/**
 * Packed cells per kernel call. The band sums below run in short calls so that V8 optimizes them as ordinary
 * functions early; one long loop ran in the interpreter until on-stack replacement, boxing every double
 * (docs/performance.md, "Cold code"). The running sum passes between calls in SUM, unboxed.
 */
const RUN = 1024;
const SUM = new Float64Array(1);

/** SUM[0] += bandCellArea of packed cells k0 … k1 − 1, in order, written out so that no double crosses a call. */
function bandAreaRun(buf: Float64Array, k0: number, k1: number, level: number, saddle: SaddleRule): void {
  let a = SUM[0];
  for (let k = k0; k < k1; k++) {
    const o = BAND_STRIDE * k;
    if (buf[o + 6] >= level) a += buf[o + 4] * buf[o + 5];
    else if (buf[o + 7] >= level) {
      cellPolyAreaAt(buf, o, level, saddle);
      a += CELL_AREA[0];
    } // else empty at this level: adds nothing (a starts at a non-negative base, never −0)
  }
  SUM[0] = a;
}

/** bandAreaRun over the packed cells index[k0 … k1 − 1]. */
function bandAreaOfRun(buf: Float64Array, index: Int32Array, k0: number, k1: number, level: number, saddle: SaddleRule): void {
  let a = SUM[0];
  for (let k = k0; k < k1; k++) {
    const o = BAND_STRIDE * index[k];
    if (buf[o + 6] >= level) a += buf[o + 4] * buf[o + 5];
    else if (buf[o + 7] >= level) {
      cellPolyAreaAt(buf, o, level, saddle);
      a += CELL_AREA[0];
    } // else empty at this level: adds nothing (a starts at a non-negative base, never −0)
  }
  SUM[0] = a;
}

/** base + Σ bandCellArea over the first `count` packed cells, in order: one frame for the whole band. */
export function bandArea(buf: Float64Array, count: number, level: number, base: number, saddle: SaddleRule): number {
  SUM[0] = base;
  for (let k = 0; k < count; k += RUN) bandAreaRun(buf, k, count - k > RUN ? k + RUN : count, level, saddle);
  return SUM[0];
}

/** base + Σ bandCellArea over the packed cells index[0 … count − 1], in that order. */
export function bandAreaOf(buf: Float64Array, index: Int32Array, count: number, level: number, base: number, saddle: SaddleRule): number {
  SUM[0] = base;
  for (let k = 0; k < count; k += RUN) bandAreaOfRun(buf, index, k, count - k > RUN ? k + RUN : count, level, saddle);
  return SUM[0];
}
