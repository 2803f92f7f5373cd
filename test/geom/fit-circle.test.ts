/**
 * fitCircle / findCircleRings against analytic circles, ellipses, squares and half-discs.
 */
import { describe, expect, it } from 'vitest';
import { findCircleRings, fitCircle } from '../../src/geom/fit-circle.js';
import type { Point, PolygonSet } from '../../src/types.js';
import { rng } from '../support/random.js';

/** Vertices at the given angles (radians) on the circle (cx, cy, r) — exactly on it up to rounding. */
const onCircle = (cx: number, cy: number, r: number, angles: readonly number[]): Point[] =>
  angles.map((t) => [cx + r * Math.cos(t), cy + r * Math.sin(t)] as Point);
/** n equal steps of one full turn, counter-clockwise from angle `start`. */
const turn = (n: number, start = 0): number[] => Array.from({ length: n }, (_, k) => start + (2 * Math.PI * k) / n);
/** Sagitta of a chord spanning angle θ on a circle of radius r: r(1 − cos(θ/2)) (analytic). */
const sagitta = (r: number, theta: number): number => r * (1 - Math.cos(theta / 2));

describe('fitCircle', () => {
  it('finds a polygonised circle: centre and radius within 1e-9·r, either orientation', () => {
    const cx = 123.456;
    const cy = -56.75;
    const r = 7.5;
    const n = 64;
    const tol = sagitta(r, (2 * Math.PI) / n) * 1.001; // analytic: the edge midpoints sit one sagitta inside
    const ccw = onCircle(cx, cy, r, turn(n, 0.3));
    for (const ring of [ccw, [...ccw].reverse()]) {
      const c = fitCircle(ring, tol);
      expect(c).not.toBeNull();
      // analytic: every vertex lies on the circle (cx, cy, r), so the least-squares circle is that circle
      expect(Math.abs(c!.cx - cx)).toBeLessThanOrEqual(1e-9 * r);
      expect(Math.abs(c!.cy - cy)).toBeLessThanOrEqual(1e-9 * r);
      expect(Math.abs(c!.r - r)).toBeLessThanOrEqual(1e-9 * r);
    }
  });

  it('checks the edge midpoints: rejected when the tolerance is just below the sagitta r(1 − cos(π/n))', () => {
    const r = 12;
    const n = 40;
    const s = sagitta(r, (2 * Math.PI) / n); // analytic midpoint deviation of a regular inscribed n-gon
    const ring = onCircle(0, 0, r, turn(n));
    expect(fitCircle(ring, s * 1.01)).not.toBeNull();
    expect(fitCircle(ring, s * 0.99)).toBeNull();
  });

  it('finds unevenly spaced vertices and ignores a repeated closing vertex', () => {
    const random = rng(7);
    const angles: number[] = [];
    for (let t = 0; t < 2 * Math.PI - 0.2; t += 0.05 + 0.6 * random()) angles.push(t); // steps < 0.65 rad < 45°
    const ring = onCircle(-3, 4, 2.25, angles);
    ring.push(ring[0]);
    const c = fitCircle(ring, 0.2); // largest step 0.65 rad: sagitta 2.25(1 − cos 0.325) ≈ 0.118 < 0.2
    expect(c).not.toBeNull();
    expect(Math.abs(c!.cx + 3)).toBeLessThanOrEqual(1e-9 * 2.25);
    expect(Math.abs(c!.cy - 4)).toBeLessThanOrEqual(1e-9 * 2.25);
    expect(Math.abs(c!.r - 2.25)).toBeLessThanOrEqual(1e-9 * 2.25);
  });

  it('accepts 8 vertices (45° steps) and rejects 7, whatever the tolerance', () => {
    const r = 3;
    // analytic: an inscribed octagon's midpoints sit r(1 − cos 22.5°) ≈ 0.228 inside the circle
    expect(fitCircle(onCircle(0, 0, r, turn(8)), 0.25)).not.toBeNull();
    expect(fitCircle(onCircle(0, 0, r, turn(7)), 10)).toBeNull();
  });

  it('rejects a square (corner radius √2 times the side midpoint radius)', () => {
    // 8 vertices: corners at radius 5√2 ≈ 7.07, side midpoints at 5 (analytic), so no circle is within 0.1
    const square: Point[] = [[-5, -5], [0, -5], [5, -5], [5, 0], [5, 5], [0, 5], [-5, 5], [-5, 0]];
    expect(fitCircle(square, 0.1)).toBeNull();
  });

  it('rejects an ellipse with axes 10 and 10.5 at tolerance 0.1, accepts it at 0.3', () => {
    // analytic: ρ(t) runs from 10 to 10.5; the best circle (centre at the ellipse's centre by symmetry) has
    // r ≈ 10.25, so the largest radial deviation is ≈ 0.25 — above 0.1, below 0.3.
    const ellipse = turn(256).map((t) => [10.5 * Math.cos(t), 10 * Math.sin(t)] as Point);
    expect(fitCircle(ellipse, 0.1)).toBeNull();
    const c = fitCircle(ellipse, 0.3);
    expect(c).not.toBeNull();
    expect(Math.hypot(c!.cx, c!.cy)).toBeLessThan(1e-9);
    expect(c!.r).toBeGreaterThan(10.2);
    expect(c!.r).toBeLessThan(10.3);
  });

  it('rejects a half-disc, with or without vertices on its diameter', () => {
    const arc = onCircle(0, 0, 10, Array.from({ length: 33 }, (_, k) => (Math.PI * k) / 32)); // 0…π
    // the diameter's midpoint is the centre, 10 mm from any circle through the arc (analytic)
    expect(fitCircle(arc, 0.5)).toBeNull();
    const withDiameter: Point[] = [...arc, ...Array.from({ length: 15 }, (_, k) => [-10 + (20 * (k + 1)) / 16, 0] as Point)];
    expect(fitCircle(withDiameter, 0.5)).toBeNull();
  });

  it('rejects a gap wider than 45° even when the tolerance would allow it', () => {
    // 0°, 30°, …, 270°, then the closing step 270° → 360° spans 90°; sagitta 10(1 − cos 45°) ≈ 2.93 < 5
    const angles = Array.from({ length: 10 }, (_, k) => (Math.PI / 6) * k);
    expect(fitCircle(onCircle(0, 0, 10, angles), 5)).toBeNull();
  });

  it('rejects a ring that goes twice around the centre', () => {
    const twice = onCircle(0, 0, 10, Array.from({ length: 32 }, (_, k) => (4 * Math.PI * k) / 32));
    expect(fitCircle(twice, 1)).toBeNull();
  });

  it('fits noise of amplitude a < tolerance on the radius', () => {
    const random = rng(20240611);
    const r = 20;
    const a = 0.05;
    const tol = 0.1;
    const ring = turn(720).map((t) => {
      const rho = r + a * (2 * random() - 1); // uniform in [r − a, r + a]
      return [50 + rho * Math.cos(t), 30 + rho * Math.sin(t)] as Point;
    });
    const c = fitCircle(ring, tol);
    expect(c).not.toBeNull();
    // the least-squares error is of order a/√n ≈ 0.002 (Kåsa 1976, error analysis); a itself is a loose bound
    expect(Math.hypot(c!.cx - 50, c!.cy - 30)).toBeLessThan(a);
    expect(Math.abs(c!.r - r)).toBeLessThan(a);
  });

  it('returns null for collinear or coincident vertices and throws for a bad tolerance', () => {
    const line = Array.from({ length: 10 }, (_, k) => [k, 2 * k] as Point);
    expect(fitCircle(line, 1)).toBeNull();
    expect(fitCircle(Array.from({ length: 10 }, () => [1, 1] as Point), 1)).toBeNull();
    const circle = onCircle(0, 0, 1, turn(16));
    expect(() => fitCircle(circle, Number.NaN)).toThrow(/tolerance/);
    expect(() => fitCircle(circle, -1)).toThrow(/tolerance/);
  });
});

describe('findCircleRings', () => {
  it('lists every circular ring, outer or hole, by polygon and ring index', () => {
    const set: PolygonSet = {
      polygons: [
        {
          outer: [[0, 0], [100, 0], [100, 60], [0, 60]],
          holes: [
            [[10, 10], [10, 20], [20, 20], [20, 10]], // a square hole
            onCircle(60, 30, 5, turn(48)).reverse(), // a circular hole, clockwise
          ],
        },
        { outer: onCircle(150, 30, 20, turn(128)), holes: [] }, // a disc
      ],
    };
    const found = findCircleRings(set, 0.05);
    expect(found.map(({ polygon, ring }) => ({ polygon, ring }))).toEqual([
      { polygon: 0, ring: 2 },
      { polygon: 1, ring: 0 },
    ]);
    // analytic centres and radii of the two circles
    expect(found[0].x).toBeCloseTo(60, 9);
    expect(found[0].y).toBeCloseTo(30, 9);
    expect(found[0].r).toBeCloseTo(5, 9);
    expect(found[1].x).toBeCloseTo(150, 9);
    expect(found[1].r).toBeCloseTo(20, 9);
  });
});
