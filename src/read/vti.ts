/**
 * VTK XML ImageData reader (`.vti`): the bytes of a file → a DensityGrid.
 *
 * Format: Kitware, "VTK File Formats", XML file formats (docs.vtk.org; VTK User's Guide, 11th ed., ch. 19):
 * <VTKFile type="ImageData" byte_order=… header_type=… compressor=…> <ImageData WholeExtent Origin Spacing>
 * <Piece Extent> <PointData>/<CellData> <DataArray type Name NumberOfComponents format offset>, with data inline
 * (ascii or base64 "binary") or in <AppendedData encoding="raw|base64"> after a '_'. See docs/input-vtk.md.
 */
import { RhoformError, type Where } from '../errors.js';
import type { DensityGrid } from '../types.js';
import { kindSize, numbersAt, toGrid, type NumKind } from './binary.js';
import { chooseCandidate, type Candidate } from './choose.js';
import { imageGeometry, overriddenOptions, sampleDims } from './image-data.js';
import { checkReadOptions, layoutWarning } from './options.js';
import { lineIndex, scanNumbers } from './text-scan.js';
import { registerReader } from './registry.js';
import type { ReadOptions, ReadResult, SamplePosition } from './types.js';
import { decodeBase64, payloadBytes, type PayloadContext } from './vti-data.js';
import { child, parseXml, type XmlElement } from './vti-xml.js';

const TYPES: Record<string, NumKind> = {
  Int8: 'i1', UInt8: 'u1', Int16: 'i2', UInt16: 'u2', Int32: 'i4', UInt32: 'u4', Int64: 'i8', UInt64: 'u8', Float32: 'f4', Float64: 'f8',
};

interface Part {
  readonly array: XmlElement;
  /** The piece's sample ranges along x, y, z, relative to the whole extent: [from, count]. */
  readonly range: readonly (readonly [number, number])[];
}

/**
 * Reads the one-component DataArray named by `options.field`, or the only one, of every Piece (placed by its
 * Extent within WholeExtent). CellData gives cell values, PointData nodal values (placement 'nodes'); Spacing is
 * the cell size unless `options.cellSizeGiven`; Origin is reported, not applied.
 *
 * Frame: VTK's own, y up, x fastest: `options.rowOrder` does not apply. `locate(i, j)` gives the 1-based sample
 * row (from the bottom) and column, and the line:column of an ascii value, the byte offset of an appended raw
 * uncompressed value, or else the position of its DataArray. The sample count from WholeExtent is checked against
 * `options.maxCells` before any data are decoded.
 * @throws RhoformError: E_VTI_XML, E_VTI_FORMAT, E_VTI_DATA, E_VTI_INFLATE, E_VTI_TYPE, E_VTI_SHAPE,
 *   E_VTI_FIELD, E_GRID_EMPTY, E_GRID_SIZE; UsageError for bad options.
 */
export function readVti(bytes: Uint8Array, options: ReadOptions): ReadResult {
  checkReadOptions(options);
  const where = lineIndex(bytes);
  const buf = Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const appendedTag = buf.indexOf('<AppendedData');
  const xmlEnd = appendedTag < 0 ? bytes.length : Math.max(buf.indexOf('>', appendedTag) + 1, appendedTag);
  const text = buf.toString('latin1', 0, xmlEnd);
  const { root, stopAt } = parseXml(text, where, 'AppendedData');
  const fmt = (what: string, el: XmlElement): never => {
    throw new RhoformError('E_VTI_FORMAT', what, where(el.start));
  };
  if (root.name !== 'VTKFile') fmt(`expected the root element <VTKFile>, found <${root.name}>`, root);
  if (root.attrs.type !== 'ImageData') fmt(`expected <VTKFile type="ImageData">, found type=${JSON.stringify(root.attrs.type ?? '')}`, root);
  const order = root.attrs.byte_order ?? 'LittleEndian';
  if (order !== 'LittleEndian' && order !== 'BigEndian') fmt(`expected byte_order="LittleEndian" or "BigEndian", found ${JSON.stringify(order)}`, root);
  const headerType = root.attrs.header_type ?? 'UInt32';
  if (headerType !== 'UInt32' && headerType !== 'UInt64') fmt(`expected header_type="UInt32" or "UInt64", found ${JSON.stringify(headerType)}`, root);
  const compressor = root.attrs.compressor ?? '';
  if (compressor !== '' && compressor !== 'vtkZLibDataCompressor') {
    throw new RhoformError('E_VTI_DATA', `expected no compressor or compressor="vtkZLibDataCompressor", found ${JSON.stringify(compressor)}; save the file with zlib compression or none`, where(root.start));
  }
  const image = child(root, 'ImageData') ?? fmt('expected an <ImageData> element in <VTKFile>, found none', root);
  const whole = ints(image, 'WholeExtent', 6, where);
  const pointDims = [0, 1, 2].map((a) => whole[2 * a + 1] - whole[2 * a] + 1);
  if (pointDims.some((d) => !(d >= 1))) fmt(`expected WholeExtent with x0 ≤ x1, y0 ≤ y1, z0 ≤ z1, found ${JSON.stringify(image.attrs.WholeExtent)}`, image);
  const spacing = floats(image, 'Spacing', [1, 1, 1], where);
  const origin = floats(image, 'Origin', [0, 0, 0], where);
  const warnings = layoutWarning(options, 'VTK image data');
  const dir = image.attrs.Direction;
  if (dir !== undefined && dir.trim().split(/\s+/).map(Number).join(' ') !== '1 0 0 0 1 0 0 0 1') {
    warnings.push(`the image's Direction (${dir.trim()}) was not applied: axes were read as x, y, z`);
  }

  // Candidates: DataArrays of the first piece; the other pieces must hold the same arrays.
  const pieces = image.children.filter((c) => c.name === 'Piece');
  if (pieces.length === 0) fmt('expected at least one <Piece> in <ImageData>, found none', image);
  const groups = new Map<string, { placement: 'cells' | 'nodes'; parts: Part[]; cand: Candidate }>();
  for (const piece of pieces) {
    const ext = ints(piece, 'Extent', 6, where);
    for (const [tag, placement] of [['CellData', 'cells'], ['PointData', 'nodes']] as const) {
      const data = child(piece, tag);
      if (!data) continue;
      for (const arr of data.children.filter((c) => c.name === 'DataArray')) {
        const name = arr.attrs.Name ?? '';
        const key = `${placement}/${name}`;
        const range = [0, 1, 2].map((a) => pieceRange(ext, whole, a, placement, pointDims[a] > 1));
        const g = groups.get(key);
        if (g) {
          g.parts.push({ array: arr, range });
          continue;
        }
        const comps = Number(arr.attrs.NumberOfComponents ?? '1');
        const type = arr.attrs.type ?? '';
        let refused: string | null = null;
        if (!TYPES[type]) refused = `the data type ${JSON.stringify(type)} is not read`;
        else if (comps !== 1) refused = `${arr.attrs.NumberOfComponents} components (one is needed)`;
        const samples = sampleDims(pointDims, placement);
        const label = `${placement === 'cells' ? 'cell' : 'point'} data, ${samples.join('×')} × ${comps} ${type}`;
        groups.set(key, { placement, parts: [{ array: arr, range }], cand: { name, label, refused, automatic: true, where: where(arr.start) } });
      }
    }
  }
  const list = [...groups.values()];
  const chosen = chooseCandidate(list.map((g) => g.cand), options.field, 'DataArray with one component', { field: 'E_VTI_FIELD', refused: 'E_VTI_TYPE' }, where(image.start));
  const group = list.find((g) => g.cand === chosen) as (typeof list)[number];
  const samples = sampleDims(pointDims, group.placement);
  warnings.push(...overriddenOptions(options, group.placement));
  const geo = imageGeometry(samples, spacing, origin, options, 'E_VTI_SHAPE', chosen.where, warnings);
  const count = samples[0] * samples[1] * samples[2];
  if (!(count <= options.maxCells)) {
    throw new RhoformError('E_GRID_SIZE', `expected at most ${options.maxCells} samples (maxCells, --max-cells), found ${JSON.stringify(chosen.name)} of ${samples.join('×')} = ${count} samples`, chosen.where);
  }

  // Appended data: after '_' (raw bytes, or base64 text) following the <AppendedData> start tag.
  let appended = -1;
  let appendedEncoding = 'raw';
  if (stopAt !== null) {
    const tag = root.children.find((c) => c.name === 'AppendedData') as XmlElement;
    appendedEncoding = tag.attrs.encoding ?? 'raw';
    if (appendedEncoding !== 'raw' && appendedEncoding !== 'base64') fmt(`expected <AppendedData encoding="raw" or "base64">, found ${JSON.stringify(appendedEncoding)}`, tag);
    appended = buf.indexOf('_', stopAt);
    if (appended < 0) throw new RhoformError('E_VTI_DATA', "expected '_' before the appended data, found none", where(stopAt));
    appended++;
  }
  const le = order === 'LittleEndian';
  const kind = TYPES[group.parts[0].array.attrs.type as string];
  const size = kindSize(kind);
  const offsetsList = appendedEncoding === 'base64' ? appendedOffsets(root) : [];
  const appendedEnd = appendedEncoding === 'base64' ? Math.max(appended, buf.indexOf('</AppendedData>', appended) < 0 ? bytes.length : buf.indexOf('</AppendedData>', appended)) : bytes.length;

  let full: ArrayLike<number> | null = null;
  let merged: Float64Array | null = null;
  let locateAt: (k: number) => Where = () => chosen.where;
  for (const part of group.parts) {
    const arr = part.array;
    if (arr.attrs.type !== group.parts[0].array.attrs.type) fmt(`expected the same type in every piece for ${JSON.stringify(chosen.name)}, found ${arr.attrs.type}`, arr);
    const n = part.range.reduce((a, r) => a * r[1], 1);
    const at = where(arr.start);
    const ctx: PayloadContext = { littleEndian: le, headerSize: headerType === 'UInt64' ? 8 : 4, compressed: compressor !== '', where: at };
    const format = arr.attrs.format ?? 'ascii';
    let src: ArrayLike<number>;
    const single = group.parts.length === 1;
    if (format === 'ascii') {
      const offsets = single ? new Uint32Array(n) : undefined;
      src = scanNumbers(text.slice(0, arr.textTo), arr.textFrom, n, { token: 'E_VTI_DATA', truncated: 'E_VTI_DATA' }, where, offsets).values;
      if (offsets) locateAt = (k) => where(offsets[k]);
    } else if (format === 'binary') {
      const b = decodeBase64(text.slice(arr.textFrom, arr.textTo), at);
      const p = payloadBytes(b, n * size, ctx);
      src = numbersAt(p.bytes, p.offset, n, kind, le);
    } else if (format === 'appended') {
      const off = Number(arr.attrs.offset);
      if (appended < 0) fmt('expected <AppendedData> for format="appended", found none', arr);
      if (!(Number.isInteger(off) && off >= 0 && appended + off <= bytes.length)) fmt(`expected an offset into the appended data, found offset=${JSON.stringify(arr.attrs.offset ?? '')}`, arr);
      let p: { bytes: Uint8Array; offset: number };
      if (appendedEncoding === 'raw') {
        p = payloadBytes(bytes.subarray(appended + off), n * size, ctx);
        if (single && !ctx.compressed) {
          const base = appended + off + ctx.headerSize;
          locateAt = (k) => ({ byteOffset: base + k * size });
        }
      } else {
        const next = offsetsList.find((o) => o > off);
        const stop = next === undefined ? appendedEnd : Math.min(appendedEnd, appended + next);
        p = payloadBytes(decodeBase64(buf.toString('latin1', appended + off, stop), at), n * size, ctx);
      }
      src = numbersAt(p.bytes, p.offset, n, kind, le);
    } else {
      throw new RhoformError('E_VTI_FORMAT', `expected format="ascii", "binary" or "appended", found ${JSON.stringify(format)}`, at);
    }
    const covers = part.range.every((r, a) => r[0] === 0 && r[1] === samples[a]);
    if (single && covers) full = src;
    else {
      merged ??= new Float64Array(count).fill(NaN);
      full = merged;
      place(merged, samples, part.range, src, at);
    }
  }
  const values = toGrid(full as ArrayLike<number>, geo.rows, geo.cols, true, false, bytes);
  const grid: DensityGrid = { nx: geo.cols, ny: geo.rows, cellSize: [geo.cellSize[0], geo.cellSize[1]], origin: [0, 0], values, placement: group.placement };
  const locate = (i: number, j: number): SamplePosition => {
    if (!(Number.isInteger(i) && i >= 0 && i < geo.cols && Number.isInteger(j) && j >= 0 && j < geo.rows)) {
      throw new RangeError(`locate: expected 0 ≤ i < ${geo.cols} and 0 ≤ j < ${geo.rows}, found (${i}, ${j})`);
    }
    return { fileRow: j + 1, fileCol: i + 1, where: locateAt(j * geo.cols + i) };
  };
  if (!options.field && list.length > 1) warnings.push(`read the array ${JSON.stringify(chosen.name)} (${chosen.label}); the file holds ${list.length} arrays`);
  // toGrid never returns a view of the file's bytes
  return { grid, format: 'vti', layout: 'grid', locate, warnings, cellSizeSource: geo.cellSizeSource, ownsValues: true };
}

function ints(el: XmlElement, attr: string, n: number, where: (o: number) => Where): number[] {
  const raw = el.attrs[attr];
  const v = (raw ?? '').trim().split(/\s+/).map(Number);
  if (raw === undefined || v.length !== n || v.some((x) => !Number.isInteger(x))) {
    throw new RhoformError('E_VTI_FORMAT', `expected ${attr} with ${n} whole numbers in <${el.name}>, found ${raw === undefined ? 'none' : JSON.stringify(raw)}`, where(el.start));
  }
  return v;
}

function floats(el: XmlElement, attr: string, dflt: number[], where: (o: number) => Where): number[] {
  const raw = el.attrs[attr];
  if (raw === undefined) return dflt;
  const v = raw.trim().split(/\s+/).map(Number);
  if (v.length !== 3 || v.some((x) => !Number.isFinite(x))) {
    throw new RhoformError('E_VTI_FORMAT', `expected ${attr} with 3 numbers in <${el.name}>, found ${JSON.stringify(raw)}`, where(el.start));
  }
  return v;
}

/** A piece's [first sample, sample count] along axis `a`, relative to the whole extent. */
function pieceRange(ext: number[], whole: number[], a: number, placement: 'cells' | 'nodes', multi: boolean): [number, number] {
  const from = ext[2 * a] - whole[2 * a];
  const points = ext[2 * a + 1] - ext[2 * a] + 1;
  return [from, placement === 'nodes' || !multi ? points : Math.max(points - 1, 0)];
}

/** Copies a piece's values (x fastest) into the whole array. */
function place(full: Float64Array, samples: number[], range: readonly (readonly [number, number])[], src: ArrayLike<number>, where: Where): void {
  const [[x0, nx], [y0, ny], [z0, nz]] = range;
  if (x0 < 0 || y0 < 0 || z0 < 0 || x0 + nx > samples[0] || y0 + ny > samples[1] || z0 + nz > samples[2]) {
    throw new RhoformError('E_VTI_SHAPE', `expected a piece Extent inside WholeExtent, found samples from (${x0}, ${y0}, ${z0}) of ${nx}×${ny}×${nz} in ${samples.join('×')}`, where);
  }
  let k = 0;
  for (let z = 0; z < nz; z++) {
    for (let y = 0; y < ny; y++) {
      const row = ((z0 + z) * samples[1] + y0 + y) * samples[0] + x0;
      for (let x = 0; x < nx; x++) full[row + x] = src[k++];
    }
  }
}

/** Every appended offset used by a DataArray, sorted (to find where each base64 array ends). */
function appendedOffsets(root: XmlElement): number[] {
  const out: number[] = [];
  const walk = (el: XmlElement): void => {
    if (el.name === 'DataArray' && el.attrs.format === 'appended') out.push(Number(el.attrs.offset));
    el.children.forEach(walk);
  };
  walk(root);
  return out.filter((x) => Number.isFinite(x)).sort((a, b) => a - b);
}

registerReader('vti', readVti);
