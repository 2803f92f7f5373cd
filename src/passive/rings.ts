/**
 * Passive primitives as rings: mm, y up, counter-clockwise (positive signed area), implicitly closed.
 */
import { circleRing, circumscribedRing } from '../geom/circle.js';
import { orientRing } from '../geom/orient.js';
import { RhoformError } from '../errors.js';
import type { Ring } from '../types.js';
import type { PassiveRegion, PassiveShape } from './types.js';

/**
 * The shape of a region as a counter-clockwise ring in mm (y up): a circle as the regular polygon inscribed in
 * it whose edges stay within `tolerance` mm (sagitta) of the arc (src/geom/circle.ts, starting at angle 0); a
 * rectangle as its 4 corners from the lower-left one; a polygon re-oriented counter-clockwise (its first point
 * stays first). `tolerance` (mm, > 0) matters for circles only.
 */
export function passiveRings(region: PassiveRegion, tolerance: number): Ring {
  return shapeRing(region.shape, tolerance);
}

/**
 * passiveRings for a bare shape. `fit` chooses the polygon of a circle: 'inscribed' (vertices on the circle,
 * edges within `tolerance` inside it) or 'circumscribed' (edges touching it, vertices within `tolerance`
 * outside: the polygon contains the disc, the form the exact booleans use so a void circle stays void).
 */
export function shapeRing(shape: PassiveShape, tolerance: number, fit: 'inscribed' | 'circumscribed' = 'inscribed'): Ring {
  if (!(tolerance > 0)) throw new RhoformError('E_INTERNAL', `passive ring tolerance must be > 0 mm, found ${tolerance}`);
  switch (shape.kind) {
    case 'circle':
      return (fit === 'circumscribed' ? circumscribedRing : circleRing)({ cx: shape.cx, cy: shape.cy, r: shape.r }, tolerance);
    case 'rect':
      return [
        [shape.x0, shape.y0],
        [shape.x1, shape.y0],
        [shape.x1, shape.y1],
        [shape.x0, shape.y1],
      ];
    case 'polygon':
      return orientRing(shape.points, 'ccw');
  }
}
