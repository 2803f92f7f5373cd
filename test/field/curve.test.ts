/** The volume-vs-level curve counts samples ≥ level (analytic on written-out fields). */
import { describe, expect, it } from 'vitest';
import { levelCurve } from '../../src/field/curve.js';

describe('levelCurve', () => {
  it('analytic: values k/100 for k = 0..99 → share ≥ L is 1 − L at the ladder levels', () => {
    const values = Float64Array.from({ length: 100 }, (_, k) => k / 100);
    const c = levelCurve({ values }, 100);
    expect(c.levels).toHaveLength(101);
    for (let b = 0; b <= 100; b++) expect(c.fractions[b]).toBeCloseTo(1 - b / 100, 12);
  });
  it('NaN counts as void; values ≥ 1 count at every level; a binary field is a step', () => {
    const c = levelCurve({ values: Float64Array.from([0, 1, 1, NaN]) }, 10);
    expect(c.fractions[0]).toBe(0.75); // 0 ≥ 0 counts at level 0
    expect(c.fractions[5]).toBe(0.5);
    expect(c.fractions[10]).toBe(0.5);
  });
  it('refuses a bad ladder', () => {
    expect(() => levelCurve({ values: new Float64Array(1) }, 0)).toThrow(/steps/);
  });
});
