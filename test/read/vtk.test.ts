/**
 * readVtk and readVti against files written by hand from Kitware's "VTK File Formats" document
 * (fixtures/make/make_vtk_fixtures.py): legacy ASCII and BINARY (big-endian), cell and point data, SCALARS with
 * and without LOOKUP_TABLE, FIELD arrays, a 3-D set with one axis of 1; XML ascii, base64 with UInt32 and UInt64
 * headers, zlib blocks, appended raw and base64, both byte orders, several pieces. Each gives the same grid as
 * the same field written by numpy.save, bit for bit, and the same built geometry.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { expectSameDxf, expectSameGrid, loadFixture, read } from './same-as-npy.js';

const DIR = new URL('../../fixtures/vtk/', import.meta.url);
interface Entry { file: string; ref: string; placement: 'cells' | 'nodes'; field: string | null }
const manifest = JSON.parse(readFileSync(new URL('manifest.json', DIR), 'utf8')) as { cellSize: [number, number]; nx: number; ny: number; ok: Entry[] };
const spacing = manifest.cellSize;

describe('VTK image data read as numpy wrote the same field', () => {
  for (const e of manifest.ok) {
    it(`${e.file}${e.field ? ` --field ${e.field}` : ''} (${e.placement})`, () => {
      const r = read(loadFixture(DIR, e.file), e.file, { field: e.field });
      const npy = read(loadFixture(DIR, e.ref), e.ref, { cellSize: spacing, values: e.placement });
      expect(r.format).toBe(e.file.endsWith('.vti') ? 'vti' : 'vtk');
      expect(r.grid.placement).toBe(e.placement);
      expect(r.cellSizeSource).toBe('file'); // SPACING / Spacing, since no --cell-size was given
      expectSameGrid(r, npy);
    });
  }
  it('--cell-size overrides the file spacing', () => {
    const r = read(loadFixture(DIR, 'cells-binary.vtk'), 'a.vtk', { cellSize: [0.5, 0.5], cellSizeGiven: true });
    expect([r.grid.cellSize, r.cellSizeSource]).toEqual([[0.5, 0.5], 'options']);
  });
  it('the xz plane of a 3-D set with one point along y is read with a warning; its origin is reported, not applied', () => {
    const r = read(loadFixture(DIR, 'xz-plane.vtk'), 'a.vtk');
    expect(r.warnings.join('\n')).toMatch(/xz plane: x was read as x and z as y/);
    expect(r.warnings.join('\n')).toMatch(/origin \(10, 0, 5\) was not applied/);
  });
  it('several arrays: the message lists them, with sizes; refused ones say why', () => {
    for (const f of ['several-ascii.vtk', 'several-binary.vtk']) {
      expect(() => read(loadFixture(DIR, f), f)).toThrow(/expected one scalar array \(one component\), found 2: "rho" \(cell data SCALARS, 1961 × 1 double\), "temp" \(point data FIELD array, 2052 × 1 double\)/);
      expect(() => read(loadFixture(DIR, f), f, { field: 'u' })).toThrow(/"u": vectors \(3 components\), which is refused: VECTORS arrays are not scalar/);
      expect(() => read(loadFixture(DIR, f), f, { field: 'disp' })).toThrow(/"disp": point data FIELD array, 2052 × 3 float, which is refused: 3 components/);
    }
    expect(() => read(loadFixture(DIR, 'two-arrays.vti'), 'a.vti')).toThrow(/found 2: "rho" \(cell data, 53×37×1 × 1 Float64\), "previous"/);
    expect(() => read(loadFixture(DIR, 'appended-raw-uint32.vti'), 'a.vti', { field: 'u' })).toThrow(/"u": .*which is refused: 3 components/);
  });
  it('locates ASCII values by line and column, binary values by byte', () => {
    const a = read(loadFixture(DIR, 'cells-ascii.vtk'), 'a.vtk');
    // header: 7 lines + CELL_DATA + SCALARS + LOOKUP_TABLE = 10 lines; 9 values per line; value 12 = line 12, 3rd
    const p = a.locate(11, 0);
    expect([p.fileRow, p.fileCol, p.where.line]).toEqual([1, 12, 12]);
    const bytes = loadFixture(DIR, 'cells-binary.vtk');
    const b = read(bytes, 'b.vtk');
    const q = b.locate(3, 2);
    const off = q.where.byteOffset as number;
    expect(new DataView(bytes.buffer, bytes.byteOffset).getFloat32(off, false)).toBe(b.grid.values[2 * b.grid.nx + 3]);
    const bytesX = loadFixture(DIR, 'appended-raw-uint32.vti');
    const x = read(bytesX, 'x.vti');
    const off2 = x.locate(5, 7).where.byteOffset as number;
    expect(new DataView(bytesX.buffer, bytesX.byteOffset).getFloat64(off2, true)).toBe(x.grid.values[7 * x.grid.nx + 5]);
  });
  it('the same DXF from legacy BINARY, VTI zlib and VTI appended raw as from NPY', () => {
    for (const [f, ref] of [['cells-binary.vtk', 'cells-f4.npy'], ['base64-uint64-zlib.vti', 'cells-f8.npy'], ['appended-raw-uint32.vti', 'cells-f8.npy']]) {
      // the file's spacing (2 × 3 mm) against NPY given the same cell size
      const s = resolve(loadFixture(DIR, f));
      expect(s.grid.cellSize).toEqual(spacing);
      expectSameDxf(loadFixture(DIR, f), loadFixture(DIR, ref), { cellSize: spacing });
    }
    // point data are nodal values: the same DXF as the NPY field read with --values nodes
    expectSameDxf(loadFixture(DIR, 'points.vti'), loadFixture(DIR, 'cells-f4.npy'), { cellSize: spacing, values: 'nodes' });
    expectSameDxf(loadFixture(DIR, 'points-ascii.vtk'), loadFixture(DIR, 'cells-f8.npy'), { cellSize: spacing, values: 'nodes' });
  });
});

function resolve(bytes: Uint8Array) {
  return read(bytes, 'x');
}

describe('options the file overrides', () => {
  it('--values and --row-order that disagree with the file are reported, and the file wins', () => {
    const r = read(loadFixture(DIR, 'cells-binary.vtk'), 'a.vtk', { values: 'nodes', rowOrder: 'bottom-up' });
    expect(r.grid.placement).toBe('cells');
    expect(r.warnings.join('\n')).toMatch(/--values nodes does not apply to VTK image data: the file holds cell data/);
    expect(r.warnings.join('\n')).toMatch(/--row-order does not apply/);
    expectSameGrid(r, read(loadFixture(DIR, 'cells-f4.npy'), 'a.npy', { cellSize: spacing }));
  });
});
