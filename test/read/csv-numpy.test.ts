/**
 * The CSV reader on files written by numpy.savetxt (fixtures/make/make_csv_fixtures.py). The expected
 * grids come from the manifest numpy's script wrote beside them, not from this project's code.
 */
import { readFileSync } from 'node:fs';
import { describe, it, expect } from 'vitest';
import { readCsv } from '../../src/read/csv.js';
import { DEFAULT_READ_OPTIONS, type ReadOptions } from '../../src/read/types.js';

interface Entry {
  file: string;
  writtenBy: string;
  layout: 'grid' | 'long';
  nx: number;
  ny: number;
  cellSize: [number, number];
  origin: [number, number];
  rows: (number | string)[][];
  decimalComma?: boolean;
  sameAs?: string;
}

const dir = new URL('../../fixtures/csv/', import.meta.url);
const manifest = JSON.parse(readFileSync(new URL('manifest.json', dir), 'utf8')) as Entry[];
const text = (name: string): string => readFileSync(new URL(name, dir), 'utf8');
const dec = (v: number | string): number =>
  typeof v === 'number' ? v : v === 'nan' ? NaN : v === 'inf' ? Infinity : -Infinity;

function read(e: Entry, extra: Partial<ReadOptions> = {}) {
  return readCsv(text(e.file), { ...DEFAULT_READ_OPTIONS, decimalComma: e.decimalComma ?? false, ...extra });
}

describe('files written by numpy.savetxt', () => {
  it('the manifest lists every delimiter, the default format, a header, CRLF, non-finite and long files', () => {
    const names = manifest.map((e) => e.file);
    expect(names).toEqual(
      expect.arrayContaining(['grid-comma.csv', 'grid-semicolon.csv', 'grid-tab.tsv', 'grid-space.txt',
        'grid-default.txt', 'grid-header.csv', 'grid-crlf.csv', 'grid-nonfinite.csv', 'long-shuffled.csv']),
    );
  });

  for (const e of manifest) {
    it(`${e.file}: ${e.writtenBy}`, () => {
      const r = read(e);
      // numpy manifest: size, layout, spacing and origin as the script laid them out
      expect(r.format).toBe('csv');
      expect(r.layout).toBe(e.layout);
      expect([r.grid.nx, r.grid.ny]).toEqual([e.nx, e.ny]);
      expect(r.grid.placement).toBe('cells');
      expect(r.grid.cellSize[0]).toBeCloseTo(e.cellSize[0], 12);
      expect(r.grid.cellSize[1]).toBeCloseTo(e.cellSize[1], 12);
      expect(r.grid.origin[0]).toBeCloseTo(e.origin[0], 12);
      expect(r.grid.origin[1]).toBeCloseTo(e.origin[1], 12);
      // numpy manifest: every double exactly as Python's repr round-trips it (rows listed top first,
      // so manifest row r is grid row j = ny − 1 − r); Object.is keeps NaN, ±Infinity and −0 apart
      for (let r0 = 0; r0 < e.ny; r0++) {
        for (let i = 0; i < e.nx; i++) {
          const got = r.grid.values[(e.ny - 1 - r0) * e.nx + i];
          if (!Object.is(got, dec(e.rows[r0][i]))) {
            throw new Error(`${e.file} row ${r0 + 1} col ${i + 1}: ${got} ≠ ${e.rows[r0][i]}`);
          }
        }
      }
    });
  }

  it('keeps nan, inf and -inf (numpy writes them so) as NaN, +Infinity, -Infinity', () => {
    const e = manifest.find((m) => m.file === 'grid-nonfinite.csv')!;
    const r = read(e);
    const at = (row: number, col: number) => r.grid.values[(e.ny - 1 - row) * e.nx + col];
    // numpy manifest: nan at file row 2 col 2, inf at 3/3, -inf at 4/4 (1-based)
    expect(at(1, 1)).toBeNaN();
    expect(at(2, 2)).toBe(Infinity);
    expect(at(3, 3)).toBe(-Infinity);
  });

  it('long form in shuffled order equals the grid form of the same field', () => {
    const long = read(manifest.find((m) => m.file === 'long-shuffled.csv')!);
    const grid = read(manifest.find((m) => m.file === 'grid-comma.csv')!, { cellSize: [0.5, 0.5] });
    // numpy script: both files hold one field; the long one has centroids ((i + ½)·0.5, (j + ½)·0.5)
    expect(long.grid).toEqual(grid.grid);
  });

  it('grid layout locate() points at the token (line and column found by String.split)', () => {
    const e = manifest.find((m) => m.file === 'grid-header.csv')!;
    const r = read(e);
    const lines = text(e.file).split('\n');
    for (const [i, j] of [[0, 0], [6, 4], [3, 2], [6, 0]]) {
      const p = r.locate(i, j);
      const fileRow = e.ny - j; // top-down: the top grid row is data row 1
      expect([p.fileRow, p.fileCol]).toEqual([fileRow, i + 1]);
      expect(p.where.line).toBe(fileRow + 1); // the header is line 1
      const fields = lines[fileRow].split(',');
      const col = fields.slice(0, i).reduce((s, f) => s + f.length + 1, 0) + 1;
      expect(p.where.col).toBe(col);
      expect(Number(fields[i])).toBe(r.grid.values[j * e.nx + i]);
    }
  });

  it('long layout locate() gives the line of the cell and the value column (checked by String.split)', () => {
    const e = manifest.find((m) => m.file === 'long-columns.csv')!;
    const r = read(e);
    const lines = text(e.file).split('\n');
    for (const [i, j] of [[0, 0], [6, 4], [2, 3]]) {
      const p = r.locate(i, j);
      const [rho, y, x] = lines[p.where.line! - 1].split(';').map(Number);
      // numpy script: x = 10 + (i + ½)·0.5, y = −3 + (j + ½)·0.25, columns density;y;x
      expect(x).toBeCloseTo(10 + (i + 0.5) * 0.5, 12);
      expect(y).toBeCloseTo(-3 + (j + 0.5) * 0.25, 12);
      expect(rho).toBe(r.grid.values[j * e.nx + i]);
      expect([p.fileRow, p.fileCol, p.where.col]).toEqual([p.where.line, 1, 1]);
    }
  });
});
