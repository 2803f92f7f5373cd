/**
 * The NPY header literal parser against Python's own `ast.literal_eval` (the function numpy reads headers
 * with): fixtures/make/make_npy_fixtures.py stores each text with what Python made of it, or that Python
 * refused it.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parsePyLiteral, PyLiteralError, showPyLiteral, type PyLiteral } from '../../src/read/npy-literal.js';

interface LiteralCase {
  text: string;
  ok: boolean;
  value?: unknown;
}

const manifest = JSON.parse(readFileSync(new URL('../../fixtures/npy/manifest.json', import.meta.url), 'utf8')) as {
  literals: LiteralCase[];
};

/** Our literal in the script's tagged JSON form: tuples, lists and dicts kept apart. */
function tagged(lit: PyLiteral): unknown {
  switch (lit.kind) {
    case 'tuple':
      return { tuple: lit.items.map(tagged) };
    case 'list':
      return { list: lit.items.map(tagged) };
    case 'dict':
      return { dict: lit.entries.map((e) => [tagged(e.key), tagged(e.value)]) };
    case 'none':
      return null;
    default:
      return lit.value;
  }
}

describe('parsePyLiteral agrees with Python ast.literal_eval', () => {
  for (const c of manifest.literals) {
    it(`${JSON.stringify(c.text)} → ${c.ok ? 'accepted' : 'refused'}`, () => {
      if (c.ok) expect(tagged(parsePyLiteral(c.text))).toEqual(c.value);
      else expect(() => parsePyLiteral(c.text)).toThrow(PyLiteralError);
    });
  }
});

describe('parsePyLiteral positions and rendering', () => {
  it('points at the offending character', () => {
    const text = "{'descr': '<f8', 'fortran_order': Flase, 'shape': (3, 5), }";
    try {
      parsePyLiteral(text);
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(PyLiteralError);
      expect((e as PyLiteralError).at).toBe(text.indexOf('Flase'));
    }
  });

  it('accepts the Python 2 long suffix numpy still reads in old headers', () => {
    // numpy/lib/_format_impl.py `_filter_header` strips the L of Python 2 longs (docs/references.md §6 source)
    expect(tagged(parsePyLiteral('(3L, 5L)'))).toEqual({ tuple: [3, 5] });
  });

  it('renders literals the way Python repr does for headers', () => {
    // Python: repr((3,)) == '(3,)', repr([('x', '<f4')]) == "[('x', '<f4')]"
    expect(showPyLiteral(parsePyLiteral('(3,)'))).toBe('(3,)');
    expect(showPyLiteral(parsePyLiteral('()'))).toBe('()');
    expect(showPyLiteral(parsePyLiteral("[('x', '<f4')]"))).toBe("[('x', '<f4')]");
    expect(showPyLiteral(parsePyLiteral("{'a': True, 'b': None}"))).toBe("{'a': True, 'b': None}");
  });

  it('refuses nesting deeper than 32 levels instead of overflowing the stack', () => {
    expect(() => parsePyLiteral('('.repeat(10000) + ')'.repeat(10000))).toThrow(PyLiteralError);
  });
});
