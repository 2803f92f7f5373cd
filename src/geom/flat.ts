/** Nested polygons to flat rings: each outer ring then its holes, coordinates as they are (mm, y up). */
import type { PolygonSet } from '../types.js';
import type { FlatRings } from './segments.js';

/** Every ring in one typed array, outer then its holes, polygon by polygon. O(vertices). */
export function flattenSet(set: PolygonSet): FlatRings {
  let rings = 0, vertices = 0;
  for (const p of set.polygons) {
    rings += 1 + p.holes.length;
    vertices += p.outer.length;
    for (const h of p.holes) vertices += h.length;
  }
  const xy = new Float64Array(2 * vertices);
  const start = new Int32Array(rings + 1);
  let r = 0, o = 0;
  const put = (ring: readonly (readonly [number, number])[]): void => {
    start[r++] = o;
    for (const [x, y] of ring) {
      xy[2 * o] = x;
      xy[2 * o + 1] = y;
      o++;
    }
  };
  for (const p of set.polygons) {
    put(p.outer);
    for (const h of p.holes) put(h);
  }
  start[r] = o;
  return { xy, start };
}
