import { describe, expect, it } from 'vitest';
import { build } from '../../src/pipeline.js';
import { resolveSettings, type Settings } from '../../src/settings.js';
import type { PolygonSet } from '../../src/types.js';
import { npyFloat64 } from '../bench/npy-write.js';
import { platePattern } from '../bench/plate.js';

// Properties (geometric invariance, no outside value needed beyond the transformation itself):
// rotating or mirroring the grid rotates or mirrors the outline; scaling the cell size scales every length.

const COLS = 90;
const ROWS = 60;
const base = platePattern(COLS, ROWS, 11); // rows top-down

/** Transform a top-down row-major field. */
function transform(v: Float64Array, cols: number, rows: number, kind: 'mirror-x' | 'mirror-y' | 'rot90'): { v: Float64Array; cols: number; rows: number } {
  if (kind === 'rot90') {
    // Counter-clockwise rotation by 90° of the picture: new[r'][c'] = old[c'][cols − 1 − r'], size cols × rows swapped.
    const out = new Float64Array(v.length);
    for (let r2 = 0; r2 < cols; r2++) for (let c2 = 0; c2 < rows; c2++) out[r2 * rows + c2] = v[c2 * cols + (cols - 1 - r2)];
    return { v: out, cols: rows, rows: cols };
  }
  const out = new Float64Array(v.length);
  for (let r = 0; r < rows; r++)
    for (let c = 0; c < cols; c++) {
      const src = kind === 'mirror-x' ? r * cols + (cols - 1 - c) : (rows - 1 - r) * cols + c;
      out[r * cols + c] = v[src];
    }
  return { v: out, cols, rows };
}

const run = (v: Float64Array, cols: number, rows: number, s: Partial<Settings>) =>
  build({ name: 'g.npy', bytes: npyFloat64(v, rows, cols) }, resolveSettings(s));

function vertexKeys(set: PolygonSet, map: (x: number, y: number) => [number, number]): string[] {
  const keys: string[] = [];
  for (const p of set.polygons) for (const ring of [p.outer, ...p.holes]) for (const [x, y] of ring) {
    const [a, b] = map(x, y);
    keys.push(`${a.toFixed(6)},${b.toFixed(6)}`);
  }
  return keys.sort();
}

describe('pipeline symmetry properties', () => {
  const s: Partial<Settings> = { cellSize: [1, 1], level: 0.5, smooth: 0, tolerance: 0 };
  const ref = run(base, COLS, ROWS, s);
  const W = COLS;
  const H = ROWS;

  it('mirroring the grid left–right mirrors the raw outline exactly', () => {
    const t = transform(base, COLS, ROWS, 'mirror-x');
    const res = run(t.v, t.cols, t.rows, s);
    expect(vertexKeys(res.smoothed.polygons, (x, y) => [W - x, y])).toEqual(vertexKeys(ref.smoothed.polygons, (x, y) => [x, y]));
  });

  it('mirroring the grid top–bottom mirrors the raw outline exactly', () => {
    const t = transform(base, COLS, ROWS, 'mirror-y');
    const res = run(t.v, t.cols, t.rows, s);
    expect(vertexKeys(res.smoothed.polygons, (x, y) => [x, H - y])).toEqual(vertexKeys(ref.smoothed.polygons, (x, y) => [x, y]));
  });

  it('rotating the grid by 90° rotates the raw outline', () => {
    const t = transform(base, COLS, ROWS, 'rot90');
    const res = run(t.v, t.cols, t.rows, s);
    // A point (x, y) of the original lands at (H − y, x) after a counter-clockwise quarter turn of the picture.
    expect(vertexKeys(ref.smoothed.polygons, (x, y) => [H - y, x])).toEqual(vertexKeys(res.smoothed.polygons, (x, y) => [x, y]));
  });

  it('with smoothing and the volume search, a mirrored grid reaches the same volume at nearly the same level', () => {
    // Simplification starts each ring at a different vertex after mirroring, so the outlines differ within the
    // tolerance budget; the volume target and the level must still agree.
    const full: Partial<Settings> = { cellSize: [1, 1] };
    const a = run(base, COLS, ROWS, full);
    const t = transform(base, COLS, ROWS, 'mirror-x');
    const b = run(t.v, t.cols, t.rows, full);
    for (const r of [a, b]) {
      const th = r.report.threshold;
      expect(Math.abs(th.achievedFraction - th.targetFraction) / th.targetFraction).toBeLessThanOrEqual(0.001);
    }
    expect(Math.abs((b.report.threshold.level as number) - (a.report.threshold.level as number))).toBeLessThan(2e-3);
  });

  it('scaling the cell size by 2.5 scales every length by 2.5 and every area by 6.25', () => {
    const full: Partial<Settings> = { cellSize: [1, 1] };
    const a = run(base, COLS, ROWS, full);
    const b = run(base, COLS, ROWS, { cellSize: [2.5, 2.5] });
    expect(b.report.threshold.level).toBeCloseTo(a.report.threshold.level as number, 9);
    expect(b.report.geometry.perimeter / a.report.geometry.perimeter).toBeCloseTo(2.5, 6);
    expect(b.report.geometry.area / a.report.geometry.area).toBeCloseTo(6.25, 6);
    expect(b.report.smoothing.maxDeviation / a.report.smoothing.maxDeviation).toBeCloseTo(2.5, 6);
    expect(b.report.geometry.vertices).toBe(a.report.geometry.vertices);
  });
});
