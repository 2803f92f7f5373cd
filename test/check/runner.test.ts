/**
 * The runner's verdicts follow the contract of docs/checks/README.md (docs/report-schema.md, CheckResult): limits are
 * inclusive, a value within the resolution of the limit is a warning, a broken limit takes the severity,
 * locations come worst first (at most 100) with 1-based file rows and columns.
 */
import { describe, expect, it } from 'vitest';
import { locator, sampleAt } from '../../src/check/locate.js';
import { MAX_LOCATIONS, runChecks, summarize, verdict, type PlannedCheck } from '../../src/check/run.js';
import type { CheckContext, CheckDefinition, Measurement } from '../../src/check/types.js';

describe('verdict (docs/checks/README.md)', () => {
  it('sizes (>=): inclusive limit, resolution band warns, broken limit takes the severity', () => {
    expect(verdict(2, 2, 0, '>=', 'fail')).toBe('pass'); // inclusive
    expect(verdict(1.99, 2, 0, '>=', 'fail')).toBe('fail');
    expect(verdict(1.99, 2, 0, '>=', 'warn')).toBe('warn');
    expect(verdict(2.05, 2, 0.1, '>=', 'fail')).toBe('warn'); // within resolution above
    expect(verdict(1.95, 2, 0.1, '>=', 'fail')).toBe('warn'); // within resolution below
    expect(verdict(2.2, 2, 0.1, '>=', 'fail')).toBe('pass');
    expect(verdict(1.8, 2, 0.1, '>=', 'fail')).toBe('fail');
    expect(verdict(null, 2, 0.1, '>=', 'fail')).toBe('pass'); // nothing to measure
  });
  it('errors (<=): the mirror image', () => {
    expect(verdict(0.001, 0.001, 0, '<=', 'fail')).toBe('pass');
    expect(verdict(0.0011, 0.001, 0, '<=', 'fail')).toBe('fail');
    expect(verdict(30, 25, 0, '<=', 'warn')).toBe('warn');
    expect(verdict(20, 25, 0, '<=', 'warn')).toBe('pass');
  });
  it('summary status is the worst status; no checks pass', () => {
    const r = (status: 'pass' | 'warn' | 'fail') => ({ status }) as never;
    expect(summarize([])).toEqual({ status: 'pass', pass: 0, warn: 0, fail: 0 });
    expect(summarize([r('pass'), r('warn')])).toEqual({ status: 'warn', pass: 1, warn: 1, fail: 0 });
    expect(summarize([r('warn'), r('fail'), r('pass')])).toEqual({ status: 'fail', pass: 1, warn: 1, fail: 1 });
  });
});

describe('runChecks', () => {
  const ctx = {} as CheckContext;
  const fake = (m: Measurement, comparison: '>=' | '<=' = '>='): CheckDefinition => ({ id: 'min-member-size', unit: 'mm', comparison, measure: () => m });
  const plan = (def: CheckDefinition, limit: number): PlannedCheck => ({ def, limit, severity: 'fail', label: 'thinnest member', place: 'thin place', none: 'no solid' });
  const at = () => ({ fileRow: 7, fileCol: 9 });

  it('sorts locations worst first, keeps 100, counts all, and maps each to the file', () => {
    const locations = Array.from({ length: 150 }, (_, k) => ({ x: k, y: 0, measured: 1 + ((k * 37) % 150) / 100 }));
    const [c] = runChecks([plan(fake({ measured: 1, resolution: 0.05, method: 'm', locations }), 3)], ctx, at);
    expect(c.status).toBe('fail');
    expect(c.locationsTotal).toBe(150);
    expect(c.locations).toHaveLength(MAX_LOCATIONS);
    for (let k = 1; k < c.locations.length; k++) expect(c.locations[k].measured).toBeGreaterThanOrEqual(c.locations[k - 1].measured);
    expect(c.locations[0]).toMatchObject({ measured: 1, fileRow: 7, fileCol: 9 });
    expect(c.message).toContain('150 thin places');
  });
  it("for '<=' checks the largest value is the worst", () => {
    const locations = [5, 50, 20].map((a, k) => ({ x: k, y: 0, measured: a }));
    const [c] = runChecks([plan(fake({ measured: 50, resolution: 0, method: 'm', locations }, '<='), 0)], ctx, at);
    expect(c.locations.map((l) => l.measured)).toEqual([50, 20, 5]);
  });
  it('nothing to measure passes and says so', () => {
    const [c] = runChecks([plan(fake({ measured: null, resolution: 0, method: 'm', locations: [] }), 3)], ctx, at);
    expect(c.status).toBe('pass');
    expect(c.message).toContain('no solid');
  });
});

describe('locations → file rows and columns', () => {
  const grid = { nx: 10, ny: 4, cellSize: [2, 2] as const, origin: [0, 0] as const, placement: 'cells' as const };
  it('cell grids: the cell under the point; top-down files count rows from the top (docs/conventions.md)', () => {
    expect(sampleAt(grid, 0.1, 0.1)).toEqual({ i: 0, j: 0 });
    expect(sampleAt(grid, 19.9, 7.9)).toEqual({ i: 9, j: 3 });
    expect(sampleAt(grid, 25, -3)).toEqual({ i: 9, j: 0 }); // clamped
    const loc = locator(grid, (i, j) => ({ fileRow: 4 - j, fileCol: i + 1 }));
    expect(loc(3, 1)).toEqual({ fileRow: 4, fileCol: 2 });
    expect(loc(3, 7)).toEqual({ fileRow: 1, fileCol: 2 });
  });
  it('nodal grids: the nearest node', () => {
    const nodes = { ...grid, nx: 11, ny: 5, placement: 'nodes' as const };
    expect(sampleAt(nodes, 2.9, 1.1)).toEqual({ i: 1, j: 1 });
    expect(sampleAt(nodes, 3.1, 0.9)).toEqual({ i: 2, j: 0 });
  });
});

describe('numbers in messages', () => {
  it('four significant digits without float noise; exponents only at the extremes', async () => {
    const { formatValue } = await import('../../src/check/format.js');
    expect(formatValue((0.03 * 25.4) / 2)).toBe('0.381'); // 0.03 in kerf / 2 = 0.38099999999999995 in binary
    expect(formatValue(3.04217)).toBe('3.042');
    expect(formatValue(3.11e-5)).toBe('3.110e-5');
    expect(formatValue(0)).toBe('0');
    expect(formatValue(123456)).toBe('1.235e+5');
  });
});
