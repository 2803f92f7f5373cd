import { describe, it, expect } from 'vitest';
import { smallHoles } from '../../src/check/small-holes.js';
import type { Polygon } from '../../src/types.js';
import { insideRing, makeContext, ngon, rect, reversed } from './context.js';

// analytic: a regular n-gon of circumradius r has area (n/2)·r²·sin(2π/n) and perimeter 2·n·r·sin(π/n)
const ngonArea = (r: number, n: number) => (n / 2) * r * r * Math.sin((2 * Math.PI) / n);
const ngonPerimeter = (r: number, n: number) => 2 * n * r * Math.sin(Math.PI / n);

const run = (polygons: Polygon[], limit: number, tolerance = 0.25) => smallHoles.measure(makeContext({ polygons: { polygons }, tolerance }), limit);
const n = 256;
const plate: Polygon = {
  outer: rect(0, 0, 100, 50),
  holes: [reversed(ngon(20, 25, 2, n)), reversed(ngon(50, 25, 5, n)), reversed(ngon(80, 25, 10, n))],
};

describe('small-holes', () => {
  it('measures the smallest hole by its area (πr² for a round hole)', () => {
    const m = run([plate], 1);
    expect(m.measured).toBeCloseTo(ngonArea(2, n), 9); // analytic n-gon area
    expect(Math.abs(m.measured! - 4 * Math.PI) / (4 * Math.PI)).toBeLessThan(1e-3); // analytic πr², r = 2
    expect(m.resolution).toBeCloseTo(ngonPerimeter(2, n) * 0.25, 9); // perimeter × tolerance
  });

  it('locates every hole below the limit plus its resolution, inside the hole', () => {
    // areas ≈ 12.57, 78.54, 314.16 mm²; resolutions ≈ 3.14, 7.85, 15.7 mm² at tolerance 0.25 mm
    const m = run([plate], 50);
    expect(m.locations).toHaveLength(1);
    expect(m.locations[0].measured).toBeCloseTo(ngonArea(2, n), 9);
    expect(insideRing(plate.holes[0], m.locations[0].x, m.locations[0].y)).toBe(true);
    expect(Math.hypot(m.locations[0].x - 20, m.locations[0].y - 25)).toBeLessThan(1e-9); // a round hole: its centre
    // 75 mm² is within the 78.54 hole's resolution (7.85): listed, the runner makes it a warning
    expect(run([plate], 75).locations.map((l) => Math.round(l.measured))).toEqual([13, 79]);
    expect(run([plate], 1).locations).toEqual([]);
  });

  it('places the finding inside a C-shaped hole whose centroid is material', () => {
    // a C-shaped hole: [10, 20]² without the tongue [13, 20] × [13, 17]; its centroid lies on the tongue
    const cHole = reversed([[10, 10], [20, 10], [20, 13], [13, 13], [13, 17], [20, 17], [20, 20], [10, 20]]);
    const m = run([{ outer: rect(0, 0, 40, 40), holes: [cHole] }], 100);
    expect(m.measured).toBe(72); // analytic 10 × 10 − 7 × 4
    expect(insideRing(cHole, m.locations[0].x, m.locations[0].y)).toBe(true);
  });

  it('has nothing to measure without holes; void open to the domain edge is no hole', () => {
    // a plate with a notch cut in from its edge: the void is part of the outer ring, not a hole ring
    const notched: Polygon = { outer: [[0, 0], [40, 0], [40, 20], [22, 20], [22, 10], [18, 10], [18, 20], [0, 20]], holes: [] };
    expect(run([notched], 100).measured).toBeNull();
    expect(run([notched], 100).locations).toEqual([]);
    expect(run([], 100).measured).toBeNull();
  });

  it('looks at the holes of every piece', () => {
    const other: Polygon = { outer: rect(200, 0, 220, 20), holes: [reversed(rect(209, 9, 210, 10))] };
    const m = run([plate, other], 5);
    expect(m.measured).toBe(1); // analytic 1 × 1
    expect(m.locations.map((l) => l.measured)).toEqual([1]);
  });
});
