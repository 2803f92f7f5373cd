/**
 * Volume preservation on realistic optimizer output: grids written by a small SIMP optimizer with a density
 * filter (fixtures/make/optimize_demo.py; numpy wrote the files and the invariants in *.expect.json).
 * docs/threshold.md / issue: |achieved − target| ≤ 0.1 % of the target, the target being numpy's mean of the field.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { build } from '../../src/pipeline.js';
import { resolveSettings } from '../../src/settings.js';

const dir = new URL('../../fixtures/grids/', import.meta.url);
const grids = readdirSync(dir).filter((f) => f.endsWith('.npy'));

describe('volume-preserving threshold on realistic optimizer grids', () => {
  it('has the fixtures', () => expect(grids.length).toBeGreaterThanOrEqual(5));
  for (const file of grids) {
    const expect_ = JSON.parse(readFileSync(new URL(file.replace(/\.npy$/, '.expect.json'), dir), 'utf8')) as {
      mean: number;
      shape: [number, number];
      cellSizeMm: number;
    };
    for (const saddle of ['decider', 'join', 'split'] as const) {
      it(`${file} (${saddle}): smoothed area within 0.1 % of numpy's mean × domain`, () => {
        const h = expect_.cellSizeMm;
        const res = build({ name: file, bytes: readFileSync(new URL(file, dir)) }, resolveSettings({ cellSize: [h, h], saddle }));
        const t = res.report.threshold;
        expect(t.mode).toBe('volume');
        // The target is the optimizer's own volume: numpy's mean of the grid (float64 sums agree to ~1e-15).
        expect(t.targetFraction).toBeCloseTo(expect_.mean, 12);
        expect(Math.abs(t.achievedFraction - t.targetFraction) / t.targetFraction).toBeLessThanOrEqual(0.001);
        // The achieved fraction is the area of the smoothed polygons over the domain; the report's area is that of
        // the rings as the DXF holds them (coordinates rounded to 1e-6 mm), which moves it by under
        // perimeter × 1e-6 mm (each vertex moves by at most 0.5e-6·√2 mm).
        const domain = expect_.shape[0] * expect_.shape[1] * h * h;
        expect(Math.abs(res.report.geometry.area / domain - t.achievedFraction)).toBeLessThanOrEqual((res.report.geometry.perimeter * 1e-6) / domain);
        // Smoothing stayed within its budget (default 0.25 cell).
        expect(res.report.smoothing.maxDeviation).toBeLessThanOrEqual(0.25 * h + 1e-9);
      });
    }
  }
});
