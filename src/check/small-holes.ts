/**
 * `small-holes`: the area of the smallest hole of the part (docs/checks/small-holes.md). Unit mm²; measured ≥
 * limit passes (`--min-hole-area`).
 *
 * Frame: mm, y up. A hole is a hole ring of a polygon (clockwise, enclosed by its outer ring); void open to the
 * domain edge is not a hole. Its area is the area its ring encloses (shoelace).
 */
import { ringArea, ringPerimeter } from '../geom/area.js';
import { interiorPoint } from '../geom/interior.js';
import type { CheckContext, CheckDefinition, Measurement, RawLocation } from './types.js';

/**
 * measured = the smallest hole area (mm²), null when the part has no hole. Resolution = that hole's perimeter ×
 * ctx.tolerance (the area a band of the outline's deviation budget along the hole can hold). Locations: every
 * hole whose area is below limit + its own resolution, at a point strictly inside the hole ring
 * (src/geom/interior.ts), measured = its area. O(vertices).
 */
export function measureSmallHoles(ctx: CheckContext, limit: number): Measurement {
  const tol = ctx.tolerance > 0 ? ctx.tolerance : 0;
  let smallest = Infinity;
  let resolution = 0;
  const locations: RawLocation[] = [];
  for (const p of ctx.polygons.polygons) {
    for (const h of p.holes) {
      const area = Math.abs(ringArea(h));
      const res = ringPerimeter(h) * tol;
      if (area < smallest) {
        smallest = area;
        resolution = res;
      }
      if (area < limit + res) {
        const [x, y] = interiorPoint(h);
        locations.push({ x, y, measured: area });
      }
    }
  }
  return {
    measured: smallest === Infinity ? null : smallest,
    resolution,
    method: 'area enclosed by each hole ring (shoelace); resolution = hole perimeter × outline tolerance',
    locations,
  };
}

export const smallHoles: CheckDefinition = {
  id: 'small-holes',
  unit: 'mm2',
  comparison: '>=',
  measure: measureSmallHoles,
};
