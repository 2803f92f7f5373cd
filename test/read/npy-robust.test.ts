/**
 * NPY headers that once crashed the reader or coloured the terminal (issue 11, items 2 and 5): every one is a
 * typed error on one line, at a byte offset. Header layout from NEP 1 (R. Kern, "A simple file format for
 * NumPy arrays", 2007): magic, version, a little-endian uint16 length, then the dict text.
 */
import { describe, expect, it } from 'vitest';
import { RhoformError } from '../../src/errors.js';
import { readNpy } from '../../src/read/npy.js';
import { DEFAULT_READ_OPTIONS, type ReadOptions } from '../../src/read/types.js';
import { rhoformErrorOf } from '../support/errors.js';

function npyV1(header: string, data: Uint8Array = new Uint8Array(0)): Uint8Array {
  const h = new Uint8Array([...header].map((c) => c.charCodeAt(0) & 0xff));
  const out = new Uint8Array(10 + h.length + data.length);
  out.set([0x93, 0x4e, 0x55, 0x4d, 0x50, 0x59, 1, 0, h.length & 0xff, h.length >> 8]);
  out.set(h, 10);
  out.set(data, 10 + h.length);
  return out;
}

function refusal(bytes: Uint8Array, o: Partial<ReadOptions> = {}): RhoformError {
  return rhoformErrorOf(() => readNpy(bytes, { ...DEFAULT_READ_OPTIONS, ...o }), 'expected a refusal');
}

// eslint-disable-next-line no-control-regex
const CONTROL = /[\u0000-\u001f\u007f-\u009f]/;

describe('NPY: headers that crashed or echoed control characters', () => {
  it("an escape past the last code point '\\U00110000' is E_NPY_HEADER, not a RangeError", () => {
    // the reproducer: 93 4e 55 4d 50 59 01 00 0c 00, then the 12 characters '\U00110000'
    const bytes = npyV1("'\\U00110000'");
    expect([...bytes.subarray(0, 10)]).toEqual([0x93, 0x4e, 0x55, 0x4d, 0x50, 0x59, 0x01, 0x00, 0x0c, 0x00]);
    const e = refusal(bytes);
    expect(e.code).toBe('E_NPY_HEADER');
    expect(e.detail).toMatch(/^expected a code point of at most \\U0010ffff/);
    expect(e.where).toEqual({ byteOffset: 11 }); // the backslash: byte 10 is the opening quote
  });

  it("the last code point '\\U0010ffff' itself is a string (then refused as no dict)", () => {
    expect(refusal(npyV1("'\\U0010ffff'")).detail).toMatch(/^expected the header to be a Python dict/);
  });

  it('an ESC and other control bytes in a dtype are escaped in the message, which stays one line', () => {
    const e = refusal(npyV1("{'descr': '<\x1b[31mX\x07', 'fortran_order': False, 'shape': (1, 1), }"));
    expect(e.code).toBe('E_NPY_DTYPE');
    expect(e.message).not.toMatch(CONTROL);
    expect(e.message).toContain('\\x1b[31mX\\x07');
  });

  it('control bytes at a header syntax error are escaped too', () => {
    const e = refusal(npyV1("{'descr'\x1b\x07 '<f8'}"));
    expect(e.code).toBe('E_NPY_HEADER');
    expect(e.message).not.toMatch(CONTROL);
    expect(e.message).toContain('\\x1b\\x07');
  });

  it('an extra key with a newline in it is quoted on one line', () => {
    const e = refusal(npyV1("{'descr': '<f8', 'fortran_order': False, 'shape': (1, 1), 'a\\nb\x9b': 1}"));
    expect(e.code).toBe('E_NPY_HEADER');
    expect(e.message).not.toMatch(CONTROL);
  });

  it('nodal values on a single-row array: E_GRID_EMPTY at the shape, not a later error without a place', () => {
    const hdr = "{'descr': '<f8', 'fortran_order': False, 'shape': (1, 3), }";
    const e = refusal(npyV1(hdr, new Uint8Array(24)), { values: 'nodes' });
    expect(e.code).toBe('E_GRID_EMPTY');
    expect(e.where).toEqual({ byteOffset: 10 + hdr.indexOf('(1, 3)') });
  });
});
