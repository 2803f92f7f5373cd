import { describe, it, expect } from 'vitest';
import { volumeError, volumeFraction } from '../../src/check/volume-fraction.js';
import { polygonSetArea } from '../../src/geom/area.js';
import { makeContext, ngon } from './context.js';

const measure = (targetFraction: number, achievedFraction: number, mode: 'volume' | 'level' | 'constant' = 'volume') =>
  volumeFraction.measure(makeContext({ threshold: { targetFraction, achievedFraction, mode } }), 0.001);

describe('volume-fraction', () => {
  it('measures |achieved − target| / target', () => {
    // definition (docs/threshold.md): relative error of the smoothed area against the target
    expect(measure(0.5, 0.5005).measured).toBeCloseTo(0.001, 12);
    expect(measure(0.4, 0.38).measured).toBeCloseTo(0.05, 12);
    expect(measure(0.3, 0.3).measured).toBe(0);
  });

  it('gives the relative area loss of an inscribed polygon of a disc', () => {
    // analytic: a disc of radius r has area πr²; the regular n-gon inscribed in it (n/2)·r²·sin(2π/n), so the
    // relative error of the polygon's area is 1 − n·sin(2π/n)/(2π)
    const r = 20, n = 64, domainArea = 100 * 100;
    const target = (Math.PI * r * r) / domainArea;
    const achieved = polygonSetArea({ polygons: [{ outer: ngon(50, 50, r, n), holes: [] }] }) / domainArea;
    const m = measure(target, achieved);
    expect(m.measured).toBeCloseTo(1 - (n * Math.sin((2 * Math.PI) / n)) / (2 * Math.PI), 12);
  });

  it('uses the absolute error when the target is 0 (relative error undefined)', () => {
    // docs/threshold.md: a target of 0 gives empty geometry, which is then exact
    expect(measure(0, 0).measured).toBe(0);
    expect(measure(0, 0.01).measured).toBeCloseTo(0.01, 15);
    expect(volumeError(0, 0)).toBe(0);
  });

  it('has nothing to measure when a fraction is not a number', () => {
    expect(measure(NaN, 0.5).measured).toBeNull();
    expect(measure(0.5, Infinity).measured).toBeNull();
  });

  it('has no locations, a rounding-level resolution, and says when the volume was not searched', () => {
    const m = measure(0.5, 0.51);
    expect(m.locations).toEqual([]);
    expect(m.resolution).toBeGreaterThan(0);
    expect(m.resolution).toBeLessThan(1e-6);
    expect(measure(0.5, 0.51, 'level').method).toMatch(/--level/);
    expect(m.method).not.toMatch(/--level/);
  });
});
