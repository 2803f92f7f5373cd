import { describe, expect, it } from 'vitest';
import { ContourScratch, contourFlat, type FlatPolygonSet } from '../../src/contour/index.js';
import { gridLattice } from '../../src/contour/lattice.js';
import { crossingBound, march } from '../../src/contour/march.js';
import type { DensityGrid } from '../../src/types.js';
import { latticeCellCorners, makeGrid, smoothField } from './grids.js';

/** Cells of the area lattice that straddle L (min < L ≤ max), NaN as −∞; counted from docs/contour.md's definition. */
function straddling(g: DensityGrid, L: number): number {
  return latticeCellCorners(g).filter((c) => Math.min(...c) < L && Math.max(...c) >= L).length;
}

function snapshot(f: FlatPolygonSet) {
  return { xy: Array.from(f.xy), start: Array.from(f.start), hole: Array.from(f.hole), owner: Array.from(f.owner) };
}

const fields: { name: string; g: DensityGrid }[] = [
  { name: 'smooth', g: smoothField(90, 60, 5, 3) },
  { name: 'rough (many small rings)', g: smoothField(70, 50, 6, 0) },
  { name: 'material at the edge, nodal', g: { ...smoothField(40, 55, 8, 2), placement: 'nodes', cellSize: [0.5, 2] } },
  // every lattice edge inside crosses every level in (0, 1]: the bound's 2 crossings a cell are reached
  { name: 'checkerboard', g: makeGrid(30, 20, (_x, _y, i, j) => (i + j) % 2) },
];

describe('contouring with a reused scratch', () => {
  for (const { name, g } of fields) {
    it(`gives the same rings as fresh arrays over levels that grow and shrink the boundary (${name})`, () => {
      const scratch = new ContourScratch();
      const levels = [0.5, 0.05, 0.93, 0.31, 0.5, 0.77, 0.12];
      const kept: { L: number; rings: FlatPolygonSet }[] = [];
      for (const L of levels) {
        // hints: none, far too small (forces regrowth inside the scratch), and the true bound
        for (const hint of [undefined, 0, straddling(g, L)]) {
          const reused = contourFlat(g, L, 'decider', scratch, hint);
          expect(snapshot(reused)).toEqual(snapshot(contourFlat(g, L, 'decider')));
          kept.push({ L, rings: reused });
        }
      }
      // nothing returned refers to the scratch: every earlier result is still the fresh one
      for (const { L, rings } of kept) expect(snapshot(rings)).toEqual(snapshot(contourFlat(g, L, 'decider')));
    });

    it(`never needs more crossings than two per straddling cell plus the domain edge (${name})`, () => {
      const lat = gridLattice(g)!;
      // contour lattice: the area lattice with one −∞ node added at each end of each axis
      const NX = lat.x.coords.length + 2;
      const NY = lat.y.coords.length + 2;
      for (const L of [0.02, 0.2, 0.5, 0.8, 0.98]) {
        for (const rule of ['join', 'split', 'decider'] as const) {
          const cr = march(g, lat, L, rule);
          expect(cr.count).toBeLessThanOrEqual(crossingBound(straddling(g, L), NX, NY));
        }
      }
    });
  }

  it('a field solid to the domain edge needs the edge term: crossings on the edges out to the −∞ border', () => {
    // analytic: a constant 1 field has no straddling cell; its one ring runs around the domain through one
    // crossing on each edge from a domain-edge node out to the border: 2·(nx + 2) + 2·(ny + 2) for cell samples
    const g: DensityGrid = { nx: 6, ny: 4, cellSize: [1, 1], origin: [0, 0], values: new Float64Array(24).fill(1), placement: 'cells' };
    const lat = gridLattice(g)!;
    const cr = march(g, lat, 0.5, 'decider');
    expect(straddling(g, 0.5)).toBe(0);
    expect(cr.count).toBe(2 * (6 + 2) + 2 * (4 + 2));
    expect(cr.count).toBeLessThanOrEqual(crossingBound(0, lat.x.coords.length + 2, lat.y.coords.length + 2));
  });
});
