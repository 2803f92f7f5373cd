/**
 * Circles as polygons, and the test whether a ring is a circle. Coordinates in mm, y up.
 */
import type { Point, Ring } from '../types.js';

/**
 * The sagitta (mm) within which circles and arcs are polygonised: a quarter of the outline's deviation budget
 * `tolerance` (mm), so a polygonised arc spends at most a quarter of what the outline may deviate.
 */
export function arcSagitta(tolerance: number): number {
  return tolerance / 4;
}

/** A circle: centre (mm) and radius (mm). */
export interface Circle {
  readonly cx: number;
  readonly cy: number;
  readonly r: number;
}

/**
 * The number of vertices of a regular polygon inscribed in a circle of radius r (mm) whose edges stay within
 * `tolerance` mm of the arc: the sagitta r(1 − cos(π/n)) ≤ tolerance (analytic); at least 8, at most 4096.
 */
export function circleSegments(r: number, tolerance: number): number {
  if (!(r > 0)) return 8;
  const t = Math.min(Math.max(tolerance, r * 1e-6), r);
  const n = Math.ceil(Math.PI / Math.acos(1 - t / r));
  return Math.min(4096, Math.max(8, n));
}

/**
 * A circle as a regular polygon inscribed in it, counter-clockwise (an outer ring; reverse it for a hole),
 * starting at angle 0 (the point (cx + r, cy)), within `tolerance` mm of the true circle.
 */
export function circleRing(c: Circle, tolerance: number): Point[] {
  const n = circleSegments(c.r, tolerance);
  const ring: Point[] = new Array(n);
  for (let k = 0; k < n; k++) {
    const a = (2 * Math.PI * k) / n;
    ring[k] = [c.cx + c.r * Math.cos(a), c.cy + c.r * Math.sin(a)];
  }
  return ring;
}

/**
 * The number of vertices of a regular polygon circumscribed about a circle of radius r (mm) whose vertices stay
 * within `tolerance` mm outside it: r(1/cos(π/n) − 1) ≤ tolerance (analytic); at least 8, at most 4096.
 */
export function circumscribedSegments(r: number, tolerance: number): number {
  if (!(r > 0)) return 8;
  const t = Math.min(Math.max(tolerance, r * 1e-6), r);
  const n = Math.ceil(Math.PI / Math.acos(1 / (1 + t / r)));
  return Math.min(4096, Math.max(8, n));
}

/** Radius (mm) of the vertices of the regular n-gon circumscribed about a circle of radius r: r / cos(π/n). */
export function circumscribedRadius(r: number, n: number): number {
  return r / Math.cos(Math.PI / n);
}

/**
 * A circle as the regular polygon circumscribed about it (its edges touch the circle at their midpoints, its
 * vertices lie at most `tolerance` mm outside), counter-clockwise, first vertex at angle 0. The polygon contains
 * the whole disc, so a boolean with it never leaves material of the other side inside the disc: a passive void
 * circle cut out this way is void exactly, a passive solid circle added this way is solid exactly.
 */
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

/** The same ring in the opposite direction (a hole from an outer ring and back). */
export function reversed(ring: Ring): Point[] {
  return [...ring].reverse();
}

/**
 * A ring of the part that is a true circle (a passive-void bolt hole, or a ring `--circles` recognised): the
 * writers draw the circle instead of the ring's vertices — a DXF CIRCLE on the ring's own layer (`outline` for
 * an outer ring, `hole` for a hole: every hole of the part is on `hole`, DESIGN §8), SVG arc commands inside
 * the part's even-odd path (so it still cuts). mm, y up.
 */
export interface RingCircle {
  /** Index into `polygons.polygons`. */
  readonly polygon: number;
  /** 0 = the outer ring, k ≥ 1 = hole k − 1. */
  readonly ring: number;
  /** Centre (mm) and radius (mm, > 0). */
  readonly x: number;
  readonly y: number;
  readonly r: number;
}
