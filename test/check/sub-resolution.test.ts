/**
 * Features below the grid's resolution (docs/checks/small-holes.md): holes and islands smaller than
 * SUB_RESOLUTION_CELLS cell areas are threshold artefacts. The fields are fixtures/grids/*-cantilever-240x80.npy
 * (fixtures/make/make_pinhole_field.py): a tapered beam with four lightening holes, and in one of them two
 * pinholes of exact density 0 in full material and one speck of density 1 in full void.
 *
 * Expected findings from the geometry (analytic): marching squares on cell-centred samples puts the contour
 * where the linear interpolation between a feature's centre and its neighbours' centres (distance h) crosses
 * the level t. A 0-cell among 1-cells is a diamond with half-diagonals t·h, area 2(t·h)²; two side by side a
 * hexagon of area (2t + 2t²)·h²; a 1-cell among 0-cells a diamond of area 2((1 − t)·h)². Each is symmetric
 * about its centre, so its centroid — the finding's point — is that centre. The smoothed outline lies within
 * the tolerance of the raw contour, so each area is that value within perimeter × tolerance (the check's own
 * resolution).
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { SUB_RESOLUTION_CELLS } from '../../src/check/small-holes.js';
import { build } from '../../src/pipeline.js';
import { resolveSettings, type Settings } from '../../src/settings.js';
import type { CheckResult, Report } from '../../src/types.js';
import '../support/boolean-engine.js';
import '../support/build-parts.js';

const h = 2.5; // mm, the cell size the fixture is meant for
const NY = 80;
const run = (file: string, more: Partial<Settings> = {}): Report => {
  const name = `fixtures/grids/${file}`;
  return build({ name, bytes: readFileSync(name) }, resolveSettings({ cellSize: [h, h], ...more })).report;
};
const check = (r: readonly CheckResult[], id: string) => r.find((c) => c.id === id)!;
/** Centre of the cell(s) at 0-based column(s) i (mean) and row j from the bottom, mm; and its file row/col. */
const centre = (cols: number[], j: number) => ({
  x: (cols.reduce((a, b) => a + b, 0) / cols.length + 0.5) * h,
  y: (j + 0.5) * h,
  fileRow: NY - j,
});

describe('features below the grid resolution', () => {
  const pin = run('pinholes-cantilever-240x80.npy');
  const t = pin.threshold.level!;

  it('by default, holes smaller than 4 cell areas warn, each at its place with its area', () => {
    const c = check(pin.checks, 'small-holes');
    expect(c.limit).toBe(SUB_RESOLUTION_CELLS * h * h); // the documented default: 4 cell areas, 25 mm²
    expect(pin.settings.minHoleArea).toBe(25);
    expect(c.status).toBe('warn');
    expect(c.locationsTotal).toBe(2); // the two pinholes, not the lightening holes
    const [a, b] = c.locations; // smallest first
    const A = centre([60], 40);
    const B = centre([155, 156], 40);
    expect(a.x).toBeCloseTo(A.x, 6);
    expect(a.y).toBeCloseTo(A.y, 6);
    expect([a.fileRow, a.fileCol]).toEqual([A.fileRow, 61]);
    expect(b.x).toBeCloseTo(B.x, 6);
    expect(b.y).toBeCloseTo(B.y, 6);
    expect(b.fileRow).toBe(B.fileRow);
    // areas: analytic raw contour within perimeter × tolerance (tolerance 0.25 cell)
    const tol = 0.25 * h;
    const areaA = 2 * (t * h) ** 2;
    const areaB = (2 * t + 2 * t * t) * h * h;
    expect(Math.abs(a.measured - areaA)).toBeLessThanOrEqual(4 * Math.SQRT2 * t * h * tol);
    expect(Math.abs(b.measured - areaB)).toBeLessThanOrEqual((2 * h + 4 * Math.SQRT2 * t * h) * tol);
    expect(c.message).toMatch(/2 are below 4 cell areas \(25 mm²\).*fill-holes/);
  });

  it('a speck of one cell is an island with its place, said to be below the resolution', () => {
    const c = check(pin.checks, 'islands');
    expect(c.status).toBe('warn');
    expect(c.locationsTotal).toBe(1);
    const S = centre([200], 72);
    expect(c.locations[0].x).toBeCloseTo(S.x, 6);
    expect(c.locations[0].y).toBeCloseTo(S.y, 6);
    expect([c.locations[0].fileRow, c.locations[0].fileCol]).toEqual([S.fileRow, 201]);
    const area = 2 * ((1 - t) * h) ** 2;
    expect(Math.abs(c.measured! - area)).toBeLessThanOrEqual(4 * Math.SQRT2 * (1 - t) * h * 0.25 * h);
    expect(c.message).toMatch(/1 is below 4 cell areas.*drop-islands/);
  });

  it('the same part without them gets no warning: its lightening holes are far above the limit', () => {
    const clean = run('clean-cantilever-240x80.npy');
    expect(clean.geometry.holes).toBe(4);
    const c = check(clean.checks, 'small-holes');
    expect(c.status).toBe('pass');
    expect(c.locationsTotal).toBe(0);
    // the smallest lightening hole has radius 9 cells: area π(9h)² less the rounding of the grey band
    expect(Math.abs(c.measured! - Math.PI * (9 * h) ** 2) / (Math.PI * (9 * h) ** 2)).toBeLessThan(0.05);
    expect(check(clean.checks, 'islands').measured).toBeNull();
    expect(clean.summary.warn).toBe(0);
  });

  it('--repair fills the pinholes and drops the speck: the checks pass, the lightening holes stay', () => {
    const r = run('pinholes-cantilever-240x80.npy', { repair: ['fill-holes', 'drop-islands'] });
    expect(check(r.checksBeforeRepair!, 'small-holes').status).toBe('warn');
    expect(check(r.checks, 'small-holes').status).toBe('pass');
    expect(check(r.checks, 'islands').measured).toBeNull();
    expect(r.summary.warn).toBe(0);
    expect(r.geometry.holes).toBe(4);
    expect(r.geometry.polygons).toBe(1);
    const fill = r.repairs.find((x) => x.id === 'fill-holes')!;
    const drop = r.repairs.find((x) => x.id === 'drop-islands')!;
    expect(fill.locationsTotal).toBe(2);
    expect(drop.locationsTotal).toBe(1);
    // the material changed is the pinholes' and the speck's area, nothing more (a filled ring adds its area, up to
    // the boolean engine's integer grid)
    const pinArea = check(r.checksBeforeRepair!, 'small-holes').locations.reduce((s, l) => s + l.measured, 0);
    expect(Math.abs(fill.area - pinArea) / pinArea).toBeLessThan(1e-4);
    const speck = check(r.checksBeforeRepair!, 'islands').measured!;
    expect(Math.abs(-drop.area - speck) / speck).toBeLessThan(1e-4);
  });

  it('--severity small-holes=off and --min-hole-area override the default', () => {
    expect(run('pinholes-cantilever-240x80.npy', { severity: { 'small-holes': 'off' } }).checks.some((c) => c.id === 'small-holes')).toBe(false);
    const own = run('pinholes-cantilever-240x80.npy', { minHoleArea: 1 });
    expect(check(own.checks, 'small-holes').limit).toBe(1);
    expect(own.settings.minHoleArea).toBe(1);
  });
});
