import { describe, expect, it } from 'vitest';
import { contourGrid, type SaddleRule } from '../../src/contour/index.js';
import { polygonSetArea, polygonSetPerimeter } from '../../src/geom/area.js';
import type { DensityGrid, PolygonSet } from '../../src/types.js';
import { smoothField } from './grids.js';

/** Every vertex, mapped, sorted by x then y. */
function vertices(set: PolygonSet, map: (x: number, y: number) => [number, number] = (x, y) => [x, y]): [number, number][] {
  const v = set.polygons.flatMap((p) => [p.outer, ...p.holes].flatMap((r) => r.map(([x, y]) => map(x, y))));
  return v.sort((a, b) => a[0] - b[0] || a[1] - b[1]);
}

function expectSameVertices(a: [number, number][], b: [number, number][]): void {
  expect(a.length).toBe(b.length);
  // sort keys can swap for coordinates equal up to rounding: match within 1e-9 after a tolerant sort
  const key = (p: [number, number]) => Math.round(p[0] * 1e6) * 1e7 + Math.round(p[1] * 1e6);
  const sa = [...a].sort((p, q) => key(p) - key(q));
  const sb = [...b].sort((p, q) => key(p) - key(q));
  for (let k = 0; k < sa.length; k++) {
    expect(Math.abs(sa[k][0] - sb[k][0])).toBeLessThan(1e-9);
    expect(Math.abs(sa[k][1] - sb[k][1])).toBeLessThan(1e-9);
  }
}

/** The grid rotated 90° counter-clockwise: the point (x, y) goes to (H − y, x), H = height of the domain. */
function rotate(g: DensityGrid): DensityGrid {
  const { nx, ny, values } = g;
  const out = new Float64Array(nx * ny);
  for (let jn = 0; jn < nx; jn++) for (let inn = 0; inn < ny; inn++) out[jn * ny + inn] = values[(ny - 1 - inn) * nx + jn];
  return { ...g, nx: ny, ny: nx, values: out, cellSize: [g.cellSize[1], g.cellSize[0]] };
}

/** The grid mirrored left–right: (x, y) → (W − x, y). */
function mirror(g: DensityGrid): DensityGrid {
  const { nx, ny, values } = g;
  const out = new Float64Array(nx * ny);
  for (let j = 0; j < ny; j++) for (let i = 0; i < nx; i++) out[j * nx + i] = values[j * nx + (nx - 1 - i)];
  return { ...g, values: out };
}

const RULES: SaddleRule[] = ['decider', 'join', 'split'];

describe('contourGrid: symmetry and scale', () => {
  for (const rule of RULES) {
    for (const placement of ['cells', 'nodes'] as const) {
      it(`rotating or mirroring the grid rotates or mirrors the outline (${rule}, ${placement})`, () => {
        const g: DensityGrid = { ...smoothField(37, 23, 5, 2), placement };
        const W = placement === 'cells' ? g.nx : g.nx - 1;
        const H = placement === 'cells' ? g.ny : g.ny - 1;
        for (const L of [0.35, 0.5, 0.66]) {
          const s = contourGrid(g, L, rule);
          const r = contourGrid(rotate(g), L, rule);
          const m = contourGrid(mirror(g), L, rule);
          // analytic: rigid motions keep areas, counts and the vertex set (mapped)
          expect(polygonSetArea(r)).toBeCloseTo(polygonSetArea(s), 9);
          expect(polygonSetArea(m)).toBeCloseTo(polygonSetArea(s), 9);
          expect(r.polygons.length).toBe(s.polygons.length);
          expect(m.polygons.length).toBe(s.polygons.length);
          expectSameVertices(vertices(r), vertices(s, (x, y) => [H - y, x]));
          expectSameVertices(vertices(m), vertices(s, (x, y) => [W - x, y]));
        }
      });
    }
  }

  it('scaling the cell size scales every length; the origin translates', () => {
    const g = smoothField(40, 30, 9, 2);
    const k = 2.5;
    const scaled: DensityGrid = { ...g, cellSize: [k, k], origin: [10, -3] };
    for (const rule of RULES) {
      const s = contourGrid(g, 0.5, rule);
      const t = contourGrid(scaled, 0.5, rule);
      // analytic: similarity x → k·x + o scales lengths by k and areas by k²
      expect(polygonSetArea(t)).toBeCloseTo(k * k * polygonSetArea(s), 8);
      expect(polygonSetPerimeter(t)).toBeCloseTo(k * polygonSetPerimeter(s), 8);
      expectSameVertices(vertices(t), vertices(s, (x, y) => [k * x + 10, k * y - 3]));
    }
  });
});
