import { describe, expect, it } from 'vitest';
import { fieldMean } from '../../src/field/mean.js';
import { fieldStats, histogram } from '../../src/field/stats.js';
import type { DensityGrid } from '../../src/types.js';

const grid = (values: number[], nx: number, ny: number, placement: 'cells' | 'nodes' = 'cells'): DensityGrid => ({
  nx,
  ny,
  cellSize: [1, 1],
  origin: [0, 0],
  values: Float64Array.from(values),
  placement,
});

describe('measure of non-discreteness M_nd', () => {
  // docs/references.md §2.4: Sigmund 2007, M_nd = 100/n Σ 4ρ(1−ρ); test values [D]: ρ ≡ 0.5 → 100, binary → 0, ρ ≡ 0.25 → 75.
  it('is 100 % for a field of 0.5 (Sigmund 2007)', () => {
    expect(fieldStats(grid(new Array(12).fill(0.5), 4, 3)).greyLevel).toBeCloseTo(100, 12);
  });
  it('is 0 % for a 0/1 design (Sigmund 2007)', () => {
    expect(fieldStats(grid([0, 1, 1, 0, 1, 0], 3, 2)).greyLevel).toBe(0);
  });
  it('is 75 % for a field of 0.25 (Sigmund 2007)', () => {
    expect(fieldStats(grid(new Array(6).fill(0.25), 3, 2)).greyLevel).toBeCloseTo(75, 12);
  });
});

describe('field statistics', () => {
  it('counts non-finite values and leaves them out of range and mean', () => {
    const s = fieldStats(grid([0.2, NaN, 0.6, Infinity, -Infinity, 1], 3, 2));
    expect(s.nonFinite).toBe(3);
    expect(s.min).toBe(0.2);
    expect(s.max).toBe(1);
    expect(s.mean).toBeCloseTo(0.6, 12); // (0.2 + 0.6 + 1) / 3, arithmetic
  });
  it('grey share counts 0.1 < ρ < 0.9 only', () => {
    expect(fieldStats(grid([0.1, 0.11, 0.5, 0.89, 0.9, 0], 3, 2)).greyShare).toBeCloseTo(3 / 6, 12);
  });
  it('histogram puts every finite sample in one bin, upper edge in the last bin', () => {
    const h = histogram(grid([0, 0.05, 0.5, 1, NaN, 0.999], 3, 2), 10);
    expect(h.edges).toHaveLength(11);
    expect(h.counts.reduce((a, b) => a + b, 0)).toBe(5);
    expect(h.counts[0]).toBe(2);
    expect(h.counts[5]).toBe(1);
    expect(h.counts[9]).toBe(2);
  });
});

describe('mean density (the default volume fraction)', () => {
  it('is the plain mean for cell values', () => {
    expect(fieldMean(grid([0, 1, 1, 0.5], 2, 2))).toBeCloseTo(0.625, 12);
  });
  it('is the integral mean of the bilinear field for nodal values (trapezoidal rule, exact for bilinear)', () => {
    // analytic: f(x, y) = x on [0, 2]×[0, 1] sampled at nodes x = 0, 1, 2 → mean 1.
    expect(fieldMean(grid([0, 1, 2, 0, 1, 2], 3, 2, 'nodes'))).toBeCloseTo(1, 12);
    // analytic: f = x·y on [0,1]² (one cell) → mean 1/4.
    expect(fieldMean(grid([0, 0, 0, 1], 2, 2, 'nodes'))).toBeCloseTo(0.25, 12);
  });
});
