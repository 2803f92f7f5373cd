import { describe, expect, it } from 'vitest';
import { bandCellBound, cellRangeHistogram, packBand } from '../../src/contour/index.js';
import type { DensityGrid } from '../../src/types.js';
import { latticeCellCorners, makeGrid, rng, smoothField } from './grids.js';

/**
 * Cells of the area lattice whose corner range meets [lo, hi], from their corners as docs/contour.md defines them
 * (latticeCellCorners): independent of src/contour's row streaming.
 */
function countMeeting(g: DensityGrid, lo: number, hi: number): number {
  return latticeCellCorners(g).filter((c) => !(Math.min(...c) >= hi) && !(Math.max(...c) < lo)).length;
}

function withNaN(g: DensityGrid, every: number): DensityGrid {
  const v = Float64Array.from(g.values);
  for (let k = 0; k < v.length; k += every) v[k] = NaN;
  return { ...g, values: v };
}

/** min and max of the samples without NaN, as the level search passes them (src/threshold/choose.ts). */
function range(g: DensityGrid): [number, number] {
  let lo = Infinity;
  let hi = -Infinity;
  for (const v of g.values) if (!Number.isNaN(v)) { lo = Math.min(lo, v); hi = Math.max(hi, v); }
  return [lo, hi];
}

describe('the band bound from the histogram (sizes the packed band at once)', () => {
  const fields: { name: string; g: DensityGrid }[] = [
    { name: 'smooth', g: smoothField(70, 50, 3, 2) },
    { name: 'rough, rectangular cells', g: { ...smoothField(41, 63, 5, 0), cellSize: [0.3, 1.7] } },
    { name: 'with NaN', g: withNaN(smoothField(50, 40, 7, 1), 13) },
    { name: 'nodal', g: { ...smoothField(33, 29, 9, 2), placement: 'nodes' } },
    { name: 'plateaus (values repeat exactly at bin edges)', g: makeGrid(64, 48, (_x, _y, i, j) => Math.round(((i * 7 + j * 3) % 17) / 16 * 8) / 8) },
  ];
  for (const { name, g } of fields) {
    it(`is never below the cells a bracket packs, and equals a counting pass's count where it must (${name})`, () => {
      const r = rng(101);
      for (const bins of [16, 1024]) {
        for (const bounds of [undefined, range(g)] as const) {
          const h = cellRangeHistogram(g, bins, bounds);
          const span = h.gmax - h.gmin;
          const edge = (k: number) => h.gmin + (k * span) / bins;
          // brackets as the search makes them (bin edges), random ones, and the whole range
          const brackets: [number, number][] = [[-Infinity, Infinity], [h.gmin, h.gmax]];
          for (let t = 0; t < 40; t++) {
            const a = Math.floor(r() * bins);
            const b = a + 1 + Math.floor(r() * (bins - a));
            brackets.push([edge(a), edge(b)]);
            const x = h.gmin + r() * span;
            brackets.push([x, x + r() * (h.gmax - x)]);
          }
          for (const [lo, hi] of brackets) {
            const counted = countMeeting(g, lo, hi);
            expect(packBand(g, lo, hi).count).toBe(counted);
            const bound = bandCellBound(h, lo, hi);
            expect(bound).toBeGreaterThanOrEqual(counted);
            expect(bound).toBeLessThanOrEqual(h.cells);
          }
          // every cell meets the whole range: nothing can be left out
          expect(bandCellBound(h, -Infinity, Infinity)).toBe(countMeeting(g, -Infinity, Infinity));
        }
      }
    });
  }

  it('is tight to within the cells of the two bins at the bracket ends (a smooth field, 1024 bins)', () => {
    const g = smoothField(120, 90, 17, 3);
    const h = cellRangeHistogram(g, 1024, range(g));
    const edge = (k: number) => h.gmin + (k * (h.gmax - h.gmin)) / 1024;
    const lo = edge(400);
    const hi = edge(600);
    const counted = countMeeting(g, lo, hi);
    // slack: at most the cells whose smallest corner bins at hi's bin or whose largest bins at lo's bin
    expect(bandCellBound(h, lo, hi) - counted).toBeLessThanOrEqual(h.minCount[600] + h.maxCount[399] + h.maxCount[400]);
  });

  it('a capacity below the band only costs a regrowth: same cells, same order', () => {
    const g = smoothField(60, 60, 23, 1);
    const sized = packBand(g, 0.3, 0.7);
    for (const capacity of [0, 1, 17, sized.count - 1]) {
      const small = packBand(g, 0.3, 0.7, capacity);
      expect(small.count).toBe(sized.count);
      expect(small.fullBase).toBe(sized.fullBase);
      expect(Array.from(small.buf.subarray(0, 8 * small.count))).toEqual(Array.from(sized.buf.subarray(0, 8 * sized.count)));
    }
  });
});
