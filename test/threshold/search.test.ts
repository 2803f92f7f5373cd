import { describe, expect, it } from 'vitest';
import { BAND_STRIDE, levelForArea, type LevelAreaModel } from '../../src/threshold/search.js';
import { volumeLevel } from '../../src/threshold/volume.js';

/**
 * An analytic model: cell c spans the values [lo_c, lo_c + w]; the part at or above L covers the share
 * (hi − L)/(hi − lo) of its unit area (a linear ramp across the cell). A(L) is then known in closed form.
 */
function rampModel(los: number[], w: number): LevelAreaModel {
  const bins = (n: number, pick: (lo: number) => number, gmin: number, gmax: number) => {
    const hist = new Float64Array(n + 1);
    for (const lo of los) hist[Math.min(n, Math.floor(((pick(lo) - gmin) * n) / (gmax - gmin)))] += 1;
    return hist;
  };
  const gmin = Math.min(...los);
  const gmax = Math.max(...los) + w;
  return {
    histogram: (n) => ({ gmin, gmax, total: los.length, minHist: bins(n, (lo) => lo, gmin, gmax), maxHist: bins(n, (lo) => lo + w, gmin, gmax) }),
    pack: (lo, hi) => {
      const cells = los.filter((l) => l < hi && l + w >= lo);
      const buf = new Float64Array(cells.length * BAND_STRIDE);
      // Packed as corners (lo, hi, lo, hi) of a unit cell, then w, h, min, max.
      cells.forEach((l, k) => buf.set([l, l + w, l, l + w, 1, 1, l, l + w], k * BAND_STRIDE));
      return { fullBase: los.filter((l) => l >= hi).length, buf, count: cells.length };
    },
    packedArea: (b, o, L) => Math.min(1, Math.max(0, (b[o + 7] - L) / (b[o + 7] - b[o + 6]))),
  };
}

describe('level search on the raw region area', () => {
  it('finds the level of a linear ramp (analytic: A(L) = Σ (hi−L)/w)', () => {
    // 100 cells with lo = k/100 and width 0.2; the area at L is an analytic sum; check A(level) = target.
    const los = Array.from({ length: 100 }, (_, k) => k / 100);
    const m = rampModel(los, 0.2);
    const exact = (L: number) => los.reduce((a, lo) => a + Math.min(1, Math.max(0, (lo + 0.2 - L) / 0.2)), 0);
    for (const target of [5, 37.25, 50, 93]) {
      const r = levelForArea(m, target);
      expect(Math.abs(exact(r.level) - target)).toBeLessThan(1e-6 * target);
    }
  });
  it('returns the ends of the range when the target is out of reach', () => {
    const m = rampModel([0, 0.5], 0.5);
    expect(levelForArea(m, 5).level).toBe(0);
    expect(levelForArea(m, 0).level).toBe(1);
  });
});

describe('volume-preserving level on the smoothed area', () => {
  it('corrects for a smoothing that removes a fixed area (fixed-point on the raw target)', () => {
    const los = Array.from({ length: 100 }, (_, k) => k / 100);
    const m = rampModel(los, 0.2);
    const raw = (L: number) => los.reduce((a, lo) => a + Math.min(1, Math.max(0, (lo + 0.2 - L) / 0.2)), 0);
    // A smoothing that shrinks every result by 0.8 area units: the answer must aim the raw area 0.8 higher.
    const r = volumeLevel(m, 40, 1e-4, (L) => ({ area: raw(L) - 0.8, rawArea: raw(L), value: L }));
    expect(Math.abs(r.build.area - 40) / 40).toBeLessThanOrEqual(1e-4);
    expect(r.builds).toBeLessThanOrEqual(3);
  });

  it('a smoothing change that varies faster than the area: the fixed point circles, bisection on the smoothed area lands', () => {
    const los = Array.from({ length: 100 }, (_, k) => k / 100);
    const m = rampModel(los, 0.2);
    const raw = (L: number) => los.reduce((a, lo) => a + Math.min(1, Math.max(0, (lo + 0.2 - L) / 0.2)), 0);
    // analytic: raw falls about 100 area units per unit level; the change swings ±1.5 with a period of 0.02 in the
    // level, so its slope (±470) beats the raw slope and the fixed-point step overshoots; the smoothed area stays
    // continuous, so a bracket holds a level where it equals the target (intermediate value theorem).
    const smoothed = (L: number) => raw(L) - 0.8 + 1.5 * Math.sin(100 * Math.PI * L);
    const f = (L: number) => ({ area: smoothed(L), rawArea: raw(L), value: L });
    const plain = volumeLevel(m, 40, 1e-5, f, 6, 0);
    const refined = volumeLevel(m, 40, 1e-5, f, 6, 30);
    expect(plain.relativeError).toBeGreaterThan(1e-5); // the fixed point alone does not get there
    expect(refined.relativeError).toBeLessThanOrEqual(1e-5);
    expect(Math.abs(smoothed(refined.level) - 40) / 40).toBeLessThanOrEqual(1e-5);
    expect(refined.builds).toBeLessThanOrEqual(36);
  });
});
