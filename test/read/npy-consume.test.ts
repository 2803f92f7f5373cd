/**
 * Handing the file's bytes over (`consumeBytes`, `InputFile.consumable`): the NPY reader flips aligned
 * little-endian f8 C-order rows inside the caller's buffer and returns a view of it; everything else is read as
 * before. Expected values are numpy 2.4's (fixtures/npy/manifest.json, fixtures/make/make_npy_fixtures.py).
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { loadGrid } from '../../src/input.js';
import { npyInPlaceBytes, readNpy, readNpyWith } from '../../src/read/npy.js';
import { DEFAULT_READ_OPTIONS, type ReadOptions } from '../../src/read/types.js';
import { resolveSettings } from '../../src/settings.js';
import { expectedGrid, load, manifest, type OkEntry } from './npy-manifest.js';

const opts = (o: Partial<ReadOptions> = {}): ReadOptions => ({ ...DEFAULT_READ_OPTIONS, ...o });

/** Little-endian f8 in C order at an 8-byte aligned offset: the case read in place. */
const inPlaceCase = (e: OkEntry): boolean => e.descr === '<f8' && !e.fortran && e.dataOffset % 8 === 0;

describe('readNpy with consumeBytes', () => {
  it('covers files read in place and files copied (the matrix has aligned <f8 C order and others)', () => {
    expect(manifest.ok.filter(inPlaceCase).length).toBeGreaterThanOrEqual(3);
    expect(manifest.ok.filter((e) => !inPlaceCase(e)).length).toBeGreaterThanOrEqual(3);
  });

  for (const e of manifest.ok) {
    it(`reads ${e.file} (${e.descr}, ${e.fortran ? 'F' : 'C'}) as numpy does, and owns its values`, () => {
      for (const rowOrder of ['top-down', 'bottom-up'] as const) {
        const bytes = load(e.file);
        const res = readNpy(bytes, opts({ rowOrder, consumeBytes: true }));
        // numpy 2.4 values, -0, NaN and ±Infinity kept (toEqual uses Object.is)
        expect(Array.from(res.grid.values)).toEqual(expectedGrid(e, rowOrder === 'top-down'));
        expect(res.ownsValues).toBe(true);
        const view = res.grid.values.buffer === bytes.buffer;
        expect(view).toBe(inPlaceCase(e));
        if (view) expect(res.grid.values.byteOffset).toBe(bytes.byteOffset + e.dataOffset);
        // the header is left as it is: locate still reads numpy's offsets from it
        expect(res.locate(0, rowOrder === 'top-down' ? e.rows - 1 : 0).where.byteOffset).toBe(e.dataOffset);
      }
    });
  }

  it('swaps every row pair of an odd and an even row count in place (the middle row stays)', () => {
    // m-f8-le-C-v1.npy and big-endian-f8's shapes differ; a hand-made odd count checks the middle row
    for (const rows of [1, 2, 3, 7]) {
      const cols = 3;
      const header = "{'descr': '<f8', 'fortran_order': False, 'shape': (" + rows + ', ' + cols + '), }';
      const pad = 64 - ((10 + header.length + 1) % 64);
      const head = header + ' '.repeat(pad) + '\n';
      const bytes = new Uint8Array(10 + head.length + rows * cols * 8);
      bytes.set([0x93, 0x4e, 0x55, 0x4d, 0x50, 0x59, 1, 0, head.length & 0xff, head.length >> 8]);
      for (let k = 0; k < head.length; k++) bytes[10 + k] = head.charCodeAt(k);
      const data = new Float64Array(bytes.buffer, 10 + head.length, rows * cols);
      for (let k = 0; k < data.length; k++) data[k] = k; // array row r holds r·cols … r·cols + cols − 1
      const res = readNpy(bytes, opts({ consumeBytes: true }));
      expect(res.grid.values.buffer).toBe(bytes.buffer);
      for (let j = 0; j < rows; j++) {
        const r = rows - 1 - j; // top-down: grid row j is array row rows − 1 − j (NEP 1 row-major order)
        expect(Array.from(res.grid.values.subarray(j * cols, (j + 1) * cols))).toEqual([r * cols, r * cols + 1, r * cols + 2]);
      }
    }
  });

  it('without consumeBytes never writes the bytes, and says when the values are a view of them', () => {
    for (const e of manifest.ok) {
      for (const rowOrder of ['top-down', 'bottom-up'] as const) {
        const bytes = load(e.file);
        const before = Uint8Array.from(bytes);
        const res = readNpy(bytes, opts({ rowOrder }));
        expect(bytes).toEqual(before);
        const view = res.grid.values.buffer === bytes.buffer;
        // only the zero-copy view of bottom-up aligned <f8 C-order data shares memory with the caller
        expect(view).toBe(inPlaceCase(e) && rowOrder === 'bottom-up');
        expect(res.ownsValues).toBe(!view);
      }
    }
  });

  it("the general (DataView) path ignores consumeBytes: a copy, the caller's bytes untouched", () => {
    const e = manifest.ok.find(inPlaceCase)!;
    const bytes = load(e.file);
    const before = Uint8Array.from(bytes);
    const res = readNpyWith(bytes, opts({ consumeBytes: true }), 'general');
    expect(Array.from(res.grid.values)).toEqual(expectedGrid(e, true));
    expect(res.grid.values.buffer).not.toBe(bytes.buffer);
    expect(bytes).toEqual(before);
  });
});

/** Little-endian f4 in C order at an 8-byte aligned offset: widened in place when the buffer has room. */
const widenCase = (e: OkEntry): boolean => e.descr === '<f4' && !e.fortran && e.dataOffset % 8 === 0;

describe('readNpy with consumeBytes and room: f4 widened to f8 in place', () => {
  it('npyInPlaceBytes asks for 8 bytes a sample after the header for aligned <f4 C order only', () => {
    let widened = 0;
    for (const e of manifest.ok) {
      const bytes = load(e.file);
      const want = widenCase(e) ? e.dataOffset + 8 * e.rows * e.cols : 0;
      expect(npyInPlaceBytes(bytes, 1e9)).toBe(want);
      if (want > 0) widened++;
    }
    expect(widened).toBeGreaterThanOrEqual(2);
    const f4 = manifest.ok.find(widenCase)!;
    expect(npyInPlaceBytes(load(f4.file), f4.rows * f4.cols - 1)).toBe(0); // more samples than maxCells
    expect(npyInPlaceBytes(load(f4.file).subarray(0, 20), 1e9)).toBe(0); // a header cut short
    expect(npyInPlaceBytes(new TextEncoder().encode('0.5,0.5\n'), 1e9)).toBe(0); // not NPY
  });

  for (const e of manifest.ok.filter(widenCase)) {
    it(`widens ${e.file} in place to numpy's values, both row orders`, () => {
      for (const rowOrder of ['top-down', 'bottom-up'] as const) {
        const file = load(e.file);
        const capacity = npyInPlaceBytes(file, 1e9);
        const buffer = new Uint8Array(capacity);
        buffer.set(file);
        const bytes = buffer.subarray(0, file.length);
        const res = readNpy(bytes, opts({ rowOrder, consumeBytes: true, room: capacity - file.length }));
        expect(res.grid.values.buffer).toBe(buffer.buffer);
        expect(res.grid.values.byteOffset).toBe(e.dataOffset);
        expect(res.ownsValues).toBe(true);
        // numpy 2.4: a.astype(float64) (f4 → f8 is exact)
        expect(Array.from(res.grid.values)).toEqual(expectedGrid(e, rowOrder === 'top-down'));
        // with a byte too little room, or without consumeBytes, the values are a new array and the bytes as read
        for (const o of [{ consumeBytes: true, room: capacity - file.length - 1 }, { room: capacity - file.length }]) {
          const again = Uint8Array.from(file);
          const copy = readNpy(again, opts({ rowOrder, ...o }));
          expect(copy.grid.values.buffer).not.toBe(again.buffer);
          expect(again).toEqual(file);
          expect(Array.from(copy.grid.values)).toEqual(expectedGrid(e, rowOrder === 'top-down'));
        }
      }
    });
  }
});

describe('loadGrid with a consumable input', () => {
  it("reports the SHA-256 of the file as read, though its rows were flipped in place", () => {
    const bytes = new Uint8Array(readFileSync(new URL('../../fixtures/grids/realistic-cantilever-100x50.npy', import.meta.url)));
    const before = Uint8Array.from(bytes);
    const read = loadGrid({ name: 'c.npy', bytes, consumable: true }, resolveSettings({}));
    // `sha256sum fixtures/grids/realistic-cantilever-100x50.npy` (GNU coreutils 9)
    expect(read.sha256).toBe('5d5ced1da6397385f2ff2e7e8f97ebd1bc3a97b1634e519293c90a74c7a9b062');
    expect(read.grid.values.buffer).toBe(bytes.buffer);
    expect(bytes).not.toEqual(before); // the rows were swapped inside the buffer
    const copy = loadGrid({ name: 'c.npy', bytes: before }, resolveSettings({}));
    expect(copy.sha256).toBe(read.sha256);
    expect(Array.from(read.grid.values)).toEqual(Array.from(copy.grid.values));
  });
});
