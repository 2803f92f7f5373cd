import { describe, expect, it } from 'vitest';
import { prepareGrid } from '../../src/field/prepare.js';
import type { SamplePosition } from '../../src/read/types.js';
import type { DensityGrid } from '../../src/types.js';
import { rhoformErrorOf } from '../support/errors.js';

// prepareGrid runs its pass in blocks of samples (src/field/prepare-pass.ts); these grids span several blocks
// with the odd samples on and around the block edges. The oracle is the definition in prepare.ts's docs,
// applied sample by sample in grid order: map (raw − lo)/(hi − lo), non-finite → 0, clip into [0, 1]; the mean
// is the plain sum in grid order over the count (analytic, no source needed).
const nx = 1000;
const ny = 9; // 9000 samples: four full blocks and part of a fifth
const locate = (i: number, j: number): SamplePosition => ({ fileRow: ny - j, fileCol: i + 1, where: { file: 'b.csv', line: ny - j, col: i + 1 } });

function field(odd: Record<number, number>): DensityGrid {
  const values = new Float64Array(nx * ny);
  for (let k = 0; k < values.length; k++) values[k] = ((k * 7919) % 1000) / 999;
  for (const [k, v] of Object.entries(odd)) values[+k] = v;
  return { nx, ny, cellSize: [1, 1], origin: [0, 0], values, placement: 'cells' };
}

function definition(values: Float64Array, lo: number, hi: number) {
  const out = new Float64Array(values.length);
  let sum = 0, nonFinite = 0, clipped = 0, min = Infinity, max = -Infinity;
  for (let k = 0; k < values.length; k++) {
    const raw = values[k];
    let v: number;
    if (!Number.isFinite(raw)) {
      nonFinite++;
      v = 0;
    } else {
      v = lo === 0 && hi === 1 ? raw : (raw - lo) * (1 / (hi - lo));
      if (v < 0 || v > 1) {
        clipped++;
        v = v < 0 ? 0 : 1;
      }
      sum += v;
    }
    out[k] = v;
    if (v < min) min = v;
    if (v > max) max = v;
  }
  return { out, mean: sum / values.length, nonFinite, clipped, min, max };
}

// samples on, just before and just after the block edges (multiples of 2048), and the last one
const edges = [0, 2047, 2048, 2049, 4095, 4096, 6143, 6144, 8191, 8192, 8999];

describe('prepare over several blocks', () => {
  it('non-finite and clipped samples at block edges give the definition, value by value', () => {
    const odd: Record<number, number> = {};
    edges.forEach((k, n) => (odd[k] = [NaN, Infinity, -Infinity, 1.2, -0.3, 1.01, -0.02][n % 7]));
    for (const inPlace of [false, true]) {
      const g = field(odd);
      const want = definition(g.values, 0, 1);
      const r = prepareGrid(g, locate, { valueRange: [0, 1], clip: true, nonFinite: 'void', inPlace });
      expect(r.nonFinite).toBe(want.nonFinite);
      expect(r.clipped).toBe(want.clipped);
      expect(r.min).toBe(want.min);
      expect(r.max).toBe(want.max);
      expect(r.mean).toBe(want.mean);
      expect(Array.from(r.grid.values)).toEqual(Array.from(want.out));
    }
  });
  it('a mapped range over several blocks: the same values and mean as the definition', () => {
    const g = field({ 2048: 1.25, 4095: -0.1, 6144: 1.2 });
    const want = definition(g.values, -0.1, 1.2);
    const r = prepareGrid(g, locate, { valueRange: [-0.1, 1.2], clip: false, nonFinite: 'error' });
    expect(r.clipped).toBe(want.clipped);
    expect(r.mean).toBe(want.mean);
    expect(Array.from(r.grid.values)).toEqual(Array.from(want.out));
  });
  it('names the first non-finite sample in file order when it lies in a later block', () => {
    // grid rows 2 (k 2048 … 2999) and 8 (k 8000 …); the file lists row 8 first (top row first)
    const e = rhoformErrorOf(() => prepareGrid(field({ 2049: NaN, 8191: Infinity, 8192: NaN }), locate, { valueRange: [0, 1], clip: false, nonFinite: 'error' }), 'expected a RhoformError');
    expect(e.code).toBe('E_GRID_NONFINITE');
    // k = 8191 is (i 191, j 8): file line 1, column 192
    expect(e.message).toMatch(/^b\.csv:1:192: expected finite densities, found Infinity \(3 non-finite values/);
  });
  it('names the worst overshoot when it lies in a later block', () => {
    const e = rhoformErrorOf(() => prepareGrid(field({ 100: 1.3, 6143: 1.9, 8500: -0.5 }), locate, { valueRange: [0, 1], clip: false, nonFinite: 'error' }), 'expected a RhoformError');
    expect(e.code).toBe('E_GRID_RANGE');
    // k = 6143 is (i 143, j 6): file line 3, column 144
    expect(e.message).toMatch(/^b\.csv:3:144: .*found 1\.9 \(3 values beyond that/);
  });
});
