import { describe, expect, it } from 'vitest';
import { polygonArea, ringArea } from '../../src/geom/area.js';
import { circleRing, circleSegments } from '../../src/geom/circle.js';
import { booleanOp, bufferPolylines, offsetRings, quantumFor, ringsOf, unionRings } from '../../src/geom/clipper.js';
import type { PolygonSet, Ring } from '../../src/types.js';

const square = (x: number, y: number, s: number): Ring => [
  [x, y],
  [x + s, y],
  [x + s, y + s],
  [x, y + s],
];
const area = (set: PolygonSet): number => set.polygons.reduce((a, p) => a + polygonArea(p), 0);

describe('clipper wrapper: booleans', () => {
  it('union of two overlapping squares: 10² + 10² − 5² (analytic)', () => {
    const u = unionRings([square(0, 0, 10), square(5, 5, 10)]);
    expect(u.polygons).toHaveLength(1);
    expect(area(u)).toBeCloseTo(175, 9); // analytic: inclusion–exclusion
    expect(ringArea(u.polygons[0].outer)).toBeGreaterThan(0); // outer counter-clockwise (DESIGN §3 / RFC 7946 right-hand rule)
  });

  it('difference of a centred square: one polygon with one clockwise hole, area 20² − 6²', () => {
    const d = booleanOp('difference', [square(0, 0, 20)], [square(7, 7, 6)]);
    expect(d.polygons).toHaveLength(1);
    expect(d.polygons[0].holes).toHaveLength(1);
    expect(ringArea(d.polygons[0].holes[0])).toBeCloseTo(-36, 9); // analytic; hole clockwise
    expect(area(d)).toBeCloseTo(364, 9);
  });

  it('material inside a hole comes back as its own polygon, and ringsOf reproduces the set under non-zero fill', () => {
    const frame = booleanOp('difference', [square(0, 0, 30)], [square(5, 5, 20)]);
    const withIsland = unionRings([...ringsOf(frame), square(10, 10, 10)]);
    expect(withIsland.polygons).toHaveLength(2);
    expect(area(withIsland)).toBeCloseTo(900 - 400 + 100, 9); // analytic
    expect(area(unionRings(ringsOf(withIsland)))).toBeCloseTo(600, 9);
  });

  it('intersection and difference with an empty subject are empty; union with an empty subject is the clip', () => {
    expect(booleanOp('intersection', [], [square(0, 0, 1)]).polygons).toHaveLength(0);
    expect(booleanOp('difference', [], [square(0, 0, 1)]).polygons).toHaveLength(0);
    expect(area(booleanOp('union', [], [square(0, 0, 2)]))).toBeCloseTo(4, 12);
  });

  it('binary-exact coordinates come back exactly (power-of-two quantum)', () => {
    const u = unionRings([square(0.5, 0.25, 2)]);
    const xs = u.polygons[0].outer.map((p) => p[0]).sort((a, b) => a - b);
    expect(xs[0]).toBe(0.5);
    expect(xs[xs.length - 1]).toBe(2.5);
    expect(quantumFor(240)).toBe(2 ** -21); // the smallest 2^k with 240 / 2^k ≤ 2^29: 240 / 2^-21 ≈ 5.0e8
  });

  it('refuses coordinates it cannot represent with a clear error instead of a bare throw', () => {
    expect(() => booleanOp('union', [square(0, 0, 1)], [], { quantum: 1e-12 })).toThrow(/outside the range/);
  });
});

describe('clipper wrapper: offsets', () => {
  it('round offset of a square: s² + 4sr + πr² (Minkowski sum with a disc, analytic)', () => {
    const s = 10;
    const r = 2;
    const tol = 1e-3;
    const o = offsetRings([square(0, 0, s)], r, { join: 'round', arcTolerance: tol });
    const exact = s * s + 4 * s * r + Math.PI * r * r;
    expect(area(o)).toBeLessThanOrEqual(exact + 1e-9); // inscribed arcs never exceed the true disc
    expect(area(o)).toBeGreaterThan(exact - 2 * Math.PI * r * tol); // arc deficit ≤ perimeter × sagitta
  });

  it('inward offset of a square by r: (s − 2r)² (analytic)', () => {
    const o = offsetRings([square(0, 0, 10)], -2, { join: 'miter', arcTolerance: 1e-3 });
    expect(area(o)).toBeCloseTo(36, 9);
  });

  it('buffer of a segment: a capsule of area 2rL + πr²; a lone point: a disc πr²', () => {
    const tol = 1e-3;
    const cap = bufferPolylines([[[0, 0], [10, 0]]], 1.5, { arcTolerance: tol });
    const exact = 2 * 1.5 * 10 + Math.PI * 1.5 * 1.5; // analytic
    expect(area(cap)).toBeLessThanOrEqual(exact + 1e-9);
    expect(area(cap)).toBeGreaterThan(exact - 2 * Math.PI * 1.5 * tol);
    const disc = bufferPolylines([[[3, 4]]], 2, { arcTolerance: tol });
    expect(area(disc)).toBeLessThanOrEqual(Math.PI * 4 + 1e-9); // analytic πr², inscribed
    expect(area(disc)).toBeGreaterThan(Math.PI * 4 - 2 * Math.PI * 2 * tol);
  });
});

describe('circles', () => {
  it('an inscribed polygon within the tolerance: sagitta r(1 − cos π/n) ≤ tol (analytic)', () => {
    for (const [r, tol] of [[5, 0.01], [50, 0.001], [0.5, 0.1]] as const) {
      const n = circleSegments(r, tol);
      expect(r * (1 - Math.cos(Math.PI / n))).toBeLessThanOrEqual(tol + 1e-15);
      const ring = circleRing({ cx: 1, cy: 2, r }, tol);
      expect(ringArea(ring)).toBeGreaterThan(0); // counter-clockwise
      // analytic: area of a regular n-gon inscribed in radius r is (n/2) r² sin(2π/n)
      expect(ringArea(ring)).toBeCloseTo((n / 2) * r * r * Math.sin((2 * Math.PI) / n), 9);
    }
  });
});
