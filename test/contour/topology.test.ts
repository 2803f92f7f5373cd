import { describe, expect, it } from 'vitest';
import { contourGrid, regionArea, type SaddleRule } from '../../src/contour/index.js';
import { ringArea } from '../../src/geom/area.js';
import type { PolygonSet } from '../../src/types.js';
import { makeGrid, smoothField } from './grids.js';
import { bruteOwners, countIntersections, segmentsMeet } from './topology.js';

const RULES: SaddleRule[] = ['decider', 'join', 'split'];

function checkRings(set: PolygonSet): void {
  for (const p of set.polygons) {
    // RFC 7946 right-hand rule: outer counter-clockwise, holes clockwise
    expect(ringArea(p.outer)).toBeGreaterThan(0);
    for (const h of p.holes) expect(ringArea(h)).toBeLessThan(0);
    for (const r of [p.outer, ...p.holes]) {
      expect(r.length).toBeGreaterThanOrEqual(3);
      for (let k = 0; k < r.length; k++) {
        const q = r[(k + 1) % r.length];
        // implicitly closed, no repeated vertex between neighbours (incl. last → first)
        expect(r[k][0] === q[0] && r[k][1] === q[1]).toBe(false);
      }
    }
  }
}

describe('contourGrid: topology', () => {
  it('the intersection checker itself finds crossings and touches', () => {
    // definition of segment intersection by orientation tests
    expect(segmentsMeet([0, 0], [2, 2], [0, 2], [2, 0])).toBe(true);
    expect(segmentsMeet([0, 0], [1, 0], [1, 0], [2, 1])).toBe(true);
    expect(segmentsMeet([0, 0], [1, 0], [0, 1], [1, 1])).toBe(false);
    const bowtie: PolygonSet = { polygons: [{ outer: [[0, 0], [2, 2], [2, 0], [0, 2]], holes: [] }] };
    expect(countIntersections(bowtie)).toBe(1);
  });

  for (const seed of [1, 2, 3]) {
    for (const rule of RULES) {
      it(`random smooth field (seed ${seed}, ${rule}): orientation, closure, no self-intersections, hole owners`, () => {
        const g = smoothField(70, 50, seed, 3);
        let holes = 0;
        for (const L of [0.3, 0.5, 0.62]) {
          const s = contourGrid(g, L, rule);
          expect(s.polygons.length).toBeGreaterThan(0);
          checkRings(s);
          // marching squares with a consistent saddle rule: no two edges meet except consecutive ones
          expect(countIntersections(s)).toBe(0);
          // each hole belongs to the smallest outer ring containing it (brute-force point in ring)
          for (const o of bruteOwners(s)) expect(o.assigned).toBe(o.expected);
          holes += bruteOwners(s).length;
        }
        expect(holes).toBeGreaterThan(0); // the owner check did run
      });
    }
  }

  it('nested islands: disc ⊃ hole ⊃ island ⊃ hole', () => {
    // bands of the distance from the centre: solid for d < 6, 10 < d < 16, 20 < d < 26 → rings at d = 6, 10, 16, 20, 26
    const g = makeGrid(64, 64, (x, y) => {
      const d = Math.hypot(x - 32, y - 32);
      const edges = [0, 6, 10, 16, 20, 26];
      let best = Infinity;
      let inside = false;
      for (let k = 0; k + 1 < edges.length; k += 2) if (d >= edges[k] && d <= edges[k + 1]) inside = true;
      for (const e of edges.slice(1)) best = Math.min(best, Math.abs(d - e));
      return Math.min(1, Math.max(0, 0.5 + (inside ? best : -best) / 2.5));
    });
    const s = contourGrid(g, 0.5, 'decider');
    // analytic: three pieces — the central disc (no hole), the ring 10..16 (one hole), the ring 20..26 (one hole)
    expect(s.polygons).toHaveLength(3);
    const byArea = [...s.polygons].sort((a, b) => ringArea(a.outer) - ringArea(b.outer));
    expect(byArea.map((p) => p.holes.length)).toEqual([0, 1, 1]);
    expect(Math.abs(-ringArea(byArea[1].holes[0]) / (Math.PI * 100) - 1)).toBeLessThan(0.01);
    expect(Math.abs(-ringArea(byArea[2].holes[0]) / (Math.PI * 400) - 1)).toBeLessThan(0.01);
    for (const o of bruteOwners(s)) expect(o.assigned).toBe(o.expected);
  });

  it('many holes in one plate, material touching the edge', () => {
    const g = makeGrid(120, 80, (x, y) => {
      const cx = Math.round(x / 10) * 10;
      const cy = Math.round(y / 10) * 10;
      return Math.min(1, Math.max(0, 0.5 + (Math.hypot(x - cx, y - cy) - 3) / 2));
    });
    const s = contourGrid(g, 0.5, 'decider');
    checkRings(s);
    expect(countIntersections(s)).toBe(0);
    // analytic: holes at every interior lattice point (11 × 7); edge holes are cut open by the domain edge
    expect(s.polygons).toHaveLength(1);
    expect(s.polygons[0].holes).toHaveLength(11 * 7);
  });
});

describe('contourGrid: values exactly at the level', () => {
  for (const rule of RULES) {
    it(`random binary grid at levels 0, 0.5 and 1 (${rule}): area as regionArea, valid rings`, () => {
      let seed = 3;
      const rnd = () => ((seed = (seed * 48271) % 2147483647) - 1) / 2147483646;
      const g = makeGrid(40, 30, () => (rnd() < 0.55 ? 1 : 0));
      for (const L of [0, 0.5, 1]) {
        const s = contourGrid(g, L, rule);
        checkRings(s);
        const poly = s.polygons.reduce((a, p) => a + ringArea(p.outer) + p.holes.reduce((b, h) => b + ringArea(h), 0), 0);
        // the stitched area equals the cell-by-cell sum even when crossings coincide with samples
        expect(Math.abs(poly - regionArea(g, L, rule))).toBeLessThan(1e-9 * 1200);
        // at 0.5 there are no ties: still no edge meets another
        if (L === 0.5) expect(countIntersections(s)).toBe(0);
      }
      // level 0: every sample is solid (ties solid) → the whole 40 × 30 domain (analytic)
      expect(contourGrid(g, 0, rule).polygons.map((p) => ringArea(p.outer))).toEqual([1200]);
    });
  }
});
