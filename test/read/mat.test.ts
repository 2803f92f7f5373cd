/**
 * readMat against MAT-files written by Debian's scipy (scipy.io.savemat, compressed and not) and a big-endian
 * file written from MathWorks' "MATLAB MAT-File Format" (fixtures/make/make_mat_fixtures.py): each gives the same
 * grid, bit for bit, as the same array written by numpy.save, and the same built geometry.
 */
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { expectSameDxf, expectSameGrid, loadFixture, read } from './same-as-npy.js';

const DIR = new URL('../../fixtures/mat/', import.meta.url);
interface Entry { file: string; ref: string; var: string; class: string; compressed: boolean; valueRange: [number, number] }
const manifest = JSON.parse(readFileSync(new URL('manifest.json', DIR), 'utf8')) as { rows: number; cols: number; ok: Entry[] };

describe('MAT-files written by scipy.io.savemat read as numpy wrote the same array', () => {
  for (const e of manifest.ok) {
    it(`${e.file} (${e.class}${e.compressed ? ', compressed' : ''})`, () => {
      const mat = read(loadFixture(DIR, e.file), e.file);
      const npy = read(loadFixture(DIR, e.ref), e.ref);
      expect(mat.format).toBe('mat');
      expect([mat.grid.nx, mat.grid.ny]).toEqual([manifest.cols, manifest.rows]);
      expectSameGrid(mat, npy);
      for (const topDown of [true, false]) {
        const o = { rowOrder: topDown ? 'top-down' : 'bottom-up' } as const;
        expectSameGrid(read(loadFixture(DIR, e.file), e.file, o), read(loadFixture(DIR, e.ref), e.ref, o));
      }
    });
  }
  it('the same field gives the same DXF from MAT (double, uint8, logical, big-endian) as from NPY', () => {
    for (const e of manifest.ok.filter((x) => ['double-z.mat', 'uint8.mat', 'logical-z.mat', 'big-endian.mat', 'single.mat'].includes(x.file))) {
      expectSameDxf(loadFixture(DIR, e.file), loadFixture(DIR, e.ref), { valueRange: e.valueRange, cellSize: [2, 2] });
    }
  });
  it('locates a sample by MATLAB (row, column) and, uncompressed, by the byte of the element', () => {
    const bytes = loadFixture(DIR, 'double.mat');
    const r = read(bytes, 'double.mat');
    // top-down: grid row j = 0 is MATLAB row 37 (the last); column i = 4 is column 5
    const p = r.locate(4, 0);
    expect([p.fileRow, p.fileCol]).toEqual([37, 5]);
    const off = p.where.byteOffset as number;
    const v = new DataView(bytes.buffer, bytes.byteOffset).getFloat64(off, true);
    expect(v).toBe(r.grid.values[4]);
  });
});

describe('choosing the variable', () => {
  it('takes the only matrix beside scalars and text (a typical optimizer workspace)', () => {
    const r = read(loadFixture(DIR, 'with-scalars.mat'), 'w.mat');
    expectSameGrid(r, read(loadFixture(DIR, 'with-scalars.npy'), 'w.npy'));
  });
  it('refuses two candidates, listing both with sizes, and reads the one named by --field', () => {
    expect(() => read(loadFixture(DIR, 'two-matrices.mat'), 't.mat')).toThrow(/expected one real numeric 2-D matrix, found 2: "x" \(37×53 double\), "previous" \(37×53 double\); choose one with --field/);
    const x = read(loadFixture(DIR, 'two-matrices.mat'), 't.mat', { field: 'previous' });
    const f = read(loadFixture(DIR, 'double.npy'), 'd.npy');
    for (let k = 0; k < f.grid.values.length; k += 97) expect(x.grid.values[k]).toBe(1 - f.grid.values[k]);
  });
  it('names what exists when --field names nothing', () => {
    expect(() => read(loadFixture(DIR, 'two-matrices.mat'), 't.mat', { field: 'rho' })).toThrow(/named "rho" \(--field\), found "x" \(37×53 double\), "previous"/);
  });
  it('reads a 3-D array with one dimension of 1, with a warning', () => {
    const r = read(loadFixture(DIR, 'three-d.mat'), 'x.mat');
    expect(r.warnings.join()).toMatch(/37×1×53 array "x" was read as 37×53/);
    expectSameGrid(r, read(loadFixture(DIR, 'double.npy'), 'd.npy'));
  });
});
