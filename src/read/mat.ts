/**
 * MAT-file level 5 reader (MATLAB `save` up to `-v7`, Octave `save -mat7-binary`, scipy.io.savemat): the bytes of
 * a `.mat` file → a DensityGrid.
 *
 * Format: MathWorks, "MATLAB MAT-File Format" (matfile_format.pdf, version 7 and later): a 128-byte header (116
 * bytes of text starting "MATLAB 5.0 MAT-file", 8 bytes of subsystem offset, version 0x0100, endian indicator
 * "IM" for little-endian or "MI" for big-endian files), then one data element per variable, each a matrix
 * (miMATRIX) or a zlib stream holding one (miCOMPRESSED, inflated with node:zlib). See docs/input-mat.md.
 */
import { constants, inflateSync } from 'node:zlib';
import { RhoformError } from '../errors.js';
import type { DensityGrid } from '../types.js';
import { kindSize, numbersAt, toGrid } from './binary.js';
import { chooseCandidate, type Candidate } from './choose.js';
import { className, MI_COMPRESSED, MI_MATRIX, miKind, readMatrixHeader, readTag, type MatrixHeader } from './mat-element.js';
import { checkReadOptions, layoutWarning } from './options.js';
import { hasHdf5Signature, registerReader } from './registry.js';
import type { ReadOptions, ReadResult, SamplePosition } from './types.js';

const V73_ADVICE = "save it as a level-5 MAT-file instead: save(filename, 'x', '-v7') in MATLAB, or save -mat7-binary in Octave";

/** One variable of the file: its header and where its bytes are. */
interface MatVariable {
  readonly header: MatrixHeader;
  /** File offset of the variable's data element tag. */
  readonly offset: number;
  /** The zlib stream of a compressed variable, or null when the matrix is stored as it is. */
  readonly compressed: Uint8Array | null;
  /** Declared byte count of the inflated matrix element (compressed variables). */
  readonly inflatedBytes: number;
}

/**
 * Reads the real numeric 2-D matrix named by `options.field`, or the only one with at least 2 rows and 2
 * columns. Classes double, single, int8…int64, uint8…uint64 and logical are read; values become float64
 * (logical 0/1; 64-bit integers rounded to the nearest double). Sparse, complex, cell, struct, char and object
 * variables are refused by name (E_MAT_CLASS), and skipped when choosing automatically.
 *
 * Frame: the matrix as MATLAB shows it, rows × cols (stored column by column): nx = cols, ny = rows. With
 * `rowOrder: 'top-down'` (default) matrix row 1 is the top of the part (y up, origin at the lower-left corner);
 * 'bottom-up' makes it the bottom row. Cell size in mm and sample placement come from the options.
 * `locate(i, j)` gives MATLAB's 1-based (row, column) and the byte offset of the element in the file, or of the
 * compressed element that holds it. The sample count is checked against `options.maxCells` from the header,
 * before the variable is inflated or any grid is allocated.
 * @throws RhoformError: E_MAT_HEADER, E_MAT_V73, E_MAT_ELEMENT, E_MAT_TRUNCATED, E_MAT_INFLATE, E_MAT_CLASS,
 *   E_MAT_SHAPE, E_MAT_FIELD, E_GRID_EMPTY, E_GRID_SIZE; UsageError for bad options.
 */
export function readMat(bytes: Uint8Array, options: ReadOptions): ReadResult {
  const { hx, hy, topDown } = checkReadOptions(options);
  const le = readFileHeader(bytes);
  const warnings = layoutWarning(options, 'MAT-file matrix');
  // MATLAB keeps the data of objects (strings, tables…) in a nameless uint8 array: not a variable
  const vars = listVariables(bytes, le, warnings).filter((v) => v.header.name !== '');
  const cands = vars.map(candidateOf);
  const chosen = chooseCandidate(cands, options.field, 'real numeric 2-D matrix', { field: 'E_MAT_FIELD', refused: 'E_MAT_CLASS' }, { byteOffset: 128 });
  const v = vars[cands.indexOf(chosen)];
  const { rows, cols } = matrixShape(v, warnings);
  const count = rows * cols;
  const at = { byteOffset: v.offset };
  const sizeText = v.header.dims.join('×');
  if (count === 0) throw new RhoformError('E_GRID_EMPTY', `expected at least one sample, found the empty ${sizeText} matrix ${JSON.stringify(v.header.name)}`, at);
  if (!(count <= options.maxCells)) {
    throw new RhoformError('E_GRID_SIZE', `expected at most ${options.maxCells} samples (maxCells, --max-cells), found ${JSON.stringify(v.header.name)} of ${sizeText} = ${count} samples`, at);
  }

  // The matrix element's bytes: in the file, or inflated (bounded by what its tag declared).
  let buf: Uint8Array;

  if (v.compressed) {
    const limit = count * 8 + 65536;
    if (v.inflatedBytes > limit) {
      throw new RhoformError('E_MAT_ELEMENT', `expected a compressed ${sizeText} matrix of at most ${limit} bytes, found ${v.inflatedBytes} declared`, at);
    }
    buf = inflate(v.compressed, v.inflatedBytes + 8, v.offset);

  } else {
    buf = bytes;

  }
  const view = new DataView(buf.buffer, buf.byteOffset, buf.byteLength);
  const header = v.compressed ? readMatrixHeader(view, 0, le, v.offset) : v.header;
  const fileBase = v.compressed ? v.offset : 0;
  const real = readTag(view, header.body, le, fileBase);
  const kind = miKind(real.type);
  if (!kind) throw new RhoformError('E_MAT_ELEMENT', `expected the real part as a numeric data type (miINT8…miUINT64, miSINGLE, miDOUBLE), found data type ${real.type}`, { byteOffset: fileBase + header.body });
  const size = kindSize(kind);
  if (real.nbytes !== count * size) {
    throw new RhoformError('E_MAT_ELEMENT', `expected ${count * size} bytes of ${kind} for ${sizeText} values, found ${real.nbytes}`, { byteOffset: fileBase + header.body });
  }
  if (real.data + real.nbytes > buf.length) {
    throw new RhoformError('E_MAT_TRUNCATED', `expected ${real.nbytes} bytes of data, found ${Math.max(0, buf.length - real.data)}`, { byteOffset: fileBase + real.data });
  }
  const src = numbersAt(buf, real.data, count, kind, le);
  const values = toGrid(src, rows, cols, false, topDown, bytes);
  if (header.logical) for (let k = 0; k < values.length; k++) values[k] = values[k] !== 0 ? 1 : 0;
  const grid: DensityGrid = { nx: cols, ny: rows, cellSize: [hx, hy], origin: [0, 0], values, placement: options.values };

  const dataOffset = v.compressed ? -1 : real.data;
  const locate = (i: number, j: number): SamplePosition => {
    if (!(Number.isInteger(i) && i >= 0 && i < cols && Number.isInteger(j) && j >= 0 && j < rows)) {
      throw new RangeError(`locate: expected 0 ≤ i < ${cols} and 0 ≤ j < ${rows}, found (${i}, ${j})`);
    }
    const r = topDown ? rows - 1 - j : j;
    return { fileRow: r + 1, fileCol: i + 1, where: { byteOffset: dataOffset >= 0 ? dataOffset + (i * rows + r) * size : v.offset } };
  };
  if (!options.field && vars.length > 1) warnings.push(`read the variable ${JSON.stringify(header.name)}; the file holds ${vars.length} variables`);
  // toGrid never returns a view of the file's bytes
  return { grid, format: 'mat', layout: 'grid', locate, warnings, ownsValues: true };
}

/** Checks the 128-byte header; returns true for a little-endian file. */
function readFileHeader(bytes: Uint8Array): boolean {
  const text = String.fromCharCode(...bytes.subarray(0, Math.min(116, bytes.length)));
  if (hasHdf5Signature(bytes, 512) || /^MATLAB 7\.3/.test(text) || hasHdf5Signature(bytes, 0)) {
    throw new RhoformError('E_MAT_V73', `expected a level-5 MAT-file (MATLAB -v7 or older), found a MATLAB -v7.3 file (an HDF5 container), which is not read; ${V73_ADVICE}`, { byteOffset: 0 });
  }
  if (!text.startsWith('MATLAB')) {
    throw new RhoformError('E_MAT_HEADER', `expected the text header "MATLAB 5.0 MAT-file", found ${JSON.stringify(text.slice(0, 20))}`, { byteOffset: 0 });
  }
  if (bytes.length < 128) throw new RhoformError('E_MAT_TRUNCATED', `expected a 128-byte header, found ${bytes.length} bytes`, { byteOffset: bytes.length });
  const ind = String.fromCharCode(bytes[126], bytes[127]);
  if (ind !== 'IM' && ind !== 'MI') throw new RhoformError('E_MAT_HEADER', `expected the endian indicator "IM" or "MI", found ${JSON.stringify(ind)}`, { byteOffset: 126 });
  const le = ind === 'IM';
  const version = new DataView(bytes.buffer, bytes.byteOffset + 124, 2).getUint16(0, le);
  if (version !== 0x0100) throw new RhoformError('E_MAT_HEADER', `expected version 0x0100 (level 5), found 0x${version.toString(16).padStart(4, '0')}`, { byteOffset: 124 });
  return le;
}

/** Every top-level variable with its header; a compressed variable is inflated only as far as its header. */
function listVariables(bytes: Uint8Array, le: boolean, warnings: string[]): MatVariable[] {
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const vars: MatVariable[] = [];
  let pos = 128;
  while (pos < bytes.length) {
    const tag = readTag(view, pos, le, 0);
    const end = tag.data + tag.nbytes;
    if (end > bytes.length) throw new RhoformError('E_MAT_TRUNCATED', `expected ${tag.nbytes} bytes of data element (type ${tag.type}), found ${bytes.length - tag.data}`, { byteOffset: pos });
    if (tag.type === MI_COMPRESSED) {
      const stream = bytes.subarray(tag.data, end);
      const head = peekHeader(stream, le, pos);
      vars.push({ header: head.header, offset: pos, compressed: stream, inflatedBytes: head.nbytes });
      pos = end;
    } else if (tag.type === MI_MATRIX) {
      if (tag.nbytes > 0) vars.push({ header: readMatrixHeader(view, pos, le, 0), offset: pos, compressed: null, inflatedBytes: 0 });
      pos = tag.next;
    } else {
      warnings.push(`skipped a top-level data element of type ${tag.type} at byte ${pos} (not a matrix)`);
      pos = tag.next;
    }
  }
  return vars;
}

/** Inflates the start of a compressed variable until its matrix header can be read. */
function peekHeader(stream: Uint8Array, le: boolean, offset: number): { header: MatrixHeader; nbytes: number } {
  for (let n = Math.min(stream.length, 256); ; n = Math.min(stream.length, n * 4)) {
    let out: Uint8Array;
    try {
      out = inflateSync(stream.subarray(0, n), { finishFlush: constants.Z_SYNC_FLUSH });
    } catch (e) {
      throw new RhoformError('E_MAT_INFLATE', `expected a zlib stream (miCOMPRESSED), found data that does not inflate: ${(e as Error).message}`, { byteOffset: offset + 8 });
    }
    const view = new DataView(out.buffer, out.byteOffset, out.byteLength);
    try {
      const header = readMatrixHeader(view, 0, le, offset);
      return { header, nbytes: readTag(view, 0, le, offset).nbytes };
    } catch (e) {
      const more = n < stream.length && out.length < 1 << 20;
      if (!(e instanceof RhoformError && e.code === 'E_MAT_TRUNCATED' && more)) throw e;
    }
  }
}

function inflate(stream: Uint8Array, maxLength: number, offset: number): Uint8Array {
  try {
    // one output chunk of the declared size: no growing and joining of 16 KB pieces
    return inflateSync(stream, { maxOutputLength: maxLength, chunkSize: Math.max(1024, Math.min(maxLength, 1 << 28)) });
  } catch (e) {
    throw new RhoformError('E_MAT_INFLATE', `expected a zlib stream of at most ${maxLength} bytes (miCOMPRESSED), found: ${(e as Error).message}`, { byteOffset: offset + 8 });
  }
}

const REFUSED_CLASSES: Record<number, string> = {
  1: 'a cell array; save the matrix itself, e.g. x = c{1}',
  2: 'a struct; save the field itself, e.g. x = s.rho',
  3: 'an object',
  4: 'a char array (text)',
  5: 'a sparse matrix; save full(x)',
  16: 'a function handle',
  17: 'an object (opaque class)',
};

function candidateOf(v: MatVariable): Candidate {
  const h = v.header;
  const cls = h.cls === 5 ? `sparse${h.logical ? ' logical' : ''}` : h.logical ? 'logical' : className(h.cls);
  const label = `${h.dims.join('×')} ${h.complex ? 'complex ' : ''}${cls}`;
  let refused: string | null = REFUSED_CLASSES[h.cls] ?? null;
  if (!refused && !(h.cls >= 6 && h.cls <= 15)) refused = `an unknown class (${h.cls})`;
  if (!refused && h.complex) refused = 'complex; save real(x) or abs(x)';
  if (!refused && !shapeOf(h.dims)) refused = `${h.dims.length}-D; expected 2-D, or 3-D with one dimension of 1`;
  const s = shapeOf(h.dims);
  return { name: h.name, label, refused, automatic: s !== null && s.rows >= 2 && s.cols >= 2, where: { byteOffset: v.offset } };
}

function shapeOf(dims: readonly number[]): { rows: number; cols: number } | null {
  if (dims.length === 2) return { rows: dims[0], cols: dims[1] };
  if (dims.length === 3) {
    const rest = dims.filter((d) => d !== 1);
    if (dims.filter((d) => d === 1).length === 1) return { rows: rest[0], cols: rest[1] };
  }
  return null;
}

function matrixShape(v: MatVariable, warnings: string[]): { rows: number; cols: number } {
  const s = shapeOf(v.header.dims);
  if (!s) throw new RhoformError('E_MAT_SHAPE', `expected a 2-D matrix, found ${v.header.dims.join('×')}`, { byteOffset: v.offset });
  if (v.header.dims.length === 3) warnings.push(`the ${v.header.dims.join('×')} array ${JSON.stringify(v.header.name)} was read as ${s.rows}×${s.cols} (its dimension of 1 dropped)`);
  return s;
}

registerReader('mat', readMat);
