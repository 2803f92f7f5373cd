/**
 * The CSV reader on small hand-written texts: line ends, BOM, blank and comment lines, separators,
 * quotes, row order and placement. Each expected value is written out from the text of the test.
 */
import { describe, it, expect } from 'vitest';
import { readCsv } from '../../src/read/csv.js';
import { DEFAULT_READ_OPTIONS, type ReadOptions } from '../../src/read/types.js';

const read = (text: string, o: Partial<ReadOptions> = {}) => readCsv(text, { ...DEFAULT_READ_OPTIONS, ...o });
const vals = (text: string, o: Partial<ReadOptions> = {}) => [...read(text, o).grid.values];

describe('readCsv grid layout, hand-written texts', () => {
  it('puts the first data line at the top by default and at the bottom with rowOrder bottom-up', () => {
    // written out: line 1 = "1,2,3" is the top row, so grid row j = 1 (values[3..5])
    expect(vals('1,2,3\n4,5,6\n')).toEqual([4, 5, 6, 1, 2, 3]);
    expect(vals('1,2,3\n4,5,6\n', { rowOrder: 'bottom-up' })).toEqual([1, 2, 3, 4, 5, 6]);
    const r = read('1,2,3\n4,5,6\n');
    expect([r.grid.nx, r.grid.ny, r.layout, r.grid.origin, r.grid.cellSize]).toEqual([3, 2, 'grid', [0, 0], [1, 1]]);
  });

  it('takes cell size and placement from the options', () => {
    const r = read('0 1\n1 0\n', { cellSize: [0.5, 2], values: 'nodes' });
    expect(r.grid.cellSize).toEqual([0.5, 2]);
    expect(r.grid.placement).toBe('nodes');
  });

  it('drops a BOM, reads CRLF and ignores trailing blank lines', () => {
    expect(vals('\ufeff1,2\r\n3,4\r\n\r\n  \r\n')).toEqual([3, 4, 1, 2]);
    const r = read('\ufeff1,2\r\n3,4\r\n\r\n');
    // written out: the BOM is not a character column; "3" is at line 2, column 1
    expect(r.locate(0, 0).where).toEqual({ line: 2, col: 1 });
    expect(r.locate(1, 1).where).toEqual({ line: 1, col: 3 });
  });

  it('reads CR-only line ends (old spreadsheet exports)', () => {
    expect(vals('1;2\r3;4\r')).toEqual([3, 4, 1, 2]);
  });

  it('skips blank and # lines anywhere but keeps file line numbers', () => {
    const text = '# made by hand\n\n1,2\n\n# middle\n3,4\n\n';
    expect(vals(text)).toEqual([3, 4, 1, 2]);
    const r = read(text);
    // written out: "1" is on line 3, "4" on line 6 column 3
    expect(r.locate(0, 1)).toEqual({ fileRow: 1, fileCol: 1, where: { line: 3, col: 1 } });
    expect(r.locate(1, 0)).toEqual({ fileRow: 2, fileCol: 2, where: { line: 6, col: 3 } });
  });

  it('detects comma, semicolon, tab and runs of whitespace', () => {
    const want = [0.25, -1, 0.5, 2];
    expect(vals('0.5,2\n0.25,-1\n')).toEqual(want);
    expect(vals('0.5;2\n0.25;-1\n')).toEqual(want);
    expect(vals('0.5\t2\n0.25\t-1\n')).toEqual(want);
    expect(vals('  0.5    2  \n\t0.25 \t -1\n')).toEqual(want);
  });

  it('tolerates spaces and quotes around fields', () => {
    expect(vals('"0.5", \'2\' ,  " 1e-1 "\n')).toEqual([0.5, 2, 0.1]);
    const r = read('  "0.5" ,  7\n');
    expect(r.locate(1, 0).where).toEqual({ line: 1, col: 12 }); // written out: '7' is the 12th character
  });

  it('reads a decimal comma with ; and with whitespace as the separator', () => {
    expect(vals('0,5;1,25e1\n-0,125;"0,75"\n', { decimalComma: true })).toEqual([-0.125, 0.75, 0.5, 12.5]);
    expect(vals('0,5 1\n2 3,5\n', { decimalComma: true })).toEqual([2, 3.5, 0.5, 1]);
  });

  it('keeps nan / inf / Infinity tokens non-finite in any letter case and with a sign', () => {
    const v = vals('nan,NaN,NAN\ninf,-inf,+Infinity\n-Infinity,INF,infinity\n');
    expect(v.slice(6)).toEqual([NaN, NaN, NaN]);
    expect(v.slice(3, 6)).toEqual([Infinity, -Infinity, Infinity]);
    expect(v.slice(0, 3)).toEqual([-Infinity, Infinity, Infinity]);
  });

  it('reads number forms: exponents, leading/trailing marks, signs, long digit strings', () => {
    // JS Number() is the oracle for each written-out token
    const toks = ['1e3', '-2.5E-3', '+.5', '5.', '0.000123', '123456789012345678901234', '0.1000000000000000055511151231257827', '4.9406564584124654e-324', '1.7976931348623157e308', '-0'];
    const v = vals(toks.join(',') + '\n');
    expect(v.map((x) => Object.is(x, -0) ? '-0' : x)).toEqual(toks.map((t) => (t === '-0' ? '-0' : Number(t))));
  });

  it('treats a first line with a non-number field as a header and ignores it in grid layout', () => {
    const r = read('a;b;c\n1;2;3\n');
    expect([...r.grid.values]).toEqual([1, 2, 3]);
    expect(r.locate(2, 0).where).toEqual({ line: 2, col: 5 });
  });

  it('resolves layout auto to long only when the header names x, y and value/rho/density', () => {
    expect(read('x,y,z\n0.5,0.5,1\n').layout).toBe('grid');
    expect(read('X (mm),Y [mm],Rho\n0.5,0.5,1\n').layout).toBe('long');
    expect(read('x,y,value\n0.5,0.5,1\n', { layout: 'grid' }).layout).toBe('grid');
    expect(read('0.5,0.5,1\n', { layout: 'long' }).layout).toBe('long');
  });

  it('does not mutate anything it is given and throws RangeError for a sample outside the grid', () => {
    const o: ReadOptions = { ...DEFAULT_READ_OPTIONS };
    const frozen = Object.freeze({ ...o, cellSize: Object.freeze([1, 1] as const) });
    const r = readCsv('1,2\n', frozen);
    expect(() => r.locate(2, 0)).toThrow(RangeError);
    expect(() => r.locate(0, 1)).toThrow(RangeError);
    expect(() => r.locate(0.5, 0)).toThrow(RangeError);
  });
});
