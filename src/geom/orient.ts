/**
 * Ring orientation in the y-up frame: counter-clockwise = positive signed area (outer rings),
 * clockwise = negative (holes), as in the right-hand rule of RFC 7946.
 */
import type { Ring } from '../types.js';
import { ringArea } from './area.js';

/** True when the ring turns counter-clockwise (signed area > 0). Degenerate rings (area 0) are neither. */
export function isCounterClockwise(ring: Ring): boolean {
  return ringArea(ring) > 0;
}

/** True when the ring turns clockwise (signed area < 0). */
export function isClockwise(ring: Ring): boolean {
  return ringArea(ring) < 0;
}

/**
 * The ring turning the requested way: the input itself when it already does, otherwise a reversed copy
 * (the first vertex stays first). Degenerate rings (area 0) are returned unchanged. Never mutates the input.
 */
export function orientRing(ring: Ring, want: 'ccw' | 'cw'): Ring {
  const a = ringArea(ring);
  if (a === 0 || (a > 0) === (want === 'ccw')) return ring;
  const out = new Array<Ring[number]>(ring.length);
  out[0] = ring[0];
  for (let k = 1; k < ring.length; k++) out[k] = ring[ring.length - k];
  return out;
}
