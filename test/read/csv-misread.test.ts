/**
 * A field holding more than one number is refused at its own line:col, never read as a guess (issue 11,
 * item 1). Positions are counted by hand from the written-out texts (noted beside each check).
 */
import { describe, it, expect } from 'vitest';
import { readCsv } from '../../src/read/csv.js';
import { RhoformError } from '../../src/errors.js';
import { DEFAULT_READ_OPTIONS, type ReadOptions } from '../../src/read/types.js';
import { rhoformErrorOf } from '../support/errors.js';

function fail(text: string, o: Partial<ReadOptions> = {}): RhoformError {
  return rhoformErrorOf(() => readCsv(text, { ...DEFAULT_READ_OPTIONS, ...o }), `expected an error for ${JSON.stringify(text)}`);
}

describe('CSV: a blank inside a field is an error, not two numbers', () => {
  it('"0.5 -1" after a comma-separated first line is E_CSV_TOKEN at line 2, column 1', () => {
    const e = fail('0,1\n0.5 -1\n');
    expect(e.code).toBe('E_CSV_TOKEN');
    expect(e.where).toEqual({ line: 2, col: 1 });
    expect(e.detail).toBe('expected a number, found "0.5 -1"');
  });

  it('"0.5 1.25" is refused, not read as 0.5 and 0.25', () => {
    const e = fail('0,1\n0.5 1.25\n');
    expect([e.code, e.where]).toEqual(['E_CSV_TOKEN', { line: 2, col: 1 }]);
  });

  it('"0.5 19" is refused cleanly (it used to crash the position lookup)', () => {
    const e = fail('0,1\n0.5 19\n');
    expect([e.code, e.where, e.detail]).toEqual(['E_CSV_TOKEN', { line: 2, col: 1 }, 'expected a number, found "0.5 19"']);
  });

  it('the bad field is found in the middle of a row: "1, 2 3, 4" points at column 4', () => {
    // hand count: "1, 2 3, 4" — the second field's first non-blank character "2" is character 4
    const e = fail('0,0,0\n1, 2 3, 4\n');
    expect([e.code, e.where]).toEqual(['E_CSV_TOKEN', { line: 2, col: 4 }]);
  });

  it('semicolon and tab separators: a blank inside a field is refused too', () => {
    expect(fail('0;1\n0.5 1;2\n').where).toEqual({ line: 2, col: 1 });
    expect(fail('0\t1\n0.5\t1 2\n').where).toEqual({ line: 2, col: 5 }); // "0.5\t1 2": '1' is character 5
  });

  it('blanks around a number are still fine: " 0.5 , 1 " reads as 0.5 and 1', () => {
    const r = readCsv('0,1\n 0.5 , 1 \n', DEFAULT_READ_OPTIONS);
    // top-down: file row 2 is grid row 0
    expect(Array.from(r.grid.values)).toEqual([0.5, 1, 0, 1]);
  });

  it('a ragged message counts the fields the way the row scanner does ("found 3", not "found 2")', () => {
    const e = fail('1,2\n3,4,5\n');
    expect([e.code, e.detail, e.where]).toEqual(['E_CSV_RAGGED', 'expected 2 values (as on line 1), found 3', { line: 2, col: 5 }]);
  });

  it('long layout: a blank inside the value field is refused at its column', () => {
    // hand count: "1,0,0.5 0.7": the value field starts at character 5
    const e = fail('x,y,value\n0,0,1\n1,0,0.5 0.7\n');
    expect([e.code, e.where]).toEqual(['E_CSV_TOKEN', { line: 3, col: 5 }]);
  });
});

describe('bytes that are not UTF-8 are refused at their offset', () => {
  it('an encoded surrogate (ED A0 80, not UTF-8 by the Unicode Standard, table 3-7) is named at its byte', async () => {
    const { readGrid } = await import('../../src/read/detect.js');
    const bytes = new Uint8Array([0x31, 0x2c, 0x30, 0x0a, 0xed, 0xa0, 0x80, 0x0a]);
    expect(rhoformErrorOf(() => readGrid(bytes, 'g.csv', DEFAULT_READ_OPTIONS)).where).toEqual({ file: 'g.csv', byteOffset: 4 });
  });
});
