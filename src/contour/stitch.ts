/**
 * Crossings → rings, one per cycle of `next`, solid on the left. Exact clean-up of what the zero-width edge
 * cells produce: repeated vertices, zero-width spikes, vertices inside an axis-parallel straight run.
 */
import { RhoformError } from '../errors.js';
import type { Crossings } from './march.js';
import { ContourScratch } from './scratch.js';

/** Rings in the order of their first crossing (bottom-up, left-to-right scan). */
export interface StitchedRings {
  readonly count: number;
  /** Ring id of every crossing (entries 0 … crossings − 1). */
  readonly ringOf: Int32Array;
  /** Ring r: vertices start[r] … start[r + 1] − 1 of xy (mm); a degenerate ring is stored empty. */
  readonly xy: Float64Array;
  readonly start: Int32Array;
  /** Signed area (mm²) of each cleaned ring. */
  readonly area: Float64Array;
}

/** `scratch`: where ringOf and xy live (valid until its next use); fresh arrays without. */
export function stitch(cr: Crossings, scratch: ContourScratch = new ContourScratch()): StitchedRings {
  const n = cr.count;
  const { ringOf, rings: out } = scratch.stitchBuffers(n);
  ringOf.fill(-1, 0, n);
  const starts: number[] = [0];
  const areas: number[] = [];
  let used = 0;
  let ox = scratch.ox;
  let oy = scratch.oy;
  const { x, y, next } = cr;
  for (let c0 = 0; c0 < n; c0++) {
    if (ringOf[c0] !== -1) continue;
    const r = areas.length;
    let m = 0;
    let c = c0;
    do {
      ringOf[c] = r;
      if (m + 1 >= ox.length) {
        const gx = new Float64Array(ox.length * 2);
        const gy = new Float64Array(ox.length * 2);
        gx.set(ox);
        gy.set(oy);
        ox = scratch.ox = gx;
        oy = scratch.oy = gy;
      }
      m = push(ox, oy, m, x[c], y[c]);
      c = next[c];
    } while (c !== c0 && c >= 0);
    if (c < 0) throw new RhoformError('E_INTERNAL', `contour: expected closed rings, found an open boundary at crossing ${c0}`);
    // re-check the seam between the last and the first vertices
    let s = 0;
    for (let changed = true; changed && m - s >= 3; ) {
      changed = false;
      if (ox[m - 1] === ox[s] && oy[m - 1] === oy[s]) {
        m--;
        changed = true;
      } else if (removable(ox[m - 2], oy[m - 2], ox[m - 1], oy[m - 1], ox[s], oy[s])) {
        m--;
        changed = true;
      } else if (removable(ox[m - 1], oy[m - 1], ox[s], oy[s], ox[s + 1], oy[s + 1])) {
        s++;
        changed = true;
      }
    }
    let a = 0;
    if (m - s >= 3) {
      const x0 = ox[s];
      const y0 = oy[s];
      for (let k = s; k < m; k++) {
        out[2 * used] = ox[k];
        out[2 * used + 1] = oy[k];
        used++;
      }
      for (let k = s + 1; k < m - 1; k++) a += (ox[k] - x0) * (oy[k + 1] - y0) - (ox[k + 1] - x0) * (oy[k] - y0);
    }
    starts.push(used);
    areas.push(0.5 * a);
  }
  return { count: areas.length, ringOf, xy: out, start: Int32Array.from(starts), area: Float64Array.from(areas) };
}

/** Appends (px, py) to the cleaned stack ox/oy of length m; returns the new length. */
function push(ox: Float64Array, oy: Float64Array, m: number, px: number, py: number): number {
  for (;;) {
    if (m >= 1 && ox[m - 1] === px && oy[m - 1] === py) return m;
    if (m >= 2 && removable(ox[m - 2], oy[m - 2], ox[m - 1], oy[m - 1], px, py)) {
      m--;
      continue;
    }
    break;
  }
  ox[m] = px;
  oy[m] = py;
  return m + 1;
}

/** True when vertex b can go without moving the outline: a spike (a = c), or b on the axis-parallel segment a–c. */
function removable(ax: number, ay: number, bx: number, by: number, cx: number, cy: number): boolean {
  if (ax === cx && ay === cy) return true;
  if (ax === bx && bx === cx) return (ay <= by && by <= cy) || (cy <= by && by <= ay);
  if (ay === by && by === cy) return (ax <= bx && bx <= cx) || (cx <= bx && bx <= ax);
  return false;
}
