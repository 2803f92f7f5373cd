import { describe, expect, it } from 'vitest';
import { coverage } from '../../src/fe/coverage.js';
import type { Point, PolygonSet, Ring } from '../../src/types.js';

/** Sutherland–Hodgman clipping of a ring to an axis-aligned box (I.E. Sutherland, G.W. Hodgman, "Reentrant
 * polygon clipping", CACM 17(1):32–42, 1974) and its shoelace area: the brute-force per-cell reference. */
function clippedArea(ring: Ring, x0: number, y0: number, x1: number, y1: number): number {
  let pts: Point[] = [...ring];
  const edges: [(p: Point) => boolean, (a: Point, b: Point) => Point][] = [
    [(p) => p[0] >= x0, (a, b) => [x0, a[1] + ((b[1] - a[1]) * (x0 - a[0])) / (b[0] - a[0])]],
    [(p) => p[0] <= x1, (a, b) => [x1, a[1] + ((b[1] - a[1]) * (x1 - a[0])) / (b[0] - a[0])]],
    [(p) => p[1] >= y0, (a, b) => [a[0] + ((b[0] - a[0]) * (y0 - a[1])) / (b[1] - a[1]), y0]],
    [(p) => p[1] <= y1, (a, b) => [a[0] + ((b[0] - a[0]) * (y1 - a[1])) / (b[1] - a[1]), y1]],
  ];
  for (const [inside, cut] of edges) {
    const out: Point[] = [];
    for (let k = 0; k < pts.length; k++) {
      const a = pts[k];
      const b = pts[(k + 1) % pts.length];
      if (inside(b)) {
        if (!inside(a)) out.push(cut(a, b));
        out.push(b);
      } else if (inside(a)) out.push(cut(a, b));
    }
    pts = out;
    if (pts.length === 0) return 0;
  }
  let s = 0;
  for (let k = 0; k < pts.length; k++) {
    const a = pts[k];
    const b = pts[(k + 1) % pts.length];
    s += a[0] * b[1] - b[0] * a[1];
  }
  return s / 2;
}

function bruteForce(set: PolygonSet, nx: number, ny: number, hx: number, hy: number): Float64Array {
  const out = new Float64Array(nx * ny);
  for (let j = 0; j < ny; j++) {
    for (let i = 0; i < nx; i++) {
      let a = 0;
      for (const p of set.polygons) for (const r of [p.outer, ...p.holes]) a += clippedArea(r, i * hx, j * hy, (i + 1) * hx, (j + 1) * hy);
      out[j * nx + i] = a / (hx * hy);
    }
  }
  return out;
}

const sum = (a: Float64Array): number => a.reduce((s, v) => s + v, 0);

function circle(cx: number, cy: number, r: number, n: number, cw = false): Point[] {
  const pts: Point[] = [];
  for (let k = 0; k < n; k++) {
    const t = ((cw ? -1 : 1) * 2 * Math.PI * k) / n;
    pts.push([cx + r * Math.cos(t), cy + r * Math.sin(t)]);
  }
  return pts;
}

describe('coverage: exact area of material per cell', () => {
  it('an axis-aligned rectangle: full cells 1, edge cells the covered share, total = w·h (analytic)', () => {
    const set: PolygonSet = { polygons: [{ outer: [[1.25, 0.5], [6.5, 0.5], [6.5, 3.75], [1.25, 3.75]], holes: [] }] };
    const a = coverage(set, { nx: 8, ny: 5, hx: 1, hy: 1 });
    expect(sum(a)).toBeCloseTo(5.25 * 3.25, 12);
    expect(a[2 * 8 + 3]).toBeCloseTo(1, 14); // inside
    expect(a[0 * 8 + 1]).toBeCloseTo(0.75 * 0.5, 14); // lower-left corner cell
    expect(a[3 * 8 + 6]).toBeCloseTo(0.5 * 0.75, 14); // upper-right corner cell
    expect(a[4 * 8 + 3]).toBe(0);
  });

  it('a triangle: total ½·b·h and every cell equal to brute-force clipping (Sutherland–Hodgman)', () => {
    const set: PolygonSet = { polygons: [{ outer: [[0.3, 0.2], [9.1, 1.7], [4.2, 6.9]], holes: [] }] };
    const a = coverage(set, { nx: 10, ny: 7, hx: 1, hy: 1 });
    const area = Math.abs((9.1 - 0.3) * (6.9 - 0.2) - (4.2 - 0.3) * (1.7 - 0.2)) / 2;
    expect(sum(a)).toBeCloseTo(area, 11);
    const ref = bruteForce(set, 10, 7, 1, 1);
    for (let k = 0; k < a.length; k++) expect(a[k]).toBeCloseTo(ref[k], 12);
  });

  it('a disc sector (quarter disc at the grid corner): total πR²/4 of the polygon, analytic to the polygonisation', () => {
    // quarter disc r = 7 around (0, 0), 1000 chords: the inscribed polygon's area is 1000·½R²·sin(π/2000)
    // exactly (analytic), within (π/2000)²/6 ≈ 4e-7 relative of the sector πR²/4.
    const n = 1000;
    const ring: Point[] = [[0, 0]];
    for (let k = 0; k <= n; k++) ring.push([7 * Math.cos((Math.PI / 2) * (k / n)), 7 * Math.sin((Math.PI / 2) * (k / n))]);
    const a = coverage({ polygons: [{ outer: ring, holes: [] }] }, { nx: 9, ny: 9, hx: 1, hy: 1 });
    expect(sum(a)).toBeCloseTo(n * 0.5 * 49 * Math.sin(Math.PI / (2 * n)), 11);
    expect(Math.abs(sum(a) / ((Math.PI * 49) / 4) - 1)).toBeLessThan(5e-7);
    // a cell cut by the arc: (6, 3)…(7, 4) holds ∫ from x = 6 to √(49 − 9) of (√(49 − x²) − 3) dx (analytic)
    const F = (x: number): number => 0.5 * (x * Math.sqrt(49 - x * x) + 49 * Math.asin(x / 7)) - 3 * x;
    expect(a[3 * 9 + 6]).toBeCloseTo(F(Math.sqrt(40)) - F(6), 5);
  });

  it('rectangular cells, an origin offset, a hole (clockwise) and a polygon reaching past the grid: equal to brute force of the clipped set', () => {
    const outer: Point[] = [[-3, -2], [23, -1], [25, 14], [-1, 13]];
    const hole = circle(9, 6, 3.3, 37, true);
    const set: PolygonSet = { polygons: [{ outer, holes: [hole] }, { outer: circle(9, 6, 1.1, 11), holes: [] }] };
    const hx = 1.6;
    const hy = 0.9;
    const a = coverage(set, { nx: 12, ny: 11, hx, hy });
    const ref = bruteForce(set, 12, 11, hx, hy);
    for (let k = 0; k < a.length; k++) expect(a[k]).toBeCloseTo(ref[k], 11);
    const shifted = coverage(
      { polygons: set.polygons.map((p) => ({ outer: p.outer.map(([x, y]) => [x + 100, y - 50] as Point), holes: p.holes.map((h) => h.map(([x, y]) => [x + 100, y - 50] as Point)) })) },
      { nx: 12, ny: 11, hx, hy, x0: 100, y0: -50 },
    );
    for (let k = 0; k < a.length; k++) expect(shifted[k]).toBeCloseTo(a[k], 9);
  });
});
