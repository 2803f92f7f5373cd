import { describe, it, expect } from 'vitest';
import { islands } from '../../src/check/islands.js';
import type { Polygon, Ring } from '../../src/types.js';
import { insideRing, makeContext, ngon, rect, reversed } from './context.js';

// analytic: a regular n-gon of circumradius r has area (n/2)·r²·sin(2π/n) and perimeter 2·n·r·sin(π/n)
const ngonArea = (r: number, n: number) => (n / 2) * r * r * Math.sin((2 * Math.PI) / n);
const ngonPerimeter = (r: number, n: number) => 2 * n * r * Math.sin(Math.PI / n);

/** Inside the polygon's material by an independent even–odd test: inside the outer ring, in no hole. */
const inMaterial = (p: Polygon, x: number, y: number) => insideRing(p.outer, x, y) && !p.holes.some((h: Ring) => insideRing(h, x, y));

const body: Polygon = { outer: rect(0, 0, 60, 40), holes: [] };
const run = (polygons: Polygon[], limit = 0, tolerance = 0.25) => islands.measure(makeContext({ polygons: { polygons }, tolerance }), limit);

describe('islands', () => {
  it('has nothing to measure for one piece or none', () => {
    expect(run([body]).measured).toBeNull();
    expect(run([body]).locations).toEqual([]);
    expect(run([]).measured).toBeNull();
  });

  it('measures a disc-shaped island by its area and places the finding inside it', () => {
    const n = 256, r = 3;
    const island: Polygon = { outer: ngon(80, 20, r, n), holes: [] };
    const m = run([body, island]);
    expect(m.measured).toBeCloseTo(ngonArea(r, n), 9); // analytic n-gon area ≈ πr²
    expect(Math.abs(m.measured! - Math.PI * r * r) / (Math.PI * r * r)).toBeLessThan(1e-3); // analytic πr²
    expect(m.resolution).toBe(0); // limit 0: a piece exists or not, nothing uncertain to band
    expect(run([body, island], 5).resolution).toBeCloseTo(ngonPerimeter(r, n) * 0.25, 9); // perimeter × tolerance
    expect(m.locations).toHaveLength(1);
    expect(m.locations[0].measured).toBeCloseTo(ngonArea(r, n), 9);
    expect(inMaterial(island, m.locations[0].x, m.locations[0].y)).toBe(true);
  });

  it('takes the largest piece as the main body wherever it is listed', () => {
    const small: Polygon = { outer: rect(70, 0, 72, 2), holes: [] };
    const m = run([small, body]);
    expect(m.measured).toBe(4); // analytic: 2 × 2 square
    expect(m.locations.map((l) => l.measured)).toEqual([4]);
  });

  it('reports only islands above the limit (less their resolution), but measures the largest', () => {
    // analytic areas: 1 × 1 = 1, 3 × 3 = 9, 5 × 5 = 25 mm²
    const pieces = [body, { outer: rect(70, 0, 71, 1), holes: [] }, { outer: rect(70, 10, 73, 13), holes: [] }, { outer: rect(70, 20, 75, 25), holes: [] }];
    const m = run(pieces, 10, 0.01); // resolutions 0.04, 0.12, 0.2 mm²
    expect(m.measured).toBe(25);
    expect(m.resolution).toBeCloseTo(20 * 0.01, 12);
    expect(m.locations.map((l) => l.measured)).toEqual([25]);
    // the limit 0 (default): every extra piece is an island
    expect(run(pieces, 0, 0.01).locations.map((l) => l.measured).sort((a, b) => a - b)).toEqual([1, 9, 25]);
    // an island within its resolution of the limit is listed too (the runner makes it a warning)
    expect(run(pieces, 25.1, 0.01).locations.map((l) => l.measured)).toEqual([25]);
  });

  it('counts material inside a hole as a separate piece', () => {
    const plate: Polygon = { outer: rect(0, 0, 60, 40), holes: [reversed(rect(20, 10, 40, 30))] };
    const speck: Polygon = { outer: rect(29, 19, 31, 21), holes: [] };
    const m = run([plate, speck]);
    expect(m.measured).toBe(4); // analytic 2 × 2
    expect(inMaterial(speck, m.locations[0].x, m.locations[0].y)).toBe(true);
  });

  it('uses the net area of an island with a hole and places the finding in its material, not at its centroid', () => {
    // an annulus island: its centroid is the centre of its hole, which is void
    const n = 512, R = 5, r = 4;
    const ring: Polygon = { outer: ngon(100, 50, R, n), holes: [reversed(ngon(100, 50, r, n))] };
    const m = run([{ outer: rect(0, 0, 60, 100), holes: [] }, ring]);
    expect(m.measured).toBeCloseTo(ngonArea(R, n) - ngonArea(r, n), 9); // analytic π(R² − r²) for the n-gons
    const [loc] = m.locations;
    expect(inMaterial(ring, loc.x, loc.y)).toBe(true);
    expect(Math.hypot(loc.x - 100, loc.y - 50)).toBeGreaterThan(r);
  });

  it('places the finding inside a C-shaped island whose centroid lies outside it', () => {
    // a C: the square [0, 10]² without the slot [3, 10] × [3, 7]; its centroid (≈ 4.2, 5) is in the slot
    const c: Polygon = { outer: [[80, 0], [90, 0], [90, 3], [83, 3], [83, 7], [90, 7], [90, 10], [80, 10]], holes: [] };
    const m = run([{ outer: rect(0, 0, 60, 100), holes: [] }, c]);
    expect(m.measured).toBe(100 - 28); // analytic: 10 × 10 − 7 × 4
    expect(inMaterial(c, m.locations[0].x, m.locations[0].y)).toBe(true);
  });

  it('never calls the morphology engine (the context throws if it does)', () => {
    expect(() => run([body, { outer: rect(70, 0, 72, 2), holes: [] }])).not.toThrow();
  });
});
