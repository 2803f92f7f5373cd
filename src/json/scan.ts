/**
 * A strict JSON scanner (RFC 8259) recording where each value sits by key path (`regions[2].circle.radius`),
 * the first syntax error's offset and repeated keys. Values come from JSON.parse.
 */

/** Offsets of a value's first character and of its key. */
export interface JsonSpot {
  readonly value: number;
  readonly key?: number;
}

/** A failed scan: `offset` of the first syntax error, or (`tooDeep`) of the first too-deep array or object. */
export type JsonScan =
  | { readonly ok: true; readonly spots: ReadonlyMap<string, JsonSpot>; readonly duplicate: { path: string; key: number } | null }
  | { readonly ok: false; readonly offset: number; readonly tooDeep: boolean };

/** Deepest nesting followed (the passive format needs 5): keeps the recursion and key paths small. */
export const MAX_JSON_DEPTH = 64;

class ScanError {
  constructor(
    readonly offset: number,
    readonly tooDeep = false,
  ) {}
}

/** A JSON.parse error message without the input echo Node 20 appends. */
export function jsonParseMessage(e: unknown): string {
  const m = e instanceof Error ? e.message : String(e);
  const cleaned = m
    .replace(/(,\s*)?(\.\.\.)?"[\s\S]*"(\.\.\.)? is not valid JSON$/, '')
    .replace(/\s*in JSON at position \d+(\s*\(line \d+ column \d+\))?/, '')
    .replace(/\s*\(line \d+ column \d+\)/, '')
    .trim();
  return cleaned === '' ? 'not valid JSON' : cleaned;
}

export function memberPath(parent: string, key: string): string {
  return parent === '' ? key : `${parent}.${key}`;
}

export function elementPath(parent: string, k: number): string {
  return `${parent}[${k}]`;
}

/** `text` without a BOM. O(length). */
export function scanJson(text: string): JsonScan {
  const s = text;
  const n = s.length;
  const spots = new Map<string, JsonSpot>();
  let duplicate: { path: string; key: number } | null = null;
  let i = 0;

  const fail = (at: number): never => {
    throw new ScanError(at);
  };
  const ws = (): void => {
    while (i < n) {
      const c = s.charCodeAt(i);
      if (c === 0x20 || c === 0x09 || c === 0x0a || c === 0x0d) i++;
      else break;
    }
  };
  const isDigit = (c: number): boolean => c >= 0x30 && c <= 0x39;
  const isHex = (c: number): boolean => isDigit(c) || (c >= 0x41 && c <= 0x46) || (c >= 0x61 && c <= 0x66);

  /** Skips the string at s[i] === '"'; returns the offset past its closing quote. */
  const string = (): number => {
    i++;
    for (;;) {
      if (i >= n) fail(n);
      const c = s.charCodeAt(i);
      if (c === 0x22) return ++i;
      if (c < 0x20) fail(i);
      if (c === 0x5c) {
        const e = s[i + 1];
        if (e === undefined) fail(n);
        if ('"\\/bfnrt'.includes(e)) i += 2;
        else if (e === 'u') {
          for (let k = 2; k < 6; k++) if (!isHex(s.charCodeAt(i + k))) fail(Math.min(i + k, n));
          i += 6;
        } else fail(i + 1);
      } else i++;
    }
  };
  const digits = (): void => {
    if (!isDigit(s.charCodeAt(i))) fail(i);
    while (isDigit(s.charCodeAt(i))) i++;
  };
  const number = (): void => {
    if (s[i] === '-') i++;
    if (s[i] === '0') i++;
    else digits();
    if (s[i] === '.') {
      i++;
      digits();
    }
    if (s[i] === 'e' || s[i] === 'E') {
      i++;
      if (s[i] === '+' || s[i] === '-') i++;
      digits();
    }
  };
  const value = (path: string, depth: number, key?: number): void => {
    if (i >= n) fail(n);
    if (spots.has(path)) {
      if (duplicate === null) duplicate = { path, key: key ?? i };
    } else spots.set(path, key === undefined ? { value: i } : { value: i, key });
    const c = s[i];
    if ((c === '{' || c === '[') && depth >= MAX_JSON_DEPTH) throw new ScanError(i, true);
    if (c === '{') {
      i++;
      ws();
      if (s[i] === '}') {
        i++;
        return;
      }
      for (;;) {
        if (s[i] !== '"') fail(i);
        const k0 = i;
        const end = string();
        const name = JSON.parse(s.slice(k0, end)) as string;
        ws();
        if (s[i] !== ':') fail(i);
        i++;
        ws();
        value(memberPath(path, name), depth + 1, k0);
        ws();
        if (s[i] === ',') {
          i++;
          ws();
          continue;
        }
        if (s[i] === '}') {
          i++;
          return;
        }
        fail(i);
      }
    }
    if (c === '[') {
      i++;
      ws();
      if (s[i] === ']') {
        i++;
        return;
      }
      for (let k = 0; ; k++) {
        value(elementPath(path, k), depth + 1);
        ws();
        if (s[i] === ',') {
          i++;
          ws();
          continue;
        }
        if (s[i] === ']') {
          i++;
          return;
        }
        fail(i);
      }
    }
    if (c === '"') {
      string();
      return;
    }
    if (c === '-' || isDigit(s.charCodeAt(i))) {
      number();
      return;
    }
    for (const lit of ['true', 'false', 'null']) {
      if (s.startsWith(lit, i)) {
        i += lit.length;
        return;
      }
    }
    fail(i);
  };

  try {
    ws();
    value('', 0);
    ws();
    if (i < n) fail(i);
  } catch (e) {
    if (e instanceof ScanError) return { ok: false, offset: e.offset, tooDeep: e.tooDeep };
    throw e;
  }
  return { ok: true, spots, duplicate };
}

/** 1-based line and column; CRLF, LF and lone CR end a line; columns in UTF-16 units. */
export function lineCol(text: string, offset: number): { line: number; col: number } {
  let line = 1;
  let start = 0;
  const end = Math.min(Math.max(offset, 0), text.length);
  for (let k = 0; k < end; k++) {
    const c = text.charCodeAt(k);
    if (c === 0x0a || (c === 0x0d && text.charCodeAt(k + 1) !== 0x0a)) {
      line++;
      start = k + 1;
    }
  }
  return { line, col: end - start + 1 };
}
