import { describe, expect, it } from 'vitest';
import { build } from '../../src/pipeline.js';
import { resolveSettings, type Settings } from '../../src/settings.js';
import { npyFloat64 } from '../bench/npy-write.js';

/** Build an NPY grid (rows top-down, as a file holds them) from a function of the cell centre (mm, y up). */
function npyOf(cols: number, rows: number, h: number, f: (x: number, y: number) => number): Uint8Array {
  const v = new Float64Array(cols * rows);
  for (let r = 0; r < rows; r++) {
    const y = (rows - 1 - r + 0.5) * h;
    for (let c = 0; c < cols; c++) v[r * cols + c] = f((c + 0.5) * h, y);
  }
  return npyFloat64(v, rows, cols);
}

const run = (bytes: Uint8Array, s: Partial<Settings>) => build({ name: 'grid.npy', bytes }, resolveSettings(s));
const clamp01 = (x: number) => Math.min(1, Math.max(0, x));

describe('whole pipeline on analytic shapes', () => {
  it('a disc with a linear ramp across its edge → area πr² within 0.5 %, perimeter 2πr within 1 % (analytic)', () => {
    const h = 0.5;
    const r = 20;
    const bytes = npyOf(100, 100, h, (x, y) => clamp01(0.5 + (r - Math.hypot(x - 25, y - 25)) / 2));
    const res = run(bytes, { cellSize: [h, h], level: 0.5 });
    const g = res.report.geometry;
    expect(g.polygons).toBe(1);
    expect(g.holes).toBe(0);
    expect(Math.abs(g.area - Math.PI * r * r) / (Math.PI * r * r)).toBeLessThan(0.005);
    expect(Math.abs(g.perimeter - 2 * Math.PI * r) / (2 * Math.PI * r)).toBeLessThan(0.01);
    // The final outline stays within the tolerance budget of the raw contour (docs/cli.md: 0.25 cell by default).
    expect(res.report.smoothing.maxDeviation).toBeLessThanOrEqual(0.25 * h + 1e-12);
  });

  it('an annulus → one outer ring and one hole, area π(R² − r²) within 0.5 % (analytic)', () => {
    const h = 0.5;
    const bytes = npyOf(120, 120, h, (x, y) => {
      const d = Math.hypot(x - 30, y - 30);
      return clamp01(Math.min(0.5 + (25 - d) / 1.5, 0.5 + (d - 12) / 1.5));
    });
    const res = run(bytes, { cellSize: [h, h], level: 0.5 });
    const g = res.report.geometry;
    expect([g.polygons, g.holes]).toEqual([1, 1]);
    const exact = Math.PI * (25 * 25 - 12 * 12);
    expect(Math.abs(g.area - exact) / exact).toBeLessThan(0.005);
  });

  it('a strut of width 6 mm across the domain keeps its width: area = 6 × length within 0.5 % (analytic)', () => {
    const h = 1;
    const bytes = npyOf(80, 40, h, (_x, y) => clamp01(0.5 + (3 - Math.abs(y - 20.3)) / 2));
    const res = run(bytes, { cellSize: [h, h], level: 0.5 });
    const g = res.report.geometry;
    expect(g.polygons).toBe(1);
    expect(Math.abs(g.area - 6 * 80) / 480).toBeLessThan(0.005);
    // The strut reaches both domain edges exactly (hard edge, docs/conventions.md).
    expect(g.bbox[0]).toBe(0);
    expect(g.bbox[2]).toBe(80);
  });

  it('constant fields: 1 → the whole domain, 0 → nothing; both are answers (docs/threshold.md)', () => {
    const one = run(npyOf(10, 6, 2, () => 1), { cellSize: [2, 2] });
    expect(one.report.threshold.mode).toBe('constant');
    expect(one.report.geometry.area).toBeCloseTo(20 * 12, 9);
    expect(one.report.geometry.vertices).toBe(4);
    const zero = run(npyOf(10, 6, 2, () => 0), { cellSize: [2, 2] });
    expect(zero.report.geometry.polygons).toBe(0);
    expect(zero.warnings.join()).toMatch(/constant/);
  });

  it('binary 10×10 block in void at level 0.5, smoothing off → area 99.5 h², perimeter (36 + 2√2) h exactly (each convex corner loses h²/8)', () => {
    const h = 1.5;
    const bytes = npyOf(20, 20, h, (x, y) => (x > 5 * h && x < 15 * h && y > 5 * h && y < 15 * h ? 1 : 0));
    const res = run(bytes, { cellSize: [h, h], level: 0.5, smooth: 0, tolerance: 0 });
    const g = res.report.geometry;
    expect(g.area).toBeCloseTo(99.5 * h * h, 9);
    expect(g.perimeter).toBeCloseTo((36 + 2 * Math.SQRT2) * h, 9);
  });
});
