import { describe, it, expect } from 'vitest';
import { outlineFidelity, samplingStep } from '../../src/check/outline-fidelity.js';
import { contourGrid } from '../../src/contour/contour.js';
import { smoothPolygons } from '../../src/smooth/smooth.js';
import type { DensityGrid, Point, PolygonSet } from '../../src/types.js';
import { bruteDeviation } from '../smooth/oracle.js';
import { makeContext, ngon, rect, reversed } from './context.js';
import { holePlateGrid } from '../support/hole-plate.js';

const set = (...outers: Point[][]): PolygonSet => ({ polygons: outers.map((outer) => ({ outer, holes: [] })) });
const run = (polygons: PolygonSet, raw: PolygonSet, limit: number) =>
  outlineFidelity.measure(makeContext({ polygons, raw, tolerance: limit }), limit);

describe('outline-fidelity', () => {
  it('is 0 with a zero resolution for an outline identical to its raw contour', () => {
    const sq = set(rect(0, 0, 10, 10));
    const m = run(sq, sq, 0.25);
    expect(m.measured).toBe(0);
    expect(m.resolution).toBe(0);
    expect(m.locations).toEqual([]);
  });

  it('has nothing to measure without an outline', () => {
    expect(run(set(), set(rect(0, 0, 1, 1)), 0.25).measured).toBeNull();
  });

  it('finds the corners of an offset square, one place per corner', () => {
    // analytic: the square [−a, 10 + a]² lies a from the square [0, 10]² along its sides and a·√2 at its corners
    const a = 0.1;
    const m = run(set(rect(-a, -a, 10 + a, 10 + a)), set(rect(0, 0, 10, 10)), 0.12);
    expect(m.measured).toBeCloseTo(a * Math.SQRT2, 12); // vertices are measured exactly
    expect(m.resolution).toBeLessThan(1e-9);
    // the run at the corner of vertex 0 wraps round the end of the ring: still one place per corner
    const places = m.locations.map((l) => [Math.round(l.x * 10) / 10, Math.round(l.y * 10) / 10]).sort((p, q) => p[0] - q[0] || p[1] - q[1]);
    expect(places).toEqual([[-0.1, -0.1], [-0.1, 10.1], [10.1, -0.1], [10.1, 10.1]]);
    for (const l of m.locations) expect(l.measured).toBeCloseTo(a * Math.SQRT2, 12);
    // no place when the limit is well above the largest distance
    expect(run(set(rect(-a, -a, 10 + a, 10 + a)), set(rect(0, 0, 10, 10)), 0.2).locations).toEqual([]);
  });

  it('measures the sagitta of a polygon inscribed in a circle, at the middle of each chord', () => {
    // analytic: a chord of a circle of radius R subtending 2π/m lies R·(1 − cos(π/m)) from the arc at its middle;
    // the raw "circle" is a 4096-gon with the same vertices, whose own sagitta (R·(1 − cos(π/4096)) ≈ 3e-6 mm) is
    // the allowance
    const R = 10, m = 16;
    const res = run(set(ngon(0, 0, R, m)), set(ngon(0, 0, R, 4096)), 0.15);
    const sagitta = R * (1 - Math.cos(Math.PI / m));
    expect(Math.abs(res.measured! - sagitta)).toBeLessThan(1e-5);
    expect(res.measured! + res.resolution).toBeGreaterThanOrEqual(sagitta - 1e-5); // certified upper bound
    expect(res.resolution).toBeLessThanOrEqual(samplingStep(2 * m * R * Math.sin(Math.PI / m), 0.15) / 2);
    expect(res.locations).toHaveLength(m);
    for (const l of res.locations) {
      // the middle of a chord: at distance R·cos(π/m) from the centre, at an odd multiple of π/m
      expect(Math.hypot(l.x, l.y)).toBeCloseTo(R * Math.cos(Math.PI / m), 2);
      const k = Math.atan2(l.y, l.x) / (Math.PI / m);
      expect(Math.abs(Math.abs(k - 2 * Math.floor(k / 2)) - 1)).toBeLessThan(0.02);
    }
  });

  it('measures the distance to the nearest raw ring of any polygon, holes included', () => {
    // analytic: a final hole ring of radius 3.05 around a raw hole of radius 3 (both 8192-gons, same phase) → 0.05
    const raw: PolygonSet = { polygons: [{ outer: rect(0, 0, 20, 20), holes: [reversed(ngon(10, 10, 3, 8192))] }] };
    const fin: PolygonSet = { polygons: [{ outer: rect(0, 0, 20, 20), holes: [reversed(ngon(10, 10, 3.05, 8192))] }] };
    expect(run(fin, raw, 0.25).measured).toBeCloseTo(0.05, 6);
  });
});

const plateGrid = holePlateGrid;

/** A wavy field with many separate blobs (about a thousand raw vertices). */
function blobGrid(): DensityGrid {
  const nx = 44, ny = 28;
  const values = new Float64Array(nx * ny);
  for (let j = 0; j < ny; j++) {
    for (let i = 0; i < nx; i++) {
      values[j * nx + i] = 0.5 + 0.5 * Math.sin(0.5 * i + 3 * Math.sin(0.09 * j)) * Math.cos(0.45 * j + 2 * Math.sin(0.03 * i));
    }
  }
  return { nx, ny, cellSize: [1, 1], origin: [0, 0], values, placement: 'cells' };
}

describe('outline-fidelity on the smoothing stage output', () => {
  for (const [name, g] of [['plate with holes', plateGrid()], ['wavy blobs', blobGrid()]] as const) {
    for (const tolerance of [0.1, 0.25, 0.5]) {
      it(`agrees with report.smoothing.maxDeviation and a brute-force measure (${name}, tolerance ${tolerance} mm)`, () => {
        const raw = contourGrid(g, 0.5, 'decider');
        const sm = smoothPolygons(raw, { iterations: 2, lambda: 0.33, mu: -0.34, tolerance, domain: [0, 0, g.nx, g.ny] });
        const ctx = makeContext({ polygons: sm.polygons, raw, tolerance, maxDeviation: sm.maxDeviation, domain: [0, 0, g.nx, g.ny] });
        const m = outlineFidelity.measure(ctx, tolerance);
        // the smoothing stage's own measure samples every tolerance/4 (docs/smoothing.md §4): both are within
        // half that step (tolerance/8) of the true directed Hausdorff distance, so of each other
        expect(Math.abs(m.measured! - sm.maxDeviation)).toBeLessThanOrEqual(tolerance / 8 + m.resolution);
        // independent O(n²) oracle sampled every tolerance/20 (test/smooth/oracle.ts): a lower bound of the true
        // value, and within tolerance/40 of it
        const brute = bruteDeviation(sm.polygons, raw, tolerance / 20);
        expect(m.measured! + m.resolution).toBeGreaterThanOrEqual(brute - 1e-12);
        expect(m.measured!).toBeLessThanOrEqual(brute + tolerance / 40 + 1e-12);
        // the stage guarantees the budget (docs/smoothing.md §3): nothing to locate
        expect(m.measured!).toBeLessThanOrEqual(tolerance);
        expect(m.locations.every((l) => l.measured > tolerance - m.resolution)).toBe(true);
        // at a lower limit the stretches beyond it are located, the worst of them at the measured value
        const half = outlineFidelity.measure(ctx, m.measured! / 2);
        // (its step is finer, limit/64: both values bracket the same true distance within their resolutions)
        expect(Math.abs(half.measured! - m.measured!)).toBeLessThanOrEqual(m.resolution + half.resolution + 1e-12);
        expect(half.locations.length).toBeGreaterThan(0);
        expect(Math.max(...half.locations.map((l) => l.measured))).toBe(half.measured);
        expect(half.locations.every((l) => l.measured > m.measured! / 2 - half.resolution)).toBe(true);
      });
    }
  }
});
