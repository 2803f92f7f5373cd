/**
 * The NPY fixtures written by numpy 2.4 (fixtures/make/make_npy_fixtures.py) and what numpy reported when it read
 * them back (fixtures/npy/manifest.json), for the NPY reader's tests.
 */
import { readFileSync } from 'node:fs';

export interface OkEntry {
  file: string;
  descr: string;
  version: [number, number];
  fortran: boolean;
  shape: number[];
  rows: number;
  cols: number;
  dataOffset: number;
  strides: [number, number];
  values: (number | string)[];
  note?: string;
}

export interface PairEntry {
  c: string;
  f: string;
  rows: number;
  cols: number;
  corners: [number, number, number, number];
}

export const DIR = new URL('../../fixtures/npy/', import.meta.url);
export const manifest = JSON.parse(readFileSync(new URL('manifest.json', DIR), 'utf8')) as { ok: OkEntry[]; pairs: PairEntry[] };
export const load = (file: string): Uint8Array => new Uint8Array(readFileSync(new URL(file, DIR)));
/** A manifest value: a number, or 'NaN', 'Infinity', '-Infinity'. */
export const num = (v: number | string): number => (typeof v === 'number' ? v : Number(v));

/** numpy's row-major values (top row first) placed in grid order: array row r → grid row j. */
export function expectedGrid(e: OkEntry, topDown: boolean): number[] {
  const out = new Array<number>(e.rows * e.cols);
  for (let r = 0; r < e.rows; r++) {
    const j = topDown ? e.rows - 1 - r : r;
    for (let c = 0; c < e.cols; c++) out[j * e.cols + c] = num(e.values[r * e.cols + c]);
  }
  return out;
}
