/**
 * Grid layout of the CSV reader: each data line is one row of samples.
 */
import { RhoformError } from '../errors.js';
import type { ReadOptions, ReadResult, SamplePosition } from './types.js';
import { LINE_CONTENT, LINE_EOF, RowScanner, columnOf, splitFields, type LineCursor } from './csv-scan.js';

/** Checks a positive, finite cell size (NaN cannot pass). */
export function checkCellSize(cellSize: readonly [number, number]): void {
  const [hx, hy] = cellSize;
  if (!(hx > 0 && hx < Infinity && hy > 0 && hy < Infinity)) {
    throw new RhoformError('E_USAGE', `expected a positive, finite cell size in mm, found ${hx}, ${hy}`);
  }
}

/** Offset just before the line break of the line starting at `start` (CRLF-aware). */
export function lineEndOf(text: string, start: number, nl: number): number {
  let eol = text.indexOf(nl === 10 ? '\n' : '\r', start);
  if (eol < 0) eol = text.length;
  if (nl === 10 && eol > start && text.charCodeAt(eol - 1) === 13) eol--;
  return eol;
}

/**
 * Reads the grid layout from the cursor's current line (the first data line, holding `ncols` values) to the
 * end. File row 1 becomes grid row j = ny − 1 with rowOrder 'top-down', j = 0 with 'bottom-up'; the file
 * column c becomes i = c − 1. Origin (0, 0), cell size from the options, placement from `options.values`.
 * Output buffers are sized once from the line count (capped by maxCells), so no row is copied twice.
 */
export function readGridLayout(cur: LineCursor, sep: number, ncols: number, options: ReadOptions): ReadResult {
  checkCellSize(options.cellSize);
  const text = cur.text;
  const maxCells = options.maxCells;
  const topDown = options.rowOrder !== 'bottom-up';
  const remaining = cur.lineCount - cur.line + 1;
  const capRows = Math.max(1, Math.min(remaining, Math.floor(maxCells / ncols)));
  const buf = new Float64Array(capRows * ncols);
  const rowLine = new Int32Array(capRows);
  const rowStart = new Int32Array(capRows);
  const scanner = new RowScanner(text, sep, options.decimalComma, ncols, cur.line);
  let rows = 0;
  let kind = LINE_CONTENT;
  while (kind !== LINE_EOF) {
    if (kind === LINE_CONTENT) {
      if (rows === capRows) {
        throw new RhoformError(
          'E_GRID_SIZE',
          `expected at most ${maxCells} values (maxCells), found more: ${rows + 1} rows of ${ncols}`,
          { line: cur.line, col: 1 },
        );
      }
      const block = topDown ? capRows - 1 - rows : rows;
      scanner.scan(cur.lineStart, cur.lineEnd, cur.line, buf, block * ncols);
      rowLine[rows] = cur.line;
      rowStart[rows] = cur.lineStart;
      rows++;
    }
    kind = cur.nextLine();
  }
  let values = buf;
  if (rows !== capRows) values = topDown ? buf.slice((capRows - rows) * ncols) : buf.slice(0, rows * ncols);
  const nx = ncols;
  const ny = rows;
  if (options.values === 'nodes' && (nx < 2 || ny < 2)) {
    throw new RhoformError(
      'E_GRID_EMPTY',
      `expected at least 2 × 2 values for nodal values (cell corners), found ${nx} × ${ny}`,
      { line: rowLine[0], col: 1 },
    );
  }
  const nl = cur.nl;
  const locate = (i: number, j: number): SamplePosition => {
    if (!(Number.isInteger(i) && Number.isInteger(j) && i >= 0 && i < nx && j >= 0 && j < ny)) {
      throw new RangeError(`sample (${i}, ${j}) is outside the ${nx} × ${ny} grid`);
    }
    const r = topDown ? ny - 1 - j : j;
    const start = rowStart[r];
    const fields = splitFields(text, start, lineEndOf(text, start, nl), sep);
    return { fileRow: r + 1, fileCol: i + 1, where: { line: rowLine[r], col: columnOf(text, start, fields[i].start) } };
  };
  return {
    grid: {
      nx,
      ny,
      cellSize: [options.cellSize[0], options.cellSize[1]],
      origin: [0, 0],
      values,
      placement: options.values,
    },
    format: 'csv',
    layout: 'grid',
    locate,
    warnings: [],
    ownsValues: true, // parsed into a fresh array
  };
}
