/**
 * readMat on bad and refused input: every outcome is a RhoformError with a stable code and the byte offset of
 * the problem. Refused files are scipy.io.savemat's (fixtures/make/make_mat_fixtures.py); damaged files are
 * those fixtures with bytes changed here, at offsets given by the MAT-file format (MathWorks, "MATLAB MAT-File
 * Format": 128-byte header, version at 124, endian indicator at 126, first element tag at 128).
 */
import { describe, expect, it } from 'vitest';
import { deflateSync } from 'node:zlib';
import type { RhoformError } from '../../src/errors.js';
import { rhoformErrorOf } from '../support/errors.js';
import { readMat } from '../../src/read/mat.js';
import { DEFAULT_READ_OPTIONS, type ReadOptions } from '../../src/read/types.js';
import { loadFixture, read } from './same-as-npy.js';

const DIR = new URL('../../fixtures/mat/', import.meta.url);

function fail(bytes: Uint8Array, options: Partial<ReadOptions> = {}): RhoformError {
  const e = rhoformErrorOf(() => read(bytes, 'bad.mat', options), 'expected an error');
  expect(e.message).not.toMatch(/\n/); // one line, as every refusal
  return e;
}

describe('refused variables are named, with the reason', () => {
  const cases: [string, string, RegExp][] = [
    ['cell.mat', 'c', /"c": 1×2 cell, which is refused: a cell array/],
    ['struct.mat', 's', /"s": 1×1 struct, which is refused: a struct/],
    ['sparse.mat', 'k', /"k": 37×53 sparse logical, which is refused: a sparse matrix; save full\(x\)/],
    ['complex.mat', 'z', /"z": 37×53 complex double, which is refused: complex/],
    ['char.mat', 't', /"t": 1×7 char, which is refused: a char array/],
  ];
  for (const [file, name, message] of cases) {
    it(`${file}: E_MAT_FIELD when choosing, E_MAT_CLASS when named`, () => {
      const auto = fail(loadFixture(DIR, file));
      expect(auto.code).toBe('E_MAT_FIELD');
      expect(auto.message).toContain(`"${name}"`);
      const named = fail(loadFixture(DIR, file), { field: name });
      expect(named.code).toBe('E_MAT_CLASS');
      expect(named.message).toMatch(message);
      expect(named.where).toMatchObject({ file: 'bad.mat', byteOffset: 128 });
    });
  }
  it('lists every refused variable when none fits', () => {
    const e = fail(loadFixture(DIR, 'mixed.mat'));
    expect(e.code).toBe('E_MAT_FIELD');
    expect(e.message).toMatch(/"c" \(1×2 cell, refused: a cell array.*"z" \(37×53 complex double, refused: complex.*"t" \(1×7 char, refused/);
  });
});

describe('damaged and foreign files', () => {
  it('a -v7.3 file (HDF5 container, made with h5py) is refused with advice to save -v7', () => {
    const e = fail(loadFixture(DIR, 'v73.mat'));
    expect(e.code).toBe('E_MAT_V73');
    expect(e.message).toMatch(/save\(filename, 'x', '-v7'\)/);
  });
  it('a file without the text header (called .mat) is E_MAT_HEADER at byte 0', () => {
    const e = fail(new TextEncoder().encode('1,2\n3,4\n'));
    expect([e.code, e.where?.byteOffset]).toEqual(['E_MAT_HEADER', 0]);
  });
  it('a bad endian indicator and a bad version are E_MAT_HEADER at bytes 126 and 124', () => {
    const b = loadFixture(DIR, 'double.mat').slice();
    b[126] = 0x41;
    expect([fail(b).code, fail(b).where?.byteOffset]).toEqual(['E_MAT_HEADER', 126]);
    const c = loadFixture(DIR, 'double.mat').slice();
    c[125] = 2;
    expect([fail(c).code, fail(c).where?.byteOffset, fail(c).message]).toEqual(['E_MAT_HEADER', 124, expect.stringMatching(/expected version 0x0100 \(level 5\), found 0x0200/)]);
  });
  it('a header cut short is E_MAT_TRUNCATED', () => {
    expect(fail(loadFixture(DIR, 'double.mat').slice(0, 100)).code).toBe('E_MAT_TRUNCATED');
  });
  it('a file cut inside the matrix is E_MAT_TRUNCATED at the element that overruns', () => {
    const b = loadFixture(DIR, 'double.mat');
    const e = fail(b.slice(0, b.length - 10));
    expect([e.code, e.where?.byteOffset]).toEqual(['E_MAT_TRUNCATED', 128]);
  });
  it('a compressed variable cut short is E_MAT_TRUNCATED; corrupt zlib data is E_MAT_INFLATE', () => {
    const b = loadFixture(DIR, 'double-z.mat');
    expect(fail(b.slice(0, b.length - 50)).code).toBe('E_MAT_TRUNCATED');
    const c = b.slice();
    for (let k = 136; k < 146; k++) c[k] ^= 0xff;
    expect([fail(c).code, fail(c).where?.byteOffset]).toEqual(['E_MAT_INFLATE', 136]);
  });
  it('dimensions that disagree with the data are E_MAT_ELEMENT', () => {
    // uncompressed 'x': tag at 128, flags at 136 (16 bytes), dims tag at 152, rows at 160 (little-endian int32)
    const b = loadFixture(DIR, 'double.mat').slice();
    expect(new DataView(b.buffer).getInt32(160, true)).toBe(37);
    new DataView(b.buffer).setInt32(160, 38, true);
    const e = fail(b);
    expect(e.code).toBe('E_MAT_ELEMENT');
    expect(e.message).toMatch(/expected 16112 bytes of f8 for 38×53 values, found 15688/);
  });
  it('too many cells are refused from the header, before inflating (--max-cells)', () => {
    const e = fail(loadFixture(DIR, 'double-z.mat'), { maxCells: 1000 });
    expect([e.code, e.where?.byteOffset]).toEqual(['E_GRID_SIZE', 128]);
    expect(e.message).toMatch(/at most 1000 samples .* 37×53 = 1961 samples/);
  });
  it('a compressed bomb (huge declared size in a tiny file) is refused before it is inflated', () => {
    // a matrix header declaring 100000×100000 doubles, deflated: a few dozen bytes
    const head = new Uint8Array(64);
    const v = new DataView(head.buffer);
    v.setUint32(0, 14, true); v.setUint32(4, 0xfffffff0, true); // 8·10^10 bytes do not fit a uint32: the largest count
    v.setUint32(8, 6, true); v.setUint32(12, 8, true); v.setUint32(16, 6, true);
    v.setUint32(24, 5, true); v.setUint32(28, 8, true); v.setInt32(32, 100000, true); v.setInt32(36, 100000, true);
    v.setUint32(40, (1 << 16) | 1, true); head[44] = 0x78;
    v.setUint32(48, 9, true); v.setUint32(52, 0xfffffff0 - 48, true);
    const z = deflateSync(head);
    const file = new Uint8Array(128 + 8 + z.length);
    file.set(loadFixture(DIR, 'double.mat').subarray(0, 128));
    new DataView(file.buffer).setUint32(128, 15, true);
    new DataView(file.buffer).setUint32(132, z.length, true);
    file.set(z, 136);
    const e = fail(file);
    expect([e.code, e.message]).toEqual(['E_GRID_SIZE', expect.stringMatching(/100000×100000 = 10000000000 samples/)]);
    // allowed that many cells, the declared data still disagree with the dimensions: refused, not inflated to 4 GB
    const f = fail(file, { maxCells: 1e11 });
    expect([f.code, f.message]).toEqual(['E_MAT_ELEMENT', expect.stringMatching(/expected 80000000000 bytes of f8/)]);
  });
  it('readMat called directly on a non-MAT file names the header', () => {
    expect(() => readMat(new Uint8Array(10), DEFAULT_READ_OPTIONS)).toThrow(/expected the text header "MATLAB 5.0 MAT-file"/);
  });
});
