/**
 * Legacy VTK reader (`# vtk DataFile Version 2.0 … 5.1`, DATASET STRUCTURED_POINTS, ASCII or BINARY): the bytes
 * of a `.vtk` file → a DensityGrid.
 *
 * Format: Kitware, "VTK File Formats" (VTK User's Guide, 11th ed., 2010, ch. 19; docs.vtk.org "VTK File
 * Formats"): five header parts — version line, title, ASCII|BINARY, DATASET with DIMENSIONS / ORIGIN / SPACING —
 * then POINT_DATA n and CELL_DATA n sections of attributes (SCALARS with an optional LOOKUP_TABLE line, FIELD
 * arrays, and others that are skipped). BINARY data are big-endian. See docs/input-vtk.md.
 */
import { RhoformError, type Where } from '../errors.js';
import type { DensityGrid } from '../types.js';
import { kindSize, numbersAt, toGrid, type NumKind } from './binary.js';
import { chooseCandidate, type Candidate } from './choose.js';
import { imageGeometry, overriddenOptions, sampleDims } from './image-data.js';
import { checkReadOptions, layoutWarning } from './options.js';
import { lineIndex, scanNumbers, skipTokens } from './text-scan.js';
import { registerReader } from './registry.js';
import type { ReadOptions, ReadResult, SamplePosition } from './types.js';

const TYPES: Record<string, NumKind> = {
  unsigned_char: 'u1', char: 'i1', unsigned_short: 'u2', short: 'i2', unsigned_int: 'u4', int: 'i4',
  unsigned_long: 'u8', long: 'i8', vtktypeint64: 'i8', vtktypeuint64: 'u8', vtkidtype: 'i8', float: 'f4', double: 'f8',
};

interface VtkArray {
  readonly cand: Candidate;
  readonly placement: 'cells' | 'nodes';
  readonly kind: NumKind;
  readonly count: number;
  /** Byte offset of the first value. */
  readonly start: number;
}

interface Line {
  readonly words: string[];
  readonly start: number;
  readonly next: number;
}

/**
 * Reads the one-component array named by `options.field` (a SCALARS or FIELD array name), or the only one.
 * CELL_DATA gives cell values (placement 'cells'); POINT_DATA gives nodal values (placement 'nodes', as
 * `--values nodes`): the file decides, `options.values` is not used. The cell size is SPACING unless
 * `options.cellSizeGiven`; ORIGIN is reported, not applied (the grid starts at 0, 0).
 *
 * Frame: VTK's own, y up, x fastest in the file: the first value is the lower-left sample; `options.rowOrder` does
 * not apply. `locate(i, j)` gives the 1-based sample row (from the bottom) and column, and the line:column of an
 * ASCII value or the byte offset of a BINARY one. Sample counts are checked against `options.maxCells` before the
 * array is decoded.
 * @throws RhoformError: E_VTK_HEADER, E_VTK_DATASET, E_VTK_TOKEN, E_VTK_TYPE, E_VTK_TRUNCATED, E_VTK_SHAPE,
 *   E_VTK_FIELD, E_GRID_EMPTY, E_GRID_SIZE; UsageError for bad options.
 */
export function readVtk(bytes: Uint8Array, options: ReadOptions): ReadResult {
  checkReadOptions(options);
  const where = lineIndex(bytes);
  const lineAt = (pos: number): Line | null => {
    let p = pos;
    for (;;) {
      if (p >= bytes.length) return null;
      let e = bytes.indexOf(0x0a, p);
      if (e < 0) e = bytes.length;
      const text = String.fromCharCode(...bytes.subarray(p, Math.min(e, p + 512))).trim();
      if (text !== '') return { words: text.split(/\s+/), start: p, next: e + 1 };
      p = e + 1;
    }
  };
  const first = lineAt(0);
  if (!first || !/^# vtk DataFile Version/i.test(first.words.join(' '))) {
    throw new RhoformError('E_VTK_HEADER', `expected "# vtk DataFile Version x.y" on line 1, found ${JSON.stringify(first?.words.join(' ').slice(0, 40) ?? '')}`, { line: 1, col: 1 });
  }
  let e = bytes.indexOf(0x0a, first.next); // line 2 is the title, possibly empty
  if (e < 0) e = bytes.length;
  const mode = lineAt(e + 1);
  const modeWord = mode?.words[0]?.toUpperCase();
  if (!mode || (modeWord !== 'ASCII' && modeWord !== 'BINARY')) {
    throw new RhoformError('E_VTK_HEADER', `expected ASCII or BINARY on line 3, found ${JSON.stringify(mode?.words.join(' ') ?? 'the end of the file')}`, where(mode?.start ?? bytes.length));
  }
  const binary = modeWord === 'BINARY';
  const text = binary ? '' : Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength).toString('latin1');
  const warnings = layoutWarning(options, 'VTK image data');

  let dims: number[] | null = null;
  let origin = [0, 0, 0];
  let spacing = [1, 1, 1];
  let spacingSeen = false;
  let dataset = false;
  let section: 'cells' | 'nodes' | null = null;
  let n = 0;
  const arrays: VtkArray[] = [];
  const others: Candidate[] = [];

  const triple = (ln: Line, integer: boolean): number[] => {
    const v = ln.words.slice(1, 4).map(Number);
    if (v.length !== 3 || v.some((x) => !Number.isFinite(x) || (integer && !(Number.isInteger(x) && x >= 1)))) {
      throw new RhoformError('E_VTK_HEADER', `expected ${ln.words[0]} with 3 ${integer ? 'whole numbers ≥ 1' : 'numbers'}, found ${JSON.stringify(ln.words.join(' '))}`, where(ln.start));
    }
    return v;
  };
  const count = (ln: Line, k: number, what: string): number => {
    const x = Number(ln.words[k]);
    if (!(Number.isInteger(x) && x >= 0)) throw new RhoformError('E_VTK_HEADER', `expected ${what} (a whole number) in ${JSON.stringify(ln.words.join(' '))}, found ${JSON.stringify(ln.words[k] ?? '')}`, where(ln.start));
    return x;
  };
  /** Skips `m` values of `type` at `pos`; returns the position after them. */
  const skip = (pos: number, m: number, type: string, ln: Line): number => {
    if (!binary) return skipTokens(text, pos, m, 'E_VTK_TRUNCATED', where);
    const t = type.toLowerCase();
    const bytesNeeded = t === 'bit' ? Math.ceil(m / 8) : TYPES[t] ? m * kindSize(TYPES[t]) : NaN;
    if (Number.isNaN(bytesNeeded)) throw new RhoformError('E_VTK_TYPE', `expected a VTK data type (float, double, int, …), found ${JSON.stringify(type)}`, where(ln.start));
    if (pos + bytesNeeded > bytes.length) throw new RhoformError('E_VTK_TRUNCATED', `expected ${bytesNeeded} bytes of binary data, found ${bytes.length - pos}`, { byteOffset: pos });
    return pos + bytesNeeded;
  };
  const addArray = (name: string, type: string, comps: number, tuples: number, start: number, ln: Line, kindWord: string): void => {
    const place = section as 'cells' | 'nodes';
    const label = `${place === 'cells' ? 'cell' : 'point'} data ${kindWord}, ${tuples} × ${comps} ${type}`;
    const kind = TYPES[type.toLowerCase()];
    let refused: string | null = null;
    if (!kind) refused = `the data type ${type} is not read`;
    else if (comps !== 1) refused = `${comps} components (one is needed)`;
    else if (tuples !== n) refused = `${tuples} values for ${n} samples`;
    const cand: Candidate = { name, label, refused, automatic: true, where: where(ln.start) };
    if (refused || !kind) others.push(cand);
    else arrays.push({ cand, placement: place, kind, count: n, start });
  };

  let pos = mode.next;
  for (let ln = lineAt(pos); ln; ln = lineAt(pos)) {
    const kw = ln.words[0].toUpperCase();
    pos = ln.next;
    if (!dataset && kw !== 'DATASET') throw new RhoformError('E_VTK_HEADER', `expected DATASET on line 4, found ${JSON.stringify(ln.words.join(' '))}`, where(ln.start));
    switch (kw) {
      case 'DATASET':
        if ((ln.words[1] ?? '').toUpperCase() !== 'STRUCTURED_POINTS') {
          throw new RhoformError('E_VTK_DATASET', `expected DATASET STRUCTURED_POINTS (image data), found DATASET ${ln.words[1] ?? ''}`, where(ln.start));
        }
        dataset = true;
        break;
      case 'DIMENSIONS': dims = triple(ln, true); break;
      case 'ORIGIN': origin = triple(ln, false); break;
      case 'SPACING':
      case 'ASPECT_RATIO': spacing = triple(ln, false); spacingSeen = true; break;
      case 'POINT_DATA':
      case 'CELL_DATA': {
        if (!dims) throw new RhoformError('E_VTK_HEADER', `expected DIMENSIONS before ${kw}`, where(ln.start));
        section = kw === 'CELL_DATA' ? 'cells' : 'nodes';
        n = count(ln, 1, 'the number of values');
        const expect = sampleDims(dims, section).reduce((a, b) => a * b, 1);
        if (n !== expect) throw new RhoformError('E_VTK_SHAPE', `expected ${kw} ${expect} for DIMENSIONS ${dims.join(' ')}, found ${kw} ${n}`, where(ln.start));
        if (!(n <= options.maxCells)) {
          throw new RhoformError('E_GRID_SIZE', `expected at most ${options.maxCells} samples (maxCells, --max-cells), found ${kw} ${n} (${sampleDims(dims, section).join('×')})`, where(ln.start));
        }
        break;
      }
      case 'SCALARS': {
        if (!section) throw new RhoformError('E_VTK_HEADER', 'expected POINT_DATA or CELL_DATA before SCALARS', where(ln.start));
        const comps = ln.words[3] === undefined ? 1 : count(ln, 3, 'the number of components');
        const lut = lineAt(pos);
        if (lut && lut.words[0].toUpperCase() === 'LOOKUP_TABLE') pos = lut.next;
        const type = ln.words[2] ?? '';
        addArray(ln.words[1] ?? '', type, comps, n, pos, ln, 'SCALARS');
        pos = skip(pos, n * comps, type, ln);
        break;
      }
      case 'LOOKUP_TABLE': pos = skip(pos, count(ln, 2, 'the table size') * 4, binary ? 'unsigned_char' : 'float', ln); break;
      case 'COLOR_SCALARS': pos = skip(pos, n * count(ln, 2, 'the number of values'), binary ? 'unsigned_char' : 'float', ln); break;
      case 'VECTORS':
      case 'NORMALS':
      case 'TENSORS':
      case 'TENSORS6':
      case 'TEXTURE_COORDINATES': {
        const tc = kw === 'TEXTURE_COORDINATES';
        const m = tc ? count(ln, 2, 'the dimension') : kw === 'TENSORS' ? 9 : kw === 'TENSORS6' ? 6 : 3;
        others.push({ name: ln.words[1] ?? '', label: `${kw.toLowerCase()} (${m} components)`, refused: `${kw} arrays are not scalar`, automatic: false, where: where(ln.start) });
        pos = skip(pos, n * m, ln.words[tc ? 3 : 2] ?? '', ln);
        break;
      }
      case 'FIELD': {
        const k = count(ln, 2, 'the number of arrays');
        for (let a = 0; a < k; a++) {
          let arr = lineAt(pos);
          while (arr && arr.words[0].toUpperCase() === 'METADATA') arr = skipMetadata(arr);
          if (!arr || arr.words.length < 4) throw new RhoformError('E_VTK_HEADER', `expected a FIELD array line "name components tuples type", found ${JSON.stringify(arr?.words.join(' ') ?? 'the end of the file')}`, where(arr?.start ?? bytes.length));
          pos = arr.next;
          const comps = count(arr, 1, 'the number of components');
          const tuples = count(arr, 2, 'the number of tuples');
          if (section) addArray(arr.words[0], arr.words[3], comps, tuples, pos, arr, 'FIELD array');
          pos = skip(pos, comps * tuples, arr.words[3], arr);
        }
        break;
      }
      case 'METADATA': pos = skipMetadata(ln).start; break;
      default:
        throw new RhoformError('E_VTK_HEADER', `expected a VTK keyword (DIMENSIONS, SPACING, ORIGIN, POINT_DATA, CELL_DATA, SCALARS, FIELD…), found ${JSON.stringify(ln.words[0])}`, where(ln.start));
    }
  }
  if (!dataset) throw new RhoformError('E_VTK_HEADER', 'expected DATASET STRUCTURED_POINTS, found the end of the file', where(bytes.length));
  if (!dims) throw new RhoformError('E_VTK_HEADER', 'expected DIMENSIONS, found the end of the file', where(bytes.length));
  if (!spacingSeen) warnings.push('the file has no SPACING; 1 was assumed');

  function skipMetadata(ln: Line): Line {
    // METADATA blocks (VTK 5.1) end at an empty line
    let p = ln.next;
    while (p < bytes.length) {
      let e2 = bytes.indexOf(0x0a, p);
      if (e2 < 0) e2 = bytes.length;
      const blank = String.fromCharCode(...bytes.subarray(p, e2)).trim() === '';
      p = e2 + 1;
      if (blank) break;
    }
    pos = p;
    return lineAt(p) ?? { words: [''], start: bytes.length, next: bytes.length };
  }

  const cands = [...arrays.map((a) => a.cand), ...others];
  const chosen = chooseCandidate(cands, options.field, 'scalar array (one component)', { field: 'E_VTK_FIELD', refused: 'E_VTK_TYPE' }, where(0));
  const arr = arrays.find((a) => a.cand === chosen) as VtkArray;
  warnings.push(...overriddenOptions(options, arr.placement));
  const geo = imageGeometry(sampleDims(dims, arr.placement), spacing, origin, options, 'E_VTK_SHAPE', chosen.where, warnings);
  if (arr.count === 0) throw new RhoformError('E_GRID_EMPTY', `expected at least one sample, found the empty array ${JSON.stringify(chosen.name)}`, chosen.where);
  if (!(arr.count <= options.maxCells)) {
    throw new RhoformError('E_GRID_SIZE', `expected at most ${options.maxCells} samples (maxCells, --max-cells), found ${JSON.stringify(chosen.name)} of ${geo.cols}×${geo.rows} = ${arr.count} samples`, chosen.where);
  }
  let offsets: Uint32Array | null = null;
  let src: ArrayLike<number>;
  if (binary) src = numbersAt(bytes, arr.start, arr.count, arr.kind, false);
  else {
    offsets = new Uint32Array(arr.count);
    src = scanNumbers(text, arr.start, arr.count, { token: 'E_VTK_TOKEN', truncated: 'E_VTK_TRUNCATED' }, where, offsets).values;
  }
  const values = toGrid(src, geo.rows, geo.cols, true, false, bytes);
  const grid: DensityGrid = { nx: geo.cols, ny: geo.rows, cellSize: [geo.cellSize[0], geo.cellSize[1]], origin: [0, 0], values, placement: arr.placement };
  const size = kindSize(arr.kind);
  const locate = (i: number, j: number): SamplePosition => {
    if (!(Number.isInteger(i) && i >= 0 && i < geo.cols && Number.isInteger(j) && j >= 0 && j < geo.rows)) {
      throw new RangeError(`locate: expected 0 ≤ i < ${geo.cols} and 0 ≤ j < ${geo.rows}, found (${i}, ${j})`);
    }
    const k = j * geo.cols + i;
    const at: Where = offsets ? where(offsets[k]) : { byteOffset: arr.start + k * size };
    return { fileRow: j + 1, fileCol: i + 1, where: at };
  };
  if (!options.field && cands.length > 1) warnings.push(`read the array ${JSON.stringify(chosen.name)} (${chosen.label}); the file holds ${cands.length} arrays`);
  // toGrid never returns a view of the file's bytes
  return { grid, format: 'vtk', layout: 'grid', locate, warnings, cellSizeSource: geo.cellSizeSource, ownsValues: true };
}

registerReader('vtk', readVtk);
