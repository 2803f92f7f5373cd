/**
 * readVtk and readVti on bad input: every outcome is a RhoformError with a stable code, the line and column (text)
 * or byte offset (binary) of the problem, and a one-line message saying what was expected and found. Files are
 * written inline from the VTK file-format document, or are fixtures with bytes changed.
 */
import { describe, expect, it } from 'vitest';
import type { RhoformError } from '../../src/errors.js';
import { rhoformErrorOf } from '../support/errors.js';
import { loadFixture, read } from './same-as-npy.js';

const DIR = new URL('../../fixtures/vtk/', import.meta.url);
const enc = (s: string): Uint8Array => new TextEncoder().encode(s);

function fail(bytes: Uint8Array, name = 'bad.vtk', options = {}): RhoformError {
  const e = rhoformErrorOf(() => read(bytes, name, options), 'expected an error');
  expect(e.message).not.toMatch(/\n/); // one line, as every refusal
  return e;
}

const legacy = (dataset: string, dims: string, body: string, mode = 'ASCII'): string =>
  `# vtk DataFile Version 3.0\ntitle\n${mode}\nDATASET ${dataset}\nDIMENSIONS ${dims}\nSPACING 1 1 1\n${body}`;

describe('legacy VTK', () => {
  it('a file called .vtk without the version line is E_VTK_HEADER on line 1', () => {
    const e = fail(enc('0.1 0.2\n0.3 0.4\n'));
    expect([e.code, e.where?.line, e.message]).toEqual(['E_VTK_HEADER', 1, expect.stringMatching(/expected "# vtk DataFile Version x.y" on line 1, found "0.1 0.2"/)]);
  });
  it('other datasets are E_VTK_DATASET on line 4', () => {
    const e = fail(enc('# vtk DataFile Version 3.0\nt\nASCII\nDATASET POLYDATA\nPOINTS 0 float\n'));
    expect([e.code, e.where?.line, e.message]).toEqual(['E_VTK_DATASET', 4, expect.stringMatching(/expected DATASET STRUCTURED_POINTS \(image data\), found DATASET POLYDATA/)]);
  });
  it('neither ASCII nor BINARY on line 3 is E_VTK_HEADER', () => {
    const e = fail(enc('# vtk DataFile Version 3.0\nt\nTEXT\nDATASET STRUCTURED_POINTS\n'));
    expect([e.code, e.where?.line]).toEqual(['E_VTK_HEADER', 3]);
  });
  it('a count that disagrees with DIMENSIONS is E_VTK_SHAPE on its line', () => {
    const e = fail(enc(legacy('STRUCTURED_POINTS', '3 3 1', 'CELL_DATA 5\nSCALARS a float\n1 2 3 4 5\n')));
    expect([e.code, e.where?.line, e.message]).toEqual(['E_VTK_SHAPE', 7, expect.stringMatching(/expected CELL_DATA 4 for DIMENSIONS 3 3 1, found CELL_DATA 5/)]);
  });
  it('a value that is not a number is E_VTK_TOKEN at its line and column', () => {
    const e = fail(enc(legacy('STRUCTURED_POINTS', '3 3 1', 'CELL_DATA 4\nSCALARS a float 1\nLOOKUP_TABLE default\n0.1 0.2\n0.3 x4\n')));
    expect([e.code, e.where?.line, e.where?.col]).toEqual(['E_VTK_TOKEN', 11, 5]);
    expect(e.message).toMatch(/expected a number \(value 4 of 4\), found "x4"/);
  });
  it('too few ASCII values and short BINARY data are E_VTK_TRUNCATED', () => {
    expect(fail(enc(legacy('STRUCTURED_POINTS', '3 3 1', 'CELL_DATA 4\nSCALARS a float 1\n0.1 0.2\n'))).code).toBe('E_VTK_TRUNCATED');
    const b = loadFixture(DIR, 'cells-binary.vtk');
    const e = fail(b.slice(0, b.length - 100));
    expect(e.code).toBe('E_VTK_TRUNCATED');
    expect(e.where?.byteOffset).toBeGreaterThan(100);
  });
  it('a truly 3-D set is E_VTK_SHAPE', () => {
    const e = fail(enc(legacy('STRUCTURED_POINTS', '3 3 3', `CELL_DATA 8\nSCALARS a float\n${'1 '.repeat(8)}\n`)));
    expect([e.code, e.message]).toEqual(['E_VTK_SHAPE', expect.stringMatching(/expected 2-D image data \(one axis with a single sample\), found 2×2×2 samples/)]);
  });
  it('an unknown keyword and a bad data type are named', () => {
    expect(fail(enc(legacy('STRUCTURED_POINTS', '3 3 1', 'CELLS 4\n'))).message).toMatch(/found "CELLS"/);
    const e = fail(enc(legacy('STRUCTURED_POINTS', '3 3 1', 'CELL_DATA 4\nSCALARS a quad\n\x00\x00', 'BINARY')));
    expect([e.code, e.message]).toEqual(['E_VTK_TYPE', expect.stringMatching(/found "quad"/)]);
  });
  it('too many cells are refused before the values are read (--max-cells)', () => {
    const e = fail(enc(legacy('STRUCTURED_POINTS', '100001 100001 1', 'CELL_DATA 10000000000\nSCALARS a float\n0\n')));
    expect([e.code, e.where?.line, e.message]).toEqual(['E_GRID_SIZE', 7, expect.stringMatching(/found CELL_DATA 10000000000 \(100000×100000×1\)/)]);
  });
  it('a missing spacing along a grid axis is refused without --cell-size', () => {
    const e = fail(enc('# vtk DataFile Version 3.0\nt\nASCII\nDATASET STRUCTURED_POINTS\nDIMENSIONS 3 3 1\nSPACING 1 0 1\nCELL_DATA 4\nSCALARS a float\n1 1 1 1\n'));
    expect([e.code, e.message]).toEqual(['E_VTK_SHAPE', expect.stringMatching(/expected a spacing > 0 along y, found 0; or give --cell-size/)]);
  });
});

describe('VTK XML ImageData', () => {
  const vti = (inner: string, root = 'type="ImageData" byte_order="LittleEndian"'): Uint8Array =>
    enc(`<?xml version="1.0"?>\n<VTKFile ${root}>\n<ImageData WholeExtent="0 2 0 2 0 0" Spacing="1 1 1">\n<Piece Extent="0 2 0 2 0 0">\n<CellData>\n${inner}\n</CellData>\n</Piece>\n</ImageData>\n</VTKFile>\n`);
  it('a file called .vti whose root is not VTKFile is E_VTI_FORMAT; no root at all is E_VTI_XML', () => {
    expect(fail(enc('<?xml version="1.0"?>\n<svg width="1"/>\n'), 'a.vti').message).toMatch(/expected the root element <VTKFile>, found <svg>/);
    expect(fail(enc('0.1,0.2\n'), 'a.vti').code).toBe('E_VTI_XML');
  });
  it('another dataset type is E_VTI_FORMAT', () => {
    const e = fail(vti('', 'type="UnstructuredGrid"'), 'a.vti');
    expect([e.code, e.where?.line, e.message]).toEqual(['E_VTI_FORMAT', 2, expect.stringMatching(/expected <VTKFile type="ImageData">, found type="UnstructuredGrid"/)]);
  });
  it('broken XML is E_VTI_XML with line and column', () => {
    const e = fail(enc('<?xml version="1.0"?>\n<VTKFile type="ImageData">\n<ImageData WholeExtent="0 2 0 2 0 0" Spacing=1>\n</VTKFile>\n'), 'a.vti');
    expect([e.code, e.where?.line, e.where?.col]).toEqual(['E_VTI_XML', 3, 38]);
  });
  it('an end tag that does not match is E_VTI_XML', () => {
    expect(fail(vti('<DataArray type="Float32" Name="a" format="ascii">1 2 3 4</Data>'), 'a.vti').code).toBe('E_VTI_XML');
  });
  it('too few ascii values are E_VTI_DATA; a bad byte count is E_VTI_DATA', () => {
    expect(fail(vti('<DataArray type="Float32" Name="a" format="ascii">1 2 3</DataArray>'), 'a.vti').message).toMatch(/expected 4 values, found 3/);
    // header says 12 bytes, 4 Float32 need 16
    const b64 = Buffer.from(new Uint8Array([12, 0, 0, 0, ...new Uint8Array(16)])).toString('base64');
    const e = fail(vti(`<DataArray type="Float32" Name="a" format="binary">${b64}</DataArray>`), 'a.vti');
    expect([e.code, e.where?.line, e.message]).toEqual(['E_VTI_DATA', 6, expect.stringMatching(/expected a header of 16 bytes of values, found 12/)]);
  });
  it('a corrupt zlib block is E_VTI_INFLATE; a cut appended section is E_VTI_DATA', () => {
    const b = loadFixture(DIR, 'appended-raw-uint32-zlib.vti').slice();
    const start = Buffer.from(b).indexOf('_', Buffer.from(b).indexOf('<AppendedData')) + 1;
    const hdrWords = 3 + 4; // 15688 bytes in blocks of 4096: 4 blocks
    for (let k = 0; k < 8; k++) b[start + 4 * hdrWords + k] ^= 0x5a;
    expect(fail(b, 'a.vti').code).toBe('E_VTI_INFLATE');
    const c = loadFixture(DIR, 'appended-raw-uint32.vti');
    expect(fail(c.slice(0, start + 2000), 'a.vti').code).toBe('E_VTI_DATA');
  });
  it('an unknown compressor is refused by name', () => {
    expect(fail(vti('', 'type="ImageData" compressor="vtkLZ4DataCompressor"'), 'a.vti').message).toMatch(/found "vtkLZ4DataCompressor"; save the file with zlib compression or none/);
  });
  it('too many cells are refused from WholeExtent before any data are decoded', () => {
    const big = enc('<VTKFile type="ImageData"><ImageData WholeExtent="0 100000 0 100000 0 0"><Piece Extent="0 100000 0 100000 0 0"><CellData><DataArray type="Float64" Name="a" format="binary">AAAA</DataArray></CellData></Piece></ImageData></VTKFile>');
    expect(fail(big, 'a.vti').code).toBe('E_GRID_SIZE');
    expect(fail(loadFixture(DIR, 'ascii.vti'), 'a.vti', { maxCells: 100 }).code).toBe('E_GRID_SIZE');
  });
});
