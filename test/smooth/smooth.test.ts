import { describe, it, expect } from 'vitest';
import { smoothPolygons, type SmoothOptions } from '../../src/smooth/smooth.js';
import { simplifyRing } from '../../src/smooth/simplify.js';
import type { Point, PolygonSet } from '../../src/types.js';
import { blob, denseRect, latticeCircle, plateWithHoles, rng } from './gen.js';
import { bruteDeviation, bruteProblems, setArea } from './oracle.js';

const opts = (tolerance: number, domain: SmoothOptions['domain'], iterations = 2): SmoothOptions =>
  ({ iterations, lambda: 0.33, mu: -0.34, tolerance, domain });

/** A polyline from a to b with a vertex every `step` mm (a included, b excluded). */
function line(a: Point, b: Point, step: number): Point[] {
  const n = Math.max(1, Math.round(Math.hypot(b[0] - a[0], b[1] - a[1]) / step));
  return Array.from({ length: n }, (_, i) => [a[0] + ((b[0] - a[0]) * i) / n, a[1] + ((b[1] - a[1]) * i) / n] as Point);
}
/** A closed polygon through the corners, densely resampled. */
const dense = (corners: Point[], step: number): Point[] => corners.flatMap((c, i) => line(c, corners[(i + 1) % corners.length], step));

describe('smoothPolygons on a circle', () => {
  const r = 20, h = 1, tol = 0.25;
  const raw: PolygonSet = { polygons: [{ outer: latticeCircle(50.3, 50.1, r, h, 0.05, 4), holes: [] }] };
  const res = smoothPolygons(raw, opts(tol, [0, 0, 100, 100]));

  it('keeps the area of the disc', () => {
    // analytic: chords of sagitta ≤ tolerance cut a circular segment of area ≤ (2/3)·L·tolerance each, so the
    // loss is at most (2/3)·2πr·tolerance, i.e. a relative 4·tolerance/(3r) of πr² (1.7 % here)
    const bound = (4 * tol) / (3 * r);
    expect(Math.abs(res.areaAfter - res.areaBefore) / res.areaBefore).toBeLessThan(bound);
    expect(Math.abs(res.areaAfter - Math.PI * r * r) / (Math.PI * r * r)).toBeLessThan(bound);
    expect(Math.abs(res.areaBefore - Math.PI * r * r) / (Math.PI * r * r)).toBeLessThan(2e-3); // raw lattice polygon
    expect(res.areaBefore).toBeCloseTo(setArea(raw), 9); // independent shoelace
    expect(res.areaAfter).toBeCloseTo(setArea(res.polygons), 9);
  });

  it('stays within the tolerance of the raw ring and measures that honestly', () => {
    const brute = bruteDeviation(res.polygons, raw, tol / 50);
    expect(brute).toBeLessThanOrEqual(tol);
    expect(res.maxDeviation).toBeLessThanOrEqual(tol);
    // the stage's measure is an upper bound up to its sampling step (tolerance/4, docs/smoothing.md §4)
    expect(res.maxDeviation).toBeGreaterThanOrEqual(brute - tol / 8);
    expect(res.maxDeviation).toBeLessThanOrEqual(brute + tol / 8);
    expect(res.verticesBefore).toBe(raw.polygons[0].outer.length);
    expect(res.verticesAfter).toBeLessThan(res.verticesBefore / 2);
    expect(res.ringsDropped).toBe(0);
    expect(bruteProblems(res.polygons)).toEqual([]);
  });
});

describe('domain edges', () => {
  it('keeps a half disc standing on the bottom edge exactly on it', () => {
    const arc: Point[] = [];
    const rand = rng(9);
    for (let i = 0; i < 126; i++) {
      const t = (Math.PI * i) / 126, rr = 10 + 0.05 * (rand() - 0.5);
      arc.push(i === 0 ? [10, 0] : [rr * Math.cos(t), rr * Math.sin(t)]);
    }
    const outer = [...line([-10, 0], [10, 0], 0.5), ...arc];
    const res = smoothPolygons({ polygons: [{ outer, holes: [] }] }, opts(0.3, [-30, 0, 30, 30], 3));
    const out = res.polygons.polygons[0].outer;
    // the material reaches the domain edge y = 0 exactly from x = −10 to x = 10 (definition of the job)
    const onEdge = out.filter((p) => p[1] === 0).map((p) => p[0]).sort((a, b) => a - b);
    expect(onEdge).toEqual([-10, 10]);
    expect(out.every((p) => p[1] >= 0)).toBe(true);
    expect(res.maxDeviation).toBeLessThanOrEqual(0.3);
    expect(bruteProblems(res.polygons)).toEqual([]);
  });

  it('reduces a plate that fills the domain to its four corners', () => {
    const set = plateWithHoles(200, 100, 4, 2, 12, 1);
    const res = smoothPolygons(set, opts(0.25, [0, 0, 200, 100]));
    const corners = res.polygons.polygons[0].outer.map((p) => `${p[0]},${p[1]}`).sort();
    expect(corners).toEqual(['0,0', '0,100', '200,0', '200,100']); // analytic: the domain rectangle
    expect(res.polygons.polygons[0].holes).toHaveLength(8);
    expect(res.maxDeviation).toBeLessThanOrEqual(0.25);
  });
});

describe('near-touching shapes stay valid', () => {
  it('two thin fingers with a narrow gap', () => {
    const outer = dense([[0, 0], [20, 0], [20, 2], [6.1, 2], [6.1, 10], [5.7, 10], [5.7, 2], [5.4, 2], [5.4, 10], [5, 10], [5, 2], [0, 2]], 0.1);
    const raw: PolygonSet = { polygons: [{ outer, holes: [] }] };
    for (const tol of [0.1, 0.3, 1]) {
      const res = smoothPolygons(raw, opts(tol, [-5, -5, 25, 15], 6));
      expect(bruteProblems(res.polygons)).toEqual([]);
      expect(res.maxDeviation).toBeLessThanOrEqual(tol);
    }
  });

  it('a slit narrower than the tolerance stays open', () => {
    const outer = dense([[0, 0], [20, 0], [20, 10], [10.05, 10], [10.05, 3], [9.95, 3], [9.95, 10], [0, 10]], 0.1);
    const raw: PolygonSet = { polygons: [{ outer, holes: [] }] };
    const res = smoothPolygons(raw, opts(1, [-5, -5, 25, 15], 10));
    expect(bruteProblems(res.polygons)).toEqual([]);
    expect(res.maxDeviation).toBeLessThanOrEqual(1);
    expect(bruteDeviation(res.polygons, raw, 0.02)).toBeLessThanOrEqual(1);
  });

  it('a small hole in a low bump that simplification would flatten is kept inside', () => {
    const outer = dense([[0, 0], [20, 0], [20, 10], [12, 10], [11, 10.4], [9, 10.4], [8, 10], [0, 10]], 0.05);
    // CW holes: one wholly inside the bump, one reaching below its base line y = 10
    for (const [y0, problem] of [[10.1, 'polygon 0 hole 0: outside its outer'], [9.9, 'segments']] as const) {
      const hole = dense([[9.9, y0], [9.9, 10.3], [10.1, 10.3], [10.1, y0]], 0.02);
      const raw: PolygonSet = { polygons: [{ outer, holes: [hole] }] };
      // without repair, RDP with ε = 1 flattens the bump: the hole ends outside the material or crosses the outline
      const keep = simplifyRing(Float64Array.from(outer.flat()), 1);
      const naiveOuter = outer.filter((_, i) => keep[i]);
      expect(bruteProblems({ polygons: [{ outer: naiveOuter, holes: [hole] }] }).some((m) => m.startsWith(problem))).toBe(true);
      for (const iterations of [0, 3]) {
        const res = smoothPolygons(raw, opts(1, [-5, -5, 25, 15], iterations));
        expect(bruteProblems(res.polygons)).toEqual([]);
        expect(res.polygons.polygons[0].holes).toHaveLength(1);
        expect(res.maxDeviation).toBeLessThanOrEqual(1);
        expect(bruteDeviation(res.polygons, raw, 0.02)).toBeLessThanOrEqual(1);
      }
    }
  });

  it('a hole close to its outer ring', () => {
    const outer = latticeCircle(0, 0, 10, 0.5, 0.05, 2);
    const hole = latticeCircle(6.6, 0, 3, 0.5, 0.05, 3).reverse(); // gap 0.4 to the outer ring
    const raw: PolygonSet = { polygons: [{ outer, holes: [hole] }] };
    for (const tol of [0.125, 0.5, 1]) {
      const res = smoothPolygons(raw, opts(tol, [-20, -20, 20, 20], 4));
      expect(bruteProblems(res.polygons)).toEqual([]);
      expect(res.polygons.polygons[0].holes).toHaveLength(1);
      expect(res.maxDeviation).toBeLessThanOrEqual(tol);
    }
  });
});

describe('properties', () => {
  it('maxDeviation ≤ tolerance and the result is valid for random blobs with holes', () => {
    for (let seed = 1; seed <= 16; seed++) {
      const rand = rng(seed * 101);
      const tol = 0.05 + rand() * 0.5;
      const h = 0.2 + rand() * 0.5;
      const outer = blob(0, 0, 8 + rand() * 4, h, seed);
      const hole = blob(1 + rand(), rand(), 2 + rand() * 2, h, seed + 1000).reverse();
      const island = blob(30, 0, 3, h, seed + 2000);
      const raw: PolygonSet = { polygons: [{ outer, holes: [hole] }, { outer: island, holes: [] }] };
      const res = smoothPolygons(raw, opts(tol, [-40, -40, 40, 40], 1 + (seed % 4)));
      expect(res.maxDeviation).toBeLessThanOrEqual(tol);
      // independent dense brute force: ≤ tolerance (sampling error of 1/40 of the tolerance allowed)
      expect(bruteDeviation(res.polygons, raw, tol / 20)).toBeLessThanOrEqual(tol * (1 + 1e-9));
      expect(bruteProblems(res.polygons)).toEqual([]);
      expect(res.ringsDropped).toBe(0);
    }
  });

  it('is idempotent within the tolerance: simplifying the result again with iterations 0', () => {
    const set = plateWithHoles(100, 60, 3, 2, 7, 0.5);
    const once = smoothPolygons(set, opts(0.125, [0, 0, 100, 60]));
    const twice = smoothPolygons(once.polygons, opts(0.125, [0, 0, 100, 60], 0));
    expect(twice.maxDeviation).toBeLessThanOrEqual(0.125);
    expect(bruteDeviation(twice.polygons, once.polygons, 0.01)).toBeLessThanOrEqual(0.125);
    expect(twice.verticesAfter).toBeLessThanOrEqual(once.verticesAfter);
    expect(Math.abs(twice.areaAfter - once.areaAfter)).toBeLessThan(0.125 * 2 * Math.PI * 7 * 6 * 0.5);
  });

  it('does not modify its input', () => {
    const set = plateWithHoles(100, 60, 2, 1, 7, 0.5);
    const copy = JSON.stringify(set);
    smoothPolygons(set, opts(0.2, [0, 0, 100, 60]));
    expect(JSON.stringify(set)).toBe(copy);
  });
});

describe('degenerate input and options', () => {
  it('drops and counts rings with fewer than three distinct points or zero area', () => {
    const good = denseRect(0, 0, 10, 10, 1);
    const res = smoothPolygons({
      polygons: [
        { outer: good, holes: [[[2, 2], [2, 2], [3, 3]], [[4, 4], [5, 5], [6, 6]]] },
        { outer: [[20, 20], [21, 21]], holes: [] },
      ],
    }, opts(0.1, [0, 0, 30, 30]));
    expect(res.ringsDropped).toBe(3);
    expect(res.polygons.polygons).toHaveLength(1);
    expect(res.polygons.polygons[0].holes).toHaveLength(0);
  });

  it('rejects bad options with E_USAGE naming the option', () => {
    const set = { polygons: [] };
    expect(() => smoothPolygons(set, opts(NaN, [0, 0, 1, 1]))).toThrow(/tolerance/);
    expect(() => smoothPolygons(set, opts(-1, [0, 0, 1, 1]))).toThrow(/tolerance/);
    expect(() => smoothPolygons(set, { ...opts(1, [0, 0, 1, 1]), iterations: 1.5 })).toThrow(/iterations/);
    expect(() => smoothPolygons(set, opts(1, [0, 0, 0, 1]))).toThrow(/domain/);
    const empty = smoothPolygons(set, opts(0.1, [0, 0, 1, 1]));
    expect(empty).toMatchObject({ maxDeviation: 0, areaBefore: 0, areaAfter: 0, verticesBefore: 0, verticesAfter: 0, ringsDropped: 0 });
  });

  it('with tolerance 0 changes nothing but exactly collinear vertices', () => {
    const raw: PolygonSet = { polygons: [{ outer: latticeCircle(5, 5, 3, 0.5, 0.05, 1), holes: [] }] };
    const res = smoothPolygons(raw, opts(0, [0, 0, 10, 10]));
    expect(res.polygons.polygons[0].outer).toEqual(raw.polygons[0].outer);
    expect(res.maxDeviation).toBe(0);
  });
});

describe('a large plate (about 200k raw vertices)', () => {
  it('stays valid and within tolerance', () => {
    const set = plateWithHoles(2000, 1000, 37, 18, 18, 0.5);
    // Its speed is measured by the benchmark (npm run bench), not here.
    const res = smoothPolygons(set, opts(0.125, [0, 0, 2000, 1000]));
    expect(res.verticesBefore).toBeGreaterThan(190_000);
    expect(res.maxDeviation).toBeLessThanOrEqual(0.125);
    expect(res.polygons.polygons[0].holes).toHaveLength(37 * 18);
    expect(res.ringsDropped).toBe(0);
    // holes shrink a little under RDP (chords lie inside a convex hole), so material grows; bound from the
    // analytic sagitta of a chord: area change ≤ perimeter × tolerance
    const perimeter = 2 * (2000 + 1000) + 37 * 18 * 2 * Math.PI * 18;
    expect(Math.abs(res.areaAfter - res.areaBefore)).toBeLessThan(perimeter * 0.125);
  });
});

describe('input that is already invalid', () => {
  it('returns touching raw rings as they are when there is no budget, and separates them when there is', () => {
    // two squares sharing the corner (10, 10): invalid before smoothing (docs/smoothing.md §5)
    const a = dense([[0, 0], [10, 0], [10, 10], [0, 10]], 0.5);
    const b = dense([[10, 10], [20, 10], [20, 20], [10, 20]], 0.5);
    const raw: PolygonSet = { polygons: [{ outer: a, holes: [] }, { outer: b, holes: [] }] };
    expect(bruteProblems(raw).length).toBeGreaterThan(0);
    const still = smoothPolygons(raw, opts(0, [-5, -5, 25, 25]));
    // tolerance 0: nothing can move; the repair gives up on the touching rings and returns them raw
    expect(still.polygons.polygons.map((p) => p.outer)).toEqual([a, b]);
    const res = smoothPolygons(raw, opts(0.3, [-5, -5, 25, 25]));
    // with a budget, smoothing rounds the shared corner away and the result is valid
    expect(bruteProblems(res.polygons)).toEqual([]);
    expect(res.maxDeviation).toBeLessThanOrEqual(0.3);
  });
});
