/**
 * A tiny PNG encoder for the report's pictures: 8-bit samples, no interlace, filter 0 (None) on every scanline,
 * zlib (RFC 1950/1951) level 9 by pako, a JavaScript port of zlib — the same bytes in Node and in a browser (Node's
 * own zlib is a fork whose output differs, so the preview page could not match the CLI byte for byte).
 *
 * Format: PNG (Portable Network Graphics) Specification, Version 1.0, T. Boutell et al., IETF RFC 2083 (1997),
 * DOI 10.17487/RFC2083; also ISO/IEC 15948:2004. Chunk CRC: CRC-32 with the reflected polynomial 0xEDB88320
 * over the chunk type and data (RFC 2083 §3.4 and Annex 15).
 */
import { deflate } from 'pako';
import { type Pending, submit } from '../parallel/lanes.js';
import { crc32 } from '../write/crc32.js';

/** PNG colour types this encoder writes: 0 grey, 2 RGB, 4 grey + alpha, 6 RGB + alpha (8 bits per sample). */
export type PngColorType = 0 | 2 | 4 | 6;

/** A raster in PNG order: row 0 is the TOP row, samples interleaved per pixel (e.g. R,G,B,A). */
export interface RasterImage {
  readonly width: number;
  readonly height: number;
  readonly colorType: PngColorType;
  /** width × height × samplesPerPixel(colorType) bytes, row-major from the top-left pixel. */
  readonly data: Uint8Array;
}

/** Samples per pixel of a PNG colour type (RFC 2083 §4.1.1). */
export function samplesPerPixel(colorType: PngColorType): number {
  return colorType === 0 ? 1 : colorType === 2 ? 3 : colorType === 4 ? 2 : 4;
}

/** Writes chunk `type` with `data` at out[o …] (length, type, data, CRC); returns the offset after it. */
function putChunk(out: Uint8Array, view: DataView, o: number, type: string, data: Uint8Array): number {
  view.setUint32(o, data.length);
  for (let i = 0; i < 4; i++) out[o + 4 + i] = type.charCodeAt(i);
  out.set(data, o + 8);
  view.setUint32(o + 8 + data.length, crc32(out, o + 4, o + 8 + data.length));
  return o + 12 + data.length;
}

/**
 * Encodes `image` as a PNG file (bytes). Every scanline gets filter type 0; the whole image is one IDAT chunk.
 * Throws a RangeError on a bad size or a data length that does not match.
 */
export function encodePng(image: RasterImage): Uint8Array {
  const { width, height, colorType, data } = image;
  if (!(Number.isInteger(width) && width > 0 && Number.isInteger(height) && height > 0)) {
    throw new RangeError(`PNG size: expected positive integers, found ${width}×${height}`);
  }
  const spp = samplesPerPixel(colorType);
  const stride = width * spp;
  if (data.length !== stride * height) {
    throw new RangeError(`PNG data: expected ${stride * height} bytes, found ${data.length}`);
  }
  const ihdr = new Uint8Array(13);
  const v = new DataView(ihdr.buffer);
  v.setUint32(0, width);
  v.setUint32(4, height);
  ihdr[8] = 8; // bit depth
  ihdr[9] = colorType;
  ihdr[10] = 0; // compression method 0: deflate
  ihdr[11] = 0; // filter method 0
  ihdr[12] = 0; // no interlace
  const raw = new Uint8Array((stride + 1) * height);
  for (let j = 0; j < height; j++) {
    raw[j * (stride + 1)] = 0; // filter type None
    raw.set(data.subarray(j * stride, (j + 1) * stride), j * (stride + 1) + 1);
  }
  const idat = deflate(raw, { level: 9 });
  // signature, IHDR, IDAT, IEND written straight into the file's bytes
  const out = new Uint8Array(8 + (12 + ihdr.length) + (12 + idat.length) + 12);
  const view = new DataView(out.buffer);
  out.set([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
  let o = putChunk(out, view, 8, 'IHDR', ihdr);
  o = putChunk(out, view, o, 'IDAT', idat);
  putChunk(out, view, o, 'IEND', new Uint8Array(0));
  return out;
}

/** Smallest picture (bytes of samples) worth encoding on another thread: level-9 deflate runs at ~1–2 MB/s. */
export const LATER_BYTES = 256 * 1024;

/** Starts encoding `image` on another lane (src/parallel) when there is one and it pays; `join()` = encodePng(image). */
export function encodePngLater(image: RasterImage): Pending<Uint8Array> {
  return submit({ module: import.meta.url, name: 'encodePng', args: [image] }, () => encodePng(image), image.data.length, LATER_BYTES);
}

/** A `data:<mime>;base64,…` URL (RFC 2397) of `bytes`. */
export function dataUrl(mime: string, bytes: Uint8Array): string {
  return `data:${mime};base64,${Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength).toString('base64')}`;
}

/** `data:image/png;base64,…` URL of an encoded PNG. */
export function pngDataUrl(png: Uint8Array): string {
  return dataUrl('image/png', png);
}
