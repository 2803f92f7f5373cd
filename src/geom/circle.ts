/** Circles as polygons, and rings that are circles. mm, y up. */
import type { Point, Ring } from '../types.js';

/** Sagitta (mm) for polygonised circles and arcs: a quarter of the outline budget. */
export function arcSagitta(tolerance: number): number {
  return tolerance / 4;
}

export interface Circle {
  readonly cx: number;
  readonly cy: number;
  readonly r: number;
}

/** Vertices of an inscribed n-gon within `tolerance` mm of the circle: r(1 − cos(π/n)) ≤ tolerance; 8 … 4096. */
export function circleSegments(r: number, tolerance: number): number {
  if (!(r > 0)) return 8;
  const t = Math.min(Math.max(tolerance, r * 1e-6), r);
  const n = Math.ceil(Math.PI / Math.acos(1 - t / r));
  return Math.min(4096, Math.max(8, n));
}

/** Inscribed regular polygon, CCW from angle 0. */
export function circleRing(c: Circle, tolerance: number): Point[] {
  const n = circleSegments(c.r, tolerance);
  const ring: Point[] = new Array(n);
  for (let k = 0; k < n; k++) {
    const a = (2 * Math.PI * k) / n;
    ring[k] = [c.cx + c.r * Math.cos(a), c.cy + c.r * Math.sin(a)];
  }
  return ring;
}

/** Vertices of a circumscribed n-gon at most `tolerance` mm outside: r(1/cos(π/n) − 1) ≤ tolerance; 8 … 4096. */
export function circumscribedSegments(r: number, tolerance: number): number {
  if (!(r > 0)) return 8;
  const t = Math.min(Math.max(tolerance, r * 1e-6), r);
  const n = Math.ceil(Math.PI / Math.acos(1 / (1 + t / r)));
  return Math.min(4096, Math.max(8, n));
}

/** Vertex radius (mm) of the n-gon circumscribed about a circle of radius r: r / cos(π/n). */
export function circumscribedRadius(r: number, n: number): number {
  return r / Math.cos(Math.PI / n);
}

/** Circumscribed regular polygon, CCW from angle 0: it holds the whole disc, so a boolean with it is exact on the disc. */
export function circumscribedRing(c: Circle, tolerance: number): Point[] {
  const n = circumscribedSegments(c.r, tolerance);
  const R = circumscribedRadius(c.r, n);
  const ring: Point[] = new Array(n);
  for (let k = 0; k < n; k++) {
    const a = (2 * Math.PI * k) / n;
    ring[k] = [c.cx + R * Math.cos(a), c.cy + R * Math.sin(a)];
  }
  return ring;
}

export function reversed(ring: Ring): Point[] {
  return [...ring].reverse();
}

/** A ring the writers draw as a true circle (DXF CIRCLE on the ring's layer, SVG arcs in the even-odd path). mm, y up. */
export interface RingCircle {
  readonly polygon: number;
  /** 0 = the outer ring, k ≥ 1 = hole k − 1. */
  readonly ring: number;
  /** Centre and radius, mm. */
  readonly x: number;
  readonly y: number;
  readonly r: number;
}
