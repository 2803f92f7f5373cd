/**
 * The engine-independent atan2 and power of the structural re-check (src/geom/portable-math.ts).
 *
 * Outside references: fdlibm 5.3 (Sun Microsystems, 1993), which V8 ports as `ieee754::atan2` and Node 20's
 * `Math.atan2` runs — the port must agree with it bit for bit; V8's `Math.hypot` (Node 20), which `hypot` follows
 * step by step — bit for bit again; Pythagorean triples (exact); ECMA-262 §21.3.2.6 for the signed zeros,
 * infinities and NaN; the exact angles π/4, π/6, π/3 of the unit circle (handbook values) to within one ulp.
 */
import { describe, expect, it } from 'vitest';
import { atan, atan2, hypot, powPortable } from '../../src/geom/portable-math.js';

/** A deterministic stream of doubles of every magnitude from 2^-70 to 2^70, both signs. */
function samples(n: number): number[] {
  let s = 0x2545f491;
  const next = () => {
    s ^= s << 13;
    s ^= s >>> 17;
    s ^= s << 5;
    return (s >>> 0) / 2 ** 32;
  };
  const out: number[] = [];
  for (let k = 0; k < n; k++) out.push((next() < 0.5 ? -1 : 1) * next() * 2 ** Math.floor(140 * next() - 70));
  return out;
}

const ulp = (x: number) => 2 ** (Math.floor(Math.log2(Math.abs(x))) - 52);

describe('atan2 (fdlibm e_atan2.c)', () => {
  // the reference is Node 20's V8 (the project's Node); other engines' Math.atan2 may round otherwise
  it.runIf(process.versions.node.startsWith('20.'))('agrees bit for bit with Node 20 Math.atan2 (V8: the same fdlibm) on 200 000 pairs of every magnitude', () => {
    const ys = samples(200_000);
    const xs = samples(200_001).slice(1);
    let differ = 0;
    for (let k = 0; k < ys.length; k++) if (!Object.is(atan2(ys[k], xs[k]), Math.atan2(ys[k], xs[k]))) differ++;
    expect(differ).toBe(0);
    // and on points of a grid near a circle, as the loads file's circle selector meets them
    for (let i = -40; i <= 40; i++) for (let j = -40; j <= 40; j++) expect(atan2(j * 0.5 - 0.1, i * 0.5 + 0.3)).toBe(Math.atan2(j * 0.5 - 0.1, i * 0.5 + 0.3));
  });

  it('gives the exact angles of the unit circle within one ulp', () => {
    expect(atan2(1, 1)).toBe(Math.PI / 4);
    expect(Math.abs(atan(1 / Math.sqrt(3)) - Math.PI / 6)).toBeLessThanOrEqual(ulp(Math.PI / 6));
    expect(Math.abs(atan(Math.sqrt(3)) - Math.PI / 3)).toBeLessThanOrEqual(ulp(Math.PI / 3));
    expect(atan2(-1, -1)).toBe((-3 * Math.PI) / 4);
  });

  it('treats signed zeros, infinities and NaN as ECMA-262 §21.3.2.6 says', () => {
    expect(Object.is(atan2(0, 1), 0)).toBe(true);
    expect(Object.is(atan2(-0, 1), -0)).toBe(true);
    expect(atan2(0, -1)).toBe(Math.PI);
    expect(atan2(-0, -1)).toBe(-Math.PI);
    expect(atan2(1, 0)).toBe(Math.PI / 2);
    expect(atan2(-1, -0)).toBe(-Math.PI / 2);
    expect(atan2(Infinity, Infinity)).toBe(Math.PI / 4);
    expect(atan2(-Infinity, -Infinity)).toBe((-3 * Math.PI) / 4);
    expect(atan2(1, -Infinity)).toBe(Math.PI);
    expect(Object.is(atan2(-1, Infinity), -0)).toBe(true);
    expect(atan2(Infinity, 5)).toBe(Math.PI / 2);
    expect(atan2(NaN, 1)).toBeNaN();
    expect(atan2(1, NaN)).toBeNaN();
  });
});

describe('hypot (V8 algorithm, IEEE arithmetic)', () => {
  it.runIf(process.versions.node.startsWith('20.'))('agrees bit for bit with Node 20 Math.hypot, two and three values, of every magnitude', () => {
    const a = samples(100_000);
    const b = samples(100_001).slice(1);
    const c = samples(100_002).slice(2);
    let differ = 0;
    for (let k = 0; k < a.length; k++) {
      if (!Object.is(hypot(a[k], b[k]), Math.hypot(a[k], b[k]))) differ++;
      if (!Object.is(hypot(a[k], b[k], c[k]), Math.hypot(a[k], b[k], c[k]))) differ++;
      if (!Object.is(hypot(a[k], b[k], 0), Math.hypot(a[k], b[k], 0))) differ++;
    }
    expect(differ).toBe(0);
  });

  it('is exact on Pythagorean triples and follows ECMA-262 for infinities, NaN and zeros', () => {
    expect(hypot(3, 4)).toBe(5);
    expect(hypot(-5, 12)).toBe(13);
    expect(hypot(2, 3, 6)).toBe(7);
    expect(hypot(1e300, 1e300)).toBe(Math.SQRT2 * 1e300); // no overflow
    expect(hypot(NaN, Infinity)).toBe(Infinity);
    expect(hypot(NaN, 1)).toBeNaN();
    expect(Object.is(hypot(-0, -0), 0)).toBe(true);
  });
});

describe('powPortable', () => {
  it('is the product of the factors for a whole exponent (x³ = x·x·x) and within 2 ulp of Math.pow', () => {
    for (const x of samples(20_000).map((v) => Math.abs(v) % 1)) {
      expect(powPortable(x, 3)).toBe(x * x * x);
      expect(powPortable(x, 1)).toBe(x);
      expect(powPortable(x, 0)).toBe(1);
      if (x > 1e-90) expect(Math.abs(powPortable(x, 3) - Math.pow(x, 3))).toBeLessThanOrEqual(2 * ulp(Math.pow(x, 3)));
    }
    expect(powPortable(2, 10)).toBe(1024);
    expect(powPortable(0.5, 5)).toBe(0.03125);
  });

  it('is Math.pow for an exponent that is not whole', () => {
    for (const x of [0.1, 0.37, 0.9]) expect(powPortable(x, 2.5)).toBe(Math.pow(x, 2.5));
  });
});
