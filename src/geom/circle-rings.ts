/** Which rings of the part the writers draw as true circles. mm, y up. */
import type { PolygonSet } from '../types.js';
import type { RingCircle } from './circle.js';
import { findCircleRings } from './fit-circle.js';

/**
 * The passive circles that survived whole, and with `recognise` (`--circles`) every other ring that is a circle
 * within `tolerance` mm (src/geom/fit-circle.ts).
 */
export function circleRings(set: PolygonSet, passive: readonly RingCircle[], recognise: boolean, tolerance: number): RingCircle[] {
  if (!recognise) return [...passive];
  const taken = new Set(passive.map((c) => `${c.polygon}:${c.ring}`));
  return [...passive, ...findCircleRings(set, tolerance).filter((c) => !taken.has(`${c.polygon}:${c.ring}`))];
}
