import { describe, it, expect } from 'vitest';
import { volumeError, volumeFraction } from '../../src/check/volume-fraction.js';
import { polygonSetArea } from '../../src/geom/area.js';
import { runChecks, type PlannedCheck } from '../../src/check/run.js';
import { makeContext, ngon, rect } from './context.js';

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

  describe('after --repair: the part written', () => {
    // a 100 × 100 mm domain; the written part is one 60 × 70 mm block: analytic final fraction 0.42
    const written = { polygons: [{ outer: rect(0, 0, 60, 70), holes: [] }] };
    const repairedCtx = (targetFraction: number, achievedFraction: number) =>
      ({ ...makeContext({ polygons: written, threshold: { targetFraction, achievedFraction } }), repaired: true });
    const plan: PlannedCheck = { def: volumeFraction, limit: 0.001, severity: 'fail', label: 'relative volume error', place: 'place', none: 'no volume target' };

    it('measures |final − target| / target with final = written area / domain area', () => {
      const m = volumeFraction.measure(repairedCtx(0.4, 0.4), 0.001);
      expect(m.measured).toBeCloseTo(Math.abs(0.42 - 0.4) / 0.4, 12); // analytic: 4200 / 10000 = 0.42
      expect(m.method).toMatch(/final/);
    });

    it('warns, not fails, when the repair moved the volume beyond the tolerance, and says why', () => {
      // the threshold met the target (achieved = target); the repair added 2 points of the domain
      const [r] = runChecks([plan], repairedCtx(0.4, 0.4), () => ({ fileRow: 1, fileCol: 1 }));
      expect(r.status).toBe('warn');
      expect(r.measured).toBeCloseTo(0.05, 12);
      expect(r.message).toMatch(/42\.00 %.*40\.00 %.*repair moved it/);
    });

    it('passes when the repair kept the volume within the tolerance', () => {
      const [r] = runChecks([plan], repairedCtx(0.42 * (1 + 0.0005), 0.42 * (1 + 0.0005)), () => ({ fileRow: 1, fileCol: 1 }));
      expect(r.status).toBe('pass');
      expect(r.measured).toBeCloseTo(0.0005 / 1.0005, 9);
    });

    it('still fails when the threshold itself missed the target (the repair is not the cause)', () => {
      const [r] = runChecks([plan], repairedCtx(0.4, 0.41), () => ({ fileRow: 1, fileCol: 1 }));
      expect(r.status).toBe('fail');
      expect(r.message).toMatch(/already missed/);
    });

    it('before repair it measures the threshold\'s outline, whatever the polygons hold', () => {
      const m = volumeFraction.measure(makeContext({ polygons: written, threshold: { targetFraction: 0.4, achievedFraction: 0.4 } }), 0.001);
      expect(m.measured).toBe(0);
      expect(m.atMost).toBeUndefined();
    });
  });
});

