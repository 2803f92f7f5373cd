/** Strict JSON input files of our own formats: values, positions, repeated keys and shared message wording. */
import { RhoformError, show, type ErrorCode, type Where } from '../errors.js';
import { MAX_JSON_DEPTH, jsonParseMessage, lineCol, scanJson, type JsonSpot } from './scan.js';

/** "an object", "an array of 3", numbers and strings as they are. */
export function describe(v: unknown): string {
  if (v === undefined) return 'nothing';
  if (v === null) return 'null';
  if (Array.isArray(v)) return v.length === 0 ? 'an empty array' : `an array of ${v.length}`;
  if (typeof v === 'object') return 'an object';
  return show(v);
}

export function jsonMessage(e: unknown): string {
  return jsonParseMessage(e);
}

/** Node 20: "at position N"; later: "line L column C". */
export function jsonOffset(text: string, e: unknown): number | { line: number; col: number } | null {
  const m = e instanceof Error ? e.message : '';
  const pos = /at position (\d+)/.exec(m);
  if (pos) return Math.min(Number(pos[1]), text.length);
  const lc = /line (\d+) column (\d+)/.exec(m);
  if (lc) return { line: Number(lc[1]), col: Number(lc[2]) };
  if (/end of (JSON )?input/i.test(m)) return text.length;
  return null;
}

/** The refusal of nesting deeper than MAX_JSON_DEPTH. */
function tooDeep(src: string, file: string, offset: number, code: ErrorCode): RhoformError {
  return new RhoformError(code, `expected at most ${MAX_JSON_DEPTH} levels of nested arrays and objects, found deeper nesting`, {
    file,
    ...lineCol(src, offset),
  });
}

export interface StrictJson {
  /** Without a BOM (positions refer to it). */
  readonly text: string;
  readonly data: unknown;
  readonly spots: ReadonlyMap<string, JsonSpot>;
}

/** Syntax errors throw `jsonCode`, repeated keys `formatCode`, at line and column. */
export function parseStrictJson(text: string, file: string, jsonCode: ErrorCode, formatCode: ErrorCode): StrictJson {
  const src = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text; // a byte-order mark is not JSON; editors add one
  let data: unknown;
  try {
    data = JSON.parse(src);
  } catch (e) {
    let at = jsonOffset(src, e);
    if (at === null) {
      const scan = scanJson(src);
      if (!scan.ok) {
        if (scan.tooDeep) throw tooDeep(src, file, scan.offset, formatCode);
        at = scan.offset;
      }
    }
    const where: Where = at === null ? { file } : typeof at === 'number' ? { file, ...lineCol(src, at) } : { file, ...at };
    throw new RhoformError(jsonCode, `expected JSON, found a syntax error (${jsonMessage(e)})`, where);
  }
  const scan = scanJson(src);
  if (!scan.ok && scan.tooDeep) throw tooDeep(src, file, scan.offset, formatCode);
  const spots = scan.ok ? scan.spots : new Map<string, JsonSpot>();
  if (scan.ok && scan.duplicate !== null) {
    const { path, key } = scan.duplicate;
    throw new RhoformError(formatCode, `${path}: expected each key once, found it repeated`, { file, ...lineCol(src, key) });
  }
  return { text: src, data, spots };
}

/** Where the value (with `key`, the key) at `path` sits, else the nearest enclosing value. */
export function whereOf(json: StrictJson, file: string, path: string, key = false): Where {
  let p = path;
  for (;;) {
    const spot = json.spots.get(p);
    if (spot) return { file, ...lineCol(json.text, key && spot.key !== undefined ? spot.key : spot.value) };
    if (p === '') return { file };
    const cut = Math.max(p.lastIndexOf('.'), p.lastIndexOf('['));
    p = cut < 0 ? '' : p.slice(0, cut);
    key = false;
  }
}
