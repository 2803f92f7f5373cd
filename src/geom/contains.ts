/** Point in ring by the crossing-number rule, exact on the boundary. mm, y up; either orientation. */
import type { Point, Ring } from '../types.js';

/** 1 strictly inside, 0 on an edge or vertex, −1 outside. */
export function ringContains(ring: Ring, p: Point): 1 | 0 | -1 {
  const [x, y] = p;
  const n = ring.length;
  let inside = false;
  for (let i = 0, j = n - 1; i < n; j = i++) {
    const [xi, yi] = ring[i];
    const [xj, yj] = ring[j];
    if (onSegment(xj, yj, xi, yi, x, y)) return 0;
    if (yi > y !== yj > y && x < ((xj - xi) * (y - yi)) / (yj - yi) + xi) inside = !inside;
  }
  return inside ? 1 : -1;
}

function onSegment(ax: number, ay: number, bx: number, by: number, x: number, y: number): boolean {
  if ((bx - ax) * (y - ay) !== (x - ax) * (by - ay)) return false;
  return Math.min(ax, bx) <= x && x <= Math.max(ax, bx) && Math.min(ay, by) <= y && y <= Math.max(ay, by);
}

/** Bounding box [minX, minY, maxX, maxY], mm. */
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
