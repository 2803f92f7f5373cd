/**
 * File operations: reading the input, and writing outputs atomically (temp file + rename) behind an
 * overwrite guard. All outputs of a run are checked before the first is written, all are written to temp
 * files before the first rename, so an error leaves nothing half-written.
 */
import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, realpathSync, renameSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import { RhoformError } from '../src/errors.js';

/** Read an input file whole; a missing or unreadable file is E_INPUT_READ, named as the user gave it (`name`). */
export function readInput(path: string, name = path): Uint8Array {
  try {
    if (statSync(path).isDirectory()) throw new RhoformError('E_INPUT_READ', `expected a grid file, found a directory`, { file: name });
    return readFileSync(path);
  } catch (e) {
    if (e instanceof RhoformError) throw e;
    const code = (e as NodeJS.ErrnoException).code ?? 'error';
    throw new RhoformError('E_INPUT_READ', `cannot read the input (${code === 'ENOENT' ? 'no such file' : code})`, { file: name });
  }
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
  readonly content: string;
}

/**
 * Write every output, or none. Refuses (before writing anything) an output that is an input, and an
 * existing file unless `force`.
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
  const temps: string[] = [];
  try {
    for (const o of outputs) {
      mkdirSync(dirname(resolve(o.path)), { recursive: true });
      const tmp = `${o.path}.${randomBytes(4).toString('hex')}.tmp`;
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
