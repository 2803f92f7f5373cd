/**
 * The required analytic cases of the size checks, end to end through `build` (grid → threshold → contour →
 * smooth → checks): grey ramps of two cells across every edge, so the true boundary is known exactly.
 * Accuracy required: measured sizes within max(0.5 cell, 2 %) of the true value.
 * Disc and ring values: docs/references.md §1.2 (the published test patterns of a length-scale measuring routine);
 * every other expectation is analytic (the drawn dimension of the shape).
 */
import { describe, expect, it } from 'vitest';
import { build } from '../../src/pipeline.js';
import { resolveSettings, type Settings } from '../../src/settings.js';
import type { CheckResult } from '../../src/types.js';
import { npyFloat64 } from '../bench/npy-write.js';

/** A grid of `cols × rows` 1 mm cells from a signed distance (mm, > 0 inside the solid), as NPY bytes (top row first). */
function gridNpy(cols: number, rows: number, sd: (x: number, y: number) => number): Uint8Array {
  const v = new Float64Array(cols * rows);
  for (let r = 0; r < rows; r++) {
    const y = rows - r - 0.5;
    for (let i = 0; i < cols; i++) v[r * cols + i] = Math.min(1, Math.max(0, 0.5 + sd(i + 0.5, y) / 2));
  }
  return npyFloat64(v, rows, cols);
}

function checks(cols: number, rows: number, sd: (x: number, y: number) => number, s: Partial<Settings>): Map<string, CheckResult> {
  const r = build({ name: 'analytic.npy', bytes: gridNpy(cols, rows, sd) }, resolveSettings({ cellSize: [1, 1], ...s }));
  return new Map(r.report.checks.map((c) => [c.id, c]));
}

const within = (measured: number | null, truth: number) => Math.abs((measured ?? NaN) - truth) <= Math.max(0.5, 0.02 * truth);
const disc = (cx: number, cy: number, r: number) => (x: number, y: number) => r - Math.hypot(x - cx, y - cy);
const box = (x0: number, y0: number, x1: number, y1: number) => (x: number, y: number) => Math.min(x - x0, x1 - x, y - y0, y1 - y);

describe('size checks on analytic grids (required cases)', () => {
  it('analytic: a disc of diameter 50 → thinnest member 50 (docs/references.md §1.2)', () => {
    const c = checks(100, 100, disc(50, 50, 25), { minMember: 60 }).get('min-member-size');
    expect(c?.status).toBe('fail');
    expect(within(c!.measured, 50)).toBe(true);
    expect(Math.hypot(c!.locations[0].x - 50, c!.locations[0].y - 50)).toBeLessThan(2);
  });

  it('analytic: a ring of outer diameter 120 and inner 50 → member 35, hole 50 (docs/references.md §1.2)', () => {
    const ring = (x: number, y: number) => Math.min(60 - Math.hypot(x - 80, y - 80), Math.hypot(x - 80, y - 80) - 25);
    const m = checks(160, 160, ring, { minMember: 20, minHole: 20 });
    expect(within(m.get('min-member-size')!.measured, 35)).toBe(true);
    expect(within(m.get('min-hole-size')!.measured, 50)).toBe(true);
    expect(m.get('min-member-size')!.status).toBe('pass');
    expect(m.get('min-hole-size')!.status).toBe('pass');
  });

  it('analytic: a solid rectangle with sharp corners → no member finding', () => {
    const c = checks(100, 60, box(20, 15, 80, 45), { minMember: 20 }).get('min-member-size')!;
    expect(c.status).toBe('pass');
    expect(c.locationsTotal).toBe(0);
    expect(within(c.measured, 30)).toBe(true); // analytic: the short side
  });

  it('analytic: a plate with holes of diameter 8 under a 10 mm hole limit → one finding per hole, each at its hole', () => {
    const centres = [
      [20, 20],
      [50, 20],
      [80, 40],
      [30, 45],
    ];
    const plate = (x: number, y: number) => Math.min(box(0, 0, 100, 60)(x, y) + 10, ...centres.map(([cx, cy]) => -disc(cx, cy, 4)(x, y)));
    const c = checks(100, 60, plate, { minHole: 10 }).get('min-hole-size')!;
    expect(c.status).toBe('fail');
    expect(c.locationsTotal).toBe(centres.length);
    for (const [cx, cy] of centres) {
      const hit = c.locations.filter((l) => Math.hypot(l.x - cx, l.y - cy) < 2);
      expect(hit.length, `hole at ${cx},${cy}`).toBe(1);
      expect(within(hit[0].measured, 8)).toBe(true);
    }
  });

  it('analytic: a wall of 6 between a hole and the domain edge under an 8 mm member limit → a finding there', () => {
    // plate fills the domain (outside the domain is open space); hole Ø20 centred 16 mm below the top edge → wall 6
    const plate = (x: number, y: number) => Math.min(box(0, 0, 100, 60)(x, y) + 10, -disc(50, 44, 10)(x, y));
    const c = checks(100, 60, plate, { minMember: 8 }).get('min-member-size')!;
    expect(c.status).toBe('fail');
    expect(within(c.measured, 6)).toBe(true);
    expect(Math.abs(c.locations[0].x - 50)).toBeLessThan(3);
    expect(Math.abs(c.locations[0].y - 57)).toBeLessThan(1.5);
  });

  it('analytic: a strut of width 3 between two blocks → 3, located on the strut', () => {
    const shape = (x: number, y: number) => Math.max(box(5, 5, 30, 55)(x, y), box(70, 5, 95, 55)(x, y), box(29, 28.5, 71, 31.5)(x, y));
    const c = checks(100, 60, shape, { minMember: 5 }).get('min-member-size')!;
    expect(c.status).toBe('fail');
    expect(within(c.measured, 3)).toBe(true);
    expect(c.locationsTotal).toBe(1);
    expect(c.locations[0].x).toBeGreaterThan(30);
    expect(c.locations[0].x).toBeLessThan(70);
  });

  it('analytic: a 45° wedge → a finding at its tip', () => {
    // wedge with its tip at (20, 30) opening to the right, half-angle 22.5°, cut off at x = 90
    const t = Math.tan((22.5 * Math.PI) / 180);
    const wedge = (x: number, y: number) => {
      const c = Math.cos((22.5 * Math.PI) / 180);
      const upper = ((x - 20) * t - (y - 30)) * c; // distance below the upper flank
      const lower = ((x - 20) * t + (y - 30)) * c; // distance above the lower flank
      return Math.min(upper, lower, 90 - x);
    };
    const c = checks(100, 60, wedge, { minMember: 4 }).get('min-member-size')!;
    expect(c.status).toBe('fail');
    const tip = c.locations[0];
    // the widest inscribed disc thinner than 4 mm sits within 4/(2·sin 22.5°) ≈ 5.2 mm of the tip
    expect(Math.hypot(tip.x - 20, tip.y - 30)).toBeLessThan(6);
  });
});
