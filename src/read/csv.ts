/**
 * CSV / delimited-text reader (docs/input-csv.md): text → DensityGrid.
 */
import { RhoformError } from '../errors.js';
import type { ReadOptions, ReadResult } from './types.js';
import {
  LINE_BLANK,
  LINE_COMMENT,
  LINE_CONTENT,
  LineCursor,
  detectSeparator,
  splitFields,
} from './csv-scan.js';
import { parseNumberToken } from './csv-number.js';
import { readGridLayout } from './csv-grid.js';
import { readLongLayout, type LongColumns } from './csv-long.js';

/** Moves the cursor to the next content line; also returns the range of the last comment line met on the way. */
function toContent(cur: LineCursor): { found: boolean; comment: [number, number] | null } {
  let comment: [number, number] | null = null;
  for (;;) {
    const kind = cur.nextLine();
    if (kind === LINE_CONTENT) return { found: true, comment };
    if (kind === LINE_COMMENT) comment = [cur.lineStart, cur.lineEnd];
    else if (kind !== LINE_BLANK) return { found: false, comment };
  }
}

/** A header name without case, quotes or a trailing unit such as "(mm)" or "[mm]". */
function normName(name: string): string {
  return name.replace(/\s*[[(].*$/, '').trim().toLowerCase();
}

/** Indices of the x, y and value columns when the names say so, else null. */
export function longColumns(names: readonly string[]): LongColumns | null {
  const norm = names.map(normName);
  const x = norm.indexOf('x');
  const y = norm.indexOf('y');
  let v = norm.indexOf('value');
  if (v < 0) v = norm.indexOf('rho');
  if (v < 0) v = norm.indexOf('density');
  return x >= 0 && y >= 0 && v >= 0 ? [x, y, v] : null;
}

/**
 * Reads delimited text into a DensityGrid (values in mm, y up, origin at the lower-left corner).
 *
 * - A leading BOM is dropped. Lines end at LF or CRLF (CR alone in CR-only files). Blank lines and lines
 *   starting with '#' are skipped anywhere; line numbers in messages and `locate` are those of the file.
 * - Separator: detected on the first data line — ',' (never with `decimalComma`), else ';', else tab, else
 *   runs of spaces/tabs — and then required on every line. Fields may carry surrounding spaces and quotes.
 * - Numbers: decimals with an optional exponent, and nan / inf / infinity (kept as NaN, ±Infinity for
 *   src/field/prepare.ts to handle).
 * - Header: a first content line in which no field is a number (a line mixing numbers and words is data,
 *   reported at its bad token, so a typo never silently drops a row). Grid layout ignores it; long layout takes
 *   column names from it (a `#` comment line right before the data counts as a header for names too).
 * - Layout 'grid': each line a row; rowOrder 'top-down' puts the first data line at the top
 *   (grid row j = ny − 1 − r); nx = columns, ny = rows; cell size and placement from the options; origin (0, 0).
 *   Layout 'long': columns x, y, value of cell centroids (or nodes) in mm, any order; spacing and origin
 *   inferred; rowOrder does not apply. 'auto' picks 'long' when the header names x, y and value/rho/density.
 * - Errors (RhoformError with a 1-based {line, col}): E_CSV_EMPTY, E_CSV_TOKEN, E_CSV_RAGGED, E_CSV_LONG,
 *   E_GRID_SIZE (as soon as the count passes `maxCells`, before allocating more), E_GRID_EMPTY (nodal grid
 *   smaller than 2 × 2), E_USAGE (cell size not positive and finite, maxCells not ≥ 1).
 * - `locate(i, j)`: grid layout → data row / column in the file and the token's {line, col}; long layout →
 *   fileRow = the line number of the cell's line, fileCol = the 1-based index of the value column (3 for
 *   x, y, value). Columns are found lazily by re-scanning that line, so the result keeps `text` alive.
 */
export function readCsv(text: string, options: ReadOptions): ReadResult {
  if (!(options.maxCells >= 1)) {
    throw new RhoformError('E_USAGE', `expected maxCells to be a positive count, found ${options.maxCells}`);
  }
  const body = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  const cur = new LineCursor(body);
  const first = toContent(cur);
  if (!first.found) {
    throw new RhoformError('E_CSV_EMPTY', 'expected rows of numbers, found no data lines', { line: Math.max(1, cur.line) });
  }
  const dc = options.decimalComma;
  const line1: [number, number, number] = [cur.lineStart, cur.lineEnd, cur.line];
  const sep1 = detectSeparator(body, line1[0], line1[1], dc);
  // A header has no number in it (and some text). A line mixing numbers and words is data with a bad
  // token: taking it for a header would silently drop a row of the grid.
  const fields1 = splitFields(body, line1[0], line1[1], sep1);
  const isHeader =
    fields1.some((f) => f.token !== '') && fields1.every((f) => f.token === '' || parseNumberToken(f.token, dc) === undefined);
  let sep = sep1;
  let names: string[] | null = null;
  if (isHeader) {
    if (!toContent(cur).found) {
      throw new RhoformError('E_CSV_EMPTY', `expected rows of numbers after the header on line ${line1[2]}, found none`, {
        line: Math.max(1, cur.line),
      });
    }
    sep = detectSeparator(body, cur.lineStart, cur.lineEnd, dc);
    names = splitFields(body, line1[0], line1[1], sep).map((f) => f.token);
  } else if (first.comment) {
    // A commented header ("# x,y,value", as numpy.savetxt writes by default) right before the data.
    const [a, b] = first.comment;
    names = splitFields(body, body.indexOf('#', a) + 1, b, sep).map((f) => f.token);
  }
  const ncols = splitFields(body, cur.lineStart, cur.lineEnd, sep, options.maxCells, {
    line: cur.line,
    what: 'values',
  }).length;
  const named = names ? longColumns(names) : null;
  const long = options.layout === 'long' || (options.layout === 'auto' && named !== null);
  if (!long) return readGridLayout(cur, sep, ncols, options);
  let cols = named;
  if (!cols) {
    if (ncols !== 3) {
      throw new RhoformError(
        'E_CSV_LONG',
        `expected columns x, y, value (named in a header, or exactly 3 columns), found ${ncols} unnamed columns`,
        { line: cur.line, col: 1 },
      );
    }
    cols = [0, 1, 2];
  } else if (Math.max(...cols) >= ncols) {
    throw new RhoformError(
      'E_CSV_LONG',
      `expected the ${Math.max(...cols) + 1} columns named in the header on line ${line1[2]}, found ${ncols}`,
      { line: cur.line, col: 1 },
    );
  }
  return readLongLayout(cur, sep, ncols, cols, options);
}
