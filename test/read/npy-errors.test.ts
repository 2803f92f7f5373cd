/**
 * readNpy refusals. Bad files come from fixtures/make/make_npy_fixtures.py: dtypes and shapes numpy 2.4
 * writes but rhoform does not read, and damaged or hand-made headers that numpy 2.4 refuses as well
 * (the script checks that). Format facts: docs/references.md §6 / NEP 1 (R. Kern, "A simple file format for
 * NumPy arrays", 2007).
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { RhoformError, type ErrorCode } from '../../src/errors.js';
import { readNpy } from '../../src/read/npy.js';
import { DEFAULT_READ_OPTIONS, type ReadOptions } from '../../src/read/types.js';
import { rhoformErrorOf } from '../support/errors.js';

interface ErrorEntry {
  file: string;
  code: ErrorCode;
  includes: string[];
  byteOffset?: number;
}

const DIR = new URL('../../fixtures/npy/', import.meta.url);
const manifest = JSON.parse(readFileSync(new URL('manifest.json', DIR), 'utf8')) as { errors: ErrorEntry[] };
const load = (file: string): Uint8Array => new Uint8Array(readFileSync(new URL(file, DIR)));
const opts = (o: Partial<ReadOptions> = {}): ReadOptions => ({ ...DEFAULT_READ_OPTIONS, ...o });

/** Runs readNpy and returns the RhoformError it throws (fails the test if it does not throw one). */
function refusal(bytes: Uint8Array, o: Partial<ReadOptions> = {}): RhoformError {
  return rhoformErrorOf(() => readNpy(bytes, opts(o)), 'expected readNpy to throw a RhoformError');
}

/** A v1.0 file with this header text, padded to 64 bytes as numpy does (NEP 1 layout). */
function npyV1(header: string, data: Uint8Array = new Uint8Array(0)): Uint8Array {
  const pad = (64 - ((10 + header.length + 1) % 64)) % 64;
  const text = header + ' '.repeat(pad) + '\n';
  const out = new Uint8Array(10 + text.length + data.length);
  out.set([0x93, 0x4e, 0x55, 0x4d, 0x50, 0x59, 1, 0, text.length & 0xff, text.length >> 8]);
  for (let k = 0; k < text.length; k++) out[10 + k] = text.charCodeAt(k);
  out.set(data, 10 + text.length);
  return out;
}

describe('readNpy refusals on fixture files', () => {
  for (const e of manifest.errors) {
    it(`${e.file} → ${e.code}`, () => {
      const err = refusal(load(e.file));
      expect(err.code).toBe(e.code);
      for (const s of e.includes) expect(err.detail).toContain(s);
      if (e.byteOffset !== undefined) expect(err.where?.byteOffset).toBe(e.byteOffset);
      expect(err.where?.byteOffset).toBeTypeOf('number'); // every NPY error points at a byte
      expect(err.message).toMatch(/^<input>:byte \d+: expected /); // errors.ts: `file:byte N: expected …`
    });
  }

  it('names the refused dtype exactly as asked: complex128', () => {
    // numpy 2.4: np.dtype('<c16').name == 'complex128'
    const detail = refusal(load('dtype-complex128.npy')).detail;
    expect(detail.startsWith("expected a real numeric dtype (f2, f4, f8, i1–i8, u1–u8, b1), found complex128 ('<c16')")).toBe(true);
  });

  it('reports the data shortfall with the shape and dtype', () => {
    // 3×5 float64 = 120 bytes (NEP 1: data follows the header, product(shape)·itemsize bytes); 7 were cut
    expect(refusal(load('truncated-data.npy')).detail).toBe('expected 120 bytes of data for shape (3, 5) <f8, found 113');
  });
});

describe('readNpy size limits', () => {
  it('refuses a declared (100000, 100000) array by size before looking for its data', () => {
    // 10^10 samples > the default maxCells 5·10^7 (docs/cli.md); the file holds no data at all
    const bytes = load('huge-header-only.npy');
    const err = refusal(bytes);
    expect(err.code).toBe('E_GRID_SIZE');
    // with no limit the same file is refused as truncated, still before any allocation of 80 GB
    const t = refusal(bytes, { maxCells: Infinity });
    expect(t.code).toBe('E_NPY_TRUNCATED');
    expect(t.detail).toBe('expected 80000000000 bytes of data for shape (100000, 100000) <f8, found 0');
  });

  it('applies maxCells inclusively to rows × cols', () => {
    const bytes = load('m-f8-le-C-v1.npy'); // numpy: shape (3, 5) = 15 samples
    expect(refusal(bytes, { maxCells: 14 }).code).toBe('E_GRID_SIZE');
    expect(readNpy(bytes, opts({ maxCells: 15 })).grid.values.length).toBe(15);
  });
});

describe('readNpy on hand-made bytes (NEP 1 layout)', () => {
  it('an empty file is E_NPY_TRUNCATED and says it is empty', () => {
    const err = refusal(new Uint8Array(0));
    expect(err.code).toBe('E_NPY_TRUNCATED');
    expect(err.detail).toContain('empty file');
  });

  it('a file cut inside the magic or the version is E_NPY_TRUNCATED; a wrong first byte is E_NPY_MAGIC', () => {
    expect(refusal(new Uint8Array([0x93, 0x4e, 0x55])).code).toBe('E_NPY_TRUNCATED');
    expect(refusal(new Uint8Array([0x93, 0x4e, 0x55, 0x4d, 0x50, 0x59, 1])).code).toBe('E_NPY_TRUNCATED');
    const bad = refusal(new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a])); // a PNG signature
    expect(bad.code).toBe('E_NPY_MAGIC');
    expect(bad.detail).toContain('found "\\x89PNG\\r\\n\\x1a\\n"');
  });

  it('a header that declares more bytes than the file has is E_NPY_TRUNCATED', () => {
    const full = npyV1("{'descr': '<f8', 'fortran_order': False, 'shape': (1, 1), }", new Uint8Array(8));
    const err = refusal(full.subarray(0, 40));
    expect(err.code).toBe('E_NPY_TRUNCATED');
    expect(err.detail).toContain('header of 118 bytes'); // 128 − 10: padded to 64 (docs/references.md §6)
  });

  it('a v3.0 header that is not UTF-8 is E_NPY_HEADER', () => {
    const v1 = npyV1("{'descr': '<f8', 'fortran_order': False, 'shape': (1, 1), }", new Uint8Array(8));
    const v3 = new Uint8Array(v1.length + 2);
    v3.set(v1.subarray(0, 8));
    v3[6] = 3;
    new DataView(v3.buffer).setUint32(8, 118, true);
    v3.set(v1.subarray(10), 12);
    v3[20] = 0xff; // never valid in UTF-8
    const err = refusal(v3);
    expect(err.code).toBe('E_NPY_HEADER');
    expect(err.detail).toContain('UTF-8');
  });

  it('a header key that appears twice is E_NPY_HEADER', () => {
    const err = refusal(npyV1("{'descr': '<f8', 'descr': '<f4', 'fortran_order': False, 'shape': (1, 1), }", new Uint8Array(8)));
    expect(err.code).toBe('E_NPY_HEADER');
    expect(err.detail).toContain("'descr'");
  });

  it('booleans other than 0/1 still read as 1', () => {
    // [D] numpy 2.4: np.frombuffer(bytes([0, 1, 7]), '|b1').astype(float) → [0., 1., 1.]
    const res = readNpy(npyV1("{'descr': '|b1', 'fortran_order': False, 'shape': (1, 3), }", new Uint8Array([0, 1, 7])), opts());
    expect(Array.from(res.grid.values)).toEqual([0, 1, 1]);
  });

  it('bad options are usage errors', () => {
    const bytes = load('m-f8-le-C-v1.npy');
    expect(refusal(bytes, { cellSize: [0, 1] }).code).toBe('E_USAGE');
    expect(refusal(bytes, { cellSize: [1, NaN] }).code).toBe('E_USAGE');
    expect(refusal(bytes, { maxCells: NaN }).code).toBe('E_USAGE');
  });

  it('locate refuses a sample outside the grid', () => {
    const res = readNpy(load('m-f8-le-C-v1.npy'), opts());
    expect(() => res.locate(5, 0)).toThrow(RangeError);
    expect(() => res.locate(0, -1)).toThrow(RangeError);
  });
});
