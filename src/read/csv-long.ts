/**
 * Long layout of the CSV reader: one line per sample with columns x, y, value (mm, y up, any order).
 */
import { RhoformError } from '../errors.js';
import type { ReadOptions, ReadResult, SamplePosition } from './types.js';
import { LINE_CONTENT, LINE_EOF, RowScanner, columnOf, splitFields, type LineCursor } from './csv-scan.js';
import { checkCellSize, lineEndOf } from './csv-grid.js';

/** Relative tolerance (of the spacing) for a coordinate to count as on the lattice. */
const LATTICE_TOL = 1e-6;
/** Coordinates closer than this fraction of their magnitude are the same coordinate (print noise). */
const SAME_TOL = 1e-9;
/** Largest |coordinate| accepted, mm (1 km, as for passive regions: anything beyond is a unit mistake). */
const MAX_COORDINATE = 1e6;

/** Column indices (0-based) of x, y and the value. */
export type LongColumns = readonly [x: number, y: number, value: number];

/** One axis of the lattice: first sample coordinate, spacing, count. */
interface Axis {
  readonly min: number;
  readonly h: number;
  readonly n: number;
  readonly inferred: boolean;
}

/** Above this many distinct values, sorting all coordinates beats collecting them in a Set. */
const SET_CAP = 1 << 16;

/** The sorted distinct values of `coords` (or all of them sorted, when they are very many; docs/notes/read-write.md). */
function distinctSorted(coords: Float64Array): Float64Array {
  const set = new Set<number>();
  let prev = NaN;
  for (let k = 0; k < coords.length; k++) {
    const v = coords[k];
    if (v !== prev) {
      set.add(v);
      prev = v;
      if (set.size > SET_CAP) return coords.slice().sort();
    }
  }
  return Float64Array.from(set).sort();
}

/**
 * The lattice of one axis from its coordinates: the spacing h is the smallest positive difference of the
 * sorted distinct values (values closer than 1e-9 of their magnitude are merged), refined to span / round(span / h)
 * so that print rounding of single values does not bias it. A single distinct value uses `fallback` (mm).
 */
function inferAxis(coords: Float64Array, fallback: number): Axis {
  const s = distinctSorted(coords);
  const min = s[0];
  const max = s[s.length - 1];
  const same = SAME_TOL * Math.max(Math.abs(min), Math.abs(max));
  let hmin = Infinity;
  let prev = min;
  for (let k = 1; k < s.length; k++) {
    const d = s[k] - prev;
    if (d > same) {
      if (d < hmin) hmin = d;
      prev = s[k];
    }
  }
  if (hmin === Infinity) return { min, h: fallback, n: 1, inferred: false };
  const steps = Math.round((max - min) / hmin);
  return { min, h: (max - min) / steps, n: steps + 1, inferred: true };
}

function fmt(v: number): string {
  return String(Number(v.toPrecision(12)));
}

/**
 * Reads the long layout from the cursor's current line (the first data line, `ncols` values) to the end.
 * Spacing and origin are inferred from the coordinates (see inferAxis); with placement 'cells' the
 * coordinates are cell centroids and origin = (min x − hx/2, min y − hy/2), with 'nodes' they are cell
 * corners and origin = (min x, min y). y is already "up": rowOrder does not apply. Every lattice cell must
 * have exactly one line (E_CSV_LONG otherwise).
 */
export function readLongLayout(
  cur: LineCursor,
  sep: number,
  ncols: number,
  cols: LongColumns,
  options: ReadOptions,
): ReadResult {
  checkCellSize(options.cellSize);
  const text = cur.text;
  const maxCells = options.maxCells;
  const cap = Math.max(1, Math.min(cur.lineCount - cur.line + 1, maxCells));
  const xs = new Float64Array(cap);
  const ys = new Float64Array(cap);
  const vs = new Float64Array(cap);
  const recLine = new Int32Array(cap);
  const recStart = new Int32Array(cap);
  const row = new Float64Array(ncols);
  const scanner = new RowScanner(text, sep, options.decimalComma, ncols, cur.line);
  const [cx, cy, cv] = cols;
  let n = 0;
  let kind = LINE_CONTENT;
  while (kind !== LINE_EOF) {
    if (kind === LINE_CONTENT) {
      if (n === cap) {
        throw new RhoformError('E_GRID_SIZE', `expected at most ${maxCells} values (maxCells), found more`, {
          line: cur.line,
          col: 1,
        });
      }
      scanner.scan(cur.lineStart, cur.lineEnd, cur.line, row, 0);
      xs[n] = row[cx];
      ys[n] = row[cy];
      vs[n] = row[cv];
      recLine[n] = cur.line;
      recStart[n] = cur.lineStart;
      n++;
    }
    kind = cur.nextLine();
  }
  const nl = cur.nl;
  const colOf = (rec: number, c: number): number => {
    const start = recStart[rec];
    const fields = splitFields(text, start, lineEndOf(text, start, nl), sep);
    return columnOf(text, start, fields[c].start);
  };
  for (let k = 0; k < n; k++) {
    const x = xs[k];
    const y = ys[k];
    if (!(Math.abs(x) <= MAX_COORDINATE && Math.abs(y) <= MAX_COORDINATE) && x - x === 0 && y - y === 0) {
      const bad = Math.abs(x) <= MAX_COORDINATE ? 'y' : 'x';
      throw new RhoformError(
        'E_CSV_LONG',
        `expected a ${bad} coordinate within ±${MAX_COORDINATE} mm, found ${bad === 'x' ? x : y}`,
        { line: recLine[k], col: colOf(k, bad === 'x' ? cx : cy) },
      );
    }
    if (!(x - x === 0 && y - y === 0)) {
      // x − x is NaN exactly for NaN and ±Infinity
      const bad = x - x === 0 ? 'y' : 'x';
      throw new RhoformError('E_CSV_LONG', `expected a finite ${bad} coordinate, found ${bad === 'x' ? x : y}`, {
        line: recLine[k],
        col: colOf(k, bad === 'x' ? cx : cy),
      });
    }
  }
  const ax = inferAxis(xs.subarray(0, n), options.cellSize[0]);
  const ay = inferAxis(ys.subarray(0, n), options.cellSize[1]);
  const nx = ax.n;
  const ny = ay.n;
  if (!(nx * ny <= maxCells)) {
    throw new RhoformError(
      'E_GRID_SIZE',
      `expected at most ${maxCells} cells (maxCells), found coordinates spanning ${nx} × ${ny} cells ` +
        `(spacing ${fmt(ax.h)} × ${fmt(ay.h)} mm) for ${n} values`,
      { line: recLine[0], col: 1 },
    );
  }
  const values = new Float64Array(nx * ny);
  const owner = new Int32Array(nx * ny);
  for (let k = 0; k < n; k++) {
    const i = Math.round((xs[k] - ax.min) / ax.h);
    const j = Math.round((ys[k] - ay.min) / ay.h);
    const offX = Math.abs(xs[k] - (ax.min + i * ax.h));
    const offY = Math.abs(ys[k] - (ay.min + j * ay.h));
    if (offX > LATTICE_TOL * ax.h || offY > LATTICE_TOL * ay.h) {
      const bad = offX > LATTICE_TOL * ax.h ? 'x' : 'y';
      const a = bad === 'x' ? ax : ay;
      throw new RhoformError(
        'E_CSV_LONG',
        `expected ${bad} on the lattice ${fmt(a.min)} + k·${fmt(a.h)} mm (spacing from the smallest difference), ` +
          `found ${bad} = ${bad === 'x' ? xs[k] : ys[k]}`,
        { line: recLine[k], col: colOf(k, bad === 'x' ? cx : cy) },
      );
    }
    const idx = j * nx + i;
    if (owner[idx] !== 0) {
      const first = recLine[owner[idx] - 1];
      throw new RhoformError(
        'E_CSV_LONG',
        `expected one value per cell, found cell x = ${xs[k]}, y = ${ys[k]} on line ${first} and again on line ${recLine[k]}`,
        { line: recLine[k], col: colOf(k, cx) },
      );
    }
    owner[idx] = k + 1;
    values[idx] = vs[k];
  }
  if (n < nx * ny) {
    const idx = owner.indexOf(0);
    const i = idx % nx;
    const j = (idx - i) / nx;
    // The missing cell has no line of its own: point at the line of its nearest neighbour in lattice order.
    let near = idx - 1;
    while (near >= 0 && owner[near] === 0) near--;
    if (near < 0) for (near = idx + 1; owner[near] === 0; near++);
    const line = recLine[owner[near] - 1];
    throw new RhoformError(
      'E_CSV_LONG',
      `expected a value for each of the ${nx} × ${ny} cells of the lattice, found ${nx * ny - n} missing; ` +
        `first missing at x = ${fmt(ax.min + i * ax.h)}, y = ${fmt(ay.min + j * ay.h)} (next to the cell on line ${line})`,
      { line, col: 1 },
    );
  }
  const warnings: string[] = [];
  if (!ax.inferred) warnings.push(`one distinct x only: cell width ${ax.h} mm taken from the cell size option`);
  if (!ay.inferred) warnings.push(`one distinct y only: cell height ${ay.h} mm taken from the cell size option`);
  if (options.values === 'nodes' && (nx < 2 || ny < 2)) {
    throw new RhoformError(
      'E_GRID_EMPTY',
      `expected at least 2 × 2 values for nodal values (cell corners), found ${nx} × ${ny}`,
      { line: recLine[0], col: 1 },
    );
  }
  const half = options.values === 'nodes' ? 0 : 0.5;
  const locate = (i: number, j: number): SamplePosition => {
    if (!(Number.isInteger(i) && Number.isInteger(j) && i >= 0 && i < nx && j >= 0 && j < ny)) {
      throw new RangeError(`sample (${i}, ${j}) is outside the ${nx} × ${ny} grid`);
    }
    const rec = owner[j * nx + i] - 1;
    return { fileRow: recLine[rec], fileCol: cv + 1, where: { line: recLine[rec], col: colOf(rec, cv) } };
  };
  return {
    grid: {
      nx,
      ny,
      cellSize: [ax.h, ay.h],
      origin: [ax.min - half * ax.h, ay.min - half * ay.h],
      values,
      placement: options.values,
    },
    format: 'csv',
    layout: 'long',
    locate,
    warnings,
    ownsValues: true, // placed into a fresh array
  };
}
