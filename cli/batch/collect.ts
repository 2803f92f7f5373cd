/**
 * The input list of a batch (docs/scale.md): files as given, folders expanded recursively to their grid files
 * (*.csv, *.tsv, *.txt, *.npy, *.mat, *.vtk, *.vti, *.png, any letter case), sorted by path and without duplicates. A path that cannot be
 * read is an entry with its error, not a crash: it is reported in the summary like a bad grid.
 *
 * Folder expansion skips hidden entries (names starting with '.') and the batch's own summary tables
 * (batch-summary.csv, batch-summary.shard-k-of-n.csv), so a batch whose out-dir lies inside an input folder
 * does not read its previous summary as a grid. Symbolic links are followed; a link loop is visited once.
 */
import { readdirSync, realpathSync, statSync } from 'node:fs';
import { extname, join, resolve } from 'node:path';
import { displayPath } from '../io.js';
import { comparePaths } from './shard.js';

export const GRID_EXTENSIONS: readonly string[] = ['.csv', '.tsv', '.txt', '.npy', '.mat', '.vtk', '.vti', '.png'];

const SUMMARY_NAME = /^batch-summary(\.shard-\d+-of-\d+)?\.csv$/i;

export interface BatchInput {
  /** The path as shown in the summary: relative to the working folder when inside it, else absolute. */
  readonly file: string;
  /** Absolute path. */
  readonly path: string;
  /** Set when the path could not be used (nothing is built for it). */
  readonly error: { readonly code: string; readonly message: string } | null;
}

function realOrResolved(path: string): string {
  try {
    return realpathSync(path);
  } catch {
    return path;
  }
}

function isGridName(name: string): boolean {
  return GRID_EXTENSIONS.includes(extname(name).toLowerCase()) && !SUMMARY_NAME.test(name);
}

/**
 * Expand `given` (files and folders, relative to `cwd`) into the sorted, de-duplicated input list.
 * Two names of one file (a/../a/x.npy, a symbolic link) count once, under the name that sorts first.
 * `notes` are remarks for stderr (a folder without grid files).
 */
export function collectInputs(given: readonly string[], cwd: string): { inputs: BatchInput[]; notes: string[] } {
  const found: BatchInput[] = [];
  const notes: string[] = [];
  const visitedDirs = new Set<string>();

  /** Grid files found below `dir`; null when it was walked already (a folder given twice, a link loop). */
  const walk = (dir: string, shownAs: string): number | null => {
    const real = realOrResolved(dir);
    if (visitedDirs.has(real)) return null;
    visitedDirs.add(real);
    let names: string[];
    try {
      names = readdirSync(dir);
    } catch (e) {
      const code = (e as NodeJS.ErrnoException).code ?? 'error';
      found.push({ file: shownAs, path: dir, error: { code: 'E_INPUT_READ', message: `${shownAs}: cannot read the folder (${code})` } });
      return 0;
    }
    let count = 0;
    for (const name of names) {
      if (name.startsWith('.')) continue;
      const path = join(dir, name);
      let isDir: boolean;
      try {
        isDir = statSync(path).isDirectory();
      } catch {
        continue; // a dangling link: not a grid
      }
      if (isDir) count += walk(path, displayPath(cwd, path)) ?? 0;
      else if (isGridName(name)) {
        found.push({ file: displayPath(cwd, path), path, error: null });
        count++;
      }
    }
    return count;
  };

  for (const g of given) {
    const path = resolve(cwd, g);
    const shown = displayPath(cwd, path);
    let isDir: boolean;
    try {
      isDir = statSync(path).isDirectory();
    } catch (e) {
      const code = (e as NodeJS.ErrnoException).code;
      const why = code === 'ENOENT' ? 'no such file or folder' : `cannot read it (${code ?? 'error'})`;
      found.push({ file: shown, path, error: { code: 'E_INPUT_READ', message: `${shown}: ${why}` } });
      continue;
    }
    if (!isDir) found.push({ file: shown, path, error: null });
    else if (walk(path, shown) === 0) notes.push(`${shown}: no grid files (${GRID_EXTENSIONS.map((e) => `*${e}`).join(', ')}) in this folder`);
  }

  found.sort((a, b) => comparePaths(a.file, b.file));
  const seen = new Set<string>();
  const inputs: BatchInput[] = [];
  for (const f of found) {
    const key = f.error ? `\0${f.file}` : realOrResolved(f.path);
    if (seen.has(key)) continue;
    seen.add(key);
    inputs.push(f);
  }
  return { inputs, notes };
}
