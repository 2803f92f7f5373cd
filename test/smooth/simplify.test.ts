import { describe, it, expect } from 'vitest';
import { gather, rdpOpen, simplifyRing } from '../../src/smooth/simplify.js';
import { rng } from './gen.js';

/** Brute-force distance from a point to a segment (independent of the library helper). */
function segDist(px: number, py: number, ax: number, ay: number, bx: number, by: number): number {
  const vx = bx - ax, vy = by - ay;
  const L2 = vx * vx + vy * vy;
  const t = L2 === 0 ? 0 : Math.max(0, Math.min(1, ((px - ax) * vx + (py - ay) * vy) / L2));
  return Math.hypot(px - ax - t * vx, py - ay - t * vy);
}

describe('rdpOpen', () => {
  it('reproduces the 10-point example with ε = 1', () => {
    const pts = [0, 0, 1, 0.1, 2, -0.1, 3, 5, 4, 6, 5, 7, 6, 8.1, 7, 9, 8, 9, 9, 9];
    // docs/references.md §4.3 [D] oracle
    expect(Array.from(rdpOpen(Float64Array.from(pts), 1.0))).toEqual([0, 0, 2, -0.1, 3, 5, 7, 9, 9, 9]);
  });

  it('keeps everything for tiny ε and only the end points for a huge ε', () => {
    const pts = Float64Array.from([0, 0, 1, 1, 2, 0, 3, 1, 4, 0]);
    expect(Array.from(rdpOpen(pts, 1e-6))).toEqual(Array.from(pts)); // definition: all points farther than ε
    expect(Array.from(rdpOpen(pts, 10))).toEqual([0, 0, 4, 0]);
  });
});

describe('simplifyRing', () => {
  it('reduces a densely sampled square to its four corners', () => {
    const xy: number[] = [];
    for (let i = 0; i < 100; i++) xy.push(i / 10, 0);
    for (let i = 0; i < 100; i++) xy.push(10, i / 10);
    for (let i = 0; i < 100; i++) xy.push(10 - i / 10, 10);
    for (let i = 0; i < 100; i++) xy.push(0, 10 - i / 10);
    const keep = simplifyRing(Float64Array.from(xy), 0.01);
    // analytic: the square's only non-collinear vertices are its corners
    expect(Array.from(gather(Float64Array.from(xy), keep))).toEqual([0, 0, 10, 0, 10, 10, 0, 10]);
  });

  it('keeps anchors, handles 200k points without recursion and keeps every dropped vertex within ε', () => {
    const n = 200_000;
    const rand = rng(3);
    const xy = new Float64Array(2 * n);
    for (let i = 0; i < n; i++) {
      const t = (2 * Math.PI * i) / n;
      const r = 100 + 0.3 * Math.sin(40 * t) + 0.01 * (rand() - 0.5);
      xy[2 * i] = r * Math.cos(t);
      xy[2 * i + 1] = r * Math.sin(t);
    }
    const anchors = new Uint8Array(n);
    anchors[12345] = anchors[150000] = 1;
    const eps = 0.05;
    const keep = simplifyRing(xy, eps, anchors);
    expect(keep[12345]).toBe(1);
    expect(keep[150000]).toBe(1);
    const kept: number[] = [];
    for (let i = 0; i < n; i++) if (keep[i]) kept.push(i);
    expect(kept.length).toBeGreaterThan(3);
    expect(kept.length).toBeLessThan(n / 10);
    // RDP guarantee (docs/references.md §4.3): every removed vertex lies within ε of the output; brute force per span
    let worst = 0;
    for (let k = 0; k < kept.length; k++) {
      const a = kept[k], b = kept[(k + 1) % kept.length];
      for (let i = (a + 1) % n; i !== b; i = (i + 1) % n) {
        worst = Math.max(worst, segDist(xy[2 * i], xy[2 * i + 1], xy[2 * a], xy[2 * a + 1], xy[2 * b], xy[2 * b + 1]));
      }
    }
    expect(worst).toBeLessThanOrEqual(eps);
    expect(worst).toBeGreaterThan(eps / 2); // the budget is actually used
  });

  it('keeps at least three vertices of a ring smaller than ε', () => {
    const xy = Float64Array.from([0, 0, 0.01, 0, 0.01, 0.01, 0, 0.01, -0.005, 0.005]);
    const keep = simplifyRing(xy, 1);
    expect(keep.reduce((s, v) => s + v, 0)).toBe(3);
  });

  it('with ε = 0 drops only vertices exactly on their chord', () => {
    const xy = Float64Array.from([0, 0, 1, 0, 2, 0, 2, 1, 1, 1.000001, 0, 1]);
    const keep = simplifyRing(xy, 0);
    expect(Array.from(keep)).toEqual([1, 0, 1, 1, 1, 1]); // (1,0) is collinear; (1,1.000001) is not
  });
});
