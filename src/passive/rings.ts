/** Passive primitives as CCW rings, mm, y up. */
import { circleRing, circumscribedRing } from '../geom/circle.js';
import { orientRing } from '../geom/orient.js';
import { RhoformError } from '../errors.js';
import type { Ring } from '../types.js';
import type { PassiveRegion, PassiveShape } from './types.js';

/** A circle inscribed within `tolerance` mm, a rectangle from its lower-left corner, a polygon re-oriented. */
export function passiveRings(region: PassiveRegion, tolerance: number): Ring {
  return shapeRing(region.shape, tolerance);
}

/** `fit`: 'circumscribed' contains the disc (the exact booleans' form, so a void circle stays void). */
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
