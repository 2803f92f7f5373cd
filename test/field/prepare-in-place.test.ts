/**
 * Preparing in place (prepareGrid `inPlace`, prepareStage `consume`, build's own read result): owned values are
 * reused, the caller's bytes are never written unless handed over, and every result and message is the same as
 * when a new array is written.
 */
import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { prepareGrid, type PrepareOptions } from '../../src/field/prepare.js';
import { prepareStage } from '../../src/field/stage.js';
import { loadGrid } from '../../src/input.js';
import { build, prepareBuild } from '../../src/pipeline.js';
import { readNpy } from '../../src/read/npy.js';
import { DEFAULT_READ_OPTIONS, type SamplePosition } from '../../src/read/types.js';
import { resolveSettings } from '../../src/settings.js';
import type { DensityGrid } from '../../src/types.js';
import { rhoformErrorOf } from '../support/errors.js';

const NPY = new URL('../../fixtures/npy/', import.meta.url);
const GRIDS = new URL('../../fixtures/grids/', import.meta.url);
const load = (url: URL): Uint8Array => new Uint8Array(readFileSync(url));

/** A 5×4 grid written top-down (file row 1 = grid row 3) or bottom-up, CSV-like positions. */
function fixture(values: number[], topDown: boolean) {
  const nx = 5;
  const ny = 4;
  const locate = (i: number, j: number): SamplePosition => {
    const r = topDown ? ny - 1 - j : j;
    return { fileRow: r + 1, fileCol: i + 1, where: { file: 'g.csv', line: r + 1, col: i + 1 } };
  };
  const grid: DensityGrid = { nx, ny, cellSize: [1, 1], origin: [0, 0], values: Float64Array.from(values), placement: 'cells' };
  return { grid, locate };
}

type Outcome = { values: number[]; rest: unknown } | { code: string; message: string; where: unknown };

function outcome(values: number[], topDown: boolean, o: PrepareOptions): Outcome {
  const { grid, locate } = fixture(values, topDown);
  try {
    const r = prepareGrid(grid, locate, o);
    if (o.inPlace) expect(r.grid.values).toBe(grid.values); // reused: no second array
    else expect(r.grid.values).not.toBe(grid.values);
    const { grid: g, ...rest } = r;
    return { values: Array.from(g.values), rest };
  } catch (e) {
    const err = rhoformErrorOf(() => {
      throw e;
    }, 'expected a RhoformError');
    return { code: err.code, message: err.message, where: err.where };
  }
}

describe('prepareGrid in place', () => {
  it('gives the same values, statistics, warnings and errors as a new array, over 600 random grids', () => {
    let seed = 987654321;
    const rand = () => (seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648;
    let errors = 0;
    for (let trial = 0; trial < 600; trial++) {
      const range = ([[0, 1], [0, 255], [-1, 1]] as [number, number][])[trial % 3];
      const values = Array.from({ length: 20 }, () => {
        const u = rand();
        if (u < 0.04) return NaN;
        if (u < 0.06) return rand() < 0.5 ? Infinity : -Infinity;
        return range[0] + (range[1] - range[0]) * (rand() * 1.3 - 0.15); // overshoots beyond 0.05 too
      });
      const topDown = trial % 2 === 0;
      const o: PrepareOptions = { valueRange: range, clip: trial % 5 === 0, nonFinite: trial % 7 === 0 ? 'void' : 'error' };
      const copied = outcome(values, topDown, o);
      const inPlace = outcome(values, topDown, { ...o, inPlace: true });
      expect(inPlace).toEqual(copied);
      if ('code' in copied) errors++;
    }
    expect(errors).toBeGreaterThan(100); // the error paths were exercised, not only the results
  });

  // Positions by hand: with row order top-down, file row 1 is grid row 3 (indices 15–19).
  for (const inPlace of [false, true]) {
    it(`names the first non-finite value in file order, both row orders (inPlace ${inPlace})`, () => {
      const v = new Array<number>(20).fill(0.5);
      v[2] = NaN; // grid row 0: file row 4 (top-down) or 1 (bottom-up)
      v[11] = -Infinity; // grid row 2, col 2: file row 2 (top-down)
      v[13] = Infinity; // grid row 2, col 4
      const o: PrepareOptions = { valueRange: [0, 1], clip: false, nonFinite: 'error', inPlace };
      const top = fixture(v, true);
      const e1 = rhoformErrorOf(() => prepareGrid(top.grid, top.locate, o), 'top-down');
      expect(e1.code).toBe('E_GRID_NONFINITE');
      expect(e1.message).toBe('g.csv:2:2: expected finite densities, found -Infinity (3 non-finite values in all; use --non-finite void to treat them as void)');
      const bottom = fixture(v, false);
      const e2 = rhoformErrorOf(() => prepareGrid(bottom.grid, bottom.locate, o), 'bottom-up');
      expect(e2.message).toBe('g.csv:1:3: expected finite densities, found NaN (3 non-finite values in all; use --non-finite void to treat them as void)');
    });

    it(`names the worst overshoot with its raw value (inPlace ${inPlace})`, () => {
      const v = new Array<number>(20).fill(128);
      v[4] = 300; // excess (300/255 − 1) = 0.176
      v[17] = -60; // excess 60/255 = 0.235: the worst; grid row 3 = file row 1 (top-down), col 3
      const { grid, locate } = fixture(v, true);
      const e = rhoformErrorOf(() => prepareGrid(grid, locate, { valueRange: [0, 255], clip: false, nonFinite: 'error', inPlace }), 'range');
      expect(e.code).toBe('E_GRID_RANGE');
      expect(e.message).toBe('g.csv:1:3: expected values within 0..255 (overshoot up to 0.05 of the range is clipped), found -60 (2 values beyond that; use --clip to clip them, or --value-range)');
    });
  }
});

describe('the first non-finite value of a numpy file, in place or not', () => {
  it('points at numpy’s first non-finite element in row-major order (nonfinite-f8-le.npy)', () => {
    // numpy 2.4 (fixtures/npy/manifest.json): np.argwhere(~np.isfinite(a))[0] = (0, 0), a NaN at byte 128, and
    // np.count_nonzero(~np.isfinite(a)) = 5; the first in grid order (bottom row first) would be (1, 1), byte 176
    for (const consumeBytes of [false, true]) {
      const read = readNpy(load(new URL('nonfinite-f8-le.npy', NPY)), { ...DEFAULT_READ_OPTIONS, consumeBytes });
      const e = rhoformErrorOf(
        () => prepareGrid(read.grid, read.locate, { valueRange: [0, 1], clip: true, nonFinite: 'error', inPlace: read.ownsValues }),
        'non-finite',
      );
      expect(e.where).toEqual({ byteOffset: 128 });
      expect(e.message).toContain('found NaN (5 non-finite values in all');
    }
  });
});

describe('prepareStage and build: who may write what', () => {
  const settings = resolveSettings({ formats: ['dxf', 'svg', 'json'], valueRange: [-0.1, 1.2] });

  it('prepareStage reuses owned values only when the read is handed over', () => {
    const bytes = load(new URL('realistic-cantilever-100x50.npy', GRIDS));
    const input = { name: 'c.npy', bytes };
    const kept = loadGrid(input, settings);
    const raw = Float64Array.from(kept.grid.values);
    const a = prepareStage(input, kept, settings, null);
    expect(a.grid.values.buffer).not.toBe(kept.grid.values.buffer);
    expect(kept.grid.values).toEqual(raw); // not consumed: left as read
    const given = loadGrid(input, settings);
    expect(given.ownsValues).toBe(true);
    const b = prepareStage(input, given, settings, null, { consume: true });
    expect(b.grid.values).toBe(given.grid.values); // the reader's copy, prepared in place
    expect(Array.from(b.grid.values)).toEqual(Array.from(a.grid.values));
    expect(b.input).toEqual(a.input);
    expect(b.warnings).toEqual(a.warnings);
  });

  it("build never writes the caller's bytes unless they are consumable, and the outputs are the same", async () => {
    await prepareBuild(settings);
    const file = load(new URL('realistic-cantilever-100x50.npy', GRIDS));
    // sha256sum (GNU coreutils 9) of the fixture as committed
    const SHA = '5d5ced1da6397385f2ff2e7e8f97ebd1bc3a97b1634e519293c90a74c7a9b062';
    const runs = [];
    for (const rowOrder of ['top-down', 'bottom-up'] as const) {
      const s = { ...settings, rowOrder };
      const bytes = Uint8Array.from(file);
      const kept = build({ name: 'c.npy', bytes }, s);
      expect(bytes).toEqual(file); // bottom-up: the grid was a view of these bytes, prepared into a new array
      const handed = Uint8Array.from(file);
      const consumed = build({ name: 'c.npy', bytes: handed, consumable: true }, s);
      if (rowOrder === 'top-down') expect(handed).not.toEqual(file); // the rows were flipped inside the buffer
      for (const r of [kept, consumed]) expect(r.report.input.sha256).toBe(SHA);
      expect(consumed.dxf()).toBe(kept.dxf());
      expect(consumed.svg()).toBe(kept.svg());
      const { timings: _t1, ...a } = kept.report;
      const { timings: _t2, ...b } = consumed.report;
      expect(b).toEqual(a);
      runs.push(kept.dxf());
    }
    expect(createHash('sha256').update(runs[0]).digest('hex')).not.toBe(createHash('sha256').update(runs[1]).digest('hex')); // the two row orders are different parts
  });
});
