import { describe, it, expect } from 'vitest';
import { contourGrid } from '../../src/contour/contour.js';
import { smoothPolygons } from '../../src/smooth/smooth.js';
import type { DensityGrid } from '../../src/types.js';
import { bruteDeviation, bruteProblems } from './oracle.js';
import { holePlateGrid } from '../support/hole-plate.js';

const grid = holePlateGrid;

describe('smoothing the contour stage output', () => {
  it('stays valid, within tolerance, and keeps the domain corners and edge contacts', () => {
    const raw = contourGrid(grid(), 0.5, 'decider');
    for (const tolerance of [0.1, 0.25, 0.5]) {
      const res = smoothPolygons(raw, { iterations: 2, lambda: 0.33, mu: -0.34, tolerance, domain: [0, 0, 120, 60] });
      expect(bruteProblems(res.polygons)).toEqual([]);
      expect(res.maxDeviation).toBeLessThanOrEqual(tolerance);
      expect(bruteDeviation(res.polygons, raw, tolerance / 20)).toBeLessThanOrEqual(tolerance);
      expect(res.polygons.polygons).toHaveLength(raw.polygons.length);
      expect(res.polygons.polygons[0].holes).toHaveLength(raw.polygons[0].holes.length);
      // the hard edge: every raw vertex where the outline meets or leaves the right edge x = 120 is kept exactly
      const rawOnEdge = raw.polygons[0].outer.filter((p) => p[0] === 120).map((p) => p[1]).sort((a, b) => a - b);
      const outOnEdge = res.polygons.polygons[0].outer.filter((p) => p[0] === 120).map((p) => p[1]).sort((a, b) => a - b);
      expect(outOnEdge).toEqual(rawOnEdge);
      for (const c of [[0, 0], [120, 0], [120, 60], [0, 60]]) expect(res.polygons.polygons[0].outer).toContainEqual(c);
    }
  });
});
