/** Disc centres kept clear of passive voids (docs/notes/repair.md). mm, y up; void rings of either orientation. */
import { ringBounds, ringContains } from '../geom/contains.js';
import { nearestOnRing } from '../geom/near.js';
import type { Point, Ring } from '../types.js';
import { hypot } from '../geom/portable-math.js';

/** `c` moved so that the disc of radius `rho` (mm) around it stays out of every void; `c` itself when none is near. */
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
      const l = hypot(ux, uy);
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

export function boxesOf(voids: readonly Ring[]): [number, number, number, number][] {
  return voids.map((r) => ringBounds(r));
}
