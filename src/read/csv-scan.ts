/**
 * Tokenizer of the CSV reader: lines, separator detection, fields, and the hot row scanner.
 *
 * Lines end at LF or CRLF (a file with CR only, as old Mac spreadsheets wrote, uses CR). Lines that are
 * empty or hold only spaces/tabs are blank, and lines whose first non-blank character is '#' are comments;
 * both are skipped wherever they are, but still counted, so reported line numbers are those of the file.
 * Positions: `line` is 1-based; `col` is the 1-based character (Unicode code point) column of the first
 * non-blank character of the field, after the BOM has been removed.
 */
import { RhoformError, show } from '../errors.js';
import { fastNumber, parseNumberToken } from './csv-number.js';

/** Separator code for runs of spaces/tabs (the space's code). Others are their char code (',' 44, ';' 59, tab 9). */
export const SEP_WS = 32;

/** What `nextLine` found. */
export const LINE_EOF = 0;
export const LINE_BLANK = 1;
export const LINE_COMMENT = 2;
export const LINE_CONTENT = 3;

/** One field of a line, cut by the slow splitter. */
export interface Field {
  /** Offset of the first non-blank character of the field (where its column points). */
  readonly start: number;
  /** The field's text without surrounding spaces/tabs and without one pair of surrounding quotes. */
  readonly token: string;
}

/** The name of a separator for messages. */
export function sepName(sep: number): string {
  if (sep === SEP_WS) return 'whitespace';
  if (sep === 9) return 'tab';
  return `'${String.fromCharCode(sep)}'`;
}

/** Picks the separator of a data line: ',' (unless ',' is the decimal mark), else ';', else tab, else whitespace. */
export function detectSeparator(text: string, start: number, end: number, decimalComma: boolean): number {
  let semi = false;
  let tab = false;
  for (let p = start; p < end; p++) {
    const c = text.charCodeAt(p);
    if (c === 44 && !decimalComma) return 44;
    if (c === 59) semi = true;
    else if (c === 9) tab = true;
  }
  return semi ? 59 : tab ? 9 : SEP_WS;
}

/** 1-based code-point column of `offset` within the line that starts at `lineStart`. */
export function columnOf(text: string, lineStart: number, offset: number): number {
  let col = 1;
  for (let p = lineStart; p < offset; p++) {
    const c = text.charCodeAt(p);
    if (c < 0xdc00 || c > 0xdfff) col++; // a low surrogate continues the previous code point
  }
  return col;
}

function isBlank(c: number): boolean {
  return c === 32 || c === 9;
}

/** Strips surrounding spaces/tabs and then one pair of matching quotes (and spaces inside them). */
function cleanToken(text: string, a: number, b: number): string {
  while (a < b && isBlank(text.charCodeAt(a))) a++;
  while (b > a && isBlank(text.charCodeAt(b - 1))) b--;
  if (b - a >= 2) {
    const q = text.charCodeAt(a);
    if ((q === 34 || q === 39) && text.charCodeAt(b - 1) === q) {
      a++;
      b--;
      while (a < b && isBlank(text.charCodeAt(a))) a++;
      while (b > a && isBlank(text.charCodeAt(b - 1))) b--;
    }
  }
  return text.slice(a, b);
}

/**
 * Splits the line [start, end) into fields (the slow, allocating path: headers, first lines, error messages
 * and lazy column look-ups). A quoted field runs to its closing quote even if a separator is inside.
 * Throws E_GRID_SIZE as soon as more than `limit` fields are found.
 */
export function splitFields(
  text: string,
  start: number,
  end: number,
  sep: number,
  limit = Infinity,
  where?: { line: number; what: string },
): Field[] {
  const out: Field[] = [];
  let p = start;
  const skipSet = (c: number): boolean => c === 32 || (c === 9 && sep !== 9);
  for (;;) {
    while (p < end && skipSet(text.charCodeAt(p))) p++;
    if (sep === SEP_WS && p >= end) break;
    const fieldStart = p;
    let q = p;
    const c0 = q < end ? text.charCodeAt(q) : -1;
    if (c0 === 34 || c0 === 39) {
      const close = text.indexOf(String.fromCharCode(c0), q + 1);
      q = close >= 0 && close < end ? close + 1 : end;
    }
    if (sep === SEP_WS) {
      while (q < end && !isBlank(text.charCodeAt(q))) q++;
    } else {
      while (q < end && text.charCodeAt(q) !== sep) q++;
    }
    out.push({ start: fieldStart, token: cleanToken(text, fieldStart, q) });
    if (out.length > limit && where) {
      throw new RhoformError(
        'E_GRID_SIZE',
        `expected at most ${limit} ${where.what} (maxCells), found more on this line`,
        { line: where.line, col: columnOf(text, start, fieldStart) },
      );
    }
    if (sep === SEP_WS) {
      p = q;
      continue;
    }
    if (q >= end) break;
    p = q + 1; // past the separator; a separator at the end of the line leaves one empty field
  }
  return out;
}

/** The error for a token that is not a number, with a hint when it holds another separator. */
export function tokenError(token: string, sep: number, line: number, col: number, decimalComma: boolean): RhoformError {
  let detail = token === '' ? 'expected a number, found an empty field' : `expected a number, found ${show(token)}`;
  const others = [',', ';', '\t'].filter((s) => s.charCodeAt(0) !== sep && token.includes(s));
  if (others.length > 0) {
    detail += ` (the separator is ${sepName(sep)}, as detected on the first data line`;
    const commaMark = !decimalComma && (sep === 44 || token.includes(','));
    detail += commaMark ? "; if ',' is the decimal mark, use the decimal-comma option)" : ')';
  }
  return new RhoformError('E_CSV_TOKEN', detail, { line, col });
}

/** Line cursor over the whole text. `lineStart`/`lineEnd` exclude the line break; `line` is 1-based. */
export class LineCursor {
  readonly text: string;
  /** The line-break character: LF (also for CRLF) or CR for CR-only files. */
  readonly nl: number;
  /** Number of lines, not counting the empty piece after a final line break. */
  readonly lineCount: number;
  pos = 0;
  line = 0;
  lineStart = 0;
  lineEnd = 0;

  constructor(text: string) {
    this.text = text;
    this.nl = text.indexOf('\n') < 0 && text.indexOf('\r') >= 0 ? 13 : 10;
    const nlChar = String.fromCharCode(this.nl);
    let count = 0;
    for (let p = text.indexOf(nlChar); p >= 0; p = text.indexOf(nlChar, p + 1)) count++;
    if (text.length > 0 && text.charCodeAt(text.length - 1) !== this.nl) count++;
    this.lineCount = count;
  }

  /** Advances to the next line and says what it is. */
  nextLine(): number {
    const text = this.text;
    const n = text.length;
    if (this.pos >= n) return LINE_EOF;
    let eol = text.indexOf(this.nl === 10 ? '\n' : '\r', this.pos);
    if (eol < 0) eol = n;
    let end = eol;
    if (this.nl === 10 && end > this.pos && text.charCodeAt(end - 1) === 13) end--;
    this.lineStart = this.pos;
    this.lineEnd = end;
    this.pos = eol + 1;
    this.line++;
    let p = this.lineStart;
    while (p < end && isBlank(text.charCodeAt(p))) p++;
    if (p === end) return LINE_BLANK;
    return text.charCodeAt(p) === 35 ? LINE_COMMENT : LINE_CONTENT;
  }
}

/** Reads the numbers of one data line into `out[offset …]`; every call site shares one instance. */
export class RowScanner {
  private readonly text: string;
  private readonly sep: number;
  private readonly mark: number;
  private readonly decimalComma: boolean;
  private readonly state = { end: 0 };
  /** Count and line of the first data line, for ragged-row messages. */
  readonly ncols: number;
  readonly firstLine: number;

  constructor(text: string, sep: number, decimalComma: boolean, ncols: number, firstLine: number) {
    this.text = text;
    this.sep = sep;
    this.decimalComma = decimalComma;
    this.mark = decimalComma ? 44 : 46;
    this.ncols = ncols;
    this.firstLine = firstLine;
  }

  /** Scans the line [start, end) (known to hold a non-blank character) into `ncols` values. */
  scan(start: number, end: number, line: number, out: Float64Array, offset: number): void {
    const text = this.text;
    const sep = this.sep;
    const ncols = this.ncols;
    const st = this.state;
    let p = start;
    let c = text.charCodeAt(p);
    while (c === 32 || (c === 9 && sep !== 9)) c = ++p < end ? text.charCodeAt(p) : -1;
    let k = 0;
    for (;;) {
      if (k === ncols) throw this.ragged(start, end, line, p);
      let v = fastNumber(text, p, end, this.mark, st);
      let q = st.end;
      // The fast number must be the whole field: after it only blanks, then the end of the line or (with a
      // character separator) the separator. Anything else ("0.5 -1", "0.5 1.25", "1x") makes the field one
      // token for the slow path, which refuses it whole at its column.
      let ok = v === v;
      if (ok) {
        c = q < end ? text.charCodeAt(q) : -1;
        if (sep === SEP_WS) ok = c === -1 || c === 32 || c === 9;
        else {
          while (c === 32 || (c === 9 && sep !== 9)) c = ++q < end ? text.charCodeAt(q) : -1;
          ok = c === -1 || c === sep;
        }
      }
      if (!ok) {
        q = this.fieldEnd(p, end);
        const token = cleanToken(text, p, q);
        const parsed = parseNumberToken(token, this.decimalComma);
        if (parsed === undefined) {
          throw tokenError(token, sep, line, columnOf(text, start, p), this.decimalComma);
        }
        v = parsed;
      }
      out[offset + k++] = v;
      // q is at the end of the field: skip blanks, then a separator, then blanks.
      c = q < end ? text.charCodeAt(q) : -1;
      if (sep === SEP_WS) {
        while (c === 32 || c === 9) c = ++q < end ? text.charCodeAt(q) : -1;
        if (c === -1) break;
      } else {
        while (c === 32 || (c === 9 && sep !== 9)) c = ++q < end ? text.charCodeAt(q) : -1;
        if (c === -1) break;
        // c is the separator: the fast path accepted only that, and fieldEnd stops only at one.
        c = ++q < end ? text.charCodeAt(q) : -1;
        while (c === 32 || (c === 9 && sep !== 9)) c = ++q < end ? text.charCodeAt(q) : -1;
      }
      p = q;
    }
    if (k !== ncols) throw this.ragged(start, end, line, end);
  }

  /** End of the raw field starting at p (quotes may hide a separator). */
  private fieldEnd(p: number, end: number): number {
    const text = this.text;
    let q = p;
    const c0 = q < end ? text.charCodeAt(q) : -1;
    if (c0 === 34 || c0 === 39) {
      const close = text.indexOf(String.fromCharCode(c0), q + 1);
      q = close >= 0 && close < end ? close + 1 : end;
    }
    if (this.sep === SEP_WS) {
      while (q < end && !isBlank(text.charCodeAt(q))) q++;
    } else {
      while (q < end && text.charCodeAt(q) !== this.sep) q++;
    }
    return q;
  }

  private ragged(start: number, end: number, line: number, at: number): RhoformError {
    const found = splitFields(this.text, start, end, this.sep).length;
    return new RhoformError(
      'E_CSV_RAGGED',
      `expected ${this.ncols} values (as on line ${this.firstLine}), found ${found}`,
      { line, col: columnOf(this.text, start, at) },
    );
  }
}

