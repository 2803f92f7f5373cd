/** Independent checks of a PolygonSet's topology, for tests (brute force, written from the definitions). */
import { ringArea } from '../../src/geom/area.js';
import { ringContains } from '../../src/geom/contains.js';
import type { PolygonSet, Ring } from '../../src/types.js';

type P = readonly [number, number];

/** Orientation of the triangle a, b, c: > 0 counter-clockwise. */
function orient(a: P, b: P, c: P): number {
  return (b[0] - a[0]) * (c[1] - a[1]) - (b[1] - a[1]) * (c[0] - a[0]);
}

function onSeg(a: P, b: P, p: P): boolean {
  return Math.min(a[0], b[0]) <= p[0] && p[0] <= Math.max(a[0], b[0]) && Math.min(a[1], b[1]) <= p[1] && p[1] <= Math.max(a[1], b[1]);
}

/** True when closed segments ab and cd share a point (standard orientation test). */
export function segmentsMeet(a: P, b: P, c: P, d: P): boolean {
  const o1 = orient(a, b, c);
  const o2 = orient(a, b, d);
  const o3 = orient(c, d, a);
  const o4 = orient(c, d, b);
  if (((o1 > 0 && o2 < 0) || (o1 < 0 && o2 > 0)) && ((o3 > 0 && o4 < 0) || (o3 < 0 && o4 > 0))) return true;
  return (o1 === 0 && onSeg(a, b, c)) || (o2 === 0 && onSeg(a, b, d)) || (o3 === 0 && onSeg(c, d, a)) || (o4 === 0 && onSeg(c, d, b));
}

/** Number of pairs of edges that meet other than at the shared vertex of consecutive edges of one ring. */
export function countIntersections(set: PolygonSet): number {
  const rings: Ring[] = set.polygons.flatMap((p) => [p.outer, ...p.holes]);
  const segs: { a: P; b: P; ring: number; k: number; n: number; minX: number; maxX: number }[] = [];
  rings.forEach((r, ri) => {
    for (let k = 0; k < r.length; k++) {
      const a = r[k];
      const b = r[(k + 1) % r.length];
      segs.push({ a, b, ring: ri, k, n: r.length, minX: Math.min(a[0], b[0]), maxX: Math.max(a[0], b[0]) });
    }
  });
  segs.sort((s, t) => s.minX - t.minX);
  let bad = 0;
  for (let i = 0; i < segs.length; i++) {
    const s = segs[i];
    for (let j = i + 1; j < segs.length && segs[j].minX <= s.maxX; j++) {
      const t = segs[j];
      if (s.ring === t.ring) {
        const d = Math.abs(s.k - t.k);
        if (d === 1 || d === s.n - 1) continue; // consecutive edges share a vertex
      }
      if (segmentsMeet(s.a, s.b, t.a, t.b)) bad++;
    }
  }
  return bad;
}

/** For each hole, the index of the smallest outer ring containing its first vertex (brute force), or −1. */
export function bruteOwners(set: PolygonSet): { hole: Ring; assigned: number; expected: number }[] {
  const outers = set.polygons.map((p) => p.outer);
  const out: { hole: Ring; assigned: number; expected: number }[] = [];
  set.polygons.forEach((p, pi) => {
    for (const hole of p.holes) {
      let best = -1;
      let bestA = Infinity;
      outers.forEach((o, oi) => {
        if (ringContains(o, hole[0]) === 1 && ringArea(o) < bestA) {
          bestA = ringArea(o);
          best = oi;
        }
      });
      out.push({ hole, assigned: pi, expected: best });
    }
  });
  return out;
}
