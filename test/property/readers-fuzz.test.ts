/**
 * Fuzz of every reader (issue 11): generated inputs, a fixed seed and a bounded number per reader (fast-check).
 * Every outcome is either a result or a typed RhoformError with a stable E_* code whose message is one line
 * without control characters — never a TypeError, RangeError or stack overflow, never a raw line of the input.
 * The inputs are mutations of valid files (bytes flipped, cut, inserted, repeated) and free text from the
 * characters that matter to each grammar.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { RhoformError } from '../../src/errors.js';
import { readCsv } from '../../src/read/csv.js';
import { readNpy } from '../../src/read/npy.js';
import { DEFAULT_READ_OPTIONS, type ReadOptions } from '../../src/read/types.js';
import { parsePassive, parsePassiveBytes } from '../../src/passive/parse.js';
import { readFileSync } from 'node:fs';
import { readMat } from '../../src/read/mat.js';
import { readVtk } from '../../src/read/vtk.js';
import { readVti } from '../../src/read/vti.js';
import { readPng } from '../../src/read/png.js';

// eslint-disable-next-line no-control-regex
const CONTROL = /[\u0000-\u001f\u007f-\u009f\u2028\u2029]/;
const CODE = /^E_[A-Z_]+$/;

/** Runs `f`; a result passes, a RhoformError must be clean, anything else fails the property. */
function clean(f: () => unknown): void {
  try {
    f();
  } catch (e) {
    if (!(e instanceof RhoformError)) throw e;
    expect(e.code).toMatch(CODE);
    expect(e.message).not.toMatch(CONTROL);
    expect(e.message.length).toBeLessThan(2000);
  }
}

const small: ReadOptions = { ...DEFAULT_READ_OPTIONS, maxCells: 10_000 };

/** A byte-level mutation of `base`: flip, cut, insert or repeat a slice. */
function mutated(base: Uint8Array): fc.Arbitrary<Uint8Array> {
  const at = fc.nat({ max: Math.max(0, base.length) });
  return fc.oneof(
    fc.tuple(at, fc.integer({ min: 0, max: 255 })).map(([k, b]) => {
      const out = base.slice();
      if (k < out.length) out[k] = b;
      return out;
    }),
    at.map((k) => base.slice(0, k)),
    fc.tuple(at, fc.uint8Array({ minLength: 1, maxLength: 12 })).map(([k, ins]) => new Uint8Array([...base.slice(0, k), ...ins, ...base.slice(k)])),
    fc.tuple(at, at, fc.integer({ min: 2, max: 50 })).map(([a, b, n]) => {
      const [s, e] = a < b ? [a, b] : [b, a];
      const piece = base.slice(s, e);
      return new Uint8Array([...base.slice(0, s), ...Array.from({ length: n }, () => [...piece]).flat(), ...base.slice(e)]);
    }),
  );
}

const enc = (s: string): Uint8Array => new TextEncoder().encode(s);
const dec = (b: Uint8Array): string => new TextDecoder().decode(b);

function npy(header: string, data: Uint8Array): Uint8Array {
  const h = enc(header);
  const out = new Uint8Array(10 + h.length + data.length);
  out.set([0x93, 0x4e, 0x55, 0x4d, 0x50, 0x59, 1, 0, h.length & 0xff, h.length >> 8]);
  out.set(h, 10);
  out.set(data, 10 + h.length);
  return out;
}

const GRID_CSV = '# a grid\n0,0.25,1\n0.5, 1 ,0\n"1",0,0.75\n';
const LONG_CSV = 'x,y,value\n0.5,0.5,1\n1.5,0.5,0\n0.5,1.5,0.25\n1.5,1.5,1\n';
const NPY_OK = npy("{'descr': '<f8', 'fortran_order': False, 'shape': (2, 3), }          \n", new Uint8Array(new Float64Array([0, 1, 0.5, 1, 0, 0.25]).buffer));
const PASSIVE =
  '{\n  "rhoformPassive": 1,\n  "units": "mm",\n  "regions": [\n    { "role": "void", "circle": { "center": [5, 5], "radius": 2 } },\n' +
  '    { "role": "solid", "rect": { "min": [0, 0], "max": [3, 1] }, "name": "pad" },\n' +
  '    { "role": "void", "polygon": [[6, 6], [8, 6], [7, 8]] }\n  ]\n}\n';

const csvChars = fc.array(fc.constantFrom(...'0123456789.,;\t -+eE"\'#\n\r xyvalue'.split(''), '\u0000', '\u001b', '\u00a0', '\ud800', '🙂'), { maxLength: 80 }).map((a) => a.join(''));
const jsonChars = fc.array(fc.constantFrom(...'{}[]":,0123456789.-eE \n\ttrufalsn\\'.split(''), 'rhoformPassive', 'regions', 'role', '"void"', 'circle', '\u0001', '\u001b'), { maxLength: 60 }).map((a) => a.join(''));
const runs = (n: number) => ({ seed: 20261205, numRuns: n });

describe('readers never crash and never print more than one clean line', () => {
  it('CSV grid layout: mutated files and free text', () => {
    fc.assert(fc.property(fc.oneof(mutated(enc(GRID_CSV)).map(dec), csvChars), (t) => clean(() => readCsv(t, { ...small, layout: 'grid' }))), runs(1500));
    fc.assert(fc.property(csvChars, (t) => clean(() => readCsv(t, { ...small, decimalComma: true, values: 'nodes' }))), runs(500));
  });

  it('CSV long layout: mutated files and free text', () => {
    fc.assert(fc.property(fc.oneof(mutated(enc(LONG_CSV)).map(dec), csvChars.map((t) => `x,y,value\n${t}`)), (t) => clean(() => readCsv(t, small))), runs(1500));
  });

  it('CSV: a located error can always be located again (locate() on every sample of a result)', () => {
    fc.assert(
      fc.property(mutated(enc(GRID_CSV)).map(dec), (t) => {
        let r;
        try {
          r = readCsv(t, small);
        } catch (e) {
          if (e instanceof RhoformError) return;
          throw e;
        }
        for (let j = 0; j < r.grid.ny; j++) for (let i = 0; i < r.grid.nx; i++) expect(r.locate(i, j).fileRow).toBeGreaterThan(0);
      }),
      runs(800),
    );
  });

  it('NPY: mutated files and headers of free text', () => {
    const headerText = fc.array(fc.constantFrom(..."{}()[]':, 0123456789<>|fiubcUuxTFNLe\\\n".split(''), "'descr'", "'shape'", "'fortran_order'", 'True', '\\U00110000', '\x1b'), { maxLength: 60 }).map((a) => a.join(''));
    fc.assert(fc.property(fc.oneof(mutated(NPY_OK), headerText.map((h) => npy(h, new Uint8Array(16)))), (b) => clean(() => readNpy(b, small))), runs(2000));
  });

  it('passive JSON: mutated files, free text, deep nesting and bytes that are not UTF-8', () => {
    fc.assert(fc.property(fc.oneof(mutated(enc(PASSIVE)), jsonChars.map(enc)), (b) => clean(() => parsePassiveBytes(b, 'p.json'))), runs(1500));
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 20_000 }), fc.constantFrom('[', '{"a":'), (n, open) => clean(() => parsePassive(open.repeat(n), 'p.json'))),
      runs(30),
    );
  });

  // The readers of issue 13, on small files: fixtures written by scipy and PIL, and VTK files of a few samples
  // written here from the VTK format document (larger fixtures: readers-formats-fuzz.test.ts).
  const fixture = (path: string): Uint8Array => new Uint8Array(readFileSync(new URL(`../../fixtures/${path}`, import.meta.url)));
  const vtkAscii = enc('# vtk DataFile Version 3.0\nt\nASCII\nDATASET STRUCTURED_POINTS\nDIMENSIONS 4 3 1\nORIGIN 0 0 0\nSPACING 1 2 1\nCELL_DATA 6\nSCALARS rho float 1\nLOOKUP_TABLE default\n0 0.5 1\n1 0.25 0\nPOINT_DATA 12\nFIELD f 1\nt 1 12 double\n0 1 0 1 0 1 0 1 0 1 0 1\n');
  const be = new Uint8Array(new Float32Array([0, 0.5, 1, 1, 0.25, 0]).buffer);
  for (let k = 0; k < be.length; k += 4) be.subarray(k, k + 4).reverse();
  const vtkBinary = new Uint8Array([...enc('# vtk DataFile Version 3.0\nt\nBINARY\nDATASET STRUCTURED_POINTS\nDIMENSIONS 4 3 1\nSPACING 1 1 1\nCELL_DATA 6\nSCALARS rho float\nLOOKUP_TABLE default\n'), ...be, 10]);
  const payload = new Uint8Array([...new Uint8Array(new Uint32Array([48]).buffer), ...new Uint8Array(new Float64Array([0, 0.5, 1, 1, 0.25, 0]).buffer)]);
  const vti = (data: string, appended: Uint8Array | null) =>
    new Uint8Array([
      ...enc(`<?xml version="1.0"?>\n<VTKFile type="ImageData" byte_order="LittleEndian"><ImageData WholeExtent="0 3 0 2 0 0" Spacing="1 1 1"><Piece Extent="0 3 0 2 0 0"><CellData>${data}</CellData></Piece></ImageData>`),
      ...(appended ? [...enc('<AppendedData encoding="raw">_'), ...appended, ...enc('</AppendedData>')] : []),
      ...enc('</VTKFile>\n'),
    ]);
  const formats: [string, Uint8Array[], (b: Uint8Array) => unknown][] = [
    ['MAT', ['mat/uint8-z.mat', 'mat/int8.mat', 'mat/logical-z.mat', 'mat/uint8.mat'].map(fixture), (b) => readMat(b, { ...small, field: null })],
    ['VTK', [vtkAscii, vtkBinary], (b) => readVtk(b, { ...small, field: 'rho' })],
    [
      'VTI',
      [
        vti('<DataArray type="Float64" Name="rho" format="ascii">0 0.5 1 1 0.25 0</DataArray>', null),
        vti(`<DataArray type="Float64" Name="rho" format="binary">${Buffer.from(payload).toString('base64')}</DataArray>`, null),
        vti('<DataArray type="Float64" Name="rho" format="appended" offset="0"/>', payload),
      ],
      (b) => readVti(b, small),
    ],
    ['PNG', ['png/palette4.png', 'png/grey16.png', 'png/rgba.png'].map(fixture), (b) => readPng(b, { ...small, imageChannel: 'luminance' })],
  ];
  for (const [name, seeds, read] of formats) {
    it(`${name}: mutated files`, () => {
      for (const seed of seeds) expect(() => read(seed)).not.toThrow(); // the seeds themselves are valid
      fc.assert(fc.property(fc.oneof(...seeds.map(mutated)), (b) => clean(() => read(b))), runs(400));
    });
  }
});
