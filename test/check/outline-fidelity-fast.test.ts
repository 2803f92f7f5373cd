/**
 * outline-fidelity's fast path (the smoothing stage's bounded measure) against its own located search on
 * realistic optimizer grids (fixtures/grids/realistic-*.npy, written by numpy from our optimizer runs): the
 * fast path is taken only when the bound is clearly inside the limit, and the located search's value never
 * exceeds the bound max + resolution (docs/smoothing.md §4: the smoothing measure bounds the distance from above).
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { measureOutlineFidelity } from '../../src/check/outline-fidelity.js';
import type { CheckContext } from '../../src/check/types.js';
import { build } from '../../src/pipeline.js';
import { resolveSettings } from '../../src/settings.js';

const GRIDS = ['realistic-cantilever-100x50', 'realistic-bridge-120x40', 'realistic-lbracket-60x60'];

describe('outline-fidelity fast path', () => {
  for (const name of GRIDS) {
    it(`${name}: the fast path's bound covers the located search; a tight limit forces the search`, () => {
      const file = `fixtures/grids/${name}.npy`;
      const r = build({ name: file, bytes: readFileSync(file) }, resolveSettings({}));
      const tolerance = r.report.smoothing.tolerance;
      const sd = { max: r.smoothed.maxDeviation, resolution: r.smoothed.deviationResolution };
      const ctx: CheckContext = {
        polygons: r.smoothed.polygons,
        raw: r.raw,
        domain: [0, 0, 1, 1],
        grid: r.grid,
        threshold: r.report.threshold,
        greyLevel: r.report.input.greyLevel,
        tolerance,
        smoothingDeviation: sd,
        morphology: () => {
          throw new Error('not used');
        },
      };
      const fast = measureOutlineFidelity(ctx, tolerance);
      const { smoothingDeviation: _omit, ...withoutBound } = ctx;
      const full = measureOutlineFidelity(withoutBound, tolerance);
      expect(fast.measured).toBe(sd.max); // the fast path was taken (the smoothed outline uses ~60 % of its budget)
      expect(fast.locations).toEqual([]);
      expect(full.measured!).toBeLessThanOrEqual(sd.max + sd.resolution + 1e-12);
      // a limit just above the bound's value but within its resolution: the located search runs instead
      const tight = measureOutlineFidelity(ctx, sd.max + sd.resolution / 2);
      expect(tight.method).not.toContain('not located');
    });
  }
});
