/**
 * File operations: reading inputs (regular files only, with a size bound), and writing outputs atomically
 * (temp file + rename) behind an overwrite guard. All outputs of a run are checked before the first is
 * written, all are written to temp files before the first rename, so an error leaves nothing half-written.
 *
 * Temp files are named `<output>.<pid>.<8 hex>.tmp`. A run removes, in the folders it writes to, the temp files
 * of its own outputs that a killed run left (their pid is no longer running, or they have the older
 * `<output>.<8 hex>.tmp` form). `batch` also removes its own on SIGINT/SIGTERM (installTempSweep).
 */
import { randomBytes } from 'node:crypto';
import {
  closeSync,
  constants,
  existsSync,
  fstatSync,
  mkdirSync,
  openSync,
  readdirSync,
  readSync,
  realpathSync,
  renameSync,
  rmSync,
  statSync,
  writeFileSync,
  type Stats,
} from 'node:fs';
import { basename, dirname, join, resolve } from 'node:path';
import { RhoformError } from '../src/errors.js';
import { maxGridBytes } from '../src/read/byte-limit.js';
import { npyInPlaceBytes } from '../src/read/npy.js';

/** Largest side file (passive regions, loads, batch summaries) read whole, bytes. */
export const MAX_SIDE_FILE_BYTES = 256 << 20;

/** What a file that is not a regular file is, for messages. */
function kindOf(st: Stats): string {
  if (st.isDirectory()) return 'a directory';
  if (st.isFIFO()) return 'a named pipe (FIFO)';
  if (st.isCharacterDevice()) return 'a character device';
  if (st.isBlockDevice()) return 'a block device';
  if (st.isSocket()) return 'a socket';
  return 'not a regular file';
}

function readError(e: unknown, name: string, what: string): RhoformError {
  if (e instanceof RhoformError) return e;
  const code = (e as NodeJS.ErrnoException).code ?? 'error';
  return new RhoformError('E_INPUT_READ', `cannot read the ${what} (${code === 'ENOENT' ? 'no such file' : code})`, { file: name });
}

/**
 * Opens a regular file for reading without ever blocking: the kind is checked before opening (a FIFO would
 * block open() until a writer comes), and again on the open descriptor (O_NONBLOCK; the path may have changed).
 */
function openRegular(path: string, name: string, what: string): number {
  const st = statSync(path);
  if (!st.isFile()) throw new RhoformError('E_INPUT_READ', `expected the ${what} to be a regular file, found ${kindOf(st)}`, { file: name });
  const fd = openSync(path, constants.O_RDONLY | (constants.O_NONBLOCK ?? 0));
  try {
    const st2 = fstatSync(fd);
    if (!st2.isFile()) throw new RhoformError('E_INPUT_READ', `expected the ${what} to be a regular file, found ${kindOf(st2)}`, { file: name });
  } catch (e) {
    closeSync(fd);
    throw e;
  }
  return fd;
}

/**
 * Reads up to `n` bytes from the start of `fd` (fewer at the end of the file), into a buffer of at least
 * `capacity` bytes (the rest is left for the reader to use: npyInPlaceBytes; never touched, so never paid for).
 */
function readUpTo(fd: number, n: number, capacity = 0): Uint8Array {
  const buf = Buffer.allocUnsafeSlow(Math.max(n, capacity)); // not pooled: byte offset 0, so typed-array views of the data stay aligned
  let got = 0;
  while (got < n) {
    const k = readSync(fd, buf, got, n - got, got);
    if (k === 0) break;
    got += k;
  }
  return got === buf.length ? buf : buf.subarray(0, got);
}

function tooLarge(name: string, what: string, size: number, max: number, why: string): RhoformError {
  return new RhoformError('E_GRID_SIZE', `expected the ${what} to hold at most ${max} bytes (${why}), found ${size} bytes`, { file: name });
}

/**
 * Reads a regular file whole, refusing anything else by what it is (directory, FIFO, device, socket) and a file
 * larger than `maxBytes` before reading it (`why` says where the bound comes from). Errors name `name`.
 */
export function readInput(path: string, name = path, opts: { maxBytes?: number; why?: string; what?: string; capacity?: number } = {}): Uint8Array {
  const what = opts.what ?? 'input';
  const maxBytes = opts.maxBytes ?? MAX_SIDE_FILE_BYTES;
  let fd: number | null = null;
  try {
    fd = openRegular(path, name, what);
    const size = fstatSync(fd).size;
    if (size > maxBytes) throw tooLarge(name, what, size, maxBytes, opts.why ?? 'a file of this kind');
    // One byte more than the bound: a file that grew while being read is refused too.
    const bytes = readUpTo(fd, Math.min(maxBytes, Math.max(size, 0)) + 1, opts.capacity);
    if (bytes.length > maxBytes) throw tooLarge(name, what, bytes.length, maxBytes, opts.why ?? 'a file of this kind');
    return bytes;
  } catch (e) {
    throw readError(e, name, what);
  } finally {
    if (fd !== null) closeSync(fd);
  }
}

/** The first `n` bytes of a regular file (fewer when it is shorter), or null when it cannot be read now. */
export function readHead(path: string, n: number): Uint8Array | null {
  let fd: number | null = null;
  try {
    fd = openRegular(path, path, 'input');
    return readUpTo(fd, n);
  } catch {
    return null;
  } finally {
    if (fd !== null) closeSync(fd);
  }
}

/** Largest NPY header read ahead to size the buffer (numpy writes 128 bytes for a 2-D array). */
const NPY_HEAD_BYTES = 1 << 16;

/**
 * Reads a grid file: a regular file whose size fits `maxCells` samples (src/read/byte-limit.ts — NPY from its
 * declared header length and 8 bytes a sample, text at a generous 128 bytes a sample), judged from its first
 * bytes before the rest is read. The buffer is this process's own (never pooled), and for NPY f4 data it has
 * `room` bytes after the file so that a build given `{ consumable: true, room }` widens them in place.
 */
export function readGridFile(path: string, name: string, maxCells: number): { bytes: Uint8Array; room: number } {
  let head: Uint8Array;
  let fd: number | null = null;
  try {
    fd = openRegular(path, name, 'input');
    head = readUpTo(fd, 16);
    const end = npyHeaderEnd(head);
    if (end > head.length && end <= NPY_HEAD_BYTES) head = readUpTo(fd, end);
  } catch (e) {
    throw readError(e, name, 'input');
  } finally {
    if (fd !== null) closeSync(fd);
  }
  const max = maxGridBytes(head, name, maxCells);
  const capacity = npyInPlaceBytes(head, maxCells);
  const bytes = readInput(path, name, { maxBytes: max, why: `for --max-cells ${maxCells}`, capacity });
  return { bytes, room: Math.max(0, capacity - bytes.length) };
}

/** readGridFile's bytes. */
export function readGridInput(path: string, name: string, maxCells: number): Uint8Array {
  return readGridFile(path, name, maxCells).bytes;
}

/** Where an NPY file's data start, from its first 12 bytes (NEP 1 preamble); 0 when they are not an NPY preamble. */
function npyHeaderEnd(head: Uint8Array): number {
  const magic = [0x93, 0x4e, 0x55, 0x4d, 0x50, 0x59];
  if (head.length < 12 || !magic.every((b, k) => head[k] === b)) return 0;
  const dv = new DataView(head.buffer, head.byteOffset, head.byteLength);
  return head[6] === 1 ? 10 + dv.getUint16(8, true) : 12 + dv.getUint32(8, true);
}

function canonical(path: string): string {
  const abs = resolve(path);
  try {
    return realpathSync(abs);
  } catch {
    // Not there yet: canonicalise the folder, keep the name.
    try {
      return resolve(realpathSync(dirname(abs)), abs.slice(dirname(abs).length + 1));
    } catch {
      return abs;
    }
  }
}

export interface PlannedOutput {
  readonly path: string;
  /** Text (written as UTF-8) or bytes (the binary solids). */
  readonly content: string | Uint8Array;
}

/** `<output>.<pid>.<8 hex>.tmp` (this version) or `<output>.<8 hex>.tmp` (earlier versions). */
const TEMP = /^(.+?)\.(?:(\d+)\.)?([0-9a-f]{8})\.tmp$/;

function alive(pid: number): boolean {
  if (pid === process.pid) return true;
  try {
    process.kill(pid, 0);
    return true;
  } catch (e) {
    return (e as NodeJS.ErrnoException).code === 'EPERM';
  }
}

/**
 * Removes temp files that killed runs left beside the given outputs: those named after one of these outputs
 * whose writer is no longer running. Never touches any other file. Best effort (errors are ignored).
 */
export function removeStaleTemps(outputs: readonly string[]): void {
  const byDir = new Map<string, Set<string>>();
  for (const o of outputs) {
    const dir = dirname(resolve(o));
    if (!byDir.has(dir)) byDir.set(dir, new Set());
    byDir.get(dir)!.add(basename(o));
  }
  for (const [dir, names] of byDir) {
    let entries: string[];
    try {
      entries = readdirSync(dir);
    } catch {
      continue;
    }
    for (const e of entries) {
      const m = TEMP.exec(e);
      if (!m || !names.has(m[1])) continue;
      if (m[2] !== undefined && alive(Number(m[2]))) continue;
      rmSync(join(dir, e), { force: true });
    }
  }
}

/** Removes this process's temp files (`*.<pid>.<8 hex>.tmp`) in `dirs`. Best effort. */
export function removeOwnTemps(dirs: Iterable<string>): void {
  const own = new RegExp(`\\.${process.pid}\\.[0-9a-f]{8}\\.tmp$`);
  for (const dir of new Set(dirs)) {
    let entries: string[];
    try {
      entries = readdirSync(dir);
    } catch {
      continue;
    }
    for (const e of entries) if (own.test(e)) rmSync(join(dir, e), { force: true });
  }
}

/**
 * For a run that keeps its event loop free while outputs are written (batch: worker threads write): on SIGINT
 * or SIGTERM, remove this process's temp files in `dirs`, then end with that signal as before. Returns the
 * function that uninstalls the handlers. (A synchronous build cannot run a handler while it writes; the next
 * run removes what a kill left: removeStaleTemps.)
 */
export function installTempSweep(dirs: readonly string[]): () => void {
  const onSignal = (signal: NodeJS.Signals): void => {
    uninstall();
    removeOwnTemps(dirs);
    process.kill(process.pid, signal);
  };
  const uninstall = (): void => {
    process.off('SIGINT', onSignal);
    process.off('SIGTERM', onSignal);
  };
  process.on('SIGINT', onSignal);
  process.on('SIGTERM', onSignal);
  return uninstall;
}

/**
 * Write every output, or none. Refuses (before writing anything) an output that is an input, and an
 * existing file unless `force`. Removes temp files a killed earlier run left beside these outputs.
 */
export function writeOutputsAtomically(outputs: readonly PlannedOutput[], inputs: readonly string[], force: boolean): void {
  const inputSet = new Set(inputs.map(canonical));
  for (const o of outputs) {
    if (inputSet.has(canonical(o.path))) {
      throw new RhoformError('E_OUTPUT_IS_INPUT', `expected an output path different from the input, found the input itself`, { file: o.path });
    }
    if (!force && existsSync(o.path)) {
      throw new RhoformError('E_OUTPUT_EXISTS', `expected a new file, found an existing one (use --force to replace it)`, { file: o.path });
    }
  }
  removeStaleTemps(outputs.map((o) => o.path));
  const temps: string[] = [];
  try {
    for (const o of outputs) {
      mkdirSync(dirname(resolve(o.path)), { recursive: true });
      const tmp = `${o.path}.${process.pid}.${randomBytes(4).toString('hex')}.tmp`;
      writeFileSync(tmp, o.content, { flag: 'wx' });
      temps.push(tmp);
    }
  } catch (e) {
    for (const t of temps) rmSync(t, { force: true });
    if (e instanceof RhoformError) throw e;
    const err = e as NodeJS.ErrnoException;
    throw new RhoformError('E_OUTPUT_WRITE', `cannot write the output (${err.code ?? err.message})`, { file: err.path ?? outputs[temps.length]?.path });
  }
  for (let k = 0; k < outputs.length; k++) renameSync(temps[k], outputs[k].path);
}
