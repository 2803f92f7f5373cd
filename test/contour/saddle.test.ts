import { describe, expect, it } from 'vitest';
import { contourGrid, regionArea, type SaddleRule } from '../../src/contour/index.js';
import { joinsSolid } from '../../src/contour/saddle.js';
import { polygonSetArea } from '../../src/geom/area.js';
import type { DensityGrid } from '../../src/types.js';

/** One lattice cell: a 2×2 nodal grid with corners B00 (bottom-left), B10, B01, B11 (top-right), 1 mm. */
function cell(b00: number, b10: number, b01: number, b11: number): DensityGrid {
  return { nx: 2, ny: 2, cellSize: [1, 1], origin: [0, 0], values: Float64Array.of(b00, b10, b01, b11), placement: 'nodes' };
}

/** Saddle value of the bilinear interpolant, docs/references.md §3.4 (Nielson & Hamann 1991). */
const saddleValue = (b00: number, b10: number, b01: number, b11: number) => (b00 * b11 - b10 * b01) / (b00 + b11 - b10 - b01);

describe('saddle cells', () => {
  it('decider separates the high corners when the saddle value is below the level', () => {
    // docs/references.md §3.4 [D]: B00=0.95, B11=0.55, B10=B01=0.30, L=0.5 → saddle 0.4806 < L → separate
    // (the centre average 0.525 would join them)
    const [b00, b10, b01, b11] = [0.95, 0.3, 0.3, 0.55];
    expect(saddleValue(b00, b10, b01, b11)).toBeCloseTo(0.4806, 4);
    expect(joinsSolid(b00, b11, b10, b01, 0.5, 'decider')).toBe(false);
    const g = cell(b00, b10, b01, b11);
    expect(contourGrid(g, 0.5, 'decider').polygons).toHaveLength(2);
    expect(contourGrid(g, 0.5, 'split').polygons).toHaveLength(2);
    expect(contourGrid(g, 0.5, 'join').polygons).toHaveLength(1);
    // analytic [D]: two corner triangles; legs 0.45/0.65 at B00 and 0.05/0.25 at B11
    const sep = 0.5 * (0.45 / 0.65) ** 2 + 0.5 * 0.2 ** 2;
    expect(polygonSetArea(contourGrid(g, 0.5, 'decider'))).toBeCloseTo(sep, 14);
    expect(regionArea(g, 0.5, 'decider')).toBeCloseTo(sep, 14);
    // joined: the unit square minus the two void-corner triangles (legs 1 − 0.45/0.65 and 1 − 0.2)
    const joined = 1 - 2 * 0.5 * (1 - 0.45 / 0.65) * (1 - 0.2);
    expect(polygonSetArea(contourGrid(g, 0.5, 'join'))).toBeCloseTo(joined, 14);
    expect(regionArea(g, 0.5, 'join')).toBeCloseTo(joined, 14);
  });

  it('decider joins the high corners when the saddle value is above the level', () => {
    // docs/references.md §3.4 [D]: B00=0.2, B10=0.9, B01=0.8, B11=0.3 → saddle 0.55 ≥ 0.5 → join
    const [b00, b10, b01, b11] = [0.2, 0.9, 0.8, 0.3];
    expect(saddleValue(b00, b10, b01, b11)).toBeCloseTo(0.55, 12);
    expect(joinsSolid(b10, b01, b00, b11, 0.5, 'decider')).toBe(true);
    const g = cell(b00, b10, b01, b11);
    expect(contourGrid(g, 0.5, 'decider').polygons).toHaveLength(1);
    expect(contourGrid(g, 0.5, 'join').polygons).toHaveLength(1);
    expect(contourGrid(g, 0.5, 'split').polygons).toHaveLength(2);
  });

  it('decider follows the saddle value on both sides of the level, for both diagonals', () => {
    // docs/references.md §3.4: joined ⇔ (B00·B11 − B10·B01)/(B00 + B11 − B10 − B01) ≥ L, checked on many random cells
    let seed = 7;
    const rnd = () => ((seed = (seed * 16807) % 2147483647) - 1) / 2147483646;
    let checked = 0;
    for (let k = 0; k < 2000; k++) {
      const v = [rnd(), rnd(), rnd(), rnd()];
      const L = 0.5;
      const [b00, b10, b01, b11] = v;
      const diag1 = b00 >= L && b11 >= L && b10 < L && b01 < L;
      const diag2 = b10 >= L && b01 >= L && b00 < L && b11 < L;
      if (!diag1 && !diag2) continue;
      checked++;
      const want = saddleValue(b00, b10, b01, b11) >= L;
      const got = diag1 ? joinsSolid(b00, b11, b10, b01, L, 'decider') : joinsSolid(b10, b01, b00, b11, L, 'decider');
      expect(got).toBe(want);
      expect(contourGrid(cell(b00, b10, b01, b11), L, 'decider').polygons).toHaveLength(want ? 1 : 2);
    }
    expect(checked).toBeGreaterThan(100);
  });

  it('checkerboard: split gives isolated squares, join one connected piece', () => {
    // 2×2-sample checkerboard on an 8×8 cell grid: solid diagonal neighbours touch only through saddle cells
    const nx = 8;
    const values = new Float64Array(nx * nx);
    for (let j = 0; j < nx; j++) for (let i = 0; i < nx; i++) values[j * nx + i] = (i + j) % 2 === 0 ? 1 : 0;
    const g: DensityGrid = { nx, ny: nx, cellSize: [1, 1], origin: [0, 0], values, placement: 'cells' };
    const count = (r: SaddleRule) => contourGrid(g, 0.5, r).polygons.length;
    // split: every solid sample its own diamond (32 of them); join: one polygon (with 4-connected void holes)
    expect(count('split')).toBe(32);
    expect(count('join')).toBe(1);
    // symmetric saddles (all corners 0 or 1, saddle value exactly 0.5 = L) count as joined under the decider
    expect(count('decider')).toBe(1);
  });
});
