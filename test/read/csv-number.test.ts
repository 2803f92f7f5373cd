/**
 * Number tokens: the fast scanner and the strict slow path against ECMAScript Number() (correctly rounded
 * conversion of decimal strings, ECMA-262 §7.1.4.1.1 StringToNumber — from memory) as the oracle.
 */
import { describe, it, expect } from 'vitest';
import { fastNumber, parseNumberToken } from '../../src/read/csv-number.js';

/** Seeded LCG (Numerical Recipes constants) so failures reproduce. */
function lcg(seed: number): () => number {
  let s = seed >>> 0;
  return () => (s = (s * 1664525 + 1013904223) >>> 0) / 4294967296;
}

function fast(t: string, mark = 46): number | undefined {
  const st = { end: -1 };
  const v = fastNumber(t, 0, t.length, mark, st);
  if (v !== v) return undefined; // this path declined; the slow path takes the token
  expect(st.end).toBe(t.length);
  return v;
}

describe('CSV number tokens', () => {
  it('fast path (or the slow path where it declines) equals Number() bit for bit on 60 000 printed doubles', () => {
    const rnd = lcg(2026);
    const f64 = new Float64Array(1);
    const u32 = new Uint32Array(f64.buffer);
    for (let k = 0; k < 10_000; k++) {
      const x = rnd() ** 4; // densities crowd near 0
      u32[0] = (rnd() * 2 ** 32) >>> 0;
      u32[1] = (rnd() * 2 ** 31) >>> 0; // any positive double bit pattern
      const y = Number.isFinite(f64[0]) ? f64[0] : 1;
      for (const t of [x.toPrecision(17), x.toExponential(18), x.toFixed(6), String(x), y.toPrecision(17), `-${y.toExponential(18)}`]) {
        const v = fast(t) ?? parseNumberToken(t, false);
        if (!Object.is(v, Number(t))) throw new Error(`${t}: ${v} ≠ ${Number(t)}`);
      }
    }
  });

  it('fast path rounds exact midpoints between doubles as Number() does (ties to even)', () => {
    // 2^53 + 1 lies halfway between 2^53 and 2^53 + 2: both round to even, 2^53
    for (const t of ['9007199254740993', '9007199254740995', '0.5000000000000000555111512312578270211815834045410156250001']) {
      expect(fast(t) ?? parseNumberToken(t, false)).toBe(Number(t));
    }
  });

  it('slow path: decimal comma, non-finite words, and the grammar that Number() alone would widen', () => {
    expect(parseNumberToken('0,125', true)).toBe(0.125);
    expect(parseNumberToken('-1,5e-3', true)).toBe(-0.0015);
    expect(parseNumberToken('1.5', true)).toBeUndefined(); // '.' with a decimal comma could be a thousands mark
    expect(parseNumberToken('nan', false)).toBeNaN();
    expect(parseNumberToken('-Infinity', false)).toBe(-Infinity);
    expect(parseNumberToken('+inf', false)).toBe(Infinity);
    for (const t of ['', ' ', '0x1f', '0b1', '0o7', '1_0', '1e', 'e1', '.', '-', '1..2', '1e5.5', 'nanx', 'infinit']) {
      expect(parseNumberToken(t, false)).toBeUndefined();
    }
    for (const t of ['1', '-0', '.5', '5.', '+1e+3', '1E-7', '123456789012345678901234567890']) {
      expect(Object.is(parseNumberToken(t, false), Number(t))).toBe(true);
    }
  });
});
