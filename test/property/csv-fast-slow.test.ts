/**
 * The CSV reader's fast row scanner against its slow path (issue 11, item 1): on every generated text the
 * reader gives the same values as a plain reference built only from the slow pieces — split each line into
 * fields (splitFields), take each whole field as one number (parseNumberToken) — or the same error at the
 * same line:col. The reference is written out here, line by line, so the fast path has an outside to meet.
 * Generated with fast-check (fixed seed, bounded runs).
 */
import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { readCsv } from '../../src/read/csv.js';
import { RhoformError } from '../../src/errors.js';
import { DEFAULT_READ_OPTIONS } from '../../src/read/types.js';
import { columnOf, detectSeparator, splitFields, tokenError } from '../../src/read/csv-scan.js';
import { parseNumberToken } from '../../src/read/csv-number.js';

type Outcome = { values: number[]; nx: number; ny: number } | { code: string; line?: number; col?: number; detail: string };

/** The slow reference: grid layout, top-down, one whole field = one number. */
function reference(raw: string, decimalComma: boolean): Outcome {
  const text = raw.charCodeAt(0) === 0xfeff ? raw.slice(1) : raw;
  const nl = text.indexOf('\n') < 0 && text.indexOf('\r') >= 0 ? '\r' : '\n';
  const pieces: [number, number][] = [];
  for (let s = 0; s < text.length; ) {
    let e = text.indexOf(nl, s);
    const next = e < 0 ? text.length : e + 1;
    if (e < 0) e = text.length;
    if (nl === '\n' && e > s && text[e - 1] === '\r') e--;
    pieces.push([s, e]);
    s = next;
  }
  const content: { line: number; s: number; e: number }[] = [];
  pieces.forEach(([s, e], k) => {
    const t = text.slice(s, e).replace(/^[ \t]+/, '');
    if (t !== '' && t[0] !== '#') content.push({ line: k + 1, s, e });
  });
  if (content.length === 0) return { code: 'E_CSV_EMPTY', detail: '' };
  let first = 0;
  const sep1 = detectSeparator(text, content[0].s, content[0].e, decimalComma);
  const f1 = splitFields(text, content[0].s, content[0].e, sep1);
  if (f1.some((f) => f.token !== '') && f1.every((f) => f.token === '' || parseNumberToken(f.token, decimalComma) === undefined)) first = 1;
  if (first >= content.length) return { code: 'E_CSV_EMPTY', detail: '' };
  const d = content[first];
  const sep = detectSeparator(text, d.s, d.e, decimalComma);
  const ncols = splitFields(text, d.s, d.e, sep).length;
  const rows: number[][] = [];
  for (const c of content.slice(first)) {
    const fields = splitFields(text, c.s, c.e, sep);
    const row: number[] = [];
    for (let k = 0; k < fields.length; k++) {
      const col = columnOf(text, c.s, fields[k].start);
      if (k >= ncols) {
        return { code: 'E_CSV_RAGGED', line: c.line, col, detail: `expected ${ncols} values (as on line ${d.line}), found ${fields.length}` };
      }
      const v = parseNumberToken(fields[k].token, decimalComma);
      if (v === undefined) {
        const e = tokenError(fields[k].token, sep, c.line, col, decimalComma);
        return { code: e.code, line: c.line, col, detail: e.detail };
      }
      row.push(v);
    }
    if (row.length < ncols) {
      return { code: 'E_CSV_RAGGED', line: c.line, col: columnOf(text, c.s, c.e), detail: `expected ${ncols} values (as on line ${d.line}), found ${fields.length}` };
    }
    rows.push(row);
  }
  return { values: rows.reverse().flat(), nx: ncols, ny: rows.length };
}

function actual(text: string, decimalComma: boolean): Outcome {
  try {
    const r = readCsv(text, { ...DEFAULT_READ_OPTIONS, layout: 'grid', decimalComma });
    return { values: Array.from(r.grid.values), nx: r.grid.nx, ny: r.grid.ny };
  } catch (e) {
    if (!(e instanceof RhoformError)) throw e;
    if (e.code === 'E_CSV_EMPTY') return { code: e.code, detail: '' };
    return { code: e.code, line: e.where?.line, col: e.where?.col, detail: e.detail };
  }
}

/** Number texts of every shape the fast path handles or hands over: short, long (17 digits), exponents, words. */
const numberText = fc.oneof(
  fc.double({ noNaN: true, noDefaultInfinity: true }).map((v) => String(v)),
  fc.double({ min: -1e6, max: 1e6, noNaN: true }).map((v) => v.toPrecision(17)),
  fc.double({ min: 0, max: 1, noNaN: true }).map((v) => v.toExponential(18)),
  fc.integer({ min: -999, max: 999 }).map(String),
  fc.constantFrom('nan', '-inf', 'Infinity', '.5', '5.', '+1', '1e5', '1E-3', '1e999999', '0', '-0'),
);
/** Junk built from the characters that matter to a tokenizer. */
const junkText = fc
  .array(fc.constantFrom(...'0123456789.-+eE ,;\t"\'xn#a'.split('')), { minLength: 0, maxLength: 8 })
  .map((cs) => cs.join(''));
const field = fc.oneof({ weight: 6, arbitrary: numberText }, { weight: 2, arbitrary: junkText },
  { weight: 1, arbitrary: fc.tuple(numberText, fc.constantFrom(' ', '  ', '\t'), numberText).map(([a, b, c]) => a + b + c) });
const pad = fc.constantFrom('', '', '', ' ', '  ', '\t');
const csvText = fc
  .record({
    sep: fc.constantFrom(',', ';', '\t', ' ', '  '),
    rows: fc.array(fc.array(fc.tuple(pad, field, pad), { minLength: 1, maxLength: 5 }), { minLength: 1, maxLength: 5 }),
    nl: fc.constantFrom('\n', '\r\n', '\r'),
    extra: fc.array(fc.constantFrom('', '# note', '   '), { maxLength: 2 }),
    header: fc.boolean(),
  })
  .map(({ sep, rows, nl, extra, header }) => {
    const lines = rows.map((r) => r.map(([a, f, b]) => a + f + b).join(sep));
    if (header) lines.unshift(['a', 'b', 'c'].join(sep));
    return [...extra, ...lines].join(nl) + nl;
  });

const same = (a: Outcome, b: Outcome): void => {
  if ('values' in a && 'values' in b) {
    expect([a.nx, a.ny]).toEqual([b.nx, b.ny]);
    // Object.is: NaN equals NaN and the sign of zero counts
    expect(a.values.every((v, k) => Object.is(v, b.values[k]))).toBe(true);
  } else expect(a).toEqual(b);
};

describe('CSV fast path = slow path on generated texts', () => {
  it('grid layout, point decimal: same values or the same error at the same line:col', () => {
    fc.assert(
      fc.property(csvText, (text) => same(actual(text, false), reference(text, false))),
      { seed: 20261205, numRuns: 3000 },
    );
  });

  it('grid layout, decimal comma: the same', () => {
    const commaText = csvText.map((t) => t.replace(/(\d)\.(\d)/g, '$1,$2'));
    fc.assert(
      fc.property(commaText, (text) => same(actual(text, true), reference(text, true))),
      { seed: 11, numRuns: 1500 },
    );
  });

  it('every single token: the fast number equals the slow one (or both refuse it)', () => {
    fc.assert(
      fc.property(fc.oneof(numberText, junkText), (tok) => {
        const text = `${tok}\n`;
        same(actual(text, false), reference(text, false));
      }),
      { seed: 7, numRuns: 3000 },
    );
  });
});
