/**
 * Test-only shapes for the morphology tests: analytic polygons (mm, y up, outer rings CCW, holes CW) and analytic
 * grids whose grey ramps put the 0.5 level exactly on a known boundary, run through the real contour and
 * smoothing stages. Every size here is computed from a formula, never from the engine.
 */
import { contourGrid } from '../../src/contour/index.js';
import { smoothPolygons } from '../../src/smooth/smooth.js';
import type { DensityGrid, Point, Polygon, PolygonSet, Ring } from '../../src/types.js';

export type Box = readonly [number, number, number, number];

/** Signed area (shoelace), mm². */
export function area(ring: Ring): number {
  let a = 0;
  for (let k = 0; k < ring.length; k++) {
    const p = ring[k], q = ring[(k + 1) % ring.length];
    a += p[0] * q[1] - q[0] * p[1];
  }
  return a / 2;
}

/** The ring with the asked orientation (ccw = positive area). */
export function oriented(ring: Ring, ccw: boolean): Ring {
  return (area(ring) > 0) === ccw ? ring : [...ring].reverse();
}

/** A circle of radius r as an n-gon with vertices on the circle. */
export function circle(cx: number, cy: number, r: number, n = 256): Point[] {
  return Array.from({ length: n }, (_, k) => [cx + r * Math.cos((2 * Math.PI * k) / n), cy + r * Math.sin((2 * Math.PI * k) / n)] as const);
}

/** A polygon set from one outer ring and holes (orientations fixed here). */
export function poly(outer: Ring, ...holes: Ring[]): Polygon {
  return { outer: oriented(outer, true), holes: holes.map((h) => oriented(h, false)) };
}

export function set(...polygons: Polygon[]): PolygonSet {
  return { polygons };
}

/** Stadium (strut with rounded ends): the points within w/2 of the segment a–b. */
export function stadium(a: Point, b: Point, w: number, nCap = 64): Point[] {
  const ang = Math.atan2(b[1] - a[1], b[0] - a[0]);
  const out: Point[] = [];
  for (let k = 0; k <= nCap; k++) {
    const t = ang - Math.PI / 2 + (Math.PI * k) / nCap;
    out.push([b[0] + (w / 2) * Math.cos(t), b[1] + (w / 2) * Math.sin(t)]);
  }
  for (let k = 0; k <= nCap; k++) {
    const t = ang + Math.PI / 2 + (Math.PI * k) / nCap;
    out.push([a[0] + (w / 2) * Math.cos(t), a[1] + (w / 2) * Math.sin(t)]);
  }
  return out;
}

export function rect(x0: number, y0: number, x1: number, y1: number): Point[] {
  return [[x0, y0], [x1, y0], [x1, y1], [x0, y1]];
}

/** Applies an affine map x → A·x + t to every point (mirrors flip the orientation back via poly()). */
export function mapSet(s: PolygonSet, f: (p: Point) => Point): PolygonSet {
  return set(...s.polygons.map((p) => poly(p.outer.map(f), ...p.holes.map((h) => h.map(f)))));
}

/**
 * A grid of nx × ny cells of size h whose value is clamp(0.5 + sd/(ramp·h)) with sd the signed distance to the
 * wanted boundary (mm, > 0 in the solid): the 0.5 level is the boundary, the ramp is `2·ramp` cells wide.
 */
export function sdGrid(nx: number, ny: number, h: number, sd: (x: number, y: number) => number, ramp = 1.5): DensityGrid {
  const values = new Float64Array(nx * ny);
  for (let j = 0; j < ny; j++) {
    for (let i = 0; i < nx; i++) {
      values[j * nx + i] = Math.min(1, Math.max(0, 0.5 + sd((i + 0.5) * h, (j + 0.5) * h) / (2 * ramp * h)));
    }
  }
  return { nx, ny, cellSize: [h, h], origin: [0, 0], values, placement: 'cells' };
}

/** The production path: contour at 0.5, then smoothing with the default settings (tolerance 0.25 cell). */
export function outline(grid: DensityGrid): PolygonSet {
  const domain: Box = [0, 0, grid.nx * grid.cellSize[0], grid.ny * grid.cellSize[1]];
  const raw = contourGrid(grid, 0.5, 'decider');
  return smoothPolygons(raw, { iterations: 2, lambda: 0.33, mu: -0.34, tolerance: 0.25 * grid.cellSize[0], domain }).polygons;
}

/** Distance from p to the segment a–b. */
export function segDist(p: Point, a: Point, b: Point): number {
  const dx = b[0] - a[0], dy = b[1] - a[1];
  const t = Math.max(0, Math.min(1, ((p[0] - a[0]) * dx + (p[1] - a[1]) * dy) / (dx * dx + dy * dy)));
  return Math.hypot(p[0] - a[0] - t * dx, p[1] - a[1] - t * dy);
}
