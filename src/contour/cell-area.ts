/**
 * Area of the marching-squares region inside one lattice cell, from its four corner values alone.
 * This is exactly the area the stitched contour encloses inside that cell (same solid test, same edge
 * crossings, same saddle rule), so summing it over cells gives the contour's area without stitching.
 */
import { crossing, joinsSolid, type SaddleRule } from './saddle.js';

/**
 * Area in mm² of {value ≥ level} inside a w × h cell (mm) as marching squares draws it: the polygon through the
 * solid corners and the linearly interpolated edge crossings. Corners: v00 bottom-left, v10 bottom-right,
 * v01 top-left, v11 top-right (lattice values: NaN already mapped to −∞).
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
  // crossings in the unit cell, measured from the bottom-left / bottom-right / top-left / bottom-left corner
  const xB = a === b ? 0 : a ? crossing(v00, v10, L) : 1 - crossing(v10, v00, L);
  const yR = b === c ? 0 : b ? crossing(v10, v11, L) : 1 - crossing(v11, v10, L);
  const xT = d === c ? 0 : d ? crossing(v01, v11, L) : 1 - crossing(v11, v01, L);
  const yL = a === d ? 0 : a ? crossing(v00, v01, L) : 1 - crossing(v01, v00, L);
  let s: number;
  if (n === 2 && a === c) {
    // saddle
    const joined = a ? joinsSolid(v00, v11, v10, v01, L, rule) : joinsSolid(v10, v01, v00, v11, L, rule);
    // triangles at each corner, unit cell
    const tBL = 0.5 * xB * yL;
    const tBR = 0.5 * (1 - xB) * yR;
    const tTR = 0.5 * (1 - xT) * (1 - yR);
    const tTL = 0.5 * xT * (1 - yL);
    if (a) s = joined ? 1 - tBR - tTL : tBL + tTR;
    else s = joined ? 1 - tBL - tTR : tBR + tTL;
  } else {
    // one polygon: walk the cell counter-clockwise, taking solid corners and crossings (shoelace)
    s = 0;
    let px = 0;
    let py = 0;
    let first = true;
    let fx = 0;
    let fy = 0;
    const put = (x: number, y: number) => {
      if (first) {
        fx = x;
        fy = y;
        first = false;
      } else s += px * y - x * py;
      px = x;
      py = y;
    };
    if (a) put(0, 0);
    if (a !== b) put(xB, 0);
    if (b) put(1, 0);
    if (b !== c) put(1, yR);
    if (c) put(1, 1);
    if (c !== d) put(xT, 1);
    if (d) put(0, 1);
    if (d !== a) put(0, yL);
    s += px * fy - fx * py;
    s *= 0.5;
  }
  return s * w * h;
}
