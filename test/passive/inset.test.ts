import { describe, expect, it } from 'vitest';
import { applyPassiveToGrid, insetShape } from '../../src/passive/cells.js';
import type { DensityGrid } from '../../src/types.js';

function grid(n: number, h: number): DensityGrid {
  return { nx: n, ny: n, cellSize: [h, h], origin: [0, 0], values: new Float64Array(n * n).fill(0.5), placement: 'cells' };
}

describe('passive cells with an inset (only samples deep inside a primitive are set)', () => {
  it('a circle of radius r with inset t sets the samples of the circle of radius r − t (Gauss circle count, analytic)', () => {
    const g = grid(200, 0.1);
    const r = 6;
    const t = 1.5;
    const withInset = applyPassiveToGrid(g, { regions: [{ role: 'void', shape: { kind: 'circle', cx: 10, cy: 10, r }, name: null, path: 'regions[0]' }] }, { inset: t });
    const direct = applyPassiveToGrid(g, { regions: [{ role: 'void', shape: { kind: 'circle', cx: 10, cy: 10, r: r - t }, name: null, path: 'regions[0]' }] });
    expect(withInset.voidSamples).toBe(direct.voidSamples);
    // π(r − t)²/h² within the perimeter band 2π(r − t)/h + 4
    const expected = (Math.PI * (r - t) ** 2) / 0.01;
    expect(Math.abs(withInset.voidSamples - expected)).toBeLessThan((2 * Math.PI * (r - t)) / 0.1 + 4);
  });

  it('rectangles shrink on every side; a primitive thinner than twice the inset sets nothing', () => {
    expect(insetShape({ kind: 'rect', x0: 0, y0: 0, x1: 10, y1: 4 }, 1)).toEqual([{ kind: 'rect', x0: 1, y0: 1, x1: 9, y1: 3 }]);
    expect(insetShape({ kind: 'rect', x0: 0, y0: 0, x1: 10, y1: 2 }, 1)).toEqual([]);
    expect(insetShape({ kind: 'circle', cx: 0, cy: 0, r: 1 }, 1)).toEqual([]);
  });

  it('a polygon is offset inward by the inset (a 10 × 10 square by 2: the 6 × 6 square, analytic)', () => {
    const out = insetShape({ kind: 'polygon', points: [[0, 0], [10, 0], [10, 10], [0, 10]] }, 2);
    expect(out).toHaveLength(1);
    const pts = out[0].kind === 'polygon' ? out[0].points : [];
    const xs = pts.map((p) => p[0]);
    const ys = pts.map((p) => p[1]);
    expect([Math.min(...xs), Math.max(...xs), Math.min(...ys), Math.max(...ys)]).toEqual([2, 8, 2, 8]);
  });

  it('void still wins: no sample inside a void primitive is set solid, even where only the solid one is deep', () => {
    const g = grid(100, 0.5); // 50 × 50 mm, all 0.5
    const bolt = { cx: 25, cy: 25, r: 5 };
    const out = applyPassiveToGrid(
      g,
      {
        regions: [
          { role: 'solid', shape: { kind: 'circle', cx: 25, cy: 25, r: 15 }, name: 'boss', path: 'regions[0]' },
          { role: 'void', shape: { kind: 'circle', ...bolt }, name: 'bolt', path: 'regions[1]' },
        ],
      },
      { inset: 1 },
    );
    for (let j = 0; j < 100; j++) {
      for (let i = 0; i < 100; i++) {
        const d = Math.hypot((i + 0.5) * 0.5 - 25, (j + 0.5) * 0.5 - 25);
        const v = out.grid.values[j * 100 + i];
        if (d <= bolt.r) expect(v).not.toBe(1); // geometric fact: inside the bolt hole
        if (d <= bolt.r - 1) expect(v).toBe(0); // deep in the hole
        if (d > bolt.r && d <= 15 - 1) expect(v).toBe(1); // deep in the boss, outside the hole
      }
    }
  });

  it('inset 0 is the plain rule', () => {
    const g = grid(50, 1);
    const region = { regions: [{ role: 'solid' as const, shape: { kind: 'circle' as const, cx: 25, cy: 25, r: 10 }, name: null, path: 'r' }] };
    expect(applyPassiveToGrid(g, region, { inset: 0 }).solidSamples).toBe(applyPassiveToGrid(g, region).solidSamples);
  });
});
