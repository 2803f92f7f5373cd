/**
 * Detection by content (docs/formats.md): each format is recognised by its magic bytes or first line whatever the
 * file is called; the name only picks the reader that reports a file matching none of them. And the CLI end to
 * end: `inspect` names the format, `build` honours --field and the file's spacing, bad input exits 2 writing nothing.
 */
import { copyFileSync, existsSync, readdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { detectFormat } from '../../src/read/detect.js';
import { cli, tempDir } from '../cli/harness.js';
import { loadFixture } from './same-as-npy.js';

const dir = (d: string): URL => new URL(`../../fixtures/${d}/`, import.meta.url);
const enc = (s: string): Uint8Array => new TextEncoder().encode(s);

describe('detectFormat', () => {
  it('recognises every fixture by content under a misleading name', () => {
    const cases: [string, string, string][] = [
      ['mat', 'double-z.mat', 'mat'], ['mat', 'v73.mat', 'mat'], ['vtk', 'cells-binary.vtk', 'vtk'], ['vtk', 'points-ascii.vtk', 'vtk'],
      ['vtk', 'appended-raw-uint32.vti', 'vti'], ['vtk', 'ascii.vti', 'vti'], ['png', 'palette4.png', 'png'], ['npy', 'm-f8-le-C-v1.npy', 'npy'],
    ];
    for (const [d, f, format] of cases) expect([f, detectFormat(loadFixture(dir(d), f), 'grid.csv')]).toEqual([f, format]);
  });
  it('reads the first line after a BOM and blank lines; an XML file with a VTKFile root is VTI', () => {
    expect(detectFormat(enc('\ufeff\n# vtk DataFile Version 2.0\n'), 'x')).toBe('vtk');
    expect(detectFormat(enc('  <?xml version="1.0"?>\n<VTKFile type="UnstructuredGrid">'), 'x')).toBe('vti');
    expect(detectFormat(enc('<?xml version="1.0"?>\n<svg/>'), 'x')).toBe('csv');
  });
  it('the HDF5 signature at byte 512 (a -v7.3 MAT-file) is MAT; text is CSV; the name decides only for unknown content', () => {
    const h = new Uint8Array(600);
    h.set([0x89, 0x48, 0x44, 0x46, 0x0d, 0x0a, 0x1a, 0x0a], 512);
    expect(detectFormat(h, 'x')).toBe('mat');
    expect(detectFormat(enc('0.1,0.2\n'), 'grid.txt')).toBe('csv');
    expect(detectFormat(enc('0.1,0.2\n'), 'grid.MAT')).toBe('mat');
    expect(detectFormat(enc('0.1,0.2\n'), 'grid.vti')).toBe('vti');
  });
});

describe('the CLI with the new formats', () => {
  const fixtures = fileURLToPath(new URL('../../fixtures/', import.meta.url));
  it('inspect names the format and, for VTK, the cell size from the file', () => {
    const d = tempDir();
    copyFileSync(join(fixtures, 'vtk/cells-binary.vtk'), join(d, 'field.dat'));
    const r = cli(['inspect', 'field.dat'], d);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/field\.dat \(VTK\)/);
    expect(r.stdout).toMatch(/cell 2 × 3 mm \(from the file\)/);
    const j = cli(['inspect', 'field.dat', '--json'], d);
    expect(JSON.parse(j.stdout).input).toMatchObject({ format: 'vtk', nx: 53, ny: 37, cellSize: [2, 3] });
  });
  it('build --field picks a MAT variable; the report says which format, and that the cell size came from --cell-size', () => {
    const d = tempDir();
    copyFileSync(join(fixtures, 'mat/two-matrices.mat'), join(d, 'opt.mat'));
    const bad = cli(['build', 'opt.mat'], d);
    expect(bad.code).toBe(2);
    expect(bad.stderr).toMatch(/E_MAT_FIELD.*"x" \(37×53 double\), "previous" \(37×53 double\); choose one with --field <name>/);
    expect(readdirSync(d)).toEqual(['opt.mat']); // nothing written
    const ok = cli(['build', 'opt.mat', '--field', 'previous', '--cell-size', '2', '--json', '--formats', 'json'], d);
    expect(ok.code).toBeLessThan(2);
    const rep = JSON.parse(ok.stdout);
    expect(rep.input.format).toBe('mat');
    expect(rep.settings).toMatchObject({ field: 'previous', cellSizeDefaulted: false, cellSizeSource: 'option' });
  });
  it('a VTK spacing is reported as the cell size, not as a default', () => {
    const d = tempDir();
    copyFileSync(join(fixtures, 'vtk/base64-uint32-zlib.vti'), join(d, 'a.vti'));
    const r = cli(['build', 'a.vti', '--json', '--formats', 'json'], d);
    const rep = JSON.parse(r.stdout);
    expect(rep.input.cellSize).toEqual([2, 3]);
    expect(rep.settings).toMatchObject({ cellSizeDefaulted: false, cellSizeSource: 'file' });
  });
  it('a colour PNG without --image-channel exits 2 with the hint; with it, builds; bad option values are usage errors', () => {
    const d = tempDir();
    copyFileSync(join(fixtures, 'png/rgb.png'), join(d, 'pic.png'));
    const bad = cli(['build', 'pic.png'], d);
    expect([bad.code, bad.stderr]).toEqual([2, expect.stringMatching(/E_PNG_CHANNEL.*--image-channel luminance\|r\|g\|b/)]);
    expect(existsSync(join(d, 'pic.dxf'))).toBe(false);
    const ok = cli(['build', 'pic.png', '--image-channel', 'g', '--image-solid', 'light', '--cell-size', '0.5'], d);
    expect(ok.code).toBeLessThan(2);
    expect(existsSync(join(d, 'pic.dxf'))).toBe(true);
    expect(cli(['build', 'pic.png', '--image-channel', 'alpha'], d).stderr).toMatch(/--image-channel: expected one of luminance, r, g, b, found "alpha"/);
    expect(cli(['build', 'pic.png', '--image-solid', 'grey'], d).stderr).toMatch(/--image-solid: expected one of dark, light/);
  });
  it('--help lists the new options', () => {
    const r = cli(['--help'], tempDir());
    for (const o of ['--field <name>', '--image-solid dark|light', '--image-channel luminance|r|g|b']) expect(r.stdout).toContain(o);
  });
  it('a truncated MAT-file exits 2 naming the file and byte, and nothing is written', () => {
    const d = tempDir();
    const b = loadFixture(dir('mat'), 'double.mat');
    writeFileSync(join(d, 'cut.mat'), b.subarray(0, b.length - 16));
    const r = cli(['build', 'cut.mat'], d);
    expect([r.code, r.stderr]).toEqual([2, expect.stringMatching(/E_MAT_TRUNCATED.*cut\.mat:byte 128: expected 15736 bytes of data element \(type 14\), found 15720/)]);
    expect(readdirSync(d)).toEqual(['cut.mat']);
  });
});
