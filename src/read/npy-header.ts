/**
 * The NPY preamble and header: magic, version, header length, and the header dict.
 *
 * Layout (NEP 1, R. Kern, "A simple file format for NumPy arrays", 2007; numpy/lib/_format_impl.py):
 * bytes 0–5 `\x93NUMPY`; byte 6 major, byte 7 minor version; then HEADER_LEN as a little-endian
 * uint16 (1.0) or uint32 (2.0, 3.0); then HEADER_LEN bytes of a Python dict literal, latin-1 (1.0, 2.0)
 * or UTF-8 (3.0), with exactly the keys 'descr', 'fortran_order', 'shape'. Data follows immediately.
 * Writers pad the header so the data starts on a 64-byte boundary (16 in older files); the reader
 * takes the data offset from HEADER_LEN and assumes no alignment.
 */
import { RhoformError, escapeControls } from '../errors.js';
import { parsePyLiteral, PyLiteralError, showPyLiteral, type PyLiteral } from './npy-literal.js';

export interface NpyHeader {
  readonly major: number;
  readonly minor: number;
  /** The descr literal (a string such as '<f8', or a list for structured dtypes). */
  readonly descr: PyLiteral;
  /** Byte offset of the descr value in the file. */
  readonly descrOffset: number;
  readonly fortranOrder: boolean;
  readonly shape: readonly number[];
  /** Byte offset of the shape value in the file. */
  readonly shapeOffset: number;
  /** Byte offset of the first data byte (end of the header). */
  readonly dataOffset: number;
}

const MAGIC = [0x93, 0x4e, 0x55, 0x4d, 0x50, 0x59]; // \x93 N U M P Y
const KEYS = ['descr', 'fortran_order', 'shape'] as const;

/**
 * Reads the preamble and header of an NPY file.
 * @throws RhoformError E_NPY_MAGIC, E_NPY_VERSION, E_NPY_TRUNCATED or E_NPY_HEADER, each with the byte offset.
 */
export function parseNpyHeader(bytes: Uint8Array): NpyHeader {
  checkMagic(bytes);
  if (bytes.length < 8) {
    throw new RhoformError('E_NPY_TRUNCATED', `expected a format version in bytes 6–7, found the end of the file after ${bytes.length} bytes`, { byteOffset: bytes.length });
  }
  const major = bytes[6];
  const minor = bytes[7];
  if (!(minor === 0 && (major === 1 || major === 2 || major === 3))) {
    throw new RhoformError('E_NPY_VERSION', `expected NPY format version 1.0, 2.0 or 3.0, found ${major}.${minor}`, { byteOffset: 6 });
  }
  const lenSize = major === 1 ? 2 : 4;
  const headerStart = 8 + lenSize;
  if (bytes.length < headerStart) {
    throw new RhoformError('E_NPY_TRUNCATED', `expected a ${lenSize}-byte header length at byte 8, found the end of the file after ${bytes.length} bytes`, { byteOffset: bytes.length });
  }
  const dv = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const headerLen = major === 1 ? dv.getUint16(8, true) : dv.getUint32(8, true);
  const dataOffset = headerStart + headerLen;
  if (dataOffset > bytes.length) {
    throw new RhoformError(
      'E_NPY_TRUNCATED',
      `expected a header of ${headerLen} bytes (as declared at byte 8), found only ${bytes.length - headerStart} bytes after byte ${headerStart}`,
      { byteOffset: bytes.length },
    );
  }
  const raw = bytes.subarray(headerStart, dataOffset);
  const text = major === 3 ? decodeUtf8(raw, headerStart) : decodeLatin1(raw);
  const byteAt = major === 3 ? utf8Offsets(text, headerStart) : (i: number) => headerStart + i;

  let dict: PyLiteral;
  try {
    dict = parsePyLiteral(text);
  } catch (e) {
    if (!(e instanceof PyLiteralError)) throw e;
    throw new RhoformError('E_NPY_HEADER', `${e.message} (the header must be a Python dict literal)`, { byteOffset: byteAt(e.at) });
  }
  if (dict.kind !== 'dict') {
    throw new RhoformError('E_NPY_HEADER', `expected the header to be a Python dict {…}, found ${cut(showPyLiteral(dict))}`, { byteOffset: byteAt(dict.at) });
  }
  const found = new Map<string, PyLiteral>();
  for (const { key, value } of dict.entries) {
    const name = key.kind === 'str' ? key.value : showPyLiteral(key);
    if (key.kind !== 'str' || !(KEYS as readonly string[]).includes(key.value)) {
      throw new RhoformError('E_NPY_HEADER', `expected only the keys 'descr', 'fortran_order', 'shape' in the header, found an extra key ${cut(key.kind === 'str' ? `'${name}'` : name)}`, { byteOffset: byteAt(key.at) });
    }
    if (found.has(name)) {
      throw new RhoformError('E_NPY_HEADER', `expected the key '${name}' once in the header, found it twice`, { byteOffset: byteAt(key.at) });
    }
    found.set(name, value);
  }
  for (const k of KEYS) {
    if (!found.has(k)) {
      const have = [...found.keys()].map((n) => `'${n}'`).join(', ') || 'no keys';
      throw new RhoformError('E_NPY_HEADER', `expected the key '${k}' in the header, found only ${have}`, { byteOffset: byteAt(dict.at) });
    }
  }
  const descr = found.get('descr')!;
  const fortran = found.get('fortran_order')!;
  const shape = found.get('shape')!;
  if (fortran.kind !== 'bool') {
    throw new RhoformError('E_NPY_HEADER', `expected 'fortran_order' to be True or False, found ${cut(showPyLiteral(fortran))}`, { byteOffset: byteAt(fortran.at) });
  }
  if (shape.kind !== 'tuple' || !shape.items.every((d) => d.kind === 'int' && d.value >= 0)) {
    throw new RhoformError('E_NPY_HEADER', `expected 'shape' to be a tuple of non-negative integers, found ${cut(showPyLiteral(shape))}`, { byteOffset: byteAt(shape.at) });
  }
  return {
    major,
    minor,
    descr,
    descrOffset: byteAt(descr.at),
    fortranOrder: fortran.value,
    shape: shape.items.map((d) => (d.kind === 'int' ? d.value : NaN)),
    shapeOffset: byteAt(shape.at),
    dataOffset,
  };
}

function checkMagic(bytes: Uint8Array): void {
  if (bytes.length === 0) {
    throw new RhoformError('E_NPY_TRUNCATED', 'expected an NPY file starting with \\x93NUMPY, found an empty file (0 bytes)', { byteOffset: 0 });
  }
  const n = Math.min(bytes.length, MAGIC.length);
  for (let k = 0; k < n; k++) {
    if (bytes[k] !== MAGIC[k]) {
      const zip = bytes[0] === 0x50 && bytes[1] === 0x4b ? ' (a zip archive — an .npz holds .npy files; extract one)' : '';
      throw new RhoformError('E_NPY_MAGIC', `expected an NPY file starting with \\x93NUMPY, found ${showBytes(bytes, 8)}${zip}`, { byteOffset: k });
    }
  }
  if (bytes.length < MAGIC.length) {
    throw new RhoformError('E_NPY_TRUNCATED', `expected the 6-byte magic \\x93NUMPY, found the end of the file after ${bytes.length} bytes`, { byteOffset: bytes.length });
  }
}

/** The first `n` bytes as a Python-like bytes literal: printable ASCII as is, the rest as \xHH. */
export function showBytes(bytes: Uint8Array, n: number): string {
  let s = '';
  for (const b of bytes.subarray(0, n)) {
    if (b === 0x5c) s += '\\\\';
    else if (b === 0x22) s += '\\"';
    else if (b === 0x0a) s += '\\n';
    else if (b === 0x0d) s += '\\r';
    else if (b === 0x09) s += '\\t';
    else if (b >= 0x20 && b < 0x7f) s += String.fromCharCode(b);
    else s += `\\x${b.toString(16).padStart(2, '0')}`;
  }
  return `"${s}"${bytes.length > n ? '…' : ''}`;
}

/** latin-1 is one byte per char (not TextDecoder('latin1'), which is windows-1252). */
function decodeLatin1(raw: Uint8Array): string {
  let s = '';
  for (let k = 0; k < raw.length; k += 8192) s += String.fromCharCode(...raw.subarray(k, k + 8192));
  return s;
}

function decodeUtf8(raw: Uint8Array, headerStart: number): string {
  try {
    return new TextDecoder('utf-8', { fatal: true }).decode(raw);
  } catch {
    throw new RhoformError('E_NPY_HEADER', 'expected a UTF-8 header (format 3.0), found bytes that are not valid UTF-8', { byteOffset: headerStart });
  }
}

/** Maps a UTF-16 index of the decoded header to a byte offset in the file. */
function utf8Offsets(text: string, headerStart: number): (i: number) => number {
  return (i) => headerStart + new TextEncoder().encode(text.slice(0, i)).length;
}

function cut(s: string): string {
  return s.length > 60 ? `${escapeControls(s.slice(0, 60))}…` : escapeControls(s);
}
