import { describe, expect, it } from 'vitest';
import { buildMorphology } from '../../src/morph/index.js';
import type { Point } from '../../src/types.js';
import { type Box, outline, poly, sdGrid, set } from './shapes.js';

/**
 * A solid block [0, 60] × [0, 30] in the domain [0, 60] × [0, 40] with a notch x ∈ [26, 34], y ∈ [20, 30] cut
 * from its top edge; the notch's two bottom corners are concave corners of the solid, filleted with radius ρ
 * (ρ = 0: sharp). Arcs have 64 segments per quarter.
 */
function notch(rho: number): Point[] {
  const pts: Point[] = [[0, 0], [60, 0], [60, 30], [34, 30]];
  const arc = (cx: number, cy: number, a0: number): void => {
    for (let k = 0; k <= 64; k++) {
      const t = a0 - ((Math.PI / 2) * k) / 64;
      pts.push([cx + rho * Math.cos(t), cy + rho * Math.sin(t)]);
    }
  };
  if (rho > 0) {
    arc(34 - rho, 20 + rho, 0); // right corner: from the right wall down to the bottom
    arc(26 + rho, 20 + rho, -Math.PI / 2); // left corner: from the bottom up to the left wall
  } else pts.push([34, 20], [26, 20]);
  pts.push([26, 30], [0, 30]);
  return pts;
}
const domain: Box = [0, 0, 60, 40];
const pixel = 0.125;
/** Depth allowance δ = max(tolerance, 0.05 R) with the default tolerance of 0.25 cell (1 mm cells). */
const allowance = (R: number): number => Math.max(0.25, 0.05 * R);

describe('tool corners (concave corners of the solid a disc of radius R cannot reach)', () => {
  it('analytic: a sharp 90° notch with R = 2 → one place at each inner corner, radius ≈ 0', () => {
    const c = buildMorphology(set(poly(notch(0))), { domain, pixel }).corners(2, allowance(2));
    // analytic: the uncut depth of a 90° corner is (√2 − 1)R = 0.83 mm > δ
    expect(c.places).toHaveLength(2);
    for (const corner of [[26, 20], [34, 20]]) {
      const p = c.places.find((q) => Math.hypot(q.x - corner[0], q.y - corner[1]) < 1);
      expect(p).toBeDefined();
      expect(p!.radius).toBeLessThanOrEqual(c.resolution); // analytic: a sharp corner has radius 0
    }
    expect(c.min).toBe(c.places[0].radius);
  });

  it('analytic: fillets of radius 1 with R = 2 → radius 1 ± resolution at both corners', () => {
    const c = buildMorphology(set(poly(notch(1))), { domain, pixel }).corners(2, 0.1);
    // analytic: uncut depth (√2 − 1)(R − ρ) = 0.41 mm > 0.1
    expect(c.places).toHaveLength(2);
    for (const p of c.places) expect(Math.abs(p.radius - 1)).toBeLessThanOrEqual(c.resolution);
    for (const corner of [[26, 20], [34, 20]]) expect(c.places.some((q) => Math.hypot(q.x - corner[0], q.y - corner[1]) < 1.5)).toBe(true);
  });

  it('analytic: fillets of radius 3 with R = 2 → no place (the tool fits the fillet)', () => {
    const c = buildMorphology(set(poly(notch(3))), { domain, pixel }).corners(2, 0.1);
    expect(c.places).toEqual([]);
    expect(c.min).toBeNull();
  });

  it('analytic: a slot narrower than 2R is uncut (correct for a milling tool); wider than 2R only its corners', () => {
    // slot of width 3 (< 2R = 4) and depth 10 cut from the top edge, with a sharp bottom
    const slot: Point[] = [[0, 0], [60, 0], [60, 30], [31.5, 30], [31.5, 20], [28.5, 20], [28.5, 30], [0, 30]];
    const c = buildMorphology(set(poly(slot)), { domain, pixel }).corners(2, 0.1);
    expect(c.places).toHaveLength(1); // the whole slot is one uncut region
    expect(c.places[0].radius).toBeLessThanOrEqual(c.resolution); // its sharp bottom corners
  });

  it('analytic: the tool comes from outside the domain — a shallow pocket at the domain edge is cut', () => {
    // solid touching the bottom, left and right domain edges; void above: no corner except the two real ones
    const c = buildMorphology(set(poly(notch(0))), { domain: [0, 0, 60, 30.5], pixel }).corners(2, 0.1);
    expect(c.places).toHaveLength(2);
  });

  it('analytic: grid with filleted notch (ρ = 3 mm, 1 mm cells) through contour and smoothing → no place for R = 2', () => {
    // signed distance of the notched block, fillets of radius 3: exact offset formula of a rounded rectangle
    const sd = (x: number, y: number): number => {
      const block = Math.min(x, 60 - x, y, 30 - y);
      // the notch as a rectangle [26, 34] × [20, ∞) with rounded bottom corners of radius 3
      const qx = Math.abs(x - 30) - (4 - 3), qy = 23 - y;
      const inNotch = Math.hypot(Math.max(qx, 0), Math.max(qy, 0)) + Math.min(Math.max(qx, qy), 0) - 3;
      return Math.min(block, inNotch);
    };
    const c = buildMorphology(outline(sdGrid(60, 40, 1, sd)), { domain, pixel: 0.25 }).corners(2, allowance(2));
    expect(c.places).toEqual([]);
  });
});
