/**
 * Pick the reader for an input: NPY by its magic bytes (\x93NUMPY), whatever the file is called;
 * everything else is read as delimited text.
 */
import { RhoformError } from '../errors.js';
import type { InputFormat } from '../types.js';
import { readCsv } from './csv.js';
import { readNpy } from './npy.js';
import type { ReadOptions, ReadResult } from './types.js';
import { firstInvalidUtf8 } from './utf8.js';

const NPY_MAGIC = [0x93, 0x4e, 0x55, 0x4d, 0x50, 0x59];

/** 'npy' when the bytes start with the NPY magic string or the name ends in .npy, else 'csv'. */
export function detectFormat(bytes: Uint8Array, name: string): InputFormat {
  if (bytes.length >= 6 && NPY_MAGIC.every((b, k) => bytes[k] === b)) return 'npy';
  return /\.npy$/i.test(name) ? 'npy' : 'csv';
}

/** Read a grid from the bytes of a file; errors name `name`. */
export function readGrid(bytes: Uint8Array, name: string, options: ReadOptions): ReadResult {
  const format = detectFormat(bytes, name);
  try {
    if (format === 'npy') return readNpy(bytes, options);
    let text: string;
    try {
      text = new TextDecoder('utf-8', { fatal: true }).decode(bytes);
    } catch {
      throw new RhoformError('E_CSV_TOKEN', 'expected UTF-8 text (CSV) or an NPY file, found bytes that are neither', {
        byteOffset: firstInvalidUtf8(bytes),
      });
    }
    return readCsv(text, options);
  } catch (e) {
    if (e instanceof RhoformError && e.where?.file === undefined) throw e.withFile(name);
    throw e;
  }
}

/** Byte offset of the first byte that is not part of a well-formed UTF-8 sequence (-1 when all are). */
export { firstInvalidUtf8 } from './utf8.js';
