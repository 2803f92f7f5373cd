import { describe, expect, it } from 'vitest';
import { polygonArea, ringArea, ringPerimeter } from '../../src/geom/area.js';
import { ringBounds, ringContains } from '../../src/geom/contains.js';
import { isClockwise, isCounterClockwise, orientRing } from '../../src/geom/orient.js';
import type { Ring } from '../../src/types.js';

const square: Ring = [
  [0, 0],
  [4, 0],
  [4, 3],
  [0, 3],
];

describe('geometry helpers', () => {
  it('shoelace area and perimeter of a rectangle and a regular polygon', () => {
    // analytic: 4 × 3 rectangle, area 12, perimeter 14; counter-clockwise → positive
    expect(ringArea(square)).toBe(12);
    expect(ringPerimeter(square)).toBe(14);
    expect(ringArea([...square].reverse())).toBe(-12);
    // analytic: regular n-gon of circumradius R: area n/2·R²·sin(2π/n), perimeter 2nR·sin(π/n)
    const n = 12;
    const R = 5;
    const ngon: Ring = Array.from({ length: n }, (_, k) => [1e6 + R * Math.cos((2 * Math.PI * k) / n), R * Math.sin((2 * Math.PI * k) / n)] as const);
    expect(ringArea(ngon)).toBeCloseTo((n / 2) * R * R * Math.sin((2 * Math.PI) / n), 8);
    expect(ringPerimeter(ngon)).toBeCloseTo(2 * n * R * Math.sin(Math.PI / n), 8);
    const hole: Ring = [
      [1, 1],
      [1, 2],
      [2, 2],
      [2, 1],
    ];
    expect(polygonArea({ outer: square, holes: [hole] })).toBe(11);
  });

  it('orientation', () => {
    expect(isCounterClockwise(square)).toBe(true);
    expect(isClockwise(square)).toBe(false);
    const cw = orientRing(square, 'cw');
    expect(ringArea(cw)).toBe(-12);
    expect(cw[0]).toEqual(square[0]);
    expect(orientRing(square, 'ccw')).toBe(square);
    expect(square).toEqual([
      [0, 0],
      [4, 0],
      [4, 3],
      [0, 3],
    ]); // input untouched
  });

  it('point in ring: inside, on the boundary, outside (even–odd rule)', () => {
    expect(ringContains(square, [1, 1])).toBe(1);
    expect(ringContains(square, [4, 1])).toBe(0);
    expect(ringContains(square, [0, 0])).toBe(0);
    expect(ringContains(square, [5, 1])).toBe(-1);
    // a ray through a vertex is counted once: concave "V"
    const v: Ring = [
      [0, 0],
      [2, 2],
      [4, 0],
      [4, 4],
      [0, 4],
    ];
    expect(ringContains(v, [1, 2])).toBe(1);
    expect(ringContains(v, [2, 1])).toBe(-1);
    expect(ringBounds(v)).toEqual([0, 0, 4, 4]);
  });
});
