/**
 * Scanning the text parts of binary-capable files (legacy VTK headers, VTK XML): lines and whitespace-separated
 * numbers over bytes, with positions turned into line:column only when a message needs one.
 */
import { RhoformError, type ErrorCode, type Where } from '../errors.js';

/** 1-based line and column of byte `offset` (counting '\n'). */
export function lineCol(bytes: Uint8Array, offset: number): { line: number; col: number } {
  let line = 1;
  let start = 0;
  const end = Math.min(offset, bytes.length);
  for (let k = 0; k < end; k++) {
    if (bytes[k] === 0x0a) {
      line++;
      start = k + 1;
    }
  }
  return { line, col: offset - start + 1 };
}

/**
 * Maps byte offsets to line:column. Line starts are found with a native search and only as far as the largest
 * offset asked for, so a header position in a file of megabytes of binary data costs only the header.
 */
export function lineIndex(bytes: Uint8Array): (offset: number) => Where {
  const starts: number[] = [0];
  let scanned = 0; // every '\n' before this offset is in `starts`
  return (offset) => {
    while (scanned < offset) {
      const nl = bytes.indexOf(0x0a, scanned);
      if (nl < 0 || nl >= offset) {
        scanned = offset;
        break;
      }
      starts.push(nl + 1);
      scanned = nl + 1;
    }
    let lo = 0;
    let hi = starts.length - 1;
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if (starts[mid] <= offset) lo = mid;
      else hi = mid - 1;
    }
    return { line: lo + 1, col: offset - starts[lo] + 1 };
  };
}

const isSpace = (c: number): boolean => c === 0x20 || c === 0x0a || c === 0x0d || c === 0x09 || c === 0x0c || c === 0x0b;

/**
 * Reads `count` whitespace-separated decimal numbers from `text` (one char per byte, latin1) starting at `pos`.
 * Tokens are parsed as JavaScript numbers ("nan", "inf" and "-inf", as C printf writes them, are accepted too).
 * `offsets` receives each token's start when given.
 * @throws RhoformError(`code`) at the first token that is not a number, or when the text ends first.
 */
export function scanNumbers(
  text: string,
  pos: number,
  count: number,
  code: { token: ErrorCode; truncated: ErrorCode },
  where: (offset: number) => Where,
  offsets?: Uint32Array,
): { values: Float64Array; end: number } {
  const values = new Float64Array(count);
  const n = text.length;
  let k = pos;
  for (let t = 0; t < count; t++) {
    while (k < n && isSpace(text.charCodeAt(k))) k++;
    if (k >= n) throw new RhoformError(code.truncated, `expected ${count} values, found ${t} before the end of the file`, where(n));
    const a = k;
    while (k < n && !isSpace(text.charCodeAt(k))) k++;
    const tok = text.slice(a, k);
    let v = Number(tok);
    if (Number.isNaN(v)) v = special(tok);
    if (Number.isNaN(v) && !/^[-+]?nan$/i.test(tok)) {
      throw new RhoformError(code.token, `expected a number (value ${t + 1} of ${count}), found ${JSON.stringify(tok.slice(0, 40))}`, where(a));
    }
    values[t] = v;
    if (offsets) offsets[t] = a;
  }
  return { values, end: k };
}

/** Skips `count` whitespace-separated tokens; returns the position after the last one. */
export function skipTokens(text: string, pos: number, count: number, code: ErrorCode, where: (offset: number) => Where): number {
  const n = text.length;
  let k = pos;
  for (let t = 0; t < count; t++) {
    while (k < n && isSpace(text.charCodeAt(k))) k++;
    if (k >= n) throw new RhoformError(code, `expected ${count} values, found ${t} before the end of the file`, where(n));
    while (k < n && !isSpace(text.charCodeAt(k))) k++;
  }
  return k;
}

function special(tok: string): number {
  const t = tok.toLowerCase();
  if (t === 'inf' || t === '+inf' || t === 'infinity' || t === '+infinity') return Infinity;
  if (t === '-inf' || t === '-infinity') return -Infinity;
  return NaN;
}
