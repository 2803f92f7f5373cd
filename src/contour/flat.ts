/** A polygon set as flat rings, the form the contour hands to smoothing without nested `[x, y]` arrays. */
import { flattenSet } from '../geom/flat.js';
import type { FlatRings } from '../geom/segments.js';
import type { Point, Polygon, PolygonSet, Ring } from '../types.js';

/**
 * Rings in polygon order: each outer ring followed by its holes. Frame: mm, y up; outer rings counter-clockwise,
 * holes clockwise, implicitly closed.
 */
export interface FlatPolygonSet extends FlatRings {
  /** 1 for a hole. */
  readonly hole: Uint8Array;
  /** For a hole, the index of its outer ring; −1 for an outer ring. */
  readonly owner: Int32Array;
}

export const NO_RINGS: FlatPolygonSet = { xy: new Float64Array(0), start: new Int32Array(1), hole: new Uint8Array(0), owner: new Int32Array(0) };

/** The nested form of a flat set (each vertex a fresh `[x, y]`). */
export function nestedSet(set: FlatPolygonSet): PolygonSet {
  const { xy, start, hole } = set;
  const polygons: Polygon[] = [];
  let holes: Ring[] = [];
  for (let r = 0; r + 1 < start.length; r++) {
    const pts: Point[] = new Array(start[r + 1] - start[r]);
    for (let i = start[r]; i < start[r + 1]; i++) pts[i - start[r]] = [xy[2 * i], xy[2 * i + 1]];
    if (hole[r] === 0) {
      holes = [];
      polygons.push({ outer: pts, holes });
    } else holes.push(pts);
  }
  return { polygons };
}

/** The flat form of a nested set, vertex for vertex. */
export function flatSet(set: PolygonSet): FlatPolygonSet {
  const { xy, start } = flattenSet(set);
  const rings = start.length - 1;
  const hole = new Uint8Array(rings);
  const owner = new Int32Array(rings);
  let r = 0;
  for (const p of set.polygons) {
    const outer = r;
    owner[r++] = -1;
    for (let k = 0; k < p.holes.length; k++) {
      hole[r] = 1;
      owner[r++] = outer;
    }
  }
  return { xy, start, hole, owner };
}
