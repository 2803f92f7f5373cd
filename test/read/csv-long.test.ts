/**
 * Long layout (x, y, value per line): lattice inference, any order, and its errors. Expected grids are
 * built from closed-form fields (value = i + 10·j) written out by the test, independent of the reader.
 */
import { describe, it, expect } from 'vitest';
import { readCsv } from '../../src/read/csv.js';
import { RhoformError } from '../../src/errors.js';
import { DEFAULT_READ_OPTIONS, type ReadOptions } from '../../src/read/types.js';
import { rhoformErrorOf } from '../support/errors.js';

const read = (text: string, o: Partial<ReadOptions> = {}) => readCsv(text, { ...DEFAULT_READ_OPTIONS, ...o });
function fail(text: string, o: Partial<ReadOptions> = {}): RhoformError {
  return rhoformErrorOf(() => read(text, o), 'expected an error');
}

/** Lines "x,y,value" of centroids ((i + ½)hx + ox, (j + ½)hy + oy) with value i + 10j, in a seeded shuffled order. */
function longLines(nx: number, ny: number, h: [number, number], o: [number, number], seed = 1): string[] {
  const lines: string[] = [];
  for (let j = 0; j < ny; j++) {
    for (let i = 0; i < nx; i++) lines.push(`${o[0] + (i + 0.5) * h[0]},${o[1] + (j + 0.5) * h[1]},${i + 10 * j}`);
  }
  let s = seed;
  for (let k = lines.length - 1; k > 0; k--) {
    s = (s * 1103515245 + 12345) >>> 0;
    const m = s % (k + 1);
    [lines[k], lines[m]] = [lines[m], lines[k]];
  }
  return lines;
}

describe('readCsv long layout', () => {
  it('reads shuffled centroids into the grid that the grid layout gives for the same field', () => {
    const nx = 6;
    const ny = 4;
    const long = read(['x,y,value', ...longLines(nx, ny, [0.5, 0.5], [0, 0])].join('\n'));
    // the same field as a grid file, top row first (j = ny − 1 on line 1)
    const rows = Array.from({ length: ny }, (_, r) => Array.from({ length: nx }, (_, i) => i + 10 * (ny - 1 - r)).join(' '));
    const grid = read(rows.join('\n'), { cellSize: [0.5, 0.5] });
    expect(long.layout).toBe('long');
    expect(long.grid).toEqual(grid.grid);
  });

  it('infers a 0.5 mm spacing and the origin from centroids (origin = min − h/2)', () => {
    const r = read(['x,y,rho', ...longLines(5, 3, [0.5, 0.5], [2, -1])].join('\n'));
    // written out: centroids x from 2.25 to 4.25, y from −0.75 to 0.25
    expect(r.grid.cellSize).toEqual([0.5, 0.5]);
    expect(r.grid.origin).toEqual([2, -1]);
    expect([r.grid.nx, r.grid.ny]).toEqual([5, 3]);
    expect(r.grid.values[2 * 5 + 4]).toBe(24); // i = 4, j = 2 → 4 + 10·2
  });

  it('infers rectangular cells and uses node coordinates as they are with values = nodes', () => {
    const lines = ['x;y;density'];
    for (let j = 0; j < 3; j++) for (let i = 0; i < 4; i++) lines.push(`${i * 0.2};${j * 1.5};${i + 10 * j}`);
    const r = read(lines.join('\n'), { values: 'nodes' });
    expect(r.grid.cellSize[0]).toBeCloseTo(0.2, 15);
    expect(r.grid.cellSize[1]).toBe(1.5);
    expect(r.grid.origin).toEqual([0, 0]);
    expect(r.grid.placement).toBe('nodes');
  });

  it('does not apply rowOrder: y is already up', () => {
    const text = ['x,y,value', ...longLines(3, 3, [1, 1], [0, 0])].join('\n');
    expect(read(text, { rowOrder: 'bottom-up' }).grid.values).toEqual(read(text).grid.values);
    expect(read(text).grid.values[0]).toBe(0); // i = 0, j = 0 → value 0 at the lowest y
  });

  it('takes columns by header name in any order, ignoring extra columns', () => {
    const r = read('id,Value,Y,X\n1,7,0.5,0.5\n2,8,0.5,1.5\n');
    expect([...r.grid.values]).toEqual([7, 8]);
    expect(r.locate(1, 0)).toEqual({ fileRow: 3, fileCol: 2, where: { line: 3, col: 3 } });
  });

  it('reads a numpy-style commented header and, with layout long, three unnamed columns', () => {
    expect(read('# x,y,value\n0.5,0.5,3\n1.5,0.5,4\n').layout).toBe('long');
    const r = read('0.5 0.5 3\n1.5 0.5 4\n', { layout: 'long' });
    expect([...r.grid.values]).toEqual([3, 4]);
  });

  it('merges print noise: 0.30000000000000004 and 0.3 are one coordinate', () => {
    const r = read('x,y,value\n0.1,0.1,1\n0.30000000000000004,0.1,2\n0.1,0.3,3\n0.3,0.3,4\n');
    expect([...r.grid.values]).toEqual([1, 2, 3, 4]);
    expect(r.grid.cellSize[0]).toBeCloseTo(0.2, 12);
  });

  it('uses the cell size option for an axis with a single distinct coordinate, and says so', () => {
    const r = read('x,y,value\n0.5,3,1\n1.5,3,2\n', { cellSize: [1, 0.25] });
    expect([r.grid.nx, r.grid.ny, r.grid.cellSize, r.grid.origin]).toEqual([2, 1, [1, 0.25], [0, 2.875]]);
    expect(r.warnings).toHaveLength(1);
  });

  it('E_CSV_LONG for a duplicate cell, naming both lines', () => {
    const e = fail('x,y,value\n0.5,0.5,1\n1.5,0.5,2\n\n0.5,0.5,3\n1.5,1.5,4\n0.5,1.5,5\n');
    expect(e.code).toBe('E_CSV_LONG');
    expect(e.detail).toBe('expected one value per cell, found cell x = 0.5, y = 0.5 on line 2 and again on line 5');
    expect(e.where).toEqual({ line: 5, col: 1 });
  });

  it('E_CSV_LONG for missing cells with their count and the first missing centroid', () => {
    const lines = longLines(4, 3, [0.5, 0.5], [0, 0]).filter((l) => !l.startsWith('0.75,0.25,') && !l.startsWith('1.75,1.25,'));
    const e = fail(['x,y,value', ...lines].join('\n'));
    expect(e.code).toBe('E_CSV_LONG');
    // written out: 12 cells, 2 left out; the first by (y, x) is (0.75, 0.25)
    // the place: the line of its neighbour in lattice order, the cell (0.25, 0.25)
    const line = ['x,y,value', ...lines].findIndex((l) => l.startsWith('0.25,0.25,')) + 1;
    expect(e.detail).toBe(`expected a value for each of the 4 × 3 cells of the lattice, found 2 missing; first missing at x = 0.75, y = 0.25 (next to the cell on line ${line})`);
    expect(e.where).toEqual({ line, col: 1 });
  });

  it('E_CSV_LONG for a coordinate off the lattice, at its line and column', () => {
    // written out: y = 0, 1.001, 2 → spacing 2 / round(2 / 0.999) = 1 mm; 1.001 is 1e-3 of it off (> 1e-6)
    const off = fail('x,y,value\n0,0,1\n1,0,2\n2,0,3\n0, 1.001,4\n1,2,5\n');
    expect(off.code).toBe('E_CSV_LONG');
    expect(off.where).toEqual({ line: 5, col: 4 });
    expect(off.detail).toContain('found y = 1.001');
    // within 1e-6 of the spacing is on the lattice: y = 0, 1.0000001, 2 → spacing 1, three rows
    const near = read('x,y,value\n0,0,1\n0,1.0000001,2\n0,2,3\n');
    expect([near.grid.ny, near.grid.cellSize[1], [...near.grid.values]]).toEqual([3, 1, [1, 2, 3]]);
  });

  it('E_CSV_LONG for a non-finite coordinate and for unnamed columns that are not three', () => {
    const e = fail('x,y,value\n0.5,nan,1\n');
    expect([e.code, e.where]).toEqual(['E_CSV_LONG', { line: 2, col: 5 }]);
    expect(fail('1,2,3,4\n', { layout: 'long' }).code).toBe('E_CSV_LONG');
    expect(fail('x,y,value\n1,2\n').code).toBe('E_CSV_LONG');
  });

  it('E_GRID_SIZE for too many lines and for coordinates spanning too large a lattice, before allocating it', () => {
    const e = fail(['x,y,value', ...longLines(4, 4, [1, 1], [0, 0])].join('\n'), { maxCells: 10 });
    expect([e.code, e.where]).toEqual(['E_GRID_SIZE', { line: 12, col: 1 }]); // the 11th data line
    const sparse = fail('x,y,value\n0,0,1\n0.001,0,1\n1000,0,1\n', { maxCells: 1000 });
    expect(sparse.code).toBe('E_GRID_SIZE'); // 1e6 + 1 cells implied by a spacing of 0.001 mm over 1000 mm
  });
});
