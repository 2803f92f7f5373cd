/**
 * The data of a VTK XML DataArray → bytes of values: inline ascii is handled by the caller; this module decodes
 * inline base64 ("binary"), appended raw and appended base64 data, each with its header of UInt32 or UInt64
 * words, and zlib-compressed blocks (vtkZLibDataCompressor).
 *
 * Source: Kitware, "VTK File Formats", XML file formats (docs.vtk.org; VTK User's Guide, 11th ed., ch. 19):
 * uncompressed data are preceded by one header word, the byte count; compressed data by
 * [number of blocks, block size, size of the last block (0 = full), compressed size of each block], followed by
 * the blocks, each a zlib stream. Header words and data use the file's byte_order. Base64 data may encode the
 * header and the data as one stream or as two (the header padded on its own); both are read.
 */
import { inflateSync } from 'node:zlib';
import { RhoformError, type Where } from '../errors.js';

export interface PayloadContext {
  readonly littleEndian: boolean;
  /** Bytes per header word: 4 (UInt32) or 8 (UInt64). */
  readonly headerSize: 4 | 8;
  readonly compressed: boolean;
  /** Where to point messages about this array. */
  readonly where: Where;
}

/** Base64 text → bytes, decoding each padded stream on its own (Node ignores the whitespace in between). */
export function decodeBase64(text: string, where: Where): Uint8Array {
  const pieces: Buffer[] = [];
  let from = 0;
  for (let eq = text.indexOf('=', from); eq >= 0; eq = text.indexOf('=', from)) {
    let k = eq;
    while (k < text.length && (text[k] === '=' || text.charCodeAt(k) <= 0x20)) k++;
    if (k >= text.length) break;
    pieces.push(Buffer.from(text.slice(from, k), 'base64'));
    from = k;
  }
  pieces.push(Buffer.from(text.slice(from), 'base64'));
  const bad = /[^A-Za-z0-9+/=\s]/.exec(text.length > 4096 ? text.slice(0, 4096) : text);
  if (bad) throw new RhoformError('E_VTI_DATA', `expected base64 data, found ${JSON.stringify(bad[0])} at character ${bad.index + 1} of the array`, where);
  return pieces.length === 1 ? pieces[0] : Buffer.concat(pieces);
}

function word(b: Uint8Array, k: number, ctx: PayloadContext): number {
  const at = k * ctx.headerSize;
  if (at + ctx.headerSize > b.length) {
    throw new RhoformError('E_VTI_DATA', `expected header word ${k + 1} of the data (${ctx.headerSize} bytes each), found the end of the data`, ctx.where);
  }
  const v = new DataView(b.buffer, b.byteOffset + at, ctx.headerSize);
  return ctx.headerSize === 4 ? v.getUint32(0, ctx.littleEndian) : Number(v.getBigUint64(0, ctx.littleEndian));
}

/**
 * The `need` bytes of values in a payload `b` that starts with its header.
 * @returns the bytes and the offset of the values within `b` (uncompressed data are not copied).
 * @throws RhoformError E_VTI_DATA (sizes, truncation) or E_VTI_INFLATE (a block that does not inflate).
 */
export function payloadBytes(b: Uint8Array, need: number, ctx: PayloadContext): { bytes: Uint8Array; offset: number } {
  const hs = ctx.headerSize;
  if (!ctx.compressed) {
    const nbytes = word(b, 0, ctx);
    if (nbytes !== need) throw new RhoformError('E_VTI_DATA', `expected a header of ${need} bytes of values, found ${nbytes}`, ctx.where);
    if (hs + nbytes > b.length) throw new RhoformError('E_VTI_DATA', `expected ${nbytes} bytes of values, found ${Math.max(0, b.length - hs)}`, ctx.where);
    return { bytes: b, offset: hs };
  }
  const nb = word(b, 0, ctx);
  const bs = word(b, 1, ctx);
  const last = word(b, 2, ctx) || bs;
  const total = nb === 0 ? 0 : (nb - 1) * bs + last;
  if (total !== need) {
    throw new RhoformError('E_VTI_DATA', `expected compressed blocks holding ${need} bytes of values, found ${nb} blocks of ${bs} bytes (last ${last}) = ${total}`, ctx.where);
  }
  const out = new Uint8Array(need);
  let pos = (3 + nb) * hs;
  let o = 0;
  for (let k = 0; k < nb; k++) {
    const cs = word(b, 3 + k, ctx);
    const size = k === nb - 1 ? last : bs;
    if (pos + cs > b.length) throw new RhoformError('E_VTI_DATA', `expected compressed block ${k + 1} of ${cs} bytes, found ${Math.max(0, b.length - pos)}`, ctx.where);
    let raw: Uint8Array;
    try {
      raw = inflateSync(b.subarray(pos, pos + cs), { maxOutputLength: Math.max(size, 1), chunkSize: Math.max(size, 1024) });
    } catch (e) {
      throw new RhoformError('E_VTI_INFLATE', `expected block ${k + 1} of ${nb} to inflate to ${size} bytes (zlib), found: ${(e as Error).message}`, ctx.where);
    }
    if (raw.length !== size) throw new RhoformError('E_VTI_INFLATE', `expected block ${k + 1} of ${nb} to inflate to ${size} bytes, found ${raw.length}`, ctx.where);
    out.set(raw, o);
    o += size;
    pos += cs;
  }
  return { bytes: out, offset: 0 };
}
