import type { PolygonSet } from '../types.js';
import type { RingCircle } from './circle.js';
import { findCircleRings } from './fit-circle.js';

/** Which rings the writers draw as true circles: the passive ones, and with `recognise` any ring fitting within `tolerance` mm. */
export function circleRings(set: PolygonSet, passive: readonly RingCircle[], recognise: boolean, tolerance: number): RingCircle[] {
  if (!recognise) return [...passive];
  const taken = new Set(passive.map((c) => `${c.polygon}:${c.ring}`));
  return [...passive, ...findCircleRings(set, tolerance).filter((c) => !taken.has(`${c.polygon}:${c.ring}`))];
}
