/**
 * MAT-file level 5 data elements: tags and the header of a matrix (miMATRIX) — array flags, dimensions, name —
 * and where its real part is stored.
 *
 * Source: MathWorks, "MATLAB MAT-File Format" (matfile_format.pdf, versions 7 and later), chapter 1: an element
 * is an 8-byte tag (data type, byte count) followed by the data padded to 8 bytes, or a "small data element" of
 * at most 4 bytes packed into the tag (byte count in the upper 16 bits of the first word, type in the lower).
 * Array classes: 1 cell, 2 struct, 3 object, 4 char, 5 sparse, 6 double, 7 single, 8 int8, 9 uint8, 10 int16,
 * 11 uint16, 12 int32, 13 uint32, 14 int64, 15 uint64; flag bits (of the second byte of the flags word): 0x08
 * complex, 0x04 global, 0x02 logical.
 */
import { RhoformError } from '../errors.js';
import type { NumKind } from './binary.js';

export const MI_MATRIX = 14;
export const MI_COMPRESSED = 15;

/** miINT8 … miUINT64 (data types 1–13) → stored number kind; 8, 10 and 11 are reserved. */
const MI_KINDS: Record<number, NumKind> = { 1: 'i1', 2: 'u1', 3: 'i2', 4: 'u2', 5: 'i4', 6: 'u4', 7: 'f4', 9: 'f8', 12: 'i8', 13: 'u8' };

export function miKind(type: number): NumKind | undefined {
  return MI_KINDS[type];
}

const CLASS_NAMES: Record<number, string> = {
  1: 'cell', 2: 'struct', 3: 'object', 4: 'char', 5: 'sparse', 6: 'double', 7: 'single', 8: 'int8', 9: 'uint8',
  10: 'int16', 11: 'uint16', 12: 'int32', 13: 'uint32', 14: 'int64', 15: 'uint64', 16: 'function handle', 17: 'opaque object',
};

/** A MATLAB class number's name ("double", "cell"…). */
export function className(cls: number): string {
  return CLASS_NAMES[cls] ?? `class ${cls}`;
}

export interface Tag {
  readonly type: number;
  readonly nbytes: number;
  /** Offset of the element's data. */
  readonly data: number;
  /** Offset of the next element (data padded to 8 bytes; a small element takes 8 bytes in all). */
  readonly next: number;
}

/** Reads the tag at `pos`; `base` is added to offsets in messages (the element's place in the file). */
export function readTag(v: DataView, pos: number, le: boolean, base: number): Tag {
  if (pos + 8 > v.byteLength) {
    throw new RhoformError('E_MAT_TRUNCATED', `expected an 8-byte data element tag, found ${Math.max(0, v.byteLength - pos)} bytes before the end`, { byteOffset: base + pos });
  }
  const w = v.getUint32(pos, le);
  if (w >>> 16 !== 0) {
    const nbytes = w >>> 16;
    if (nbytes > 4) throw new RhoformError('E_MAT_ELEMENT', `expected a small data element of at most 4 bytes, found ${nbytes}`, { byteOffset: base + pos });
    return { type: w & 0xffff, nbytes, data: pos + 4, next: pos + 8 };
  }
  const nbytes = v.getUint32(pos + 4, le);
  return { type: w, nbytes, data: pos + 8, next: pos + 8 + Math.ceil(nbytes / 8) * 8 };
}

export interface MatrixHeader {
  readonly name: string;
  readonly cls: number;
  readonly complex: boolean;
  readonly logical: boolean;
  readonly dims: readonly number[];
  /** Offset (within the element's bytes) of the first subelement after the name: the real part, for numeric classes. */
  readonly body: number;
  /** Offset of the end of the matrix element. */
  readonly end: number;
}

/**
 * Parses the header of the miMATRIX element at `pos` of `v`. Data after the name may be missing (a partially
 * inflated element); `base` is the element's offset in the file, for messages.
 */
export function readMatrixHeader(v: DataView, pos: number, le: boolean, base: number): MatrixHeader {
  const at = (p: number) => ({ byteOffset: base + p });
  const tag = readTag(v, pos, le, base);
  if (tag.type !== MI_MATRIX) throw new RhoformError('E_MAT_ELEMENT', `expected a matrix element (miMATRIX, type 14), found data type ${tag.type}`, at(pos));
  const end = tag.data + tag.nbytes;
  const flags = readTag(v, tag.data, le, base);
  if (flags.type !== 6 || flags.nbytes !== 8) {
    throw new RhoformError('E_MAT_ELEMENT', `expected array flags (miUINT32, 8 bytes), found data type ${flags.type} of ${flags.nbytes} bytes`, at(tag.data));
  }
  if (flags.data + 8 > v.byteLength) throw new RhoformError('E_MAT_TRUNCATED', 'expected array flags, found the end of the data', at(flags.data));
  const word = v.getUint32(flags.data, le);
  const cls = word & 0xff;
  const bits = (word >>> 8) & 0xff;
  const dimsTag = readTag(v, flags.next, le, base);
  if (dimsTag.type !== 5 || dimsTag.nbytes % 4 !== 0 || dimsTag.nbytes < 8) {
    throw new RhoformError('E_MAT_ELEMENT', `expected dimensions (miINT32, at least 2 of them), found data type ${dimsTag.type} of ${dimsTag.nbytes} bytes`, at(flags.next));
  }
  if (dimsTag.data + dimsTag.nbytes > v.byteLength) throw new RhoformError('E_MAT_TRUNCATED', 'expected the dimensions, found the end of the data', at(dimsTag.data));
  const dims: number[] = [];
  for (let k = 0; k < dimsTag.nbytes / 4; k++) {
    const d = v.getInt32(dimsTag.data + 4 * k, le);
    if (d < 0) throw new RhoformError('E_MAT_ELEMENT', `expected dimensions ≥ 0, found ${d}`, at(dimsTag.data + 4 * k));
    dims.push(d);
  }
  const nameTag = readTag(v, dimsTag.next, le, base);
  if (nameTag.type !== 1 && nameTag.type !== 2 && nameTag.type !== 16) {
    throw new RhoformError('E_MAT_ELEMENT', `expected the array name (miINT8), found data type ${nameTag.type}`, at(dimsTag.next));
  }
  if (nameTag.data + nameTag.nbytes > v.byteLength) throw new RhoformError('E_MAT_TRUNCATED', 'expected the array name, found the end of the data', at(nameTag.data));
  const name = new TextDecoder('utf-8').decode(new Uint8Array(v.buffer, v.byteOffset + nameTag.data, nameTag.nbytes));
  return { name, cls, complex: (bits & 0x08) !== 0, logical: (bits & 0x02) !== 0, dims, body: nameTag.next, end };
}
