/**
 * Simplification of a finished outline (after the repairs) within a tolerance, keeping it a valid polygon set.
 *
 * The repairs build their result from polygon booleans and offsets, whose outlines carry many collinear and
 * near-coincident vertices (slivers a fraction of a micrometre long, arcs polygonised finer than the outline
 * tolerance). Each ring is simplified by Ramer–Douglas–Peucker (src/smooth/simplify.ts; U. Ramer 1972,
 * Douglas & Peucker 1973) within `epsilon` mm — every dropped vertex lies within ε of the chord that replaces it
 * — and the rings are then united by the boolean engine with the positive fill rule (outer rings
 * counter-clockwise +1, holes clockwise −1), which turns any crossing the independent simplification made into
 * a valid set again with the same material. Frame: mm, y up. Pure.
 */
import type { Point, PolygonSet, Ring } from '../types.js';
import { simplifyRing } from './simplify.js';
import { booleanOp, ringsOf } from '../geom/clipper.js';

/** Simplifies every ring of `set` within `epsilon` mm and re-validates the set (see the header). */
export function simplifySet(set: PolygonSet, epsilon: number, opts: { quantum?: number } = {}): PolygonSet {
  if (!(epsilon > 0) || set.polygons.length === 0) return set;
  const rings: Ring[] = ringsOf(set).map((ring) => simplifyOne(ring, epsilon));
  return booleanOp('union', rings, [], { ...opts, fill: 'positive' });
}

function simplifyOne(ring: Ring, epsilon: number): Ring {
  const n = ring.length;
  if (n <= 4) return ring;
  const xy = new Float64Array(2 * n);
  for (let i = 0; i < n; i++) {
    xy[2 * i] = ring[i][0];
    xy[2 * i + 1] = ring[i][1];
  }
  const keep = simplifyRing(xy, epsilon);
  const out: Point[] = [];
  for (let i = 0; i < n; i++) if (keep[i] !== 0) out.push(ring[i]);
  return out;
}
