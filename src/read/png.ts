/**
 * PNG reader: an image of the density → a DensityGrid. Decoding (inflate, unfiltering, interlace) is done by
 * fast-png (docs/dependencies.md says why that decoder); this module checks the header, maps pixels to densities
 * and places them.
 *
 * Format: W3C, "Portable Network Graphics (PNG) Specification (Third Edition)", 2025 (= ISO/IEC 15948): the
 * 8-byte signature, then the IHDR chunk (width, height, bit depth, colour type 0 grey, 2 RGB, 3 palette,
 * 4 grey + alpha, 6 RGBA).
 */
import { decode } from 'fast-png';
import { RhoformError } from '../errors.js';
import type { DensityGrid } from '../types.js';
import { checkReadOptions, layoutWarning } from './options.js';
import { registerReader } from './registry.js';
import type { ReadOptions, ReadResult, SamplePosition } from './types.js';

const SIGNATURE = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];
const COLOUR_TYPES: Record<number, string> = { 0: 'grey', 2: 'RGB', 3: 'palette', 4: 'grey + alpha', 6: 'RGBA' };

/**
 * Luma weights of ITU-R Recommendation BT.709-6 (2015), item 3.2: Y = 0.2126 R + 0.7152 G + 0.0722 B, applied to
 * the stored (gamma-encoded) values, as image tools compute a grey level; no linearisation.
 */
export const REC709 = [0.2126, 0.7152, 0.0722] as const;

export interface PngHeader {
  readonly width: number;
  readonly height: number;
  readonly depth: number;
  readonly colourType: number;
}

/** The IHDR chunk, read before any decoding (so that the cell limit applies first). */
export function readPngHeader(bytes: Uint8Array): PngHeader {
  if (!SIGNATURE.every((b, k) => bytes[k] === b)) {
    throw new RhoformError('E_PNG_MAGIC', `expected the PNG signature 89 50 4E 47 0D 0A 1A 0A, found ${hex(bytes.subarray(0, 8))}`, { byteOffset: 0 });
  }
  if (bytes.length < 33) throw new RhoformError('E_PNG_DECODE', `expected the 13-byte IHDR chunk after the signature, found ${Math.max(0, bytes.length - 8)} bytes in all`, { byteOffset: bytes.length });
  const v = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const type = String.fromCharCode(...bytes.subarray(12, 16));
  if (type !== 'IHDR' || v.getUint32(8) !== 13) {
    throw new RhoformError('E_PNG_DECODE', `expected the IHDR chunk of 13 bytes first, found ${JSON.stringify(type)} of ${v.getUint32(8)} bytes`, { byteOffset: 8 });
  }
  const width = v.getUint32(16);
  const height = v.getUint32(20);
  const depth = bytes[24];
  const colourType = bytes[25];
  if (width === 0 || height === 0) throw new RhoformError('E_GRID_EMPTY', `expected an image of at least 1×1 pixels, found ${width}×${height}`, { byteOffset: 16 });
  const allowed: Record<number, number[]> = { 0: [1, 2, 4, 8, 16], 2: [8, 16], 3: [1, 2, 4, 8], 4: [8, 16], 6: [8, 16] };
  if (!(allowed[colourType] ?? []).includes(depth)) {
    throw new RhoformError('E_PNG_DECODE', `expected a valid colour type and bit depth (PNG table 11.1), found colour type ${colourType} with bit depth ${depth}`, { byteOffset: 24 });
  }
  return { width, height, depth, colourType };
}

function hex(b: Uint8Array): string {
  return Array.from(b, (x) => x.toString(16).toUpperCase().padStart(2, '0')).join(' ') || 'nothing';
}

/**
 * Reads a PNG image. Grey images (and grey + alpha) are read as they are; colour images (RGB, RGBA, palette) only
 * with `options.imageChannel` ('luminance' = BT.709 luma, or one of 'r', 'g', 'b'), and are refused without it
 * (E_PNG_CHANNEL). A pixel value v of bit depth d becomes v / (2^d − 1) (palette colours: v / 255); with
 * `imageSolid: 'dark'` (default) the density is 1 − that, so black is solid. Alpha is ignored (with a warning
 * when some pixel is not opaque).
 *
 * Frame: image row 1 is the top of the part with `rowOrder: 'top-down'` (default); nx = width, ny = height,
 * origin [0, 0], y up. An image has no unit: the cell size in mm comes from the options (`--cell-size`).
 * `locate(i, j)` gives the 1-based pixel row (from the top) and column, also as `where.line`/`where.col`.
 * @throws RhoformError: E_PNG_MAGIC, E_PNG_DECODE, E_PNG_CHANNEL, E_GRID_EMPTY, E_GRID_SIZE; UsageError.
 */
export function readPng(bytes: Uint8Array, options: ReadOptions): ReadResult {
  const { hx, hy, topDown } = checkReadOptions(options);
  const h = readPngHeader(bytes);
  const { width, height } = h;
  const count = width * height;
  if (!(count <= options.maxCells)) {
    throw new RhoformError('E_GRID_SIZE', `expected at most ${options.maxCells} samples (maxCells, --max-cells), found a ${width}×${height} image = ${count} pixels`, { byteOffset: 16 });
  }
  const colour = h.colourType === 2 || h.colourType === 3 || h.colourType === 6;
  const channel = options.imageChannel ?? null;
  if (colour && channel === null) {
    throw new RhoformError('E_PNG_CHANNEL', `expected a grey image, found a ${COLOUR_TYPES[h.colourType]} colour image; choose what to read with --image-channel luminance|r|g|b`, { byteOffset: 25 });
  }
  const warnings = layoutWarning(options, 'image');
  if (!colour && channel !== null && channel !== 'luminance') warnings.push(`--image-channel ${channel} has no effect on a grey image`);
  if (!options.cellSizeGiven) warnings.push(`an image has no unit: each pixel was taken as ${hx} × ${hy} mm; set --cell-size`);

  let png: ReturnType<typeof decode>;
  try {
    png = decode(bytes);
  } catch (e) {
    throw new RhoformError('E_PNG_DECODE', `expected a decodable PNG image, found: ${(e as Error).message}`, { byteOffset: 33 });
  }
  if (png.width !== width || png.height !== height) {
    throw new RhoformError('E_PNG_DECODE', `expected ${width}×${height} pixels as IHDR declares, found ${png.width}×${png.height}`, { byteOffset: 16 });
  }
  const dark = (options.imageSolid ?? 'dark') === 'dark';
  const values = densities(png, h, channel, dark, topDown, warnings);
  const grid: DensityGrid = { nx: width, ny: height, cellSize: [hx, hy], origin: [0, 0], values, placement: options.values };
  const locate = (i: number, j: number): SamplePosition => {
    if (!(Number.isInteger(i) && i >= 0 && i < width && Number.isInteger(j) && j >= 0 && j < height)) {
      throw new RangeError(`locate: expected 0 ≤ i < ${width} and 0 ≤ j < ${height}, found (${i}, ${j})`);
    }
    const r = topDown ? height - 1 - j : j;
    return { fileRow: r + 1, fileCol: i + 1, where: { line: r + 1, col: i + 1 } };
  };
  return { grid, format: 'png', layout: 'grid', locate, warnings, ownsValues: true }; // densities() fills a fresh array
}

/**
 * Each pixel's density in grid order (values[j·width + i], j up from the bottom). A level v / max (max = 2^d − 1,
 * or 255 for palette colours) becomes 1 − v / max when dark is solid; grey levels go through a table of every
 * possible value, computed with the same operations.
 */
function densities(png: ReturnType<typeof decode>, h: PngHeader, channel: ReadOptions['imageChannel'], dark: boolean, topDown: boolean, warnings: string[]): Float64Array {
  const { width, height } = h;
  const n = width * height;
  const out = new Float64Array(n);
  const data = png.depth < 8 ? unpack(png.data as Uint8Array, width, height, png.depth) : png.data;
  const ch = png.depth < 8 ? 1 : png.channels;
  const density = (level: number): number => (dark ? 1 - level : level);
  const rowOf = (r: number): number => (topDown ? height - 1 - r : r) * width;
  if (h.colourType === 3) {
    const pick = channelOf(channel);
    const table = (png.palette ?? []).map((rgb) => density(pick(rgb[0], rgb[1], rgb[2]) / 255));
    for (let r = 0, p = 0; r < height; r++) {
      const dst = rowOf(r);
      for (let c = 0; c < width; c++, p++) {
        const v = table[data[p]];
        if (v === undefined) throw new RhoformError('E_PNG_DECODE', `expected palette indices below ${table.length}, found ${data[p]} at pixel row ${r + 1}, column ${c + 1}`, { byteOffset: 33 });
        out[dst + c] = v;
      }
    }
    return out;
  }
  const max = 2 ** png.depth - 1;
  if (h.colourType === 0 || h.colourType === 4) {
    const table = new Float64Array(max + 1);
    for (let v = 0; v <= max; v++) table[v] = density(v / max);
    placeByTable(data, ch, table, width, height, topDown, out);
  } else {
    const pick = channelOf(channel);
    for (let r = 0, k = 0; r < height; r++) {
      const dst = rowOf(r);
      for (let c = 0; c < width; c++, k += ch) out[dst + c] = density(pick(data[k], data[k + 1], data[k + 2]) / max);
    }
  }
  if (h.colourType === 4 || h.colourType === 6) {
    let translucent = 0;
    for (let p = 0, k = ch - 1; p < n; p++, k += ch) if (data[k] !== max) translucent++;
    if (translucent > 0) warnings.push(`${translucent} pixels are not opaque; the alpha channel was ignored`);
  }
  return out;
}

/** out[j·width + i] = table[first channel of pixel (r, i)], with image row r → grid row j. A tight loop of its own. */
function placeByTable(data: ArrayLike<number>, ch: number, table: Float64Array, width: number, height: number, topDown: boolean, out: Float64Array): void {
  let k = 0;
  for (let r = 0; r < height; r++) {
    const dst = (topDown ? height - 1 - r : r) * width;
    for (let c = 0; c < width; c++) {
      out[dst + c] = table[data[k]];
      k += ch;
    }
  }
}

function channelOf(channel: ReadOptions['imageChannel']): (r: number, g: number, b: number) => number {
  switch (channel) {
    case 'r': return (r) => r;
    case 'g': return (_r, g) => g;
    case 'b': return (_r, _g, b) => b;
    default: return (r, g, b) => REC709[0] * r + REC709[1] * g + REC709[2] * b;
  }
}

/** Sub-byte samples (bit depth 1, 2, 4; one channel) unpacked to one byte per pixel; rows start on byte boundaries. */
function unpack(packed: Uint8Array, width: number, height: number, depth: number): Uint8Array {
  const out = new Uint8Array(width * height);
  const rowBytes = Math.ceil((width * depth) / 8);
  const mask = (1 << depth) - 1;
  for (let r = 0; r < height; r++) {
    for (let c = 0; c < width; c++) {
      const bit = c * depth;
      const byte = packed[r * rowBytes + (bit >> 3)];
      out[r * width + c] = (byte >> (8 - depth - (bit & 7))) & mask;
    }
  }
  return out;
}

registerReader('png', readPng);
