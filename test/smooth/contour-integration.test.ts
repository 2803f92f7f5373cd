import { describe, it, expect } from 'vitest';
import { contourGrid } from '../../src/contour/contour.js';
import { smoothPolygons } from '../../src/smooth/smooth.js';
import type { DensityGrid } from '../../src/types.js';
import { bruteDeviation, bruteProblems } from './oracle.js';

/** A 120 × 60 cell plate (1 mm cells) with round holes, one of them cut by the domain edge; linear ramps. */
function grid(): DensityGrid {
  const nx = 120, ny = 60;
  const holes = [[20.3, 20.2, 9], [55.1, 35.7, 12], [95.4, 18.9, 7], [118, 45, 10], [60, 8, 3]];
  const values = new Float64Array(nx * ny);
  for (let j = 0; j < ny; j++) {
    for (let i = 0; i < nx; i++) {
      let d = Infinity;
      for (const [cx, cy, r] of holes) d = Math.min(d, Math.hypot(i + 0.5 - cx, j + 0.5 - cy) - r);
      values[j * nx + i] = Math.max(0, Math.min(1, 0.5 + d / 3));
    }
  }
  return { nx, ny, cellSize: [1, 1], origin: [0, 0], values, placement: 'cells' };
}

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
