/**
 * The local-thickness picture of parts without curvature: a square filling its whole domain (an all-solid grid),
 * and a long rectangle. τ(p) = diameter of the largest disc inside the solid that contains p (Hildebrand &
 * Rüegsegger 1997). Analytic: in a square of side L the inscribed disc (diameter L) holds every point at least
 * L/2·(1 − 1/√2) from both sides of a corner, so τ = L over all of the square but its four corner wedges, and
 * τ ≤ L everywhere; in a W × H strip (W ≫ H) τ = H away from its ends.
 * (These shapes once made every coarse pixel a "ridge" and the picture quadratic in its size: issue 11, item 4.)
 */
import { describe, expect, it } from 'vitest';
import { buildMorphology } from '../../src/morph/index.js';
import type { Point } from '../../src/types.js';

const rect = (x0: number, y0: number, x1: number, y1: number): Point[] => [[x0, y0], [x1, y0], [x1, y1], [x0, y1]];

describe('thickness picture of an all-solid domain and a strip', () => {
  it('a 1 × 1 mm square filling its domain: τ = 1 mm at the centre and on the mid-lines, never above', () => {
    const m = buildMorphology({ polygons: [{ outer: rect(0, 0, 1, 1), holes: [] }] }, { domain: [0, 0, 1, 1], pixel: 1 / 200 });
    const map = m.thicknessMap(600);
    const at = (x: number, y: number): number => {
      const s = (map.domain[2] - map.domain[0]) / map.nx;
      return map.values[Math.floor((y - map.domain[1]) / s) * map.nx + Math.floor((x - map.domain[0]) / s)];
    };
    expect(at(0.5, 0.5)).toBeCloseTo(1, 1);
    expect(at(0.5, 0.02)).toBeCloseTo(1, 1); // on a mid-line near an edge: inside the inscribed disc
    expect(at(0.02, 0.5)).toBeCloseTo(1, 1);
    let max = 0;
    let nan = 0;
    for (const v of map.values) {
      if (Number.isNaN(v)) nan++;
      else max = Math.max(max, v);
    }
    expect(nan).toBe(0);
    expect(max).toBeLessThanOrEqual(1 + 0.02); // the raster pixel of slack
  });

  it('a 40 × 4 mm strip: τ = 4 mm along its middle, a point 0.2 mm from the long edge included', () => {
    const m = buildMorphology({ polygons: [{ outer: rect(0, 0, 40, 4), holes: [] }] }, { domain: [0, 0, 40, 4], pixel: 0.05 });
    const map = m.thicknessMap(400);
    const s = (map.domain[2] - map.domain[0]) / map.nx;
    const at = (x: number, y: number): number => map.values[Math.floor(y / s) * map.nx + Math.floor(x / s)];
    for (const x of [10, 20, 30]) {
      expect(at(x, 2)).toBeCloseTo(4, 1);
      expect(at(x, 0.2)).toBeCloseTo(4, 1);
    }
  });
});
