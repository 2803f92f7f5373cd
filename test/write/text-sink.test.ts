/**
 * The byte sink must write numbers exactly as formatNumber does (the two share one specification: round half
 * away from zero to d decimals, trim zeros, no exponent, no -0), and text as UTF-8 that decodes back.
 */
import { describe, expect, it } from 'vitest';
import { RhoformError } from '../../src/errors.js';
import { formatNumber } from '../../src/write/number.js';
import { TextSink } from '../../src/write/text-sink.js';

describe('TextSink', () => {
  it('writes numbers byte-identical to formatNumber', () => {
    const values: number[] = [0, -0, 1, -1, 0.5, 1e-7, -4e-7, 1e-6, 123456.789012345, 1e9 + 0.25, 1e14, 2e15, 1e20];
    let s = 0x9e3779b9;
    for (let k = 0; k < 5000; k++) {
      s = (Math.imul(s, 1664525) + 1013904223) >>> 0; // LCG, Numerical Recipes constants (from memory)
      values.push((s / 2 ** 32 - 0.5) * 10 ** ((k % 12) - 4));
    }
    const mismatches: string[] = [];
    for (const d of [0, 3, 4, 6]) {
      const sink = new TextSink(16); // tiny start: exercises growth
      for (const v of values) sink.num(v, d).str(';');
      const expected = values.map((v) => `${formatNumber(v, d)};`).join('');
      if (sink.text() !== expected) mismatches.push(`decimals ${d}`);
    }
    expect(mismatches).toEqual([]);
  });

  it('round-trips non-ASCII text through UTF-8', () => {
    const text = 'ASCII, × − é, 🙂 and more';
    expect(new TextSink().str('a').str(text).str('z').text()).toBe(`a${text}z`);
  });

  it('rejects NaN like formatNumber', () => {
    expect(() => new TextSink().num(NaN, 3)).toThrow(RhoformError);
  });
});
