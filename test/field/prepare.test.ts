import { describe, expect, it } from 'vitest';
import { RhoformError } from '../../src/errors.js';
import { prepareGrid } from '../../src/field/prepare.js';
import type { SamplePosition } from '../../src/read/types.js';
import type { DensityGrid } from '../../src/types.js';
import { rhoformErrorOf } from '../support/errors.js';

// A 3×2 grid written top-down: file row 1 is grid row j = 1.
const nx = 3;
const ny = 2;
const locate = (i: number, j: number): SamplePosition => ({
  fileRow: ny - j,
  fileCol: i + 1,
  where: { file: 'g.csv', line: ny - j, col: 2 * i + 1 },
});
const grid = (values: number[]): DensityGrid => ({ nx, ny, cellSize: [1, 1], origin: [0, 0], values: Float64Array.from(values), placement: 'cells' });
const opts = { valueRange: [0, 1] as [number, number], clip: false, nonFinite: 'error' as const };

function error(f: () => unknown): RhoformError {
  return rhoformErrorOf(f, 'expected a RhoformError');
}

describe('prepare', () => {
  it('maps a value range linearly to 0..1 (e.g. 8-bit images, 0..255)', () => {
    const r = prepareGrid(grid([0, 51, 255, 127.5, 255, 0]), locate, { ...opts, valueRange: [0, 255] });
    expect(Array.from(r.grid.values)).toEqual([0, 0.2, 1, 0.5, 1, 0]);
  });
  it('clips an overshoot up to 0.05 with a warning', () => {
    const r = prepareGrid(grid([-0.04, 1.05, 0.5, 0.5, 0.5, 0.5]), locate, opts);
    expect(r.grid.values[0]).toBe(0);
    expect(r.grid.values[1]).toBe(1);
    expect(r.clipped).toBe(2);
    expect(r.warnings.join(' ')).toMatch(/2 values slightly outside/);
  });
  it('refuses values beyond the overshoot unless --clip, naming the worst value and its position', () => {
    // grid index 4 = (i 1, j 1) → file line 1, col 3
    const e = error(() => prepareGrid(grid([0.5, 0.5, 0.5, 1.2, 1.7, 0.5]), locate, opts));
    expect(e.code).toBe('E_GRID_RANGE');
    expect(e.message).toMatch(/^g\.csv:1:3: expected values within 0\.\.1.*found 1\.7 \(2 values beyond that/);
    const r = prepareGrid(grid([0.5, 0.5, 0.5, 1.2, 1.7, 0.5]), locate, { ...opts, clip: true });
    expect(r.grid.values[4]).toBe(1);
  });
  it('refuses non-finite values naming the first in file order and the count', () => {
    // NaN at grid index 0 (file row 2) and at index 5 (file row 1, col 3): the first in the file is index 5.
    const e = error(() => prepareGrid(grid([NaN, 0.5, 0.5, 0.5, 0.5, Infinity]), locate, opts));
    expect(e.code).toBe('E_GRID_NONFINITE');
    expect(e.message).toMatch(/^g\.csv:1:5: expected finite densities, found Infinity \(2 non-finite values/);
  });
  it('treats non-finite values as void with --non-finite void', () => {
    const r = prepareGrid(grid([NaN, 0.5, 0.5, 0.5, 0.5, 0.5]), locate, { ...opts, nonFinite: 'void' });
    expect(r.grid.values[0]).toBe(0);
    expect(r.nonFinite).toBe(1);
  });
  it('never modifies its input', () => {
    const g = grid([-0.01, 0.5, 0.5, 0.5, 0.5, 0.5]);
    prepareGrid(g, locate, opts);
    expect(g.values[0]).toBe(-0.01);
  });
});

describe('input statistics gathered while preparing', () => {
  it('equal fieldStats of the range-mapped field (raw min and max), with NaN, ±Inf and overshoots', async () => {
    const { fieldStats } = await import('../../src/field/stats.js');
    let seed = 12345;
    const rand = () => ((seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648);
    for (let trial = 0; trial < 120; trial++) {
      const range = ([[0, 1], [0, 255], [-1, 1]] as [number, number][])[trial % 3];
      const vals = Array.from({ length: 6 }, () => {
        const u = rand();
        if (u < 0.1) return NaN;
        if (u < 0.15) return Infinity;
        return range[0] + (range[1] - range[0]) * (rand() * 1.08 - 0.04);
      });
      const g = grid(vals);
      const r = prepareGrid(g, locate, { valueRange: range, clip: true, nonFinite: 'void' });
      const mapped = { ...g, values: Float64Array.from(vals, (v) => (v - range[0]) / (range[1] - range[0])) };
      const want = fieldStats(mapped);
      const raw = fieldStats(g);
      expect(r.inputStats.nonFinite).toBe(want.nonFinite);
      expect(r.inputStats.min).toBe(raw.min);
      expect(r.inputStats.max).toBe(raw.max);
      expect(r.inputStats.mean).toBeCloseTo(want.mean, 12);
      expect(r.inputStats.greyLevel).toBeCloseTo(want.greyLevel, 10);
      expect(r.inputStats.greyShare).toBeCloseTo(want.greyShare, 12);
    }
  });
});
