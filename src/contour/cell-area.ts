/** Area of the marching-squares region inside one lattice cell, from its four corner values alone. */
import { crossing, joinsSolid, type SaddleRule } from './saddle.js';

/** x, y pairs of the case polygon: at most 5 vertices. */
const SCRATCH = new Float64Array(12);

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
  const L = level;
  const a = v00 >= L;
  const b = v10 >= L;
  const c = v11 >= L;
  const d = v01 >= L;
  const n = (a ? 1 : 0) + (b ? 1 : 0) + (c ? 1 : 0) + (d ? 1 : 0);
  if (n === 0) return 0;
  if (n === 4) return w * h;
  // crossings in the unit cell, from the bottom-left / bottom-right / top-left / bottom-left corner
  const xB = a === b ? 0 : a ? crossing(v00, v10, L) : 1 - crossing(v10, v00, L);
  const yR = b === c ? 0 : b ? crossing(v10, v11, L) : 1 - crossing(v11, v10, L);
  const xT = d === c ? 0 : d ? crossing(v01, v11, L) : 1 - crossing(v11, v01, L);
  const yL = a === d ? 0 : a ? crossing(v00, v01, L) : 1 - crossing(v01, v00, L);
  let s: number;
  if (n === 2 && a === c) {
    const joined = a ? joinsSolid(v00, v11, v10, v01, L, rule) : joinsSolid(v10, v01, v00, v11, L, rule);
    const tBL = 0.5 * xB * yL;
    const tBR = 0.5 * (1 - xB) * yR;
    const tTR = 0.5 * (1 - xT) * (1 - yR);
    const tTL = 0.5 * xT * (1 - yL);
    if (a) s = joined ? 1 - tBR - tTL : tBL + tTR;
    else s = joined ? 1 - tBL - tTR : tBR + tTL;
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
  return s * w * h;
}
