/**
 * Disc centres kept clear of passive voids: a thickening disc that would reach into a passive-void region (a
 * bolt hole the caller fixed) is moved away from it, so that the member grows on its other side instead of
 * being cut back by the void on every round.
 *
 * Frame: millimetres, y up. Rings: passive-void regions, either orientation (non-zero fill of one ring).
 */
import { ringBounds, ringContains } from '../geom/contains.js';
import type { Point, Ring } from '../types.js';

/**
 * The nearest point of ring `r`'s boundary to (x, y) (mm) and its distance. O(vertices).
 */
function nearestOnRing(r: Ring, x: number, y: number): { px: number; py: number; d: number } {
  let best = Infinity, bx = x, by = y;
  for (let i = 0, j = r.length - 1; i < r.length; j = i++) {
    const ax = r[j][0], ay = r[j][1], ex = r[i][0] - ax, ey = r[i][1] - ay;
    const l2 = ex * ex + ey * ey;
    let t = l2 > 0 ? ((x - ax) * ex + (y - ay) * ey) / l2 : 0;
    t = t < 0 ? 0 : t > 1 ? 1 : t;
    const qx = ax + t * ex, qy = ay + t * ey;
    const d2 = (x - qx) * (x - qx) + (y - qy) * (y - qy);
    if (d2 < best) { best = d2; bx = qx; by = qy; }
  }
  return { px: bx, py: by, d: Math.sqrt(best) };
}

/**
 * `c` moved so that the disc of radius `rho` (mm) around it stays out of every ring of `voids`: when the disc
 * reaches into a void (the centre closer than rho to its boundary, or inside it), the centre moves along the
 * line from the nearest boundary point through the centre to distance rho outside. A few passes settle a
 * centre between two voids as well as it can be (it may still touch one when they are closer than 2·rho).
 * Returns `c` itself when no void is near.
 */
export function clearOfVoids(c: Point, rho: number, voids: readonly Ring[], boxes: readonly [number, number, number, number][]): Point {
  let x = c[0], y = c[1];
  for (let pass = 0; pass < 3; pass++) {
    let moved = false;
    for (let k = 0; k < voids.length; k++) {
      const b = boxes[k];
      if (x < b[0] - rho || x > b[2] + rho || y < b[1] - rho || y > b[3] + rho) continue;
      const n = nearestOnRing(voids[k], x, y);
      const inside = ringContains(voids[k], [x, y]) > 0;
      if (!inside && n.d >= rho) continue;
      let ux = x - n.px, uy = y - n.py;
      const l = Math.hypot(ux, uy);
      if (!(l > 0)) continue; // on the boundary exactly: no direction to go (rare; left as it is)
      ux /= l; uy /= l;
      if (inside) { ux = -ux; uy = -uy; }
      x = n.px + ux * rho;
      y = n.py + uy * rho;
      moved = true;
    }
    if (!moved) break;
  }
  return x === c[0] && y === c[1] ? c : [x, y];
}

/** Bounding boxes of the rings, for clearOfVoids. */
export function boxesOf(voids: readonly Ring[]): [number, number, number, number][] {
  return voids.map((r) => ringBounds(r));
}
