/** Area of the marching-squares region inside one lattice cell, from its four corner values alone. */
import { joinsSolid, type SaddleRule } from './saddle.js';

/** x, y pairs of the case polygon: at most 5 vertices. */
const SCRATCH = new Float64Array(12);

/** The cell cellPolyArea hands to cellPolyAreaAt. */
const CELL = new Float64Array(6);

/** Where cellPolyAreaAt writes its result (mm²): read it right after the call. */
export const CELL_AREA = new Float64Array(1);

/**
 * mm² of {value ≥ level} inside a w × h cell (mm) as marching squares draws it. Corners: v00 bottom-left,
 * v10 bottom-right, v01 top-left, v11 top-right (lattice values).
 */
export function cellPolyArea(
  v00: number,
  v10: number,
  v01: number,
  v11: number,
  level: number,
  w: number,
  h: number,
  rule: SaddleRule,
): number {
  CELL[0] = v00;
  CELL[1] = v10;
  CELL[2] = v01;
  CELL[3] = v11;
  CELL[4] = w;
  CELL[5] = h;
  cellPolyAreaAt(CELL, 0, level, rule);
  return CELL_AREA[0];
}

/**
 * cellPolyArea of the cell cell[o … o + 5] = v00, v10, v01, v11, w, h, written to CELL_AREA[0]. For hot loops:
 * V8 does not inline a function this long, and a double passed to or returned from a call that is not inlined
 * is boxed on the heap; an index and the caller's own level are not.
 */
export function cellPolyAreaAt(cell: Float64Array, o: number, level: number, rule: SaddleRule): void {
  const v00 = cell[o];
  const v10 = cell[o + 1];
  const v01 = cell[o + 2];
  const v11 = cell[o + 3];
  const w = cell[o + 4];
  const h = cell[o + 5];
  const L = level;
  const a = v00 >= L;
  const b = v10 >= L;
  const c = v11 >= L;
  const d = v01 >= L;
  const n = (a ? 1 : 0) + (b ? 1 : 0) + (c ? 1 : 0) + (d ? 1 : 0);
  if (n === 0) {
    CELL_AREA[0] = 0;
    return;
  }
  if (n === 4) {
    CELL_AREA[0] = w * h;
    return;
  }
  // crossings in the unit cell, from the bottom-left / bottom-right / top-left / bottom-left corner; the
  // quotients are crossing() written out (a call site per edge and direction needed its own type feedback)
  const xB = a === b ? 0 : a ? (L - v00) / (v10 - v00) : 1 - (L - v10) / (v00 - v10);
  const yR = b === c ? 0 : b ? (L - v10) / (v11 - v10) : 1 - (L - v11) / (v10 - v11);
  const xT = d === c ? 0 : d ? (L - v01) / (v11 - v01) : 1 - (L - v11) / (v01 - v11);
  const yL = a === d ? 0 : a ? (L - v00) / (v01 - v00) : 1 - (L - v01) / (v00 - v01);
  let s: number;
  if (n === 2 && a === c) {
    // saddles are rare: out of line, so that the common cells' code stays small
    saddleShare(v00, v10, v01, v11, L, rule, xB, yR, xT, yL);
    s = CELL_AREA[0];
  } else {
    // walk the cell counter-clockwise through solid corners and crossings (shoelace)
    const P = SCRATCH;
    let m = 0;
    if (a) (P[m++] = 0), (P[m++] = 0);
    if (a !== b) (P[m++] = xB), (P[m++] = 0);
    if (b) (P[m++] = 1), (P[m++] = 0);
    if (b !== c) (P[m++] = 1), (P[m++] = yR);
    if (c) (P[m++] = 1), (P[m++] = 1);
    if (c !== d) (P[m++] = xT), (P[m++] = 1);
    if (d) (P[m++] = 0), (P[m++] = 1);
    if (d !== a) (P[m++] = 0), (P[m++] = yL);
    s = P[m - 2] * P[1] - P[0] * P[m - 1];
    for (let k = 2; k < m; k += 2) s += P[k - 2] * P[k + 1] - P[k] * P[k - 1];
    s *= 0.5;
  }
  CELL_AREA[0] = s * w * h;
}

/** Share of the unit cell that is solid in a saddle cell (a = c solid, or b = d), written to CELL_AREA[0]. */
function saddleShare(
  v00: number,
  v10: number,
  v01: number,
  v11: number,
  L: number,
  rule: SaddleRule,
  xB: number,
  yR: number,
  xT: number,
  yL: number,
): void {
  const a = v00 >= L;
  const joined = a ? joinsSolid(v00, v11, v10, v01, L, rule) : joinsSolid(v10, v01, v00, v11, L, rule);
  const tBL = 0.5 * xB * yL;
  const tBR = 0.5 * (1 - xB) * yR;
  const tTR = 0.5 * (1 - xT) * (1 - yR);
  const tTL = 0.5 * xT * (1 - yL);
  if (a) CELL_AREA[0] = joined ? 1 - tBR - tTL : tBL + tTR;
  else CELL_AREA[0] = joined ? 1 - tBL - tTR : tBR + tTL;
}
