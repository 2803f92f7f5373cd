import { describe, expect, it } from 'vitest';
import { locator } from '../../src/check/locate.js';
import { fieldMean, gridDomain } from '../../src/field/mean.js';
import { mirrorPlanes, unfoldGrid, unfoldLocate } from '../../src/field/mirror.js';
import { readCsv } from '../../src/read/csv.js';
import { DEFAULT_READ_OPTIONS } from '../../src/read/types.js';
import type { MirrorEdge } from '../../src/settings.js';
import type { DensityGrid } from '../../src/types.js';

// Sources: the geometry of a reflection (analytic: the image of (x, y) in the plane x = a is (2a − x, y)) and,
// for file positions, the CSV text itself (row r, column c of the text). Cell sizes and origins are binary
// fractions so that sample coordinates are exact and values can be compared exactly.

/** A field that tells every point apart (not symmetric in anything): f(x, y) = x·1000 + y + 0.25. */
const f = (x: number, y: number) => x * 1000 + y + 0.25;

/** A grid of f at the sample positions of its placement (cells: centres; nodes: corners). */
function gridOf(nx: number, ny: number, placement: 'cells' | 'nodes', h: [number, number], origin: [number, number]): DensityGrid {
  const off = placement === 'cells' ? 0.5 : 0;
  const values = new Float64Array(nx * ny);
  for (let j = 0; j < ny; j++) for (let i = 0; i < nx; i++) values[j * nx + i] = f(origin[0] + (i + off) * h[0], origin[1] + (j + off) * h[1]);
  return { nx, ny, cellSize: h, origin, values, placement };
}

/** Sample position (mm) of index (i, j) of a grid. */
function samplePos(g: DensityGrid, i: number, j: number): [number, number] {
  const off = g.placement === 'cells' ? 0.5 : 0;
  return [g.origin[0] + (i + off) * g.cellSize[0], g.origin[1] + (j + off) * g.cellSize[1]];
}

/** Fold a point of the unfolded domain back into the input domain: reflect it in every plane it lies beyond. */
function foldBack(g: DensityGrid, edges: readonly MirrorEdge[], x: number, y: number): [number, number] {
  for (const p of mirrorPlanes(g, edges)) {
    const v = p.axis === 'x' ? x : y;
    const beyond = p.keep === 'above' ? v < p.at : v > p.at;
    const r = beyond ? 2 * p.at - v : v; // analytic: reflection in the line axis = at
    if (p.axis === 'x') x = r;
    else y = r;
  }
  return [x, y];
}

const CASES: { edges: MirrorEdge[]; placement: 'cells' | 'nodes' }[] = [];
for (const placement of ['cells', 'nodes'] as const) {
  for (const edges of [['left'], ['right'], ['bottom'], ['top'], ['left', 'bottom'], ['top', 'right']] as MirrorEdge[][]) {
    CASES.push({ edges, placement });
  }
}

describe('unfoldGrid', () => {
  for (const { edges, placement } of CASES) {
    it(`${placement}, --mirror ${edges.join(' --mirror ')}: every sample equals the input at its reflected position`, () => {
      const nx = 7;
      const ny = 5;
      const h: [number, number] = [0.5, 0.25];
      const origin: [number, number] = [2, -1.5];
      const g = gridOf(nx, ny, placement, h, origin);
      const before = g.values.slice();
      const u = unfoldGrid(g, edges);
      const shared = placement === 'nodes' ? 1 : 0;
      const horizontal = edges.some((e) => e === 'left' || e === 'right');
      const vertical = edges.some((e) => e === 'bottom' || e === 'top');
      // sizes: cells double, nodes share the plane's samples (2n − 1)
      expect(u.nx).toBe(horizontal ? 2 * nx - shared : nx);
      expect(u.ny).toBe(vertical ? 2 * ny - shared : ny);
      expect(u.cellSize).toEqual(h);
      expect(u.placement).toBe(placement);
      // origin: the image lies beyond the named edge, so left/bottom move the origin by −W / −H
      const W = (nx - shared) * h[0];
      const H = (ny - shared) * h[1];
      expect(u.origin).toEqual([origin[0] - (edges.includes('left') ? W : 0), origin[1] - (edges.includes('bottom') ? H : 0)]);
      // the unfolded domain is the input domain and its mirror image
      const d = gridDomain(g);
      const du = gridDomain(u);
      expect(du[2] - du[0]).toBe(horizontal ? 2 * W : W);
      expect(du[3] - du[1]).toBe(vertical ? 2 * H : H);
      // values: analytic reflection of the sample position, evaluated with the same formula as the input
      for (let j = 0; j < u.ny; j++)
        for (let i = 0; i < u.nx; i++) {
          const [x, y] = foldBack(g, edges, ...samplePos(u, i, j));
          expect(x).toBeGreaterThanOrEqual(d[0]);
          expect(x).toBeLessThanOrEqual(d[2]);
          expect(y).toBeGreaterThanOrEqual(d[1]);
          expect(y).toBeLessThanOrEqual(d[3]);
          expect(u.values[j * u.nx + i]).toBe(f(x, y));
        }
      // the input is not modified (and not shared)
      expect(g.values).toEqual(before);
      expect(u.values).not.toBe(g.values);
    });
  }

  it('the unfolded mean equals the input mean, cells and nodes (analytic: each sample is copied, plane nodes weigh double)', () => {
    for (const placement of ['cells', 'nodes'] as const) {
      const g = gridOf(9, 6, placement, [1, 1], [0, 0]);
      for (const edges of [['right'], ['left', 'top']] as MirrorEdge[][]) {
        const m0 = fieldMean(g);
        expect(Math.abs(fieldMean(unfoldGrid(g, edges)) - m0) / m0).toBeLessThan(1e-12);
      }
    }
  });

  it('the result is exactly symmetric sample by sample (analytic: reflection of indices)', () => {
    const g = gridOf(6, 4, 'cells', [1, 1], [0, 0]);
    const u = unfoldGrid(g, ['left', 'bottom']);
    for (let j = 0; j < u.ny; j++)
      for (let i = 0; i < u.nx; i++) {
        const v = u.values[j * u.nx + i];
        expect(u.values[j * u.nx + (u.nx - 1 - i)]).toBe(v);
        expect(u.values[(u.ny - 1 - j) * u.nx + i]).toBe(v);
      }
  });

  it('edge order does not matter for a quarter model; no edges copy the grid', () => {
    const g = gridOf(5, 3, 'nodes', [1, 1], [0, 0]);
    const a = unfoldGrid(g, ['left', 'bottom']);
    const b = unfoldGrid(g, ['bottom', 'left']);
    expect(b.values).toEqual(a.values);
    expect(b.origin).toEqual(a.origin);
    const c = unfoldGrid(g, []);
    expect(c.values).toEqual(g.values);
    expect(c.values).not.toBe(g.values);
  });

  it('refuses both edges of one axis and a repeated edge (a usage error, as cli/args.ts refuses them)', () => {
    const g = gridOf(3, 3, 'cells', [1, 1], [0, 0]);
    expect(() => unfoldGrid(g, ['left', 'right'])).toThrow(/at most one of left\/right/);
    expect(() => unfoldGrid(g, ['top', 'top'])).toThrow(/at most one of bottom\/top/);
  });
});

describe('mirrorPlanes', () => {
  it('names the plane in the input frame and the side of the input (analytic: the domain edges)', () => {
    const g = gridOf(10, 4, 'cells', [0.5, 2], [1, 3]);
    // domain [1, 3] … [6, 11]
    expect(mirrorPlanes(g, ['left', 'top'])).toEqual([
      { axis: 'x', at: 1, keep: 'above' },
      { axis: 'y', at: 11, keep: 'below' },
    ]);
    expect(mirrorPlanes(g, ['bottom', 'right'])).toEqual([
      { axis: 'y', at: 3, keep: 'above' },
      { axis: 'x', at: 6, keep: 'below' },
    ]);
    const n = gridOf(10, 4, 'nodes', [0.5, 2], [0, 0]);
    expect(mirrorPlanes(n, ['right', 'top'])).toEqual([
      { axis: 'x', at: 4.5, keep: 'below' },
      { axis: 'y', at: 6, keep: 'below' },
    ]);
  });
});

describe('unfoldLocate', () => {
  // A 3-row × 4-column CSV (row 1 = top of the part); each value names its own text row and column.
  const text = ['0.11,0.12,0.13,0.14', '0.21,0.22,0.23,0.24', '0.31,0.32,0.33,0.34'].join('\n') + '\n';
  const fileValue = (row: number, col: number) => Number(text.split('\n')[row - 1].split(',')[col - 1]);

  for (const values of ['cells', 'nodes'] as const) {
    for (const edges of [['left'], ['top'], ['right', 'bottom']] as MirrorEdge[][]) {
      it(`${values}, ${edges.join('+')}: a sample of the unfolded grid points at the file cell it is a copy of (source: the CSV text)`, () => {
        const read = readCsv(text, { ...DEFAULT_READ_OPTIONS, values });
        const u = unfoldGrid(read.grid, edges);
        const loc = unfoldLocate(read.locate, read.grid, edges);
        for (let j = 0; j < u.ny; j++)
          for (let i = 0; i < u.nx; i++) {
            const p = loc(i, j);
            expect(fileValue(p.fileRow, p.fileCol)).toBe(u.values[j * u.nx + i]);
          }
      });
    }
  }

  it('through the check locator: a point in the mirrored half maps to the file cell of its mirror point', () => {
    const read = readCsv(text, { ...DEFAULT_READ_OPTIONS, cellSize: [2, 2] });
    const edges: MirrorEdge[] = ['left'];
    const u = unfoldGrid(read.grid, edges);
    const where = locator(u, unfoldLocate(read.locate, read.grid, edges));
    const direct = locator(read.grid, read.locate);
    // points at cell centres of the image (x < 0) and their reflections (analytic: x ↦ −x about the plane x = 0)
    for (const [x, y] of [[-1, 1], [-7, 5], [-3, 3]] as const) {
      expect(where(x, y)).toEqual(direct(-x, y));
    }
    // a point in the input half keeps its own file cell
    expect(where(5, 1)).toEqual(direct(5, 1));
  });
});
