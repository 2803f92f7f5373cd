import { describe, expect, it } from 'vitest';
import { contourGrid, regionArea } from '../../src/contour/index.js';
import { polygonSetArea, polygonSetPerimeter, ringArea } from '../../src/geom/area.js';
import type { PolygonSet } from '../../src/types.js';
import { makeGrid } from './grids.js';

const clamp = (v: number) => Math.min(1, Math.max(0, v));

function allVertices(set: PolygonSet): (readonly [number, number])[] {
  return set.polygons.flatMap((p) => [...p.outer, ...p.holes.flat()]);
}

describe('contourGrid: analytic shapes', () => {
  it('disc with a linear density ramp across its edge', () => {
    // ρ = clamp(0.5 + (r − dist)/w): the 0.5 level set is the circle dist = r
    const r = 20;
    const g = makeGrid(60, 60, (x, y) => clamp(0.5 + (r - Math.hypot(x - 30, y - 30)) / 3));
    const s = contourGrid(g, 0.5, 'decider');
    expect(s.polygons).toHaveLength(1);
    expect(s.polygons[0].holes).toHaveLength(0);
    // analytic: area of a disc πr², perimeter 2πr
    expect(Math.abs(polygonSetArea(s) / (Math.PI * r * r) - 1)).toBeLessThan(0.005);
    expect(Math.abs(polygonSetPerimeter(s) / (2 * Math.PI * r) - 1)).toBeLessThan(0.01);
  });

  it('annulus: one outer ring and one hole', () => {
    const r1 = 10;
    const r2 = 22;
    const g = makeGrid(60, 60, (x, y) => {
      const d = Math.hypot(x - 30, y - 30);
      return clamp(0.5 + Math.min(d - r1, r2 - d) / 3);
    });
    const s = contourGrid(g, 0.5, 'decider');
    expect(s.polygons).toHaveLength(1);
    expect(s.polygons[0].holes).toHaveLength(1);
    // analytic: outer disc πr2², hole πr1² (clockwise, negative area)
    expect(Math.abs(ringArea(s.polygons[0].outer) / (Math.PI * r2 * r2) - 1)).toBeLessThan(0.005);
    expect(Math.abs(-ringArea(s.polygons[0].holes[0]) / (Math.PI * r1 * r1) - 1)).toBeLessThan(0.005);
  });

  it('strut of known width running into the domain edges', () => {
    // analytic: a band |y − yc| ≤ t/2 with a linear ramp; the field is linear in y near the level set, so
    // linear interpolation is exact and the strut is the rectangle [0, W] × [yc − t/2, yc + t/2]
    const t = 7.4;
    const yc = 15.3;
    const W = 50;
    const g = makeGrid(W, 30, (_x, y) => clamp(0.5 + (t / 2 - Math.abs(y - yc)) / 3));
    const s = contourGrid(g, 0.5, 'decider');
    expect(s.polygons).toHaveLength(1);
    expect(polygonSetArea(s)).toBeCloseTo(t * W, 10);
    const xs = s.polygons[0].outer.map((p) => p[0]);
    const ys = s.polygons[0].outer.map((p) => p[1]);
    expect(Math.min(...xs)).toBe(0); // hard edge: material reaches the domain edge exactly
    expect(Math.max(...xs)).toBe(W);
    expect(Math.min(...ys)).toBeCloseTo(yc - t / 2, 12);
    expect(Math.max(...ys)).toBeCloseTo(yc + t / 2, 12);
  });

  it('constant fields: 0 → empty, 1 → the whole domain rectangle', () => {
    const zero = makeGrid(7, 5, () => 0, { h: 2, origin: [3, -1] });
    expect(contourGrid(zero, 0.5, 'decider').polygons).toHaveLength(0);
    expect(regionArea(zero, 0.5, 'decider')).toBe(0);
    const one = makeGrid(7, 5, () => 1, { h: 2, origin: [3, -1] });
    const s = contourGrid(one, 0.5, 'decider');
    // analytic: the domain [3, 3 + 7·2] × [−1, −1 + 5·2], counter-clockwise
    expect(s.polygons).toHaveLength(1);
    expect(s.polygons[0].outer).toEqual([
      [3, -1],
      [17, -1],
      [17, 9],
      [3, 9],
    ]);
    expect(regionArea(one, 0.5, 'decider')).toBe(140);
    // ties count as solid: a constant field exactly at the level is solid everywhere
    expect(polygonSetArea(contourGrid(one, 1, 'decider'))).toBe(140);
  });

  it('binary 10×10 block in a void 20×20 grid at level 0.5', () => {
    const h = 0.5;
    const g = makeGrid(20, 20, (_x, _y, i, j) => (i >= 5 && i < 15 && j >= 5 && j < 15 ? 1 : 0), { h });
    for (const rule of ['decider', 'join', 'split'] as const) {
      const s = contourGrid(g, 0.5, rule);
      expect(s.polygons).toHaveLength(1);
      // analytic [D]: crossings halfway between centres; each convex corner cut by a right triangle with legs
      // h/2, area h²/8 → 100h² − 4·h²/8 = 99.5h²; perimeter 4·9h + 4·(h/√2) = (36 + 2√2)h
      expect(polygonSetArea(s)).toBeCloseTo(99.5 * h * h, 12);
      expect(polygonSetPerimeter(s)).toBeCloseTo((36 + 2 * Math.SQRT2) * h, 12);
      expect(regionArea(g, 0.5, rule)).toBeCloseTo(99.5 * h * h, 12);
    }
  });

  it('a block touching the domain edge reaches it exactly, at any level', () => {
    // block in columns 0..9, rows 5..14 of a 20×20 void grid
    const g = makeGrid(20, 20, (_x, _y, i, j) => (i < 10 && j >= 5 && j < 15 ? 1 : 0));
    const s = contourGrid(g, 0.5, 'decider');
    expect(s.polygons).toHaveLength(1);
    // analytic [D]: zero-gradient extension → no corner cut at the edge: 100 − 2·(1/8); perimeter
    // 10 (along x = 0) + 2·9.5 + 9 + 2·(1/√2)
    expect(polygonSetArea(s)).toBeCloseTo(99.75, 12);
    expect(polygonSetPerimeter(s)).toBeCloseTo(38 + Math.SQRT2, 12);
    for (const L of [0.05, 0.5, 0.93, 1]) {
      const v = allVertices(contourGrid(g, L, 'decider'));
      expect(Math.min(...v.map((p) => p[0]))).toBe(0);
    }
    // corner block: rows 0..9, columns 0..9 → one convex corner cut: 100 − 1/8 [D]
    const c = makeGrid(20, 20, (_x, _y, i, j) => (i < 10 && j < 10 ? 1 : 0));
    expect(polygonSetArea(contourGrid(c, 0.5, 'decider'))).toBeCloseTo(100 - 0.125, 12);
  });

  it('void at the domain edge stays void', () => {
    const r = 12;
    const g = makeGrid(30, 30, (x, y) => clamp(0.5 + (r - Math.hypot(x - 15, y - 15)) / 3));
    const v = allVertices(contourGrid(g, 0.5, 'decider'));
    // analytic: the disc ends at distance ≥ r − (cell) from the centre, well inside the 30 × 30 domain
    expect(Math.min(...v.map((p) => p[0]))).toBeGreaterThan(2);
    expect(Math.max(...v.map((p) => p[0]))).toBeLessThan(28);
  });

  it('nodal input: samples on cell corners, domain (nx − 1)·h', () => {
    // ρ = x/10 on an 11×11 nodal grid (10×10 cells of 1 mm): the region x ≥ 5 is the rectangle [5, 10] × [0, 10]
    const g = makeGrid(11, 11, (x) => x / 10, { placement: 'nodes' });
    const s = contourGrid(g, 0.5, 'decider');
    expect(s.polygons).toHaveLength(1);
    expect(polygonSetArea(s)).toBeCloseTo(50, 12);
    const v = s.polygons[0].outer;
    expect(Math.min(...v.map((p) => p[0]))).toBeCloseTo(5, 12);
    expect(Math.max(...v.map((p) => p[0]))).toBe(10);
    expect(Math.max(...v.map((p) => p[1]))).toBe(10);
    // nodal disc: πr² within 0.5 % (analytic)
    const r = 15;
    const d = makeGrid(41, 41, (x, y) => clamp(0.5 + (r - Math.hypot(x - 20, y - 20)) / 3), { placement: 'nodes' });
    expect(Math.abs(polygonSetArea(contourGrid(d, 0.5, 'decider')) / (Math.PI * r * r) - 1)).toBeLessThan(0.005);
    // a single solid corner sample: right triangle with legs 0.5 at level 0.5 [D]
    const one = makeGrid(4, 3, (_x, _y, i, j) => (i === 0 && j === 0 ? 1 : 0), { placement: 'nodes' });
    expect(polygonSetArea(contourGrid(one, 0.5, 'decider'))).toBeCloseTo(0.125, 14);
  });

  it('NaN counts as void (below every level)', () => {
    // a NaN sample inside solid material: with NaN as −∞ the crossings sit on the four neighbouring samples,
    // a hole shaped as the diamond through them: diagonals 2h → area 2h² [D] (d3-contour treats NaN the same
    // way; see test/reference/contour-d3.test.ts)
    const g = makeGrid(9, 9, (_x, _y, i, j) => (i === 4 && j === 4 ? NaN : 1));
    const s = contourGrid(g, 0.5, 'decider');
    expect(s.polygons).toHaveLength(1);
    expect(s.polygons[0].holes).toHaveLength(1);
    expect(ringArea(s.polygons[0].holes[0])).toBeCloseTo(-2, 12);
    expect(regionArea(g, 0.5, 'decider')).toBeCloseTo(81 - 2, 12);
  });

  it('rejects a malformed grid or level', () => {
    const g = makeGrid(3, 3, () => 1);
    expect(() => contourGrid(g, NaN, 'decider')).toThrow(/level: expected a finite number/);
    expect(() => contourGrid({ ...g, values: new Float64Array(8) }, 0.5, 'decider')).toThrow(/expected 3×3 = 9 values, found 8/);
    expect(() => regionArea({ ...g, cellSize: [0, 1] }, 0.5, 'decider')).toThrow(/positive finite cell size/);
    // a nodal grid with one row has a zero-area domain: nothing is enclosed
    const flat = makeGrid(5, 1, () => 1, { placement: 'nodes' });
    expect(contourGrid(flat, 0.5, 'decider').polygons).toHaveLength(0);
  });
});
