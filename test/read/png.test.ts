/**
 * readPng against images written by PIL (fixtures/make/make_png_fixtures.py) in every colour type — grey 1, 8 and
 * 16 bits, grey + alpha, RGB, RGBA, palette with 8- and 4-bit indices — each giving, bit for bit, the densities
 * numpy computed from the same pixels (v / (2^d − 1), dark = solid by default; BT.709 luma for colour), and the
 * same built geometry as those densities written as NPY. Bad input: E_PNG_* codes with positions.
 */
import { readFileSync } from 'node:fs';
import { deflateSync } from 'node:zlib';
import { describe, expect, it } from 'vitest';
import type { RhoformError } from '../../src/errors.js';
import { rhoformErrorOf } from '../support/errors.js';
import type { ReadOptions } from '../../src/read/types.js';
import { expectSameDxf, expectSameGrid, loadFixture, read } from './same-as-npy.js';

const DIR = new URL('../../fixtures/png/', import.meta.url);
interface Entry { file: string; ref: string; options: Partial<ReadOptions> }
const manifest = JSON.parse(readFileSync(new URL('manifest.json', DIR), 'utf8')) as { width: number; height: number; ok: Entry[] };

function fail(bytes: Uint8Array, options: Partial<ReadOptions> = {}): RhoformError {
  const e = rhoformErrorOf(() => read(bytes, 'bad.png', options), 'expected an error');
  expect(e.message).not.toMatch(/\n/); // one line, as every refusal
  return e;
}

describe('PNG images written by PIL read as numpy mapped the same pixels', () => {
  for (const e of manifest.ok) {
    it(`${e.file} ${JSON.stringify(e.options)}`, () => {
      const r = read(loadFixture(DIR, e.file), e.file, e.options);
      expect(r.format).toBe('png');
      expect([r.grid.nx, r.grid.ny]).toEqual([manifest.width, manifest.height]);
      expectSameGrid(r, read(loadFixture(DIR, e.ref), e.ref));
    });
  }
  it('image row 1 is the top row by default, the bottom row with --row-order bottom-up', () => {
    const top = read(loadFixture(DIR, 'grey8.png'), 'a.png');
    const bottom = read(loadFixture(DIR, 'grey8.png'), 'a.png', { rowOrder: 'bottom-up' });
    expectSameGrid(bottom, read(loadFixture(DIR, 'grey8-dark.npy'), 'a.npy', { rowOrder: 'bottom-up' }));
    expect(top.locate(2, 0)).toMatchObject({ fileRow: manifest.height, fileCol: 3, where: { line: manifest.height, col: 3 } });
  });
  it('warns that an image has no unit when --cell-size was not given, and when alpha was ignored', () => {
    expect(read(loadFixture(DIR, 'grey8.png'), 'a.png').warnings.join()).toMatch(/an image has no unit: each pixel was taken as 1 × 1 mm; set --cell-size/);
    expect(read(loadFixture(DIR, 'grey8.png'), 'a.png', { cellSizeGiven: true, cellSize: [0.5, 0.5] }).warnings).toEqual([]);
    expect(read(loadFixture(DIR, 'grey-alpha.png'), 'a.png').warnings.join()).toMatch(/25 pixels are not opaque; the alpha channel was ignored/);
  });
  it('the same DXF from an 8-bit and a 16-bit grey PNG as from NPY of v / (2^d − 1)', () => {
    expectSameDxf(loadFixture(DIR, 'grey8.png'), loadFixture(DIR, 'grey8-dark.npy'), { cellSize: [0.5, 0.5] });
    expectSameDxf(loadFixture(DIR, 'grey16.png'), loadFixture(DIR, 'grey16-dark.npy'), { cellSize: [0.5, 0.5] });
    expectSameDxf(loadFixture(DIR, 'rgb.png'), loadFixture(DIR, 'rgb-luma.npy'), { cellSize: [0.5, 0.5], imageChannel: 'luminance' });
  });
});

describe('bad PNG input', () => {
  it('a colour image without --image-channel is E_PNG_CHANNEL with the hint', () => {
    for (const f of ['rgb.png', 'rgba.png', 'palette8.png']) {
      const e = fail(loadFixture(DIR, f));
      expect([e.code, e.where?.byteOffset]).toEqual(['E_PNG_CHANNEL', 25]);
      expect(e.message).toMatch(/choose what to read with --image-channel luminance\|r\|g\|b/);
    }
  });
  it('a wrong signature is E_PNG_MAGIC (a .png name routes to the PNG reader)', () => {
    const b = loadFixture(DIR, 'grey8.png').slice();
    b[1] = 0x51;
    const e = fail(b);
    expect([e.code, e.message]).toEqual(['E_PNG_MAGIC', expect.stringMatching(/found 89 51 4E 47 0D 0A 1A 0A/)]);
  });
  it('a file cut inside the image data is E_PNG_DECODE; a cut header is E_PNG_DECODE at its end', () => {
    const b = loadFixture(DIR, 'grey8.png');
    expect(fail(b.slice(0, b.length - 200)).code).toBe('E_PNG_DECODE');
    expect([fail(b.slice(0, 20)).code, fail(b.slice(0, 20)).where?.byteOffset]).toEqual(['E_PNG_DECODE', 20]);
  });
  it('an invalid bit depth for the colour type is E_PNG_DECODE at byte 24', () => {
    const b = loadFixture(DIR, 'rgb.png').slice();
    b[24] = 4;
    expect([fail(b, { imageChannel: 'r' }).code, fail(b, { imageChannel: 'r' }).where?.byteOffset]).toEqual(['E_PNG_DECODE', 24]);
  });
  it('too many pixels are refused from IHDR before decoding (--max-cells)', () => {
    // a 100000 × 100000 grey image: IHDR only, with a tiny IDAT
    const ihdr = new Uint8Array([0, 0, 0, 13, 0x49, 0x48, 0x44, 0x52, 0, 1, 0x86, 0xa0, 0, 1, 0x86, 0xa0, 8, 0, 0, 0, 0, 0, 0, 0, 0]);
    const z = deflateSync(new Uint8Array(10));
    const file = new Uint8Array([...loadFixture(DIR, 'grey8.png').subarray(0, 8), ...ihdr, ...z]);
    const e = fail(file);
    expect([e.code, e.message]).toEqual(['E_GRID_SIZE', expect.stringMatching(/a 100000×100000 image = 10000000000 pixels/)]);
    expect(fail(loadFixture(DIR, 'grey8.png'), { maxCells: 1000 }).code).toBe('E_GRID_SIZE');
  });
});
