import { describe, expect, it } from 'vitest';
import { buildMorphology, choosePixel } from '../../src/morph/index.js';
import type { PolygonSet } from '../../src/types.js';
import { type Box, circle, outline, poly, rect, sdGrid, segDist, set, stadium } from './shapes.js';

/** Accuracy asked of every measured size: max(0.5 cell, 2 %) (cells of 1 mm here). */
const tol = (truth: number, cell = 1): number => Math.max(0.5 * cell, 0.02 * truth);

function engine(s: PolygonSet, domain: Box, maxPixels = 1_000_000) {
  return buildMorphology(s, { domain, pixel: choosePixel([1, 1], domain, maxPixels) });
}

describe('choosePixel', () => {
  it('divides the cell by the largest k ≤ 8 that keeps the raster under the pixel budget', () => {
    expect(choosePixel([1, 1], [0, 0, 100, 50])).toBe(1 / 8); // 800 × 400 = 320 000 ≤ 4 M
    expect(choosePixel([1, 1], [0, 0, 2000, 1000])).toBe(1); // k = 2 would be 8 M
    expect(choosePixel([2, 1], [0, 0, 1000, 1000], 1_000_000)).toBe(1); // 1000² = 1 M exactly
    expect(choosePixel([1, 1], [0, 0, 5000, 5000])).toBe(1); // over even at k = 1
    expect(() => choosePixel([0, 1], [0, 0, 1, 1])).toThrow(RangeError);
    expect(() => choosePixel([1, 1], [0, 0, Number.NaN, 1])).toThrow(RangeError);
  });
});

describe('local width — analytic polygons', () => {
  it('analytic: a disc of diameter 50 has solid width 50 (docs/references.md §1.2 check value)', () => {
    const m = engine(set(poly(circle(40, 40, 25))), [0, 0, 80, 80]);
    const w = m.width('solid', 10);
    expect(Math.abs(w.min! - 50)).toBeLessThanOrEqual(tol(50)); // docs/references.md §1.2: disc Ø50 → 50
    expect(Math.hypot(w.minAt!.x - 40, w.minAt!.y - 40)).toBeLessThan(1); // analytic: the medial axis is the centre
    expect(w.places).toEqual([]);
    expect(m.width('void', 1000).min).toBeNull(); // analytic: the void around a lone disc has no second wall
  });

  it('analytic: a ring Ø120/Ø50 has solid width 35 and void width 50 (docs/references.md §1.2 check values)', () => {
    const m = engine(set(poly(circle(70, 70, 60), circle(70, 70, 25))), [0, 0, 140, 140]);
    expect(Math.abs(m.width('solid', 0).min! - 35)).toBeLessThanOrEqual(tol(35)); // (120 − 50)/2
    expect(Math.abs(m.width('void', 0).min! - 50)).toBeLessThanOrEqual(tol(50)); // the inner hole
  });

  for (const w of [1.5, 3, 5, 8]) {
    for (const deg of [0, 30, 45]) {
      it(`analytic: a strut of width ${w} at ${deg}° measures ${w}`, () => {
        const a = (deg * Math.PI) / 180;
        const c = [50, 50] as const, L = 30;
        const s = set(poly(stadium([c[0] - L * Math.cos(a), c[1] - L * Math.sin(a)], [c[0] + L * Math.cos(a), c[1] + L * Math.sin(a)], w)));
        const r = engine(s, [0, 0, 100, 100]).width('solid', w + 1);
        expect(Math.abs(r.min! - w)).toBeLessThanOrEqual(tol(w)); // analytic: a stadium of width w
        expect(r.places).toHaveLength(1); // one strut, one place
        expect(Math.abs(r.places[0].width - w)).toBeLessThanOrEqual(tol(w));
      });
    }
  }

  it('analytic: a strut thinner than a pixel is still found, at its width', () => {
    const s = set(poly(stadium([20, 50.1], [80, 50.1], 0.1)));
    const m = buildMorphology(s, { domain: [0, 0, 100, 100], pixel: 0.5 });
    const r = m.width('solid', 1);
    expect(r.min!).toBeGreaterThan(0.05); // analytic: width 0.1 (± half a pixel would allow 0, we do better)
    expect(r.min!).toBeLessThan(0.15);
    expect(r.places).toHaveLength(1);
  });

  it('analytic: a solid rectangle with sharp corners has no place below 0.9 × its short side (corners never count)', () => {
    for (const [w, h] of [[40, 20], [30, 30], [50, 8]]) {
      const m = engine(set(poly(rect(10, 10, 10 + w, 10 + h))), [0, 0, w + 20, h + 20]);
      const r = m.width('solid', 0.9 * Math.min(w, h));
      expect(r.places).toEqual([]); // docs/checks/README.md required behaviour: a rectangle → no finding
      expect(Math.abs(r.min! - Math.min(w, h))).toBeLessThanOrEqual(tol(Math.min(w, h))); // analytic: the central medial segment
    }
  });

  it('analytic: a 45° wedge has a place at its tip', () => {
    const half = (22.5 * Math.PI) / 180, L = 60;
    const tip = [20, 50] as const;
    const s = set(poly([tip, [tip[0] + L, tip[1] - L * Math.tan(half)], [tip[0] + L, tip[1] + L * Math.tan(half)]]));
    const r = engine(s, [0, 0, 100, 100]).width('solid', 3);
    expect(r.places).toHaveLength(1);
    expect(Math.hypot(r.places[0].x - tip[0], r.places[0].y - tip[1])).toBeLessThan(1); // analytic: width 2·t·sin 22.5° → 0 at the tip
    expect(r.places[0].width).toBeLessThan(0.5);
    // analytic: the base corners are 67.5°, separation angle 112.5° < 120°: no other place
  });

  it('analytic: the domain edge is a hard edge — a wall of 6 between a hole and the edge is one place under 8', () => {
    // solid plate filling the domain, hole of radius 10 at (16, 30): wall 0 … 6 at y = 30 (docs/checks/README.md)
    const m = engine(set(poly(rect(0, 0, 100, 60), circle(16, 30, 10))), [0, 0, 100, 60]);
    const r = m.width('solid', 8);
    expect(r.places).toHaveLength(1);
    expect(Math.abs(r.places[0].width - 6)).toBeLessThanOrEqual(tol(6));
    expect(Math.abs(r.places[0].x - 3)).toBeLessThan(1);
    expect(Math.abs(r.places[0].y - 30)).toBeLessThan(1);
  });
});

describe('local width — analytic grids through contour and smoothing', () => {
  const cell = 1;
  it('analytic: disc Ø50 and ring Ø120/Ø50 from grey-ramp grids (docs/references.md §1.2 check values)', () => {
    const disc = outline(sdGrid(80, 80, cell, (x, y) => 25 - Math.hypot(x - 40.3, y - 39.6)));
    expect(Math.abs(engine(disc, [0, 0, 80, 80]).width('solid', 0).min! - 50)).toBeLessThanOrEqual(tol(50));
    const ring = outline(sdGrid(140, 140, cell, (x, y) => {
      const d = Math.hypot(x - 70.2, y - 69.7);
      return Math.min(60 - d, d - 25);
    }));
    const m = engine(ring, [0, 0, 140, 140]);
    expect(Math.abs(m.width('solid', 0).min! - 35)).toBeLessThanOrEqual(tol(35));
    expect(Math.abs(m.width('void', 0).min! - 50)).toBeLessThanOrEqual(tol(50));
  });

  for (const w of [3, 5, 8]) {
    for (const deg of [0, 30, 45]) {
      it(`analytic: grid strut of width ${w} at ${deg}° measures ${w}`, () => {
        const a = (deg * Math.PI) / 180;
        const A = [50 - 30 * Math.cos(a), 50.3 - 30 * Math.sin(a)] as const, B = [50 + 30 * Math.cos(a), 50.3 + 30 * Math.sin(a)] as const;
        const s = outline(sdGrid(100, 100, cell, (x, y) => w / 2 - segDist([x, y], A, B)));
        const r = engine(s, [0, 0, 100, 100]).width('solid', w + 1);
        expect(Math.abs(r.min! - w)).toBeLessThanOrEqual(tol(w));
        expect(r.places).toHaveLength(1);
      });
    }
  }

  it('analytic: a plate with Ø8 holes under a 10 mm hole limit → one place per hole, at its centre', () => {
    const holes = [[20.2, 20.4], [50.7, 30.1], [80.4, 40.3], [30.5, 45.2]];
    const g = sdGrid(100, 60, cell, (x, y) => Math.min(...holes.map(([cx, cy]) => Math.hypot(x - cx, y - cy) - 4)));
    const r = engine(outline(g), [0, 0, 100, 60]).width('void', 10);
    expect(r.places).toHaveLength(holes.length);
    for (const [cx, cy] of holes) {
      const p = r.places.find((q) => Math.hypot(q.x - cx, q.y - cy) < 0.5 * cell + 0.25);
      expect(p).toBeDefined(); // analytic: a disc's medial axis is its centre
      expect(Math.abs(p!.width - 8)).toBeLessThanOrEqual(tol(8));
    }
  });

  it('analytic: a slot of width 4 open to the domain edge is a void place; void open to the edge without a second wall is not', () => {
    // slot y ∈ [28, 32] from the left edge to x = 40 (rounded end)
    const slot = sdGrid(100, 60, cell, (x, y) => segDist([x, y], [-10, 30.2], [40, 30.2]) - 2);
    const r = engine(outline(slot), [0, 0, 100, 60]).width('void', 6);
    expect(r.places).toHaveLength(1);
    expect(Math.abs(r.places[0].width - 4)).toBeLessThanOrEqual(tol(4));
    // solid below y = 30.4, open space above: the void has one wall only (docs/checks/README.md)
    const half = sdGrid(100, 60, cell, (_x, y) => 30.4 - y);
    const open = engine(outline(half), [0, 0, 100, 60]).width('void', 1000);
    expect(open.places).toEqual([]);
    expect(open.min).toBeNull();
  });

  it('analytic: a grid rectangle (sharp corners, rounded only by contouring) has no place below 0.9 × its short side', () => {
    const g = sdGrid(80, 60, cell, (x, y) => Math.min(x - 10.3, 60.3 - x, y - 15.2, 35.2 - y));
    const r = engine(outline(g), [0, 0, 80, 60]).width('solid', 0.9 * 20);
    expect(r.places).toEqual([]);
  });

  it('analytic: a grid 45° wedge has a place near its tip', () => {
    const half = (22.5 * Math.PI) / 180;
    const tip = [20.3, 50.2];
    const g = sdGrid(100, 100, cell, (x, y) => {
      const dx = x - tip[0], dy = y - tip[1];
      return Math.min(dx * Math.sin(half) - dy * Math.cos(half), dx * Math.sin(half) + dy * Math.cos(half), 80.3 - x);
    });
    const r = engine(outline(g), [0, 0, 100, 100]).width('solid', 3);
    expect(r.places).toHaveLength(1);
    expect(Math.hypot(r.places[0].x - tip[0], r.places[0].y - tip[1])).toBeLessThan(3 / (2 * Math.sin(half))); // analytic: width < 3 only within 3/(2 sin 22.5°) of the tip
  });
});
