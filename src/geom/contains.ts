/**
 * Point in ring by the even–odd (crossing number) rule, with an exact on-boundary test.
 * Coordinates in mm, y up; rings implicitly closed, either orientation.
 */
import type { Point, Ring } from '../types.js';

/** 1 if `p` is strictly inside `ring`, 0 if it lies on an edge or vertex, −1 if outside. */
export function ringContains(ring: Ring, p: Point): 1 | 0 | -1 {
  const [x, y] = p;
  const n = ring.length;
  let inside = false;
  for (let i = 0, j = n - 1; i < n; j = i++) {
    const [xi, yi] = ring[i];
    const [xj, yj] = ring[j];
    if (onSegment(xj, yj, xi, yi, x, y)) return 0;
    // half-open rule on y so that a vertex on the ray is counted once
    if (yi > y !== yj > y && x < ((xj - xi) * (y - yi)) / (yj - yi) + xi) inside = !inside;
  }
  return inside ? 1 : -1;
}

/** True when (x, y) lies exactly on the segment (ax, ay)–(bx, by). */
function onSegment(ax: number, ay: number, bx: number, by: number, x: number, y: number): boolean {
  if ((bx - ax) * (y - ay) !== (x - ax) * (by - ay)) return false;
  return Math.min(ax, bx) <= x && x <= Math.max(ax, bx) && Math.min(ay, by) <= y && y <= Math.max(ay, by);
}

/** Axis-aligned bounding box [minX, minY, maxX, maxY] of a ring (mm). */
export function ringBounds(ring: Ring): [number, number, number, number] {
  let minX = Infinity;
  let minY = Infinity;
  let maxX = -Infinity;
  let maxY = -Infinity;
  for (const [x, y] of ring) {
    if (x < minX) minX = x;
    if (x > maxX) maxX = x;
    if (y < minY) minY = y;
    if (y > maxY) maxY = y;
  }
  return [minX, minY, maxX, maxY];
}
