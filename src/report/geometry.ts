/**
 * The `geometry` block of the report: counts, area, perimeter, vertices and bounding box of the part as the
 * geometry files hold it (DESIGN §8): rings cleaned as written in mm (src/geom/clean-ring.ts), true circles as
 * circles (area πr², perimeter 2πr) and arcs (`--arcs`) as arcs (src/geom/bulge.ts). mm, y up.
 */
import { bulgeArcLength, bulgeSegmentArea, extendByArc } from '../geom/bulge.js';
import { cleanRing, MIN_SEGMENT_MM } from '../geom/clean-ring.js';
import type { PolygonSet, Report } from '../types.js';
import type { RingBulges, RingCircle } from '../write/types.js';
import { hypot } from '../geom/portable-math.js';

/** What is written instead of plain rings: true circles and arcs (as the writers take them). */
export interface WrittenShape {
  readonly ringCircles?: readonly RingCircle[];
  readonly arcs?: RingBulges;
}

/** Decimals of the DXF in mm: the rings are measured as that file holds them. */
const DECIMALS = 6;

export function summarizeGeometry(set: PolygonSet, domainArea: number, shape: WrittenShape = {}): Report['geometry'] {
  const circles = new Map<string, RingCircle>();
  for (const c of shape.ringCircles ?? []) circles.set(`${c.polygon}:${c.ring}`, c);
  let holes = 0;
  let area = 0;
  let perimeter = 0;
  let vertices = 0;
  let lines = 0;
  let arcs = 0;
  let nCircles = 0;
  let shortest = Infinity;
  const box = [Infinity, Infinity, -Infinity, -Infinity];
  set.polygons.forEach((p, i) => {
    holes += p.holes.length;
    [p.outer, ...p.holes].forEach((ring, k) => {
      const c = circles.get(`${i}:${k}`);
      if (c) {
        nCircles++;
        area += (k === 0 ? 1 : -1) * Math.PI * c.r * c.r;
        perimeter += 2 * Math.PI * c.r;
        if (k === 0) {
          box[0] = Math.min(box[0], c.x - c.r);
          box[1] = Math.min(box[1], c.y - c.r);
          box[2] = Math.max(box[2], c.x + c.r);
          box[3] = Math.max(box[3], c.y + c.r);
        }
        return;
      }
      const w = cleanRing(ring, 1, DECIMALS, MIN_SEGMENT_MM, shape.arcs?.[i]?.[k] ?? null);
      if (!w) return;
      const { xy, bulge } = w;
      const n = xy.length >> 1;
      vertices += n;
      let s = 0;
      const x0 = xy[0];
      const y0 = xy[1];
      for (let a = 0; a < n; a++) {
        const b = (a + 1) % n;
        const ax = xy[2 * a], ay = xy[2 * a + 1], bx = xy[2 * b], by = xy[2 * b + 1];
        // shoelace relative to the first point, plus each arc's circular segment
        s += (ax - x0) * (by - y0) - (bx - x0) * (ay - y0);
        const chord = hypot(bx - ax, by - ay);
        const g = bulge ? bulge[a] : 0;
        if (g !== 0) {
          arcs++;
          area += bulgeSegmentArea(chord, g);
        } else lines++;
        perimeter += bulgeArcLength(chord, g);
        if (chord < shortest) shortest = chord;
        if (k === 0) extendByArc(box, ax, ay, bx, by, g);
      }
      area += 0.5 * s;
    });
  });
  const empty = set.polygons.length === 0;
  return {
    polygons: set.polygons.length,
    holes,
    area,
    perimeter,
    vertices,
    bbox: empty || !(box[0] <= box[2]) ? [0, 0, 0, 0] : [box[0], box[1], box[2], box[3]],
    finalFraction: domainArea > 0 ? area / domainArea : 0,
    written: { lines, arcs, circles: nCircles, shortestSegment: Number.isFinite(shortest) ? shortest : null },
  };
}
