/**
 * Simplification of a repaired outline (booleans and offsets leave slivers and finely polygonised arcs): RDP per
 * ring within `epsilon` mm (Ramer 1972; Douglas & Peucker 1973), then a union with the positive fill rule, which
 * makes any crossing the independent simplification made valid again with the same material. mm, y up.
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
