/**
 * Every CSV reader error, with its code, message and exact 1-based line and column. Lines and columns are
 * counted by hand from the written-out texts (noted beside each check).
 */
import { describe, it, expect } from 'vitest';
import { readCsv } from '../../src/read/csv.js';
import { RhoformError } from '../../src/errors.js';
import { DEFAULT_READ_OPTIONS, type ReadOptions } from '../../src/read/types.js';
import { rhoformErrorOf } from '../support/errors.js';

function fail(text: string, o: Partial<ReadOptions> = {}): RhoformError {
  return rhoformErrorOf(() => readCsv(text, { ...DEFAULT_READ_OPTIONS, ...o }), 'expected an error');
}

describe('readCsv errors', () => {
  it('E_CSV_EMPTY: empty text, only blank or comment lines, a header without data', () => {
    expect(fail('').code).toBe('E_CSV_EMPTY');
    expect(fail('\ufeff').code).toBe('E_CSV_EMPTY');
    const blank = fail('\n  \n# note\n');
    expect([blank.code, blank.where]).toEqual(['E_CSV_EMPTY', { line: 3 }]);
    const header = fail('x,y,value\n\n');
    expect(header.code).toBe('E_CSV_EMPTY');
    expect(header.detail).toBe('expected rows of numbers after the header on line 1, found none');
  });

  it('E_CSV_RAGGED names the expected count and its line: a short row (column = end of the line)', () => {
    const head = Array.from({ length: 120 }, (_, k) => `c${k}`).join(',');
    const full = Array.from({ length: 120 }, (_, k) => (k / 120).toFixed(3)).join(',');
    const short = full.slice(0, full.lastIndexOf(','));
    const e = fail(`${head}\n${full}\n${short}\n`);
    expect(e.code).toBe('E_CSV_RAGGED');
    expect(e.detail).toBe('expected 120 values (as on line 2), found 119');
    // hand count: the short line is line 3; its end is after short.length characters
    expect(e.where).toEqual({ line: 3, col: short.length + 1 });
    expect(e.message).toBe(`<input>:3:${short.length + 1}: expected 120 values (as on line 2), found 119`);
  });

  it('E_CSV_RAGGED: a long row points at the first extra field', () => {
    const e = fail('1 2 3\n4 5 6\n7 8 9  10\n');
    expect(e.code).toBe('E_CSV_RAGGED');
    expect(e.detail).toBe('expected 3 values (as on line 1), found 4');
    expect(e.where).toEqual({ line: 3, col: 8 }); // '10' starts at character 8 of "7 8 9  10"
  });

  it('E_CSV_TOKEN quotes the token and points at it', () => {
    const e = fail('1;2;3\n4;abc;6\n');
    expect(e.code).toBe('E_CSV_TOKEN');
    expect(e.detail).toBe('expected a number, found "abc"');
    expect(e.where).toEqual({ line: 2, col: 3 });
    const crlf = fail('\ufeff1,2\r\n\r\n3, "x"\r\n');
    expect([crlf.where, crlf.detail]).toEqual([{ line: 3, col: 4 }, 'expected a number, found "x"']);
  });

  it('E_CSV_TOKEN refuses what Number() would accept but is no decimal: hex, binary, separators in digits', () => {
    for (const [tok, col] of [['0x10', 3], ['0b1', 3], ['1_000', 3], ['1e', 3], ['.', 3], ['--1', 3], ['1.2.3', 3]] as const) {
      const e = fail(`1,${tok}\n`);
      expect([e.code, e.where]).toEqual(['E_CSV_TOKEN', { line: 1, col }]);
    }
  });

  it('E_CSV_TOKEN: an empty field and a trailing separator', () => {
    const e = fail('1,,3\n');
    expect([e.code, e.detail, e.where]).toEqual(['E_CSV_TOKEN', 'expected a number, found an empty field', { line: 1, col: 3 }]);
    const t = fail('1,2\n3,4,\n');
    expect([t.code, t.where]).toEqual(['E_CSV_RAGGED', { line: 2, col: 5 }]);
    const first = fail('1,2,\n');
    expect([first.code, first.where]).toEqual(['E_CSV_TOKEN', { line: 1, col: 5 }]);
  });

  it('E_CSV_TOKEN: a line with another separator than the first data line, with a hint', () => {
    const e = fail('0.5;0.25\n0.5,0.25\n');
    expect(e.code).toBe('E_CSV_TOKEN');
    expect(e.where).toEqual({ line: 2, col: 1 });
    expect(e.detail).toContain("the separator is ';'");
    const comma = fail('0,5;0,25\n');
    expect(comma.detail).toContain('decimal-comma');
  });

  it('E_CSV_TOKEN: with a decimal comma, a decimal point is refused (it may be a thousands mark)', () => {
    const e = fail('1.5;2\n', { decimalComma: true });
    expect([e.code, e.where]).toEqual(['E_CSV_TOKEN', { line: 1, col: 1 }]);
  });

  it('E_GRID_SIZE as soon as the count passes maxCells: on the row that crosses it', () => {
    const rows = Array.from({ length: 1000 }, () => '1,2,3').join('\n');
    const e = fail(rows, { maxCells: 10 });
    expect(e.code).toBe('E_GRID_SIZE');
    expect(e.where).toEqual({ line: 4, col: 1 }); // 3 rows hold 9 ≤ 10 values, the 4th would make 12
    const wide = fail('1 2 3 4 5 6\n', { maxCells: 4 });
    expect([wide.code, wide.where]).toEqual(['E_GRID_SIZE', { line: 1, col: 9 }]); // the 5th value
    expect(readCsv('1,2\n3,4\n', { ...DEFAULT_READ_OPTIONS, maxCells: 4 }).grid.ny).toBe(2); // 4 ≤ 4 is fine
  });

  it('E_GRID_EMPTY for nodal values with fewer than 2 × 2 samples', () => {
    expect(fail('1,2,3\n', { values: 'nodes' }).code).toBe('E_GRID_EMPTY');
  });

  it('E_USAGE for a cell size that is not positive and finite and a maxCells below 1 (NaN included)', () => {
    for (const cellSize of [[0, 1], [1, -1], [NaN, 1], [1, Infinity]] as [number, number][]) {
      expect(fail('1,2\n', { cellSize }).code).toBe('E_USAGE');
    }
    for (const maxCells of [0, NaN, -5]) expect(fail('1,2\n', { maxCells }).code).toBe('E_USAGE');
  });
});
