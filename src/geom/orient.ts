/** Ring orientation, y up: CCW = positive area (outer rings), CW = negative (holes), as RFC 7946. */
import type { Ring } from '../types.js';
import { ringArea } from './area.js';

/** Area-0 rings are neither. */
export function isCounterClockwise(ring: Ring): boolean {
  return ringArea(ring) > 0;
}

export function isClockwise(ring: Ring): boolean {
  return ringArea(ring) < 0;
}

/** The ring itself, or a reversed copy with the same first vertex; area-0 rings unchanged. */
export function orientRing(ring: Ring, want: 'ccw' | 'cw'): Ring {
  const a = ringArea(ring);
  if (a === 0 || (a > 0) === (want === 'ccw')) return ring;
  const out = new Array<Ring[number]>(ring.length);
  out[0] = ring[0];
  for (let k = 1; k < ring.length; k++) out[k] = ring[ring.length - k];
  return out;
}
