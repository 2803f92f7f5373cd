import { inflateSync } from 'node:zlib';
import { describe, expect, it } from 'vitest';
import { encodePng, samplesPerPixel, type PngColorType } from '../../src/report/png.js';
import { crc32 } from '../../src/write/crc32.js';
import { blockMeans, densityGrey, densityRaster } from '../../src/report/raster.js';
import type { DensityGrid } from '../../src/types.js';

/**
 * CRC-32 written out bit by bit from its published definition (RFC 2083 §3.4 / ISO/IEC 15948 Annex D:
 * reflected polynomial 0xEDB88320, register preset to all ones, result complemented) — no table, so it is
 * independent of the encoder's table-driven code.
 */
function referenceCrc(bytes: Uint8Array): number {
  let c = 0xffffffff;
  for (const b of bytes) {
    c ^= b;
    for (let k = 0; k < 8; k++) c = c & 1 ? (c >>> 1) ^ 0xedb88320 : c >>> 1;
  }
  return (c ^ 0xffffffff) >>> 0;
}

interface Chunk {
  type: string;
  data: Uint8Array;
  crc: number;
  crcInput: Uint8Array;
}

/** A minimal PNG reader for the test: signature, chunk list (RFC 2083 §3.2), IHDR, inflated scanlines. */
function decode(png: Uint8Array) {
  const sig = Array.from(png.subarray(0, 8));
  const view = new DataView(png.buffer, png.byteOffset, png.byteLength);
  const chunks: Chunk[] = [];
  let o = 8;
  while (o < png.length) {
    const len = view.getUint32(o);
    const type = String.fromCharCode(...png.subarray(o + 4, o + 8));
    chunks.push({ type, data: png.subarray(o + 8, o + 8 + len), crc: view.getUint32(o + 8 + len), crcInput: png.subarray(o + 4, o + 8 + len) });
    o += 12 + len;
  }
  const ih = chunks[0].data;
  const iv = new DataView(ih.buffer, ih.byteOffset, ih.byteLength);
  const ihdr = { width: iv.getUint32(0), height: iv.getUint32(4), depth: ih[8], colorType: ih[9], compression: ih[10], filter: ih[11], interlace: ih[12] };
  const idat = Buffer.concat(chunks.filter((c) => c.type === 'IDAT').map((c) => c.data));
  const raw = new Uint8Array(inflateSync(idat));
  const spp = samplesPerPixel(ihdr.colorType as PngColorType);
  const stride = ihdr.width * spp;
  const filters: number[] = [];
  const pixels = new Uint8Array(stride * ihdr.height);
  for (let j = 0; j < ihdr.height; j++) {
    filters.push(raw[j * (stride + 1)]);
    pixels.set(raw.subarray(j * (stride + 1) + 1, (j + 1) * (stride + 1)), j * stride);
  }
  return { sig, chunks, ihdr, raw, filters, pixels };
}

describe('PNG encoder', () => {
  it('CRC-32 matches the published check value', () => {
    const ascii = new TextEncoder().encode('123456789');
    // published check value of CRC-32 (ISO-HDLC / PNG / zlib): CRC32("123456789") = 0xCBF43926
    expect(referenceCrc(ascii)).toBe(0xcbf43926);
    expect(crc32(ascii)).toBe(0xcbf43926);
    // every PNG ends in IEND with CRC AE 42 60 82 (CRC of the 4 type bytes; widely quoted, from memory)
    expect(crc32(new TextEncoder().encode('IEND'))).toBe(0xae426082);
  });

  it('writes signature, IHDR, IDAT, IEND with correct CRCs and filter-0 scanlines', () => {
    const data = Uint8Array.of(0, 64, 128, 255, 1, 2); // 3 × 2 grey
    const png = decode(encodePng({ width: 3, height: 2, colorType: 0, data }));
    // RFC 2083 §3.1: the PNG signature
    expect(png.sig).toEqual([137, 80, 78, 71, 13, 10, 26, 10]);
    expect(png.chunks.map((c) => c.type)).toEqual(['IHDR', 'IDAT', 'IEND']);
    // RFC 2083 §4.1.1: IHDR is 13 bytes: width, height, bit depth, colour type, compression, filter, interlace
    expect(png.chunks[0].data.length).toBe(13);
    expect(png.ihdr).toEqual({ width: 3, height: 2, depth: 8, colorType: 0, compression: 0, filter: 0, interlace: 0 });
    for (const c of png.chunks) expect(c.crc).toBe(referenceCrc(c.crcInput));
    expect(png.chunks[2].data.length).toBe(0);
    expect(png.filters).toEqual([0, 0]);
    expect(Array.from(png.pixels)).toEqual(Array.from(data));
  });

  it('round-trips RGBA and grey+alpha samples', () => {
    for (const colorType of [2, 4, 6] as const) {
      const spp = samplesPerPixel(colorType);
      const data = new Uint8Array(5 * 4 * spp).map((_, i) => (i * 37) & 255);
      const png = decode(encodePng({ width: 5, height: 4, colorType, data }));
      expect(png.ihdr.colorType).toBe(colorType);
      for (const c of png.chunks) expect(c.crc).toBe(referenceCrc(c.crcInput));
      expect(Array.from(png.pixels)).toEqual(Array.from(data));
    }
  });

  it('refuses a data length that does not match the size', () => {
    expect(() => encodePng({ width: 2, height: 2, colorType: 0, data: new Uint8Array(3) })).toThrow(/expected 4 bytes, found 3/);
    expect(() => encodePng({ width: 0, height: 2, colorType: 0, data: new Uint8Array(0) })).toThrow(RangeError);
  });
});

describe('density raster', () => {
  const grid = (nx: number, ny: number, values: number[], placement: 'cells' | 'nodes' = 'cells'): DensityGrid => ({
    nx,
    ny,
    cellSize: [2, 2],
    origin: [0, 0],
    values: Float64Array.from(values),
    placement,
  });

  it('puts the top grid row (j = ny−1) first and maps density 1 dark, 0 white', () => {
    // rows j count up from the bottom: j = 0 is [0, 0.25, 0.5], j = 1 is [0.75, 1, 0]
    const r = densityRaster(grid(3, 2, [0, 0.25, 0.5, 0.75, 1, 0]));
    const png = decode(encodePng(r.image));
    expect(png.ihdr).toMatchObject({ width: 3, height: 2, colorType: 0 });
    // documented mapping 255 − 200·v: 0.75 → 105, 1 → 55, 0 → 255, 0.25 → 205, 0.5 → 155
    expect(Array.from(png.pixels)).toEqual([105, 55, 255, 255, 205, 155]);
    expect(r.extent).toEqual([0, 0, 6, 4]);
    expect(densityGrey(-0.2)).toBe(255);
    expect(densityGrey(1.3)).toBe(55);
  });

  it('averages k×k blocks (arithmetic means) and makes all-NaN blocks transparent', () => {
    // 4 × 2 grid, maxSide 2 → k = 2: blocks {0,1,4,5} and {2,3,6,7} (indices j*nx+i)
    const v = [0, 1, NaN, NaN, 0.5, 0.5, NaN, NaN];
    const { w, h, means } = blockMeans(v, 4, 2, 2);
    expect([w, h]).toEqual([2, 1]);
    expect(means[0]).toBeCloseTo((0 + 1 + 0.5 + 0.5) / 4, 12); // mean of the four samples
    expect(Number.isNaN(means[1])).toBe(true);
    const r = densityRaster(grid(4, 2, v), 2);
    const png = decode(encodePng(r.image));
    expect(png.ihdr.colorType).toBe(4); // grey + alpha because of NaN
    expect(Array.from(png.pixels)).toEqual([densityGrey(0.5), 255, 255, 0]);
  });

  it('covers a partial last block and the half cells around nodal samples', () => {
    const r = densityRaster(grid(5, 3, new Array(15).fill(1)), 2); // k = 3: 2 × 1 pixels over 6 × 3 cells
    expect([r.image.width, r.image.height]).toEqual([2, 1]);
    expect(r.extent).toEqual([0, 0, 12, 6]); // grid top edge at 3 × 2 mm; image covers 2·3 cells across
    const n = densityRaster(grid(3, 3, new Array(9).fill(0.5), 'nodes'));
    expect(n.extent).toEqual([-1, -1, 5, 5]); // nodes at 0, 2, 4 mm each cover ±1 mm
  });
});
