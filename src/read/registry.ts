/**
 * The readers that most runs do not use — MAT, VTK, VTI and PNG, with node:zlib and fast-png — are loaded on
 * demand (detect.ts `loadReader`). Each registers itself here when its module is evaluated, so importing a reader
 * module (as the library's index does) also makes `readGrid` able to use it.
 */
import { RhoformError } from '../errors.js';
import type { ReadOptions, ReadResult } from './types.js';

export type LazyFormat = 'mat' | 'vtk' | 'vti' | 'png';
export type Reader = (bytes: Uint8Array, options: ReadOptions) => ReadResult;

const readers: Partial<Record<LazyFormat, Reader>> = {};

export function registerReader(format: LazyFormat, read: Reader): void {
  readers[format] = read;
}

/** The reader of `format`; throws E_INTERNAL when it was not loaded first. */
export function registeredReader(format: LazyFormat): Reader {
  const read = readers[format];
  if (read === undefined) {
    throw new RhoformError('E_INTERNAL', `the ${format.toUpperCase()} reader is not loaded: await prepareBuild(settings, input) before build(), or loadReader('${format}') before readGrid()`);
  }
  return read;
}

/** HDF5 file signature (HDF5 File Format Specification, version 3.0, §II.A "Format Signature"). */
const HDF5_SIGNATURE = [0x89, 0x48, 0x44, 0x46, 0x0d, 0x0a, 0x1a, 0x0a];

/** True when the bytes carry the HDF5 signature at offset `at` (512 in a -v7.3 MAT-file, or 0). */
export function hasHdf5Signature(bytes: Uint8Array, at: number): boolean {
  return bytes.length >= at + 8 && HDF5_SIGNATURE.every((b, k) => bytes[at + k] === b);
}
