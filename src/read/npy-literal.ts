/**
 * A small parser for the Python literal subset that NPY headers are written in: dicts, tuples, lists,
 * strings, integers, floats, True, False and None (NEP 1, "A simple file format for NumPy arrays", R. Kern, 2007,
 * numpy.org/neps/nep-0001-npy-format.html; numpy reads the header with `ast.literal_eval`).
 *
 * It never evaluates anything, and it does not match header text against a fixed pattern: numpy pads
 * the header with spaces (and may grow the shape in place), so only the parsed structure counts.
 * Positions (`at`) are indices into the parsed string; the caller turns them into byte offsets.
 */

import { escapeControls, quote } from '../errors.js';

interface At {
  /** Index of the first character of this literal in the parsed text. */
  readonly at: number;
}

export type PyLiteral =
  | (At & { readonly kind: 'str'; readonly value: string })
  | (At & { readonly kind: 'int'; readonly value: number })
  | (At & { readonly kind: 'float'; readonly value: number })
  | (At & { readonly kind: 'bool'; readonly value: boolean })
  | (At & { readonly kind: 'none' })
  | (At & { readonly kind: 'tuple' | 'list'; readonly items: readonly PyLiteral[] })
  | (At & { readonly kind: 'dict'; readonly entries: readonly PyDictEntry[] });

export interface PyDictEntry {
  readonly key: PyLiteral;
  readonly value: PyLiteral;
}

/** A literal that could not be parsed; `at` is the index of the offending character. */
export class PyLiteralError extends Error {
  constructor(
    message: string,
    readonly at: number,
  ) {
    super(message);
    this.name = 'PyLiteralError';
  }
}

const MAX_DEPTH = 32;
const SPACE = new Set([' ', '\t', '\n', '\r', '\f', '\v']);

/**
 * Parses `text` as exactly one Python literal, optionally surrounded by whitespace.
 * Integers may carry a sign and a Python 2 `L` suffix (old headers); they become JS numbers.
 * Strings take '…' or "…" with an optional u/U prefix and the usual backslash escapes.
 * @throws PyLiteralError naming what was expected and what was found, with its index.
 */
export function parsePyLiteral(text: string): PyLiteral {
  const p = new Parser(text);
  p.skipSpace();
  const value = p.value(0);
  p.skipSpace();
  if (p.pos < text.length) p.fail('the end of the literal');
  return value;
}

/** Python-like rendering of a literal, for messages: `[('x', '<f4')]`, `(3, 5)`. */
export function showPyLiteral(lit: PyLiteral): string {
  switch (lit.kind) {
    case 'str':
      return `'${escapeControls(lit.value.replace(/\\/g, '\\\\').replace(/'/g, "\\'"))}'`;
    case 'int':
      return String(lit.value);
    case 'float':
      return Number.isInteger(lit.value) ? lit.value.toFixed(1) : String(lit.value);
    case 'bool':
      return lit.value ? 'True' : 'False';
    case 'none':
      return 'None';
    case 'list':
      return `[${lit.items.map(showPyLiteral).join(', ')}]`;
    case 'tuple':
      return lit.items.length === 1
        ? `(${showPyLiteral(lit.items[0])},)`
        : `(${lit.items.map(showPyLiteral).join(', ')})`;
    case 'dict':
      return `{${lit.entries.map((e) => `${showPyLiteral(e.key)}: ${showPyLiteral(e.value)}`).join(', ')}}`;
  }
}

class Parser {
  pos = 0;
  constructor(readonly text: string) {}

  skipSpace(): void {
    while (this.pos < this.text.length && SPACE.has(this.text[this.pos])) this.pos++;
  }

  /** Throws "expected <what>, found <the text here>". */
  fail(what: string, at = this.pos): never {
    const rest = this.text.slice(at, at + 12);
    const found = rest.length === 0 ? 'the end of the header' : quote(rest, 12) + (at + 12 < this.text.length && rest.length === 12 ? '…' : '');
    throw new PyLiteralError(`expected ${what}, found ${found}`, at);
  }

  value(depth: number): PyLiteral {
    if (depth > MAX_DEPTH) this.fail(`at most ${MAX_DEPTH} levels of nesting`);
    const at = this.pos;
    const ch = this.text[at];
    if (ch === '{') return this.dict(depth);
    if (ch === '(' || ch === '[') return this.sequence(depth);
    if (ch === "'" || ch === '"') return this.string();
    if ((ch === 'u' || ch === 'U') && (this.text[at + 1] === "'" || this.text[at + 1] === '"')) {
      this.pos++;
      const s = this.string();
      return { ...s, at };
    }
    if (ch === '-' || ch === '+' || ch === '.' || (ch >= '0' && ch <= '9')) return this.number();
    for (const [word, lit] of WORDS) {
      if (this.text.startsWith(word, at) && !isNameChar(this.text[at + word.length])) {
        this.pos += word.length;
        return { ...lit, at } as PyLiteral;
      }
    }
    return this.fail('a Python literal (dict, tuple, list, string, number, True, False or None)');
  }

  private dict(depth: number): PyLiteral {
    const at = this.pos++;
    const entries: PyDictEntry[] = [];
    for (;;) {
      this.skipSpace();
      if (this.text[this.pos] === '}') break;
      const key = this.value(depth + 1);
      this.skipSpace();
      if (this.text[this.pos] !== ':') this.fail("':' after a dict key");
      this.pos++;
      this.skipSpace();
      const value = this.value(depth + 1);
      entries.push({ key, value });
      this.skipSpace();
      if (this.text[this.pos] === ',') this.pos++;
      else if (this.text[this.pos] !== '}') this.fail("',' or '}' in a dict");
    }
    this.pos++;
    return { kind: 'dict', entries, at };
  }

  private sequence(depth: number): PyLiteral {
    const at = this.pos;
    const close = this.text[this.pos++] === '(' ? ')' : ']';
    const items: PyLiteral[] = [];
    let trailingComma = false;
    for (;;) {
      this.skipSpace();
      if (this.text[this.pos] === close) break;
      items.push(this.value(depth + 1));
      this.skipSpace();
      trailingComma = this.text[this.pos] === ',';
      if (trailingComma) this.pos++;
      else if (this.text[this.pos] !== close) this.fail(`',' or '${close}'`);
    }
    this.pos++;
    // In Python `(x)` is just x, while `(x,)` is a 1-tuple.
    if (close === ')' && items.length === 1 && !trailingComma) return items[0];
    return { kind: close === ')' ? 'tuple' : 'list', items, at };
  }

  private string(): PyLiteral {
    const at = this.pos;
    const quote = this.text[this.pos++];
    let out = '';
    for (;;) {
      if (this.pos >= this.text.length) this.fail(`a closing ${quote}`);
      const ch = this.text[this.pos++];
      if (ch === quote) break;
      if (ch === '\n') this.fail(`a closing ${quote} before the end of the line`, this.pos - 1);
      if (ch !== '\\') {
        out += ch;
        continue;
      }
      const esc = this.text[this.pos++];
      const simple = ESCAPES[esc];
      if (simple !== undefined) out += simple;
      else if (esc === 'x' || esc === 'u' || esc === 'U') {
        const n = esc === 'x' ? 2 : esc === 'u' ? 4 : 8;
        const hex = this.text.slice(this.pos, this.pos + n);
        if (!/^[0-9a-fA-F]+$/.test(hex) || hex.length !== n) this.fail(`${n} hex digits after \\${esc}`);
        const code = parseInt(hex, 16);
        // Python refuses \U escapes past the last code point too ("illegal Unicode character").
        if (code > 0x10ffff) this.fail('a code point of at most \\U0010ffff', this.pos - 2);
        out += String.fromCodePoint(code);
        this.pos += n;
      } else if (esc === '\n') {
        // a backslash-newline continues the string
      } else out += '\\' + (esc ?? '');
    }
    return { kind: 'str', value: out, at };
  }

  private number(): PyLiteral {
    const at = this.pos;
    let sign = 1;
    if (this.text[this.pos] === '-' || this.text[this.pos] === '+') {
      if (this.text[this.pos] === '-') sign = -1;
      this.pos++;
      this.skipSpace();
    }
    const start = this.pos;
    const m = /^(?:[0-9]+(\.[0-9]*)?|\.[0-9]+)([eE][+-]?[0-9]+)?/.exec(this.text.slice(start, start + 400));
    if (!m) this.fail('a number');
    this.pos += m[0].length;
    const isFloat = m[0].includes('.') || m[2] !== undefined;
    if (!isFloat && (this.text[this.pos] === 'L' || this.text[this.pos] === 'l')) this.pos++; // Python 2 long
    if (isNameChar(this.text[this.pos]) || this.text[this.pos] === '.') this.fail('a number', at);
    if (!isFloat && m[0].length > 1 && m[0][0] === '0' && /[1-9]/.test(m[0])) this.fail('an integer without leading zeros', start);
    return { kind: isFloat ? 'float' : 'int', value: sign * Number(m[0]), at };
  }
}

const ESCAPES: Record<string, string> = {
  '\\': '\\', "'": "'", '"': '"', n: '\n', t: '\t', r: '\r', '0': '\0', a: '\x07', b: '\b', f: '\f', v: '\v',
};

const WORDS: readonly [string, { kind: 'bool'; value: boolean } | { kind: 'none' }][] = [
  ['True', { kind: 'bool', value: true }],
  ['False', { kind: 'bool', value: false }],
  ['None', { kind: 'none' }],
];

function isNameChar(ch: string | undefined): boolean {
  return ch !== undefined && /[A-Za-z0-9_]/.test(ch);
}
