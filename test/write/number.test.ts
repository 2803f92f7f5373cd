/**
 * Deterministic decimal formatting. The reference values are the decimal expansions themselves
 * (analytic: rounding to d decimals moves a value by at most half a unit of the d-th decimal).
 */
import { describe, expect, it } from 'vitest';
import { RhoformError } from '../../src/errors.js';
import { formatNumber } from '../../src/write/number.js';

/** Seeded LCG (Numerical Recipes constants, from memory) so the sample is the same on every run. */
function lcg(seed: number): () => number {
  let s = seed >>> 0;
  return () => {
    s = (Math.imul(s, 1664525) + 1013904223) >>> 0;
    return s / 2 ** 32;
  };
}

describe('formatNumber', () => {
  it('trims trailing zeros and writes integers without a point', () => {
    expect(formatNumber(1.5, 6)).toBe('1.5');
    expect(formatNumber(100, 6)).toBe('100');
    expect(formatNumber(0.1 + 0.2, 6)).toBe('0.3');
    expect(formatNumber(-2.25, 1)).toBe('-2.3'); // half away from zero
    expect(formatNumber(2.25, 1)).toBe('2.3');
    expect(formatNumber(1 / 3, 6)).toBe('0.333333');
    expect(formatNumber(2 / 3, 3)).toBe('0.667');
    expect(formatNumber(120 / 25.4, 6)).toBe('4.724409'); // 120 mm = 4.7244094… in
  });

  it('never writes -0 or an exponent', () => {
    expect(formatNumber(-0, 6)).toBe('0');
    expect(formatNumber(-1e-9, 6)).toBe('0');
    expect(formatNumber(1e-7, 6)).toBe('0');
    expect(formatNumber(1e-6, 6)).toBe('0.000001');
    expect(formatNumber(-4e-7, 6)).toBe('0');
    expect(formatNumber(1e12 + 0.5, 6)).toBe('1000000000000.5');
    expect(formatNumber(1e20, 3)).toBe('100000000000000000000');
  });

  it('stays within half a unit of the last decimal and parses back to the same text', () => {
    const rand = lcg(12345);
    const bad: string[] = [];
    for (let k = 0; k < 20000; k++) {
      const magnitude = 10 ** Math.floor(rand() * 10 - 4); // 1e-4 … 1e5
      const x = (rand() - 0.5) * 2 * magnitude;
      for (const d of [3, 4, 6]) {
        const text = formatNumber(x, d);
        const back = Number(text);
        const ok =
          /^-?(0|[1-9]\d*)(\.\d*[1-9])?$/.test(text) &&
          (text.split('.')[1]?.length ?? 0) <= d &&
          Math.abs(back - x) <= 0.5 * 10 ** -d * (1 + 1e-9) + Math.abs(x) * 1e-15 &&
          formatNumber(back, d) === text; // idempotent
        if (!ok) bad.push(`${x} @${d} → ${text}`);
      }
    }
    expect(bad).toEqual([]);
  });

  it('rejects NaN, infinities and bad decimal counts', () => {
    for (const v of [NaN, Infinity, -Infinity, 1e22]) expect(() => formatNumber(v, 6)).toThrow(RhoformError);
    expect(() => formatNumber(1, 7)).toThrow(RhoformError);
    expect(() => formatNumber(1, -1)).toThrow(RhoformError);
  });
});
