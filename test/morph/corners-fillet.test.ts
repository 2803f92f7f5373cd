import { describe, expect, it } from 'vitest';
import { buildMorphology } from '../../src/morph/index.js';
import type { Point } from '../../src/types.js';
import { type Box, poly, set } from './shapes.js';

/**
 * An L-shaped plate: the square [0, 4a] × [0, 4a] without the quadrant x > 2a, y > 2a. Its one concave corner
 * (2a, 2a) is filleted with radius ρ (ρ = 0: sharp): a quarter-circle centred at (2a + ρ, 2a + ρ), polygonised
 * with vertices on the circle and just enough segments that every chord's sagitta ρ(1 − cos(Δ/2)) is ≤ 1e-3·ρ.
 * The whole polygon is rotated by `deg` degrees about the plate centre; the domain is square with a margin, so
 * the rotated plate stays inside it.
 */
function plate(rho: number, a: number, deg: number): { pts: Point[]; domain: Box; corner: Point } {
  const pts: Point[] = [[0, 0], [4 * a, 0], [4 * a, 2 * a]];
  if (rho > 0) {
    // analytic: a chord turning by Δ on a circle of radius ρ has sagitta ρ(1 − cos(Δ/2))
    const n = Math.ceil(Math.PI / 2 / (2 * Math.acos(1 - 1e-3)));
    const cx = 2 * a + rho, cy = 2 * a + rho;
    for (let k = 0; k <= n; k++) {
      const t = -Math.PI / 2 - ((Math.PI / 2) * k) / n; // from (2a + ρ, 2a) round to (2a, 2a + ρ)
      pts.push([cx + rho * Math.cos(t), cy + rho * Math.sin(t)]);
    }
  } else pts.push([2 * a, 2 * a]);
  pts.push([2 * a, 4 * a], [0, 4 * a]);
  const th = (deg * Math.PI) / 180, c = Math.cos(th), s = Math.sin(th), m = 2 * a;
  const rot = (p: Point): Point => [m + c * (p[0] - m) - s * (p[1] - m), m + c * (p[1] - m) + s * (p[0] - m)];
  const half = 2 * a * Math.SQRT2 + 2;
  // the corner the fillet rounds, on the plate's bisector: the arc's midpoint (2a + ρ(1 − 1/√2), same y)
  const q = 2 * a + rho * (1 - Math.SQRT1_2);
  return { pts: pts.map(rot), domain: [m - half, m - half, m + half, m + half], corner: rot([q, q]) };
}

describe('corner radius of an analytic fillet (concave corner of the solid rounded with radius ρ)', () => {
  for (const pixel of [0.05, 0.125, 0.25]) {
    for (const rho of [1, 2, 5]) {
      it(`analytic: ρ = ${rho} mm at pixel ${pixel} mm, R = 1.5ρ → one corner of radius ρ ± pixel/2 at 0°, 30°, 45°`, () => {
        const R = 1.5 * rho;
        // analytic: uncut depth of a 90° fillet ρ under a tool R is (√2 − 1)(R − ρ) = 0.207ρ > δ = max(0.1, 0.05R)
        const depth = Math.max(0.1, 0.05 * R);
        for (const deg of [0, 30, 45]) {
          const { pts, domain, corner } = plate(rho, R, deg);
          const c = buildMorphology(set(poly(pts)), { domain, pixel }).corners(R, depth);
          expect(c.resolution).toBeCloseTo(pixel / 2, 12); // the check's stated resolution ± pixel/2
          expect(c.places, `${deg}°`).toHaveLength(1);
          const p = c.places[0];
          // analytic: the largest disc inside the void touching the arc has the arc's radius ρ
          expect(Math.abs(p.radius - rho), `${deg}°: radius ${p.radius}`).toBeLessThanOrEqual(c.resolution);
          // analytic: the uncut region hugs the arc, which lies within ρ(1 − 1/√2) + ... of the bisector point
          expect(Math.hypot(p.x - corner[0], p.y - corner[1]), `${deg}°`).toBeLessThan(rho + 2 * pixel);
        }
      });
    }
  }

  for (const rho of [1, 2, 5]) {
    it(`analytic: ρ = ${rho} mm, R = 0.9ρ → no corner (the tool fits the fillet) at 0°, 30°, 45°`, () => {
      const R = 0.9 * rho;
      for (const pixel of [0.125, 0.25]) {
        for (const deg of [0, 30, 45]) {
          const { pts, domain } = plate(rho, Math.max(R, 1), deg);
          const c = buildMorphology(set(poly(pts)), { domain, pixel }).corners(R, Math.max(0.1, 0.05 * R));
          expect(c.places, `pixel ${pixel}, ${deg}°`).toEqual([]);
          expect(c.min).toBeNull();
        }
      }
    });
  }

  it('analytic: a sharp 90° concave corner → found, radius 0 within ± pixel/2, at 0°, 30°, 45°', () => {
    for (const pixel of [0.05, 0.125, 0.25]) {
      for (const deg of [0, 30, 45]) {
        const R = 2;
        const { pts, domain, corner } = plate(0, R, deg);
        const c = buildMorphology(set(poly(pts)), { domain, pixel }).corners(R, Math.max(0.1, 0.05 * R));
        expect(c.places, `pixel ${pixel}, ${deg}°`).toHaveLength(1);
        // analytic: a sharp corner has radius 0
        expect(c.places[0].radius, `pixel ${pixel}, ${deg}°`).toBeLessThanOrEqual(c.resolution);
        expect(Math.hypot(c.places[0].x - corner[0], c.places[0].y - corner[1])).toBeLessThan(1);
      }
    }
  });

  it('analytic: the depth rule — uncut depth (√2 − 1)(R − ρ) above δ is found, below δ is not', () => {
    const rho = 2, R = 3, pixel = 0.125;
    const depthOf = (Math.SQRT2 - 1) * (R - rho); // analytic: from the arc's midpoint to the tool disc, 0.414 mm
    for (const deg of [0, 30]) {
      const { pts, domain } = plate(rho, R, deg);
      const m = buildMorphology(set(poly(pts)), { domain, pixel });
      // δ two pixels below the depth: found; two pixels above it: not found (depth is measured to ~1 pixel)
      expect(m.corners(R, depthOf - 2 * pixel).places, `${deg}°`).toHaveLength(1);
      expect(m.corners(R, depthOf + 2 * pixel).places, `${deg}°`).toEqual([]);
      // the check's rule δ = max(tolerance, 0.05 R): tolerance 0.25 → δ = 0.25 < 0.414, found; tolerance 0.5 → not
      expect(m.corners(R, Math.max(0.25, 0.05 * R)).places, `${deg}°`).toHaveLength(1);
      expect(m.corners(R, Math.max(0.5, 0.05 * R)).places, `${deg}°`).toEqual([]);
    }
  });
});
