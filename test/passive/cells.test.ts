import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { applyPassiveToGrid } from '../../src/passive/cells.js';
import { parsePassive } from '../../src/passive/parse.js';
import type { PassiveRegion, PassiveRegions, PassiveShape } from '../../src/passive/types.js';
import { readNpy } from '../../src/read/npy.js';
import { DEFAULT_READ_OPTIONS } from '../../src/read/types.js';
import type { DensityGrid, Point } from '../../src/types.js';

const region = (role: 'solid' | 'void', shape: PassiveShape, k = 0): PassiveRegion => ({ role, shape, name: null, path: `regions[${k}]` });
const regionsOf = (...r: PassiveRegion[]): PassiveRegions => ({ regions: r });

function grid(nx: number, ny: number, h: number, fill: number, placement: 'cells' | 'nodes' = 'cells', origin: Point = [0, 0]): DensityGrid {
  return { nx, ny, cellSize: [h, h], origin, values: new Float64Array(nx * ny).fill(fill), placement };
}

const count = (values: Float64Array, v: number): number => values.reduce((n, x) => n + (x === v ? 1 : 0), 0);

describe('applyPassiveToGrid', () => {
  it('a circle of radius r on a fine cell grid sets ≈ πr²/h² samples, within the perimeter band, and leaves the input unchanged', () => {
    const h = 0.1;
    const r = 7.3;
    const g = grid(300, 200, h, 0.4);
    const before = new Float64Array(g.values);
    const { grid: out, solidSamples, voidSamples } = applyPassiveToGrid(g, regionsOf(region('solid', { kind: 'circle', cx: 12.34, cy: 9.87, r })));
    const expected = (Math.PI * r * r) / (h * h); // analytic: area of a disc πr², one sample per h² of area
    const band = (2 * Math.PI * r) / h + 4; // samples whose cell the circle crosses: at most perimeter / h + 4 (analytic bound)
    expect(Math.abs(solidSamples - expected)).toBeLessThan(band);
    expect(count(out.values, 1)).toBe(solidSamples);
    expect(count(out.values, 0.4)).toBe(g.values.length - solidSamples);
    expect(voidSamples).toBe(0);
    expect(g.values).toEqual(before); // the input is never mutated
    expect(out.values).not.toBe(g.values);
    expect(out.placement).toBe('cells');
  });

  it('a circle of integer radius on a unit nodal grid sets exactly the lattice points of the Gauss circle problem', () => {
    // nodes: sample (i, j) at (i·h, j·h) — integer points for h = 1; circle centred on a lattice point
    const r = 17;
    const g = grid(60, 60, 1, 0.5, 'nodes');
    const { voidSamples, grid: out } = applyPassiveToGrid(g, regionsOf(region('void', { kind: 'circle', cx: 30, cy: 29, r })));
    // analytic (Gauss circle problem): N(r) = Σ_{x=−r..r} (2⌊√(r² − x²)⌋ + 1) lattice points with x² + y² ≤ r²
    let gauss = 0;
    for (let x = -r; x <= r; x++) gauss += 2 * Math.floor(Math.sqrt(r * r - x * x)) + 1;
    expect(voidSamples).toBe(gauss);
    expect(count(out.values, 0)).toBe(gauss);
    // the boundary counts: (30 + 17, 29) is on the circle and inside (closed set)
    expect(out.values[29 * 60 + 47]).toBe(0);
    expect(out.values[29 * 60 + 48]).toBe(0.5);
  });

  it('a concave lattice polygon on a unit nodal grid sets I + B samples, from Pick\'s theorem A = I + B/2 − 1', () => {
    // an arrow-like concave polygon with lattice vertices, clockwise in the file (either orientation is allowed)
    const pts: Point[] = [[2, 3], [5, 20], [11, 9], [17, 21], [25, 2], [13, 6]];
    const g = grid(30, 30, 1, 0.5, 'nodes');
    const { solidSamples } = applyPassiveToGrid(g, regionsOf(region('solid', { kind: 'polygon', points: pts })));
    // Pick (1899): area A, boundary lattice points B = Σ gcd(|dx|, |dy|), interior I = A − B/2 + 1; closed count I + B
    const gcd = (a: number, b: number): number => (b === 0 ? a : gcd(b, a % b));
    let twiceA = 0;
    let B = 0;
    for (let k = 0; k < pts.length; k++) {
      const [x0, y0] = pts[k];
      const [x1, y1] = pts[(k + 1) % pts.length];
      twiceA += x0 * y1 - x1 * y0;
      B += gcd(Math.abs(x1 - x0), Math.abs(y1 - y0));
    }
    const A = Math.abs(twiceA) / 2;
    expect(solidSamples).toBe(A - B / 2 + 1 + B);
  });

  it('a lattice rectangle on a nodal grid sets (w + 1)(h + 1) samples, and on a cell grid the w·h cells whose centres it holds', () => {
    const rect: PassiveShape = { kind: 'rect', x0: 4, y0: 6, x1: 14, y1: 11 };
    // analytic: lattice points of a closed w × h rectangle with lattice corners
    expect(applyPassiveToGrid(grid(20, 20, 1, 0.5, 'nodes'), regionsOf(region('solid', rect))).solidSamples).toBe(11 * 6);
    // cell centres (i + ½, j + ½) inside [4, 14] × [6, 11]: i = 4..13, j = 6..10 (analytic)
    const cells = applyPassiveToGrid(grid(20, 20, 1, 0.5, 'cells'), regionsOf(region('solid', rect)));
    expect(cells.solidSamples).toBe(10 * 5);
    expect(cells.grid.values[6 * 20 + 4]).toBe(1);
    expect(cells.grid.values[5 * 20 + 4]).toBe(0.5);
    // the same rectangle as a polygon marks the same samples (closed sets on both paths)
    const poly: PassiveShape = { kind: 'polygon', points: [[4, 6], [14, 6], [14, 11], [4, 11]] };
    const asPoly = applyPassiveToGrid(grid(20, 20, 1, 0.5, 'nodes'), regionsOf(region('solid', poly)));
    expect(asPoly.solidSamples).toBe(11 * 6);
  });

  it('the origin and cell size place the samples; primitives reaching outside the grid are clipped to it', () => {
    // 10 × 10 cells of 2 mm from (100, 50): centres at 101, 103, …, 119 and 51, …, 69
    const g = grid(10, 10, 2, 0.5, 'cells', [100, 50]);
    const { solidSamples, grid: out } = applyPassiveToGrid(g, regionsOf(region('solid', { kind: 'rect', x0: 0, y0: 0, x1: 104, y1: 200 })));
    expect(solidSamples).toBe(2 * 10); // analytic: centres x = 101, 103 ≤ 104, every row
    expect(out.values[9 * 10 + 1]).toBe(1);
    expect(out.values[9 * 10 + 2]).toBe(0.5);
  });

  it('void wins where void and solid overlap (a bolt hole through a pad), in either file order', () => {
    const pad = region('solid', { kind: 'rect', x0: 0, y0: 0, x1: 20, y1: 20 });
    const hole = region('void', { kind: 'circle', cx: 10, cy: 10, r: 3 }, 1);
    for (const rs of [regionsOf(pad, hole), regionsOf(hole, pad)]) {
      const { grid: out, solidSamples, voidSamples } = applyPassiveToGrid(grid(40, 40, 1, 0.5), rs);
      expect(out.values[10 * 40 + 10]).toBe(0); // cell centre (10.5, 10.5) lies in the hole
      // analytic: 20 × 20 cell centres in the pad; the hole's centres are counted once, as void
      expect(solidSamples + voidSamples).toBe(400);
      expect(count(out.values, 0)).toBe(voidSamples);
    }
  });

  it('the demo bracket: its passive cells, fixed by the optimizer that wrote the grid, are exactly the cells the scenario file marks', () => {
    // fixtures/make/optimize_demo.py (numpy) fixes cells whose centre is within r of a bolt or the cable hole at 0
    // and the pad (discs r 12 ∪ rectangle) at 1, and restores them after filtering: those cells are exact 0 / 1.
    const bytes = readFileSync(new URL('../../fixtures/grids/demo-bracket.npy', import.meta.url));
    const read = readNpy(bytes, { ...DEFAULT_READ_OPTIONS, cellSize: [2, 2] });
    const regions = parsePassive(readFileSync(new URL('../../fixtures/passive/demo-bracket.passive.json', import.meta.url), 'utf8'), 'demo');
    const { grid: out, solidSamples, voidSamples } = applyPassiveToGrid(read.grid, regions);
    expect(out.values).toEqual(read.grid.values); // nothing to change: the optimizer's passive cells already agree
    expect(solidSamples).toBeGreaterThan(0);
    expect(voidSamples).toBeGreaterThan(0);
    // analytic counts for the cable hole alone: cell centres (odd mm) within 8 mm of (90, 62)
    const cable = applyPassiveToGrid(read.grid, regionsOf(region('void', { kind: 'circle', cx: 90, cy: 62, r: 8 })));
    let n = 0;
    for (let x = 1; x < 240; x += 2) for (let y = 1; y < 120; y += 2) if ((x - 90) ** 2 + (y - 62) ** 2 <= 64) n++;
    expect(cable.voidSamples).toBe(n);
  });

  it('no regions: a copy of the grid, nothing counted', () => {
    const g = grid(5, 5, 1, 0.3);
    const r = applyPassiveToGrid(g, { regions: [] });
    expect(r.grid.values).toEqual(g.values);
    expect(r.grid.values).not.toBe(g.values);
    expect(r.solidSamples + r.voidSamples).toBe(0);
  });

  it('8 million samples with a large disc: the solid count is the disc area over the sample area', () => {
    const g = grid(4000, 2000, 0.05, 0.5);
    const { solidSamples } = applyPassiveToGrid(g, regionsOf(region('solid', { kind: 'circle', cx: 100, cy: 50, r: 45 })));
    expect(Math.abs(solidSamples - (Math.PI * 45 * 45) / 0.0025)).toBeLessThan((2 * Math.PI * 45) / 0.05 + 4); // analytic: πr²/h²
  });
});
