/**
 * NPY reader: the bytes of a `.npy` file → a DensityGrid.
 *
 * Format: NEP 1 (R. Kern, "A simple file format for NumPy arrays", 2007,
 * numpy.org/neps/nep-0001-npy-format.html), versions 1.0, 2.0 and 3.0, as written by numpy.
 * See docs/input-npy.md for what is accepted and every error.
 */
import { RhoformError, UsageError } from '../errors.js';
import type { DensityGrid } from '../types.js';
import { decodeNpyData, type NpyDecodePath } from './npy-decode.js';
import { parseNpyDtype } from './npy-dtype.js';
import { parseNpyHeader } from './npy-header.js';
import { checkReadOptions } from './options.js';
import type { ReadOptions, ReadResult, SamplePosition } from './types.js';

/**
 * Reads an NPY file holding a 2-D array (rows, cols) — or a 3-D array with exactly one axis of length 1,
 * which is squeezed with a warning — of a real numeric dtype (f2, f4, f8, i1–i8, u1–u8, b1; either byte
 * order; C or Fortran order).
 *
 * Frame: the array is read as numpy shows it, (rows, cols); nx = cols, ny = rows. With
 * `rowOrder: 'top-down'` array row 0 is the top of the part, so array row r is grid row j = rows − 1 − r
 * (y up, origin at the lower-left corner, origin [0, 0]); with 'bottom-up' array row 0 is the bottom row.
 * cellSize [hx, hy] in mm comes from the options; sample placement (cell centres or cell corners) is
 * `options.values`. Values are not mapped or clipped: NaN and ±Infinity stay as they are, booleans
 * become 0/1, integers become float64 (64-bit integers rounded to the nearest double above 2^53).
 *
 * With `options.consumeBytes`, aligned little-endian f8 C-order data are flipped into grid order inside `bytes`
 * and viewed there (no copy), and so are f4 data, widened to f8 in place, when `options.room` leaves space for
 * them (npyInPlaceBytes); `bytes` then no longer hold the file as it was.
 *
 * `locate(i, j)` gives the 1-based array row and column as numpy shows the 2-D array, and the byte
 * offset of that element in the file (Fortran order accounted for).
 *
 * The sample count is checked against `options.maxCells` from the header alone, before any allocation.
 * @throws RhoformError with `where.byteOffset`: E_NPY_MAGIC, E_NPY_VERSION, E_NPY_HEADER, E_NPY_DTYPE,
 *   E_NPY_SHAPE, E_NPY_TRUNCATED, E_GRID_EMPTY, E_GRID_SIZE; UsageError (E_USAGE) for bad options.
 */
export function readNpy(bytes: Uint8Array, options: ReadOptions): ReadResult {
  return readNpyWith(bytes, options, 'auto');
}

/** readNpy with a choice of decoding path; 'general' forces the DataView path (used by tests). */
export function readNpyWith(bytes: Uint8Array, options: ReadOptions, path: NpyDecodePath): ReadResult {
  const { hx, hy, topDown } = checkReadOptions(options);
  const header = parseNpyHeader(bytes);
  const dtype = parseNpyDtype(header.descr, { byteOffset: header.descrOffset });
  const warnings: string[] = [];
  if (options.layout === 'long') warnings.push("layout 'long' applies to CSV files only; the NPY array was read as a grid");
  const { rows, cols } = gridShape(header.shape, header.shapeOffset, warnings);
  const shapeText = showShape(header.shape);

  const count = rows * cols;
  if (count === 0) {
    throw new RhoformError('E_GRID_EMPTY', `expected at least one sample, found an empty array of shape ${shapeText}`, { byteOffset: header.shapeOffset });
  }
  if (!(count <= options.maxCells)) {
    throw new RhoformError(
      'E_GRID_SIZE',
      `expected at most ${options.maxCells} samples (maxCells, --max-cells), found shape ${shapeText} = ${count} samples`,
      { byteOffset: header.shapeOffset },
    );
  }
  if (options.values === 'nodes' && (rows < 2 || cols < 2)) {
    throw new RhoformError(
      'E_GRID_EMPTY',
      `expected at least 2 × 2 values for nodal values (cell corners), found shape ${shapeText}`,
      { byteOffset: header.shapeOffset },
    );
  }
  const need = count * dtype.size;
  const have = bytes.length - header.dataOffset;
  if (have < need) {
    throw new RhoformError('E_NPY_TRUNCATED', `expected ${need} bytes of data for shape ${shapeText} ${dtype.descr}, found ${have}`, { byteOffset: header.dataOffset });
  }
  if (have > need) warnings.push(`${have - need} bytes after the array data (from byte ${header.dataOffset + need}) were ignored`);

  const consume = options.consumeBytes === true;
  const { values, view } = decodeNpyData(bytes, { dtype, dataOffset: header.dataOffset, rows, cols, fortranOrder: header.fortranOrder }, topDown, path, consume, options.room ?? 0);
  const grid: DensityGrid = { nx: cols, ny: rows, cellSize: [hx, hy], origin: [0, 0], values, placement: options.values };

  const { dataOffset, fortranOrder } = header;
  const size = dtype.size;
  const locate = (i: number, j: number): SamplePosition => {
    if (!(Number.isInteger(i) && i >= 0 && i < cols && Number.isInteger(j) && j >= 0 && j < rows)) {
      throw new RangeError(`locate: expected 0 ≤ i < ${cols} and 0 ≤ j < ${rows}, found (${i}, ${j})`);
    }
    const r = topDown ? rows - 1 - j : j;
    // squeezing a unit axis keeps the element order, so the 2-D index is the file index
    const k = fortranOrder ? i * rows + r : r * cols + i;
    return { fileRow: r + 1, fileCol: i + 1, where: { byteOffset: dataOffset + k * size } };
  };
  return { grid, format: 'npy', layout: 'grid', locate, warnings, ownsValues: !view || consume };
}

/**
 * How many bytes, from the start of an NPY file, a buffer needs so that readNpy with `consumeBytes` widens its
 * data to f8 in place: the data offset plus 8 bytes a sample, for little-endian f4 in C order at an 8-byte
 * aligned offset (the buffer itself starting 8-byte aligned). 0 when the file's own bytes suffice (f8), when its
 * data are converted into a new array anyway, when it has more than `maxCells` samples, or when `head` (the
 * file's first bytes, the whole header) cannot be read: the reader reports those. A caller that reads the file
 * into a buffer this large passes the bytes after the file as `room`.
 */
export function npyInPlaceBytes(head: Uint8Array, maxCells: number): number {
  try {
    const header = parseNpyHeader(head);
    const dtype = parseNpyDtype(header.descr, { byteOffset: header.descrOffset });
    const count = header.shape.reduce((a, b) => a * b, 1);
    const f4 = dtype.kind === 'f' && dtype.size === 4 && dtype.littleEndian;
    if (!f4 || header.fortranOrder || header.dataOffset % 8 !== 0 || !(count > 0 && count <= maxCells)) return 0;
    return header.dataOffset + 8 * count;
  } catch {
    return 0;
  }
}

/** (rows, cols) of a 2-D array, or of a 3-D array squeezed along its one unit axis. */
function gridShape(shape: readonly number[], byteOffset: number, warnings: string[]): { rows: number; cols: number } {
  if (shape.length === 2) return { rows: shape[0], cols: shape[1] };
  const expected = 'expected a 2-D array (rows, columns) or a 3-D array with exactly one axis of length 1';
  if (shape.length === 3) {
    const unit = shape.flatMap((d, axis) => (d === 1 ? [axis] : []));
    if (unit.length === 1) {
      const rest = shape.filter((_, axis) => axis !== unit[0]);
      warnings.push(`the 3-D array of shape ${showShape(shape)} was squeezed to 2-D ${showShape(rest)} by dropping axis ${unit[0]} (length 1)`);
      return { rows: rest[0], cols: rest[1] };
    }
    const why = unit.length === 0 ? 'no axis of length 1' : `${unit.length} axes of length 1, which is ambiguous`;
    throw new RhoformError('E_NPY_SHAPE', `${expected}, found shape ${showShape(shape)} (${why})`, { byteOffset });
  }
  throw new RhoformError('E_NPY_SHAPE', `${expected}, found shape ${showShape(shape)} (${shape.length}-D)`, { byteOffset });
}

/** A shape as Python prints it: (3, 5), (5,), (). */
function showShape(shape: readonly number[]): string {
  return shape.length === 1 ? `(${shape[0]},)` : `(${shape.join(', ')})`;
}
