/** The `geometry` block of the report: counts, area, perimeter, vertices and bounding box of the final polygons. */
import { ringArea, ringPerimeter } from '../geom/area.js';
import type { PolygonSet, Report } from '../types.js';

export function summarizeGeometry(set: PolygonSet, domainArea: number): Report['geometry'] {
  let holes = 0;
  let area = 0;
  let perimeter = 0;
  let vertices = 0;
  let minX = Infinity;
  let minY = Infinity;
  let maxX = -Infinity;
  let maxY = -Infinity;
  for (const p of set.polygons) {
    for (const ring of [p.outer, ...p.holes]) {
      area += ringArea(ring);
      perimeter += ringPerimeter(ring);
      vertices += ring.length;
    }
    holes += p.holes.length;
    for (const [x, y] of p.outer) {
      if (x < minX) minX = x;
      if (y < minY) minY = y;
      if (x > maxX) maxX = x;
      if (y > maxY) maxY = y;
    }
  }
  const empty = set.polygons.length === 0;
  return {
    polygons: set.polygons.length,
    holes,
    area,
    perimeter,
    vertices,
    bbox: empty ? [0, 0, 0, 0] : [minX, minY, maxX, maxY],
    finalFraction: domainArea > 0 ? area / domainArea : 0,
  };
}
