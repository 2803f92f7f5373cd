/**
 * readNpy against files written by numpy 2.4 (fixtures/make/make_npy_fixtures.py): every accepted dtype
 * in both byte orders, C and Fortran order, format versions 1.0/2.0/3.0, and special layouts.
 * Expected values, data offsets and strides are what numpy reports when it reads the same files back.
 */
import { describe, expect, it } from 'vitest';
import { readNpy, readNpyWith } from '../../src/read/npy.js';
import { DEFAULT_READ_OPTIONS, type ReadOptions } from '../../src/read/types.js';
import { expectedGrid, load, manifest, type OkEntry } from './npy-manifest.js';

const opts = (o: Partial<ReadOptions> = {}): ReadOptions => ({ ...DEFAULT_READ_OPTIONS, ...o });

describe('readNpy: the dtype × byte order × memory order × version matrix written by numpy 2.4', () => {
  it('the manifest covers every accepted dtype, both byte orders, C/F order and versions 1.0/2.0/3.0', () => {
    // the brief's matrix: f2 f4 f8 i1–i8 u1–u8 b1; '<' and '>' for multi-byte types; C and Fortran; 3 versions
    const m = manifest.ok.filter((e) => e.file.startsWith('m-'));
    const descrs = new Set(m.map((e) => e.descr));
    for (const code of ['f2', 'f4', 'f8', 'i2', 'i4', 'i8', 'u2', 'u4', 'u8']) {
      expect(descrs.has(`<${code}`) && descrs.has(`>${code}`)).toBe(true);
    }
    for (const code of ['i1', 'u1', 'b1']) expect(descrs.has(`|${code}`)).toBe(true);
    expect(m.length).toBe((9 * 2 + 3) * 2 * 3);
    expect(new Set(m.map((e) => e.version.join('.')))).toEqual(new Set(['1.0', '2.0', '3.0']));
    expect(new Set(m.map((e) => e.fortran))).toEqual(new Set([false, true]));
  });

  for (const e of manifest.ok) {
    const label = `${e.file} (${e.descr}, v${e.version.join('.')}, ${e.fortran ? 'Fortran' : 'C'} order, shape (${e.shape.join(', ')}))`;
    it(`reads ${label} as numpy does, both row orders`, () => {
      const bytes = load(e.file);
      for (const rowOrder of ['top-down', 'bottom-up'] as const) {
        const res = readNpy(bytes, opts({ rowOrder, cellSize: [0.5, 2], values: 'cells' }));
        expect(res.format).toBe('npy');
        expect(res.layout).toBe('grid');
        // nx = columns, ny = rows of the 2-D array as numpy shows it
        expect(res.grid.nx).toBe(e.cols);
        expect(res.grid.ny).toBe(e.rows);
        expect(res.grid.cellSize).toEqual([0.5, 2]);
        expect(res.grid.origin).toEqual([0, 0]);
        expect(res.grid.placement).toBe('cells');
        // numpy 2.4: a.astype(float64), row-major, top row first (Object.is: -0, NaN and ±Inf kept)
        expect(Array.from(res.grid.values)).toEqual(expectedGrid(e, rowOrder === 'top-down'));
      }
    });

    it(`locates every element of ${e.file} at numpy's byte offset`, () => {
      const res = readNpy(load(e.file), opts());
      for (let j = 0; j < e.rows; j++) {
        for (let i = 0; i < e.cols; i++) {
          const r = e.rows - 1 - j; // top-down: grid row j is array row rows−1−j
          const pos = res.locate(i, j);
          expect(pos.fileRow).toBe(r + 1);
          expect(pos.fileCol).toBe(i + 1);
          // numpy memmap: offset + r·strides[0] + c·strides[1]
          expect(pos.where.byteOffset).toBe(e.dataOffset + r * e.strides[0] + i * e.strides[1]);
        }
      }
      const up = readNpy(load(e.file), opts({ rowOrder: 'bottom-up' })).locate(0, 0);
      expect(up.fileRow).toBe(1);
      expect(up.where.byteOffset).toBe(e.dataOffset);
    });

    it(`decodes ${e.file} identically on the typed-array and the DataView path`, () => {
      const bytes = load(e.file);
      const fast = readNpyWith(bytes, opts(), 'auto').grid.values;
      const general = readNpyWith(bytes, opts(), 'general').grid.values;
      expect(Array.from(fast)).toEqual(Array.from(general));
    });
  }
});

describe('readNpy: layouts numpy reads', () => {
  const entry = (file: string): OkEntry => manifest.ok.find((e) => e.file === file)!;

  it('squeezes (1, r, c), (r, c, 1) and Fortran (r, 1, c) arrays to (r, c) with a warning', () => {
    for (const [file, axis] of [['3d-1rc.npy', 0], ['3d-rc1.npy', 2], ['3d-r1c-F.npy', 1]] as const) {
      const res = readNpy(load(file), opts());
      expect(res.grid.ny).toBe(3); // numpy.squeeze → (3, 5)
      expect(res.grid.nx).toBe(5);
      expect(res.warnings.join(' ')).toContain(`dropping axis ${axis}`);
      expect(Array.from(res.grid.values)).toEqual(expectedGrid(entry(file), true));
    }
  });

  it('keeps NaN and ±Infinity as they are (f8, big-endian f4, f2)', () => {
    for (const file of ['nonfinite-f8-le.npy', 'nonfinite-f4-be.npy', 'nonfinite-f2-le.npy']) {
      const v = readNpy(load(file), opts()).grid.values;
      // numpy: top row [nan, inf, -inf, 0, 1] → grid row 1 (top) of a 2-row grid
      expect(Number.isNaN(v[5])).toBe(true);
      expect(v[6]).toBe(Infinity);
      expect(v[7]).toBe(-Infinity);
      expect(Array.from(v)).toEqual(expectedGrid(entry(file), true));
    }
  });

  it('reads 2000 big-endian float64 values with full mantissas exactly', () => {
    const e = entry('big-endian-f8-40x50.npy');
    const res = readNpy(load(e.file), opts());
    expect(res.grid.values.length).toBe(2000);
    expect(Array.from(res.grid.values)).toEqual(expectedGrid(e, true)); // numpy 2.4 values
  });

  it('reads one array saved in C and in Fortran order identically, on both paths (37×53, partial tiles)', () => {
    for (const p of manifest.pairs) {
      for (const rowOrder of ['top-down', 'bottom-up'] as const) {
        const c = readNpyWith(load(p.c), opts({ rowOrder }), 'auto').grid;
        const f = readNpyWith(load(p.f), opts({ rowOrder }), 'auto').grid;
        const fGeneral = readNpyWith(load(p.f), opts({ rowOrder }), 'general').grid;
        // numpy 2.4: np.array_equal(C file, Fortran file)
        expect(Array.from(f.values)).toEqual(Array.from(c.values));
        expect(Array.from(fGeneral.values)).toEqual(Array.from(c.values));
        // numpy 2.4: a[0,0], a[0,-1], a[-1,0], a[-1,-1]; array row 0 is grid row ny−1 when top-down
        const top = rowOrder === 'top-down' ? p.rows - 1 : 0;
        const bottom = p.rows - 1 - top;
        const at = (i: number, j: number): number => f.values[j * p.cols + i];
        expect([at(0, top), at(p.cols - 1, top), at(0, bottom), at(p.cols - 1, bottom)]).toEqual(p.corners);
      }
    }
  });

  it('honours a 16-byte-aligned (NEP 1) and an unaligned data offset', () => {
    // NEP 1: the header was padded to a multiple of 16 in older files; numpy never checks alignment
    expect(entry('old-align16.npy').dataOffset).toBe(80);
    for (const file of ['old-align16.npy', 'unaligned-f8.npy', 'unaligned-f4.npy', 'py2-long-shape.npy']) {
      const e = entry(file);
      const res = readNpy(load(file), opts());
      expect(Array.from(res.grid.values)).toEqual(expectedGrid(e, true));
      expect(res.locate(0, e.rows - 1).where.byteOffset).toBe(e.dataOffset);
    }
  });

  it('works on a Uint8Array that starts at an odd offset of its buffer', () => {
    for (const e of manifest.ok.filter((x) => x.file.startsWith('m-') && x.version[0] === 1)) {
      const file = load(e.file);
      const host = new Uint8Array(file.length + 3);
      host.set(file, 3);
      const res = readNpy(host.subarray(3), opts());
      expect(Array.from(res.grid.values)).toEqual(expectedGrid(e, true)); // numpy 2.4 values
    }
  });

  it('ignores bytes after the data with a warning, as numpy does', () => {
    const res = readNpy(load('trailing-bytes.npy'), opts());
    expect(res.warnings.join(' ')).toContain('8 bytes after the array data');
    expect(Array.from(res.grid.values)).toEqual(expectedGrid(entry('trailing-bytes.npy'), true));
  });

  it("reads an NPY file as a grid even when layout 'long' is asked for, with a warning", () => {
    const res = readNpy(load('m-f8-le-C-v1.npy'), opts({ layout: 'long' }));
    expect(res.layout).toBe('grid'); // src/read/types.ts: NPY is always 'grid'
    expect(res.warnings.join(' ')).toContain("layout 'long'");
    expect(readNpy(load('m-f8-le-C-v1.npy'), opts({ layout: 'auto' })).warnings).toEqual([]);
  });

  it('passes cell size and placement through and does not modify the input bytes', () => {
    const bytes = load('m-f8-le-C-v1.npy');
    const before = Uint8Array.from(bytes);
    const res = readNpy(bytes, opts({ cellSize: [0.25, 0.25], values: 'nodes' }));
    expect(res.grid.cellSize).toEqual([0.25, 0.25]);
    expect(res.grid.placement).toBe('nodes');
    res.grid.values[0] = 42; // the grid owns its values: writing them leaves the file bytes alone
    expect(bytes).toEqual(before);
    expect(readNpy(bytes, opts()).grid.values[0]).not.toBe(42);
  });
});
