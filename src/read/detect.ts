/**
 * Pick the reader for an input by its content, whatever the file is called: magic bytes first (NPY, PNG, MAT,
 * HDF5), then the first line of text (legacy VTK) or the XML root (VTK XML ImageData); everything else is read as
 * delimited text. The file name only decides which reader reports a file whose content matches none of them
 * (a broken `.mat` gets a MAT error rather than a CSV one).
 */
import { RhoformError } from '../errors.js';
import type { InputFormat } from '../types.js';
import { readCsv } from './csv.js';
import { readNpy } from './npy.js';
import { hasHdf5Signature, registeredReader } from './registry.js';
import type { ReadOptions, ReadResult } from './types.js';
import { firstInvalidUtf8 } from './utf8.js';

const NPY_MAGIC = [0x93, 0x4e, 0x55, 0x4d, 0x50, 0x59];
/** PNG signature (ISO/IEC 15948 / W3C PNG, §5.2). */
export const PNG_SIGNATURE = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];

function startsWith(bytes: Uint8Array, magic: readonly number[], at = 0): boolean {
  return bytes.length >= at + magic.length && magic.every((b, k) => bytes[at + k] === b);
}

function asciiAt(bytes: Uint8Array, from: number, to: number): string {
  return String.fromCharCode(...bytes.subarray(from, Math.min(to, bytes.length)));
}

/** detectFormat reads no byte beyond this offset: a file's first DETECT_BYTES decide its format as the whole file does. */
export const DETECT_BYTES = 8192;

/** The format of a file: by content (docs/formats.md), then by the name's extension, else 'csv'. */
export function detectFormat(bytes: Uint8Array, name: string): InputFormat {
  if (startsWith(bytes, NPY_MAGIC)) return 'npy';
  if (startsWith(bytes, PNG_SIGNATURE)) return 'png';
  if (asciiAt(bytes, 0, 6) === 'MATLAB' || hasHdf5Signature(bytes, 512)) return 'mat';
  let k = startsWith(bytes, [0xef, 0xbb, 0xbf]) ? 3 : 0;
  while (k < bytes.length && k < 4096 && (bytes[k] === 0x20 || bytes[k] === 0x09 || bytes[k] === 0x0a || bytes[k] === 0x0d)) k++;
  const head = asciiAt(bytes, k, k + 1024);
  if (/^# vtk DataFile Version/i.test(head)) return 'vtk';
  if ((head.startsWith('<?xml') || head.startsWith('<VTKFile')) && /<VTKFile[\s>]/.test(head)) return 'vti';
  const ext = /\.([a-z0-9]+)$/i.exec(name)?.[1].toLowerCase();
  if (ext === 'npy' || ext === 'mat' || ext === 'vtk' || ext === 'vti' || ext === 'png') return ext;
  return 'csv';
}

/** Read a grid from the bytes of a file; errors name `name`. */
export function readGrid(bytes: Uint8Array, name: string, options: ReadOptions): ReadResult {
  const format = detectFormat(bytes, name);
  try {
    switch (format) {
      case 'npy': return readNpy(bytes, options);
      case 'mat':
      case 'vtk':
      case 'vti':
      case 'png':
        return registeredReader(format)(bytes, options);
      case 'csv': break;
    }
    let text: string;
    try {
      text = new TextDecoder('utf-8', { fatal: true }).decode(bytes);
    } catch {
      throw new RhoformError('E_CSV_TOKEN', 'expected UTF-8 text (CSV) or an NPY, MAT, VTK, VTI or PNG file, found bytes that are none of these', {
        byteOffset: firstInvalidUtf8(bytes),
      });
    }
    return readCsv(text, options);
  } catch (e) {
    if (e instanceof RhoformError && e.where?.file === undefined) throw e.withFile(name);
    throw e;
  }
}

/** Loads the reader of `format` when it is one of those loaded on demand (registry.ts); once. */
export async function loadReader(format: InputFormat): Promise<void> {
  switch (format) {
    case 'mat': await import('./mat.js'); break;
    case 'vtk': await import('./vtk.js'); break;
    case 'vti': await import('./vti.js'); break;
    case 'png': await import('./png.js'); break;
    default: break;
  }
}

/** Loads the reader an input needs (`bytes` may be its first DETECT_BYTES), or every reader without an input. */
export async function loadReaders(input?: { readonly name: string; readonly bytes: Uint8Array }): Promise<void> {
  const formats: readonly InputFormat[] = input ? [detectFormat(input.bytes, input.name)] : ['mat', 'vtk', 'vti', 'png'];
  await Promise.all(formats.map(loadReader));
}

/** Byte offset of the first byte that is not part of a well-formed UTF-8 sequence (-1 when all are). */
export { firstInvalidUtf8 } from './utf8.js';
