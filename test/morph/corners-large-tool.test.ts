/**
 * A tool radius large against the part (issue 11, item 2: `--tool-radius 550` on a 600 × 600 grid threw a
 * RangeError at the raster limit). The survey runs on a coarser raster instead and says so in its resolution.
 * Analytic: the sharp concave corners of a notch have radius 0, so a tool of any radius leaves them uncut.
 */
import { describe, expect, it } from 'vitest';
import { buildMorphology } from '../../src/morph/index.js';
import type { Point } from '../../src/types.js';

describe('tool corners with a tool far larger than the part', () => {
  it('R = 400 mm on a 100 × 100 mm domain: a result on a coarser raster, the sharp notch corners found', () => {
    // a block with a 20 mm wide, 30 mm deep notch from its top edge: two sharp concave corners at (40, 60), (60, 60)
    const outer: Point[] = [[0, 0], [100, 0], [100, 90], [60, 90], [60, 60], [40, 60], [40, 90], [0, 90]];
    const pixel = 0.1;
    const m = buildMorphology({ polygons: [{ outer, holes: [] }] }, { domain: [0, 0, 100, 100], pixel });
    const survey = m.corners(400, 20);
    expect(survey.resolution).toBeGreaterThan(0.5 * pixel); // coarser than the first raster, and says so
    expect(survey.resolution).toBeLessThan(2); // still fine against a 400 mm tool
    expect(survey.min).not.toBeNull();
    expect(survey.min!).toBeLessThanOrEqual(survey.resolution); // radius 0 within the method's resolution
    const nearCorner = survey.places.some((p) => Math.hypot(p.x - 40, p.y - 60) < 5 || Math.hypot(p.x - 60, p.y - 60) < 5);
    expect(nearCorner).toBe(true);
  });
});
