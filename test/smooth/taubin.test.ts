import { describe, it, expect } from 'vitest';
import { taubinRing } from '../../src/smooth/taubin.js';

/** Regular N-gon of radius R around the origin, flat, counter-clockwise. */
function ngon(N: number, R: number, phase = 0.3): Float64Array {
  const xy = new Float64Array(2 * N);
  for (let i = 0; i < N; i++) {
    xy[2 * i] = R * Math.cos(phase + (2 * Math.PI * i) / N);
    xy[2 * i + 1] = R * Math.sin(phase + (2 * Math.PI * i) / N);
  }
  return xy;
}

function radii(xy: Float64Array): number[] {
  const out: number[] = [];
  for (let i = 0; i < xy.length; i += 2) out.push(Math.hypot(xy[i], xy[i + 1]));
  return out;
}

describe('taubinRing', () => {
  it('scales a regular 64-gon by (1 − λk)(1 − μk) per λ|μ pair', () => {
    const R = 10;
    const { xy } = taubinRing(ngon(64, R), { iterations: 1, lambda: 0.33, mu: -0.34, maxShift: Infinity });
    // docs/references.md §4.1 [D]: N=64, λ=0.33, μ=−0.34 → 1.0000456 per pair
    for (const r of radii(xy)) expect(r / R).toBeCloseTo(1.0000456, 7);
    const k = 1 - Math.cos((2 * Math.PI) / 64);
    // docs/references.md §4.1 [S2]: transfer function f(k) = (1 − λk)(1 − μk)
    for (const r of radii(xy)) expect(r / R).toBeCloseTo((1 - 0.33 * k) * (1 + 0.34 * k), 12);
  });

  it('shrinks a regular 64-gon to 0.976183 after 10 pure Laplacian steps of λ = 0.5', () => {
    const R = 3;
    // μ = 0: each pair is one plain Laplacian step
    const { xy } = taubinRing(ngon(64, R), { iterations: 10, lambda: 0.5, mu: 0, maxShift: Infinity });
    // docs/references.md §4.1 [D]: factor 0.997592 per step, 10 steps → 0.976183
    for (const r of radii(xy)) expect(r / R).toBeCloseTo(0.976183, 6);
  });

  it('never moves fixed vertices and never moves any vertex farther than maxShift', () => {
    const ring = ngon(12, 5);
    ring[0] += 2; // a spike at vertex 0
    const fixed = new Uint8Array(12);
    fixed[5] = 1;
    const cap = 0.05;
    const { xy, maxShift } = taubinRing(ring, { iterations: 20, lambda: 0.5, mu: -0.53, maxShift: cap }, fixed);
    expect(xy[10]).toBe(ring[10]); // fixed: bit-identical (definition of fixed)
    expect(xy[11]).toBe(ring[11]);
    for (let i = 0; i < 12; i++) {
      // the cap is a Euclidean radius around the starting position (definition)
      expect(Math.hypot(xy[2 * i] - ring[2 * i], xy[2 * i + 1] - ring[2 * i + 1])).toBeLessThanOrEqual(cap * (1 + 1e-12));
    }
    expect(maxShift).toBeGreaterThan(0.04); // the spike really wanted to move more than the cap
    expect(ring[0]).toBe(5 * Math.cos(0.3) + 2); // input untouched
  });

  it('clamps free vertices into the box', () => {
    // a square ring poking out of the box [0,0,10,10] at its top-right corner region
    const ring = Float64Array.from([2, 2, 9.9, 2, 12, 12, 2, 9.9]);
    const { xy } = taubinRing(ring, { iterations: 3, lambda: 0.33, mu: -0.34, maxShift: Infinity, box: [0, 0, 10, 10] });
    for (let i = 0; i < xy.length; i += 2) {
      expect(xy[i]).toBeLessThanOrEqual(10);
      expect(xy[i + 1]).toBeLessThanOrEqual(10);
    }
  });
});
