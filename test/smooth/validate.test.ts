import { describe, it, expect } from 'vitest';
import { segmentsIntersect } from '../../src/geom/segments.js';
import { validateRings } from '../../src/smooth/validate.js';
import { flatRingArea as ringArea } from '../../src/geom/area.js';
import { directedHausdorff } from '../../src/smooth/deviation.js';
import { rng } from './gen.js';

const flat = (...rings: number[][]) => {
  const xy: number[] = [];
  const start = [0];
  for (const r of rings) { xy.push(...r); start.push(xy.length / 2); }
  return { xy: Float64Array.from(xy), start: Int32Array.from(start) };
};
const roles = (hole: number[], owner: number[]) => ({ hole: Uint8Array.from(hole), owner: Int32Array.from(owner) });

const outer = [0, 0, 10, 0, 10, 10, 0, 10]; // CCW
const holeIn = [2, 2, 2, 4, 4, 4, 4, 2]; // CW

/** Independent brute-force closed-segment intersection test with exact rational-free cases. */
function bruteIntersect(p: number[], q: number[]): boolean {
  const o = (a: number[], b: number[], c: number[]) => Math.sign((b[0] - a[0]) * (c[1] - a[1]) - (b[1] - a[1]) * (c[0] - a[0]));
  const on = (a: number[], b: number[], c: number[]) =>
    Math.min(a[0], b[0]) <= c[0] && c[0] <= Math.max(a[0], b[0]) && Math.min(a[1], b[1]) <= c[1] && c[1] <= Math.max(a[1], b[1]);
  const [p1, p2, q1, q2] = [[p[0], p[1]], [p[2], p[3]], [q[0], q[1]], [q[2], q[3]]];
  const d1 = o(q1, q2, p1), d2 = o(q1, q2, p2), d3 = o(p1, p2, q1), d4 = o(p1, p2, q2);
  if (d1 * d2 < 0 && d3 * d4 < 0) return true;
  return (d1 === 0 && on(q1, q2, p1)) || (d2 === 0 && on(q1, q2, p2)) || (d3 === 0 && on(p1, p2, q1)) || (d4 === 0 && on(p1, p2, q2));
}

describe('segmentsIntersect', () => {
  it('agrees with a brute-force test on random lattice segments (many touching and collinear cases)', () => {
    const rand = rng(11);
    const pick = () => Math.floor(rand() * 5);
    for (let k = 0; k < 20000; k++) {
      const p = [pick(), pick(), pick(), pick()], q = [pick(), pick(), pick(), pick()];
      // textbook orientation test (Cormen et al., "Introduction to Algorithms", §33.1) [M]
      expect(segmentsIntersect(p[0], p[1], p[2], p[3], q[0], q[1], q[2], q[3])).toBe(bruteIntersect(p, q));
    }
  });
});

describe('validateRings', () => {
  it('accepts a square with a hole', () => {
    expect(validateRings(flat(outer, holeIn), roles([0, 1], [-1, 0])).problems).toBe(0);
  });

  it('flags a bow tie, a hole touching its outer ring, a hole outside it and wrong orientation', () => {
    const bow = [0, 0, 4, 4, 4, 0, 0, 4];
    expect(validateRings(flat(bow), roles([0], [-1])).problems).toBeGreaterThan(0);
    const touching = [2, 2, 2, 4, 4, 4, 10, 2]; // vertex (10,2) lies on the outer ring's edge x = 10
    expect(validateRings(flat(outer, touching), roles([0, 1], [-1, 0])).segmentHit.some((v) => v === 1)).toBe(true);
    const outside = [12, 2, 12, 4, 14, 4, 14, 2];
    const v = validateRings(flat(outer, outside), roles([0, 1], [-1, 0]));
    expect(v.ringHit[1]).toBe(1);
    expect(v.blamed[0]).toBe(1);
    const ccwHole = [2, 2, 4, 2, 4, 4, 2, 4];
    expect(validateRings(flat(outer, ccwHole), roles([0, 1], [-1, 0])).ringHit[1]).toBe(1);
  });

  it('flags a spike that folds back onto its own ring', () => {
    const spike = [0, 0, 10, 0, 10, 10, 5, 10, 5, 12, 5, 11, 0, 10]; // 5,12 → 5,11 runs back along 5,10–5,12
    expect(validateRings(flat(spike), roles([0], [-1])).problems).toBeGreaterThan(0);
  });

  it('finds the same crossings as an O(n²) brute force on random rings', () => {
    for (let seed = 1; seed <= 5; seed++) {
      const rand = rng(seed);
      const rings: number[][] = [];
      for (let r = 0; r < 6; r++) {
        const cx = rand() * 20, cy = rand() * 20, R = 1 + rand() * 4;
        const ring: number[] = [];
        for (let i = 0; i < 30; i++) {
          const t = (2 * Math.PI * i) / 30, rr = R * (0.7 + 0.6 * rand());
          ring.push(cx + rr * Math.cos(t), cy + rr * Math.sin(t));
        }
        rings.push(ring);
      }
      const f = flat(...rings);
      const v = validateRings(f, roles([0, 0, 0, 0, 0, 0], [-1, -1, -1, -1, -1, -1]));
      const n = f.start[f.start.length - 1];
      const seg = (i: number) => {
        const r = f.start.findIndex((s, k) => k + 1 < f.start.length && s <= i && i < f.start[k + 1]);
        const j = i + 1 === f.start[r + 1] ? f.start[r] : i + 1;
        return { r, j, c: [f.xy[2 * i], f.xy[2 * i + 1], f.xy[2 * j], f.xy[2 * j + 1]] };
      };
      const hit = new Uint8Array(n);
      for (let i = 0; i < n; i++) {
        for (let k = i + 1; k < n; k++) {
          const a = seg(i), b = seg(k);
          if (a.r === b.r && (a.j === k || b.j === i)) continue; // neighbours share a vertex
          if (bruteIntersect(a.c, b.c)) hit[i] = hit[k] = 1;
        }
      }
      expect(Array.from(v.segmentHit)).toEqual(Array.from(hit));
    }
  });
});

describe('measures', () => {
  it('ringArea is the shoelace area', () => {
    expect(ringArea(Float64Array.from(outer))).toBe(100); // analytic: 10 × 10 square, CCW positive
    expect(ringArea(Float64Array.from(holeIn))).toBe(-4);
  });

  it('directedHausdorff of a square to a larger concentric square is the offset distance', () => {
    const inner = flat([1, 1, 9, 1, 9, 9, 1, 9]);
    // analytic: every point of the inner square is 1 from the outer one, corners included (distance to edges)
    expect(directedHausdorff(inner, flat(outer), 0.01)).toBeCloseTo(1, 12);
    // the other way: the corners of the outer square are √2 from the inner square's corners
    expect(directedHausdorff(flat(outer), inner, 0.01)).toBeCloseTo(Math.SQRT2, 12);
  });

  it('directedHausdorff agrees with a brute-force sampled distance on random rings', () => {
    const rand = rng(5);
    const ring = (R: number, noise: number) => {
      const out: number[] = [];
      for (let i = 0; i < 200; i++) {
        const t = (2 * Math.PI * i) / 200, r = R + noise * (rand() - 0.5);
        out.push(r * Math.cos(t), r * Math.sin(t));
      }
      return out;
    };
    const a = ring(10, 0.6), b = ring(10, 0.1);
    const step = 0.01;
    let brute = 0;
    for (let i = 0; i < 200; i++) {
      const j = (i + 1) % 200;
      const m = Math.ceil(Math.hypot(a[2 * j] - a[2 * i], a[2 * j + 1] - a[2 * i + 1]) / step);
      for (let k = 0; k < m; k++) {
        const x = a[2 * i] + ((a[2 * j] - a[2 * i]) * k) / m, y = a[2 * i + 1] + ((a[2 * j + 1] - a[2 * i + 1]) * k) / m;
        let best = Infinity;
        for (let q = 0; q < 200; q++) {
          const w = (q + 1) % 200;
          const vx = b[2 * w] - b[2 * q], vy = b[2 * w + 1] - b[2 * q + 1];
          const t = Math.max(0, Math.min(1, ((x - b[2 * q]) * vx + (y - b[2 * q + 1]) * vy) / (vx * vx + vy * vy)));
          best = Math.min(best, Math.hypot(x - b[2 * q] - t * vx, y - b[2 * q + 1] - t * vy));
        }
        brute = Math.max(brute, best);
      }
    }
    // same samples on both sides (same step), so the two must agree to rounding
    expect(directedHausdorff(flat(a), flat(b), step)).toBeCloseTo(brute, 12);
  });
});
