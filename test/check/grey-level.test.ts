import { describe, it, expect } from 'vitest';
import { greyLevel } from '../../src/check/grey-level.js';
import { fieldStats } from '../../src/field/stats.js';
import type { DensityGrid } from '../../src/types.js';
import { makeContext } from './context.js';

const grid = (values: number[]): DensityGrid => ({
  nx: values.length, ny: 1, cellSize: [1, 1], origin: [0, 0], values: Float64Array.from(values), placement: 'cells',
});

/** M_nd of the values as the input statistics compute it, then the check's measure on that context. */
const measured = (values: number[]) => {
  const g = grid(values);
  return greyLevel.measure(makeContext({ grid: g, greyLevel: fieldStats(g).greyLevel }), 25);
};

describe('grey-level (M_nd, Sigmund 2007)', () => {
  it('is 100 % for a uniform grey field ρ ≡ 0.5', () => {
    // docs/references.md §2.4 (Sigmund 2007): ρ ≡ 0.5 → 100 %
    expect(measured(Array(50).fill(0.5)).measured).toBeCloseTo(100, 12);
  });

  it('is 0 % for a black-and-white design', () => {
    // docs/references.md §2.4 (Sigmund 2007): ρ ∈ {0, 1} → 0 %
    expect(measured([0, 1, 1, 0, 0, 0, 1, 1, 0, 1]).measured).toBe(0);
  });

  it('is 75 % for ρ ≡ 0.25', () => {
    // docs/references.md §2.4 [D]: 4 · 0.25 · 0.75 = 0.75
    expect(measured(Array(12).fill(0.25)).measured).toBeCloseTo(75, 12);
  });

  it('averages over the elements', () => {
    // docs/references.md §2.4 formula [D]: half 0.5 (100 %), half 0 or 1 (0 %) → 50 %
    expect(measured([0.5, 0.5, 0, 1]).measured).toBeCloseTo(50, 12);
  });

  it('has nothing to measure without a finite value, and never locations', () => {
    const g = grid([NaN, NaN]);
    const m = greyLevel.measure(makeContext({ grid: g, greyLevel: fieldStats(g).greyLevel }), 25);
    expect(m.measured).toBeNull();
    expect(m.locations).toEqual([]);
    expect(measured([0.5]).locations).toEqual([]);
    expect(measured([0.5]).method).toMatch(/Sigmund 2007/);
  });
});
