/**
 * Rings of the part drawn as true circles (`WriterInput.ringCircles`): validation and lookup for the writers.
 */
import { RhoformError } from '../errors.js';
import type { PolygonSet } from '../types.js';
import type { RingCircle } from './types.js';

/** Finds the circle that replaces ring `ring` (0 = outer, k ≥ 1 = hole k − 1) of polygon `polygon`, if any. */
export type RingCircleLookup = (polygon: number, ring: number) => RingCircle | undefined;

const NONE: RingCircleLookup = () => undefined;

/**
 * Checks every RingCircle against the polygons and returns a lookup by (polygon, ring).
 *
 * A RingCircle must name an existing ring (integer polygon index in range; ring 0 for the outer ring or
 * k ≥ 1 for hole k − 1 of that polygon), have a finite centre (mm) and a finite radius > 0 (mm), and be the
 * only entry for its ring; anything else throws RhoformError `E_INTERNAL` with the entry's index and values.
 */
export function ringCircleLookup(polygons: PolygonSet, circles: readonly RingCircle[] | undefined): RingCircleLookup {
  if (circles === undefined || circles.length === 0) return NONE;
  const byPolygon = new Map<number, Map<number, RingCircle>>();
  circles.forEach((c, i) => {
    const where = `ringCircles[${i}]`;
    const p = polygons.polygons[c.polygon];
    if (!Number.isInteger(c.polygon) || p === undefined) {
      throw new RhoformError(
        'E_INTERNAL',
        `${where}: expected a polygon index 0…${polygons.polygons.length - 1}, found ${String(c.polygon)}`,
      );
    }
    if (!(Number.isInteger(c.ring) && c.ring >= 0 && c.ring <= p.holes.length)) {
      throw new RhoformError(
        'E_INTERNAL',
        `${where}: expected a ring index 0…${p.holes.length} of polygon ${c.polygon} (0 = outer, k = hole k − 1), found ${String(c.ring)}`,
      );
    }
    if (!(c.r > 0 && Number.isFinite(c.r))) {
      throw new RhoformError('E_INTERNAL', `${where}: expected a circle radius > 0 mm, found ${String(c.r)}`);
    }
    if (!(Number.isFinite(c.x) && Number.isFinite(c.y))) {
      throw new RhoformError(
        'E_INTERNAL',
        `${where}: expected a finite circle centre, found (${String(c.x)}, ${String(c.y)})`,
      );
    }
    let rings = byPolygon.get(c.polygon);
    if (rings === undefined) byPolygon.set(c.polygon, (rings = new Map()));
    if (rings.has(c.ring)) {
      throw new RhoformError(
        'E_INTERNAL',
        `${where}: expected at most one circle per ring, found a second one for polygon ${c.polygon} ring ${c.ring}`,
      );
    }
    rings.set(c.ring, c);
  });
  return (polygon, ring) => byPolygon.get(polygon)?.get(ring);
}
