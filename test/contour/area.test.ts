import { describe, expect, it } from 'vitest';
import {
  bandCellArea,
  packBand,
  contourGrid,
  levelBandModel,
  BAND_STRIDE,
  regionArea,
  type SaddleRule,
} from '../../src/contour/index.js';
import { polygonSetArea } from '../../src/geom/area.js';
import type { DensityGrid } from '../../src/types.js';
import { makeGrid, smoothField } from './grids.js';

const RULES: SaddleRule[] = ['decider', 'join', 'split'];

/** Random smooth fields: void border, material at the edge, NaN holes, nodal placement, odd cell sizes. */
function fields(): { name: string; g: DensityGrid }[] {
  const a = smoothField(60, 40, 11, 2);
  const b = smoothField(45, 70, 12, 3, 2);
  const c = smoothField(50, 50, 13, 2);
  const cv = Float64Array.from(c.values);
  for (let k = 0; k < cv.length; k += 37) cv[k] = NaN;
  const d = smoothField(41, 31, 14, 3);
  return [
    { name: 'edge-touching', g: { ...a, cellSize: [0.7, 1.3], origin: [5, -2] } },
    { name: 'void border', g: b },
    { name: 'with NaN', g: { ...c, values: cv } },
    { name: 'nodal', g: { ...d, placement: 'nodes', cellSize: [2, 2] } },
  ];
}

describe('regionArea', () => {
  for (const { name, g } of fields()) {
    for (const rule of RULES) {
      it(`equals the stitched polygon area (${name}, ${rule})`, () => {
        for (const L of [0.2, 0.45, 0.5, 0.71]) {
          const poly = polygonSetArea(contourGrid(g, L, rule));
          const cells = regionArea(g, L, rule);
          expect(poly).toBeGreaterThan(0);
          // shoelace over the stitched rings vs the cell-by-cell sum: same geometry, two ways (1e-9 relative)
          expect(Math.abs(cells - poly) / poly).toBeLessThan(1e-9);
        }
      });
    }
  }

  it('depends on the saddle rule exactly as the contour does', () => {
    const g = smoothField(40, 40, 21, 1);
    const areas = RULES.map((r) => regionArea(g, 0.5, r));
    // joining solid corners adds area, splitting removes it (definition of the two cuts of a saddle cell)
    expect(areas[1]).toBeGreaterThanOrEqual(areas[0]);
    expect(areas[0]).toBeGreaterThanOrEqual(areas[2]);
    expect(areas[1]).toBeGreaterThan(areas[2]);
  });
});

describe('area cell by cell (the band of the level search)', () => {
  for (const { name, g } of fields()) {
    it(`cells add up to regionArea, full and empty cells by their corner range (${name})`, () => {
      // Every cell meets the bracket (−∞, ∞): the band is the whole lattice.
      const all = packBand(g, -Infinity, Infinity);
      expect(all.fullBase).toBe(0);
      // analytic: the cells tile the domain rectangle
      let tiled = 0;
      for (let k = 0; k < all.count; k++) tiled += all.buf[BAND_STRIDE * k + 4] * all.buf[BAND_STRIDE * k + 5];
      const cx = g.placement === 'nodes' ? g.nx - 1 : g.nx;
      const cy = g.placement === 'nodes' ? g.ny - 1 : g.ny;
      expect(tiled).toBeCloseTo(cx * cy * g.cellSize[0] * g.cellSize[1], 9);
      for (const rule of RULES) {
        for (const L of [0.3, 0.55]) {
          let sum = 0;
          for (let k = 0; k < all.count; k++) {
            const o = BAND_STRIDE * k;
            const a = bandCellArea(all.buf, o, L, rule);
            if (all.buf[o + 6] >= L) expect(a).toBe(all.buf[o + 4] * all.buf[o + 5]);
            else if (all.buf[o + 7] < L) expect(a).toBe(0);
            sum += a;
          }
          expect(Math.abs(sum / regionArea(g, L, rule) - 1)).toBeLessThan(1e-12);
        }
      }
    });
  }

  it('the straddling cells alone give the area over a level bracket', () => {
    // the use in the level search: A(L) = Σ full cells (min ≥ hi) + Σ straddling cells, for lo ≤ L ≤ hi
    const g = smoothField(80, 60, 31, 3);
    const band = packBand(g, 0.4, 0.6);
    expect(band.count).toBeLessThan(packBand(g, -Infinity, Infinity).count);
    for (const L of [0.4, 0.47, 0.6]) {
      let a = band.fullBase;
      for (let k = 0; k < band.count; k++) a += bandCellArea(band.buf, BAND_STRIDE * k, L, 'decider');
      expect(Math.abs(a / regionArea(g, L, 'decider') - 1)).toBeLessThan(1e-12);
    }
  });

  it('the band model (histogram + packed cells) gives regionArea for every level in its bracket, all saddle rules', () => {
    const g = smoothField(30, 30, 41, 1);
    for (const rule of RULES) {
      const m = levelBandModel(g, rule);
      const h = m.histogram(64);
      // The histograms account for every cell: their totals are the domain area.
      expect(h.minHist.reduce((x, y) => x + y, 0)).toBeCloseTo(h.total, 9);
      expect(h.maxHist.reduce((x, y) => x + y, 0)).toBeCloseTo(h.total, 9);
      expect(h.total).toBeCloseTo(30 * 30, 9);
      const band = m.pack(0.4, 0.6);
      for (const L of [0.4, 0.45, 0.5, 0.6]) {
        let a = band.fullBase;
        for (let k = 0; k < band.count; k++) a += m.packedArea(band.buf, BAND_STRIDE * k, L);
        expect(Math.abs(a / regionArea(g, L, rule) - 1)).toBeLessThan(1e-12);
      }
    }
  });

  it('NaN samples make the cell range reach −∞', () => {
    const g = makeGrid(3, 3, (_x, _y, i, j) => (i === 1 && j === 1 ? NaN : 1));
    // 3×3 cell-centred samples → a 4×4 lattice of cells; cell (1, 1) has the NaN sample as a corner.
    const all = packBand(g, -Infinity, Infinity);
    expect(all.count).toBe(16);
    const o = BAND_STRIDE * (1 * 4 + 1);
    expect(all.buf[o + 6]).toBe(-Infinity);
    expect(all.buf[o + 7]).toBe(1);
  });
});
