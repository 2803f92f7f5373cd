/**
 * Compares our raw contour with d3-contour 4.0.3 (ISC, github.com/d3/d3-contour), an independent
 * marching-squares implementation (docs/references.md §3.3).
 *
 * d3's frame: values row-major, value (i, j) at (i + 0.5, j + 0.5), x over [0, nx]; its rows are taken in the
 * order given, so with our bottom-up rows its y equals ours (h = 1, origin 0). Its corner test is `>=` (ties
 * solid, as ours), invalid values are below every level (as our NaN), and its saddle cells never join the
 * solid corners — our 'split' rule. d3 closes rings with blurred edge values, so the grids here have a void
 * border where the two edge treatments agree. d3 rings repeat the first point and use the opposite sign
 * convention for area (its exteriors are clockwise in our y-up frame), so only absolute areas are compared.
 */
import { describe, expect, it } from 'vitest';
import { contourGrid } from '../../src/contour/index.js';
import { ringArea } from '../../src/geom/area.js';
import type { DensityGrid } from '../../src/types.js';
import { makeGrid, smoothField } from '../contour/grids.js';

type D3Ring = [number, number][];
interface D3MultiPolygon {
  coordinates: D3Ring[][];
}
interface D3Contours {
  size(s: [number, number]): D3Contours;
  contour(values: ArrayLike<number>, threshold: number): D3MultiPolygon;
}
// d3-contour ships no type declarations: import it through a plain string and type the little we use.
const d3Name = 'd3-contour';
const { contours } = (await import(d3Name)) as { contours: () => D3Contours };

/** |area| of a d3 ring (closed: last point = first). */
function d3Area(ring: D3Ring): number {
  return Math.abs(ringArea(ring.slice(0, -1)));
}

interface Summary {
  polygons: number;
  holes: number;
  /** |outer area| − Σ|hole area| of each polygon, sorted. */
  areas: number[];
}

function ours(g: DensityGrid, L: number): Summary {
  const s = contourGrid(g, L, 'split');
  return {
    polygons: s.polygons.length,
    holes: s.polygons.reduce((n, p) => n + p.holes.length, 0),
    areas: s.polygons.map((p) => ringArea(p.outer) + p.holes.reduce((a, h) => a + ringArea(h), 0)).sort((a, b) => a - b),
  };
}

function theirs(g: DensityGrid, L: number): Summary {
  const mp = contours().size([g.nx, g.ny]).contour(Array.from(g.values), L);
  return {
    polygons: mp.coordinates.length,
    holes: mp.coordinates.reduce((n, p) => n + p.length - 1, 0),
    areas: mp.coordinates.map((p) => d3Area(p[0]) - p.slice(1).reduce((a, h) => a + d3Area(h), 0)).sort((a, b) => a - b),
  };
}

function compare(g: DensityGrid, L: number): void {
  const a = ours(g, L);
  const b = theirs(g, L);
  // d3-contour 4.0.3 on the same grid: same count of rings and holes, and the same area of every polygon
  // (outer minus its holes). Both interpolate x + (L − v0)/(v1 − v0) along edges, so the areas agree to
  // rounding; 1e-9 relative is far inside the 0.1 % a different interpolation would already exceed.
  expect(a.polygons).toBe(b.polygons);
  expect(a.holes).toBe(b.holes);
  for (let k = 0; k < a.areas.length; k++) expect(Math.abs(a.areas[k] - b.areas[k])).toBeLessThanOrEqual(1e-9 * b.areas[k]);
}

const clamp = (v: number) => Math.min(1, Math.max(0, v));

/** Sets the outermost `w` rows and columns to 0 (void border). */
function voidBorder(g: DensityGrid, w = 1): DensityGrid {
  const v = Float64Array.from(g.values);
  for (let j = 0; j < g.ny; j++)
    for (let i = 0; i < g.nx; i++) if (i < w || j < w || i >= g.nx - w || j >= g.ny - w) v[j * g.nx + i] = 0;
  return { ...g, values: v };
}

describe('contourGrid vs d3-contour (saddle rule split)', () => {
  it('disc', () => {
    const g = makeGrid(50, 40, (x, y) => clamp(0.5 + (14 - Math.hypot(x - 24.3, y - 19.1)) / 3));
    for (const L of [0.25, 0.5, 0.8]) compare(g, L);
  });

  it('annulus', () => {
    const g = makeGrid(50, 50, (x, y) => {
      const d = Math.hypot(x - 25, y - 25);
      return clamp(0.5 + Math.min(d - 8, 20 - d) / 3);
    });
    for (const L of [0.3, 0.5, 0.7]) compare(g, L);
  });

  it('binary blocks and a checkerboard patch (many saddles, exact ties at level 1)', () => {
    const g = voidBorder(makeGrid(24, 18, (_x, _y, i, j) => ((i >> 2) + (j >> 1)) % 2 === 0 || (i + j) % 2 === 0 ? 1 : 0));
    for (const L of [0.5, 1]) compare(g, L);
  });

  for (const seed of [101, 102, 103, 104, 105]) {
    it(`random blobs from a smoothed seeded random field (seed ${seed})`, () => {
      const g = voidBorder(smoothField(90, 70, seed, 3));
      for (const L of [0.35, 0.5, 0.65]) compare(g, L);
    });
  }

  it('NaN samples are holes in both', () => {
    const base = voidBorder(smoothField(60, 60, 201, 2));
    const v = Float64Array.from(base.values);
    for (let k = 0; k < v.length; k += 53) if (v[k] > 0) v[k] = NaN;
    compare({ ...base, values: v }, 0.4);
  });
});
