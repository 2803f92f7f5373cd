import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { RhoformError } from '../../src/errors.js';
import { parsePassive } from '../../src/passive/parse.js';
import { rhoformErrorOf } from '../support/errors.js';

const fixture = (name: string): string => readFileSync(new URL(`../../fixtures/passive/${name}`, import.meta.url), 'utf8');

/**
 * 1-based line and column of the `nth` occurrence of `needle` in `text`, found by splitting the text into lines
 * (an independent reading of the file, not the parser's own position scanner).
 */
function positionOf(text: string, needle: string, nth = 1): { line: number; col: number } {
  const lines = text.split('\n');
  let seen = 0;
  for (let l = 0; l < lines.length; l++) {
    let from = 0;
    for (;;) {
      const c = lines[l].indexOf(needle, from);
      if (c < 0) break;
      if (++seen === nth) return { line: l + 1, col: c + 1 };
      from = c + 1;
    }
  }
  throw new Error(`${needle} not in text`);
}

function errorOf(text: string, file = 'p.json'): RhoformError {
  return rhoformErrorOf(() => parsePassive(text, file), 'expected parsePassive to throw');
}

describe('parsePassive: the demo bracket scenario', () => {
  it('reads every region of fixtures/passive/demo-bracket.passive.json with its role, shape, name and key path', () => {
    const { regions } = parsePassive(fixture('demo-bracket.passive.json'), 'demo-bracket.passive.json');
    // fixtures/grids/demo-bracket.md, "The part": bosses r 12 and pad 194…224 × 18…42 solid; holes r 5.5 and r 8 void
    expect(regions.map((r) => r.role)).toEqual(['solid', 'solid', 'solid', 'void', 'void', 'void']);
    expect(regions[0].shape).toEqual({ kind: 'circle', cx: 194, cy: 30, r: 12 });
    expect(regions[2].shape).toEqual({ kind: 'rect', x0: 194, y0: 18, x1: 224, y1: 42 });
    expect(regions[5].shape).toEqual({ kind: 'circle', cx: 90, cy: 62, r: 8 });
    expect(regions[5].name).toBe('cable pass-through');
    expect(regions[4].path).toBe('regions[4]');
  });

  it('accepts the example of docs/passive.md, an empty region list, a polygon closed by repeating its first point, and a byte-order mark', () => {
    const doc = readFileSync(new URL('../../docs/passive.md', import.meta.url), 'utf8');
    const example = /```json\n([\s\S]*?)```/.exec(doc);
    expect(example).not.toBeNull();
    expect(parsePassive(example![1], 'docs').regions.length).toBeGreaterThan(0);
    expect(parsePassive('{"rhoformPassive": 1, "regions": []}', 'e.json').regions).toEqual([]);
    const closed = parsePassive('\ufeff{"rhoformPassive":1,"regions":[{"role":"solid","polygon":[[0,0],[4,0],[4,3],[0,0]]}]}', 'c.json');
    // the closing repeat is dropped: a triangle is left (3 distinct points)
    expect(closed.regions[0].shape).toEqual({ kind: 'polygon', points: [[0, 0], [4, 0], [4, 3]] });
    expect(closed.regions[0].name).toBeNull();
  });
});

describe('parsePassive: bad files name the key path and the position', () => {
  it('a syntax error (trailing comma) is E_PASSIVE_JSON at the line and column of the character after it', () => {
    const text = fixture('bad/syntax-trailing-comma.json');
    const e = errorOf(text, 'bad.json');
    expect(e.code).toBe('E_PASSIVE_JSON');
    // by inspection of the file: line 4 ends "5.5 }, }" — the parser stops at the "}" that follows the comma
    const at = positionOf(text, '}, }');
    expect(e.where).toMatchObject({ file: 'bad.json', line: 4, col: at.col + 3 });
    expect(at.line).toBe(4);
    expect(e.message.startsWith(`bad.json:4:${at.col + 3}: expected JSON`)).toBe(true);
  });

  it('a syntax error whose JSON.parse message has no position (Node 20: "Unexpected token") is still located', () => {
    const text = '{\n  "rhoformPassive": 1,\n  "regions": [ 1, 2,, 3 ]\n}';
    const e = errorOf(text);
    expect(e.code).toBe('E_PASSIVE_JSON');
    // by inspection: the first comma of ",," ends the element "2,", so the offending character is the second one
    const at = positionOf(text, ',,');
    expect(e.where).toMatchObject({ line: at.line, col: at.col + 1 });
    expect(at.line).toBe(3);
  });

  it('Windows line ends (CRLF) give the same line and column as LF', () => {
    const lf = fixture('bad/radius-negative.json');
    const e = errorOf(lf.replace(/\n/g, '\r\n'));
    expect(e.where).toMatchObject(positionOf(lf, '-3')); // the LF reading of the same file, by line splitting
  });

  it('end of input: the position is the end of the text', () => {
    const e = errorOf('{"rhoformPassive": 1,\n"regions": [');
    expect(e.code).toBe('E_PASSIVE_JSON');
    expect(e.where).toMatchObject({ line: 2, col: 13 }); // by inspection: line 2 is 12 characters long
  });

  it('radius −3: regions[2].circle.radius, at the value', () => {
    const text = fixture('bad/radius-negative.json');
    const e = errorOf(text, 'r.json');
    expect(e.code).toBe('E_PASSIVE_FORMAT');
    expect(e.detail).toBe('regions[2].circle.radius: expected a radius > 0 mm, found -3');
    expect(e.where).toMatchObject({ file: 'r.json', ...positionOf(text, '-3') });
  });

  it('an unknown key: its key path, at the key', () => {
    const text = fixture('bad/unknown-key.json');
    const e = errorOf(text);
    expect(e.code).toBe('E_PASSIVE_FORMAT');
    expect(e.detail).toMatch(/^regions\[0\]\.colour: expected one of the keys role, circle, rect, polygon, name, found the unknown key "colour"$/);
    expect(e.where).toMatchObject(positionOf(text, '"colour"'));
  });

  it('a rectangle with min x above max x: regions[0].rect.max[0], at that value', () => {
    const text = fixture('bad/rect-min-above-max.json');
    const e = errorOf(text);
    expect(e.code).toBe('E_PASSIVE_FORMAT');
    expect(e.detail).toBe('regions[0].rect.max[0]: expected a value greater than min x = 224, found 194');
    expect(e.where).toMatchObject(positionOf(text, '194')); // the first "194" in the file is max x (by inspection)
  });

  it('a self-intersecting bow-tie polygon: regions[1].polygon, naming the crossing edges', () => {
    const text = fixture('bad/bowtie-polygon.json');
    const e = errorOf(text);
    expect(e.code).toBe('E_PASSIVE_FORMAT');
    // analytic: edge 0–1 from (20,20) to (40,36) crosses edge 2–3 from (40,20) to (20,40) (at (31.1, 28.9))
    expect(e.detail).toBe('regions[1].polygon: expected a simple polygon (edges neither cross nor touch), found edge 0–1 crossing or touching edge 2–3 (point indices)');
    expect(e.where).toMatchObject(positionOf(text, '[[20, 20]'));
  });

  it('units "in": refused with the hint to convert, at the value', () => {
    const text = fixture('bad/units-inch.json');
    const e = errorOf(text);
    expect(e.code).toBe('E_PASSIVE_FORMAT');
    expect(e.detail).toMatch(/^units: expected "mm" .*found "in"$/);
    expect(e.where).toMatchObject(positionOf(text, '"in"'));
  });

  it('more schema errors, each with its key path', () => {
    const cases: [string, RegExp][] = [
      ['[]', /^top level: expected an object/],
      ['{"regions": []}', /^rhoformPassive: expected 1 \(the format version\), found nothing$/],
      ['{"rhoformPassive": 2, "regions": []}', /^rhoformPassive: expected 1 .*found 2$/],
      ['{"rhoformPassive": 1}', /^regions: expected an array of regions, found nothing$/],
      ['{"rhoformPassive": 1, "regions": [{"circle": {"center": [0, 0], "radius": 1}}]}', /^regions\[0\]\.role: expected "solid" or "void", found nothing$/],
      ['{"rhoformPassive": 1, "regions": [{"role": "hole", "circle": {"center": [0, 0], "radius": 1}}]}', /^regions\[0\]\.role: .*found "hole"$/],
      ['{"rhoformPassive": 1, "regions": [{"role": "void"}]}', /^regions\[0\]: expected exactly one of the keys circle, rect, polygon, found none$/],
      ['{"rhoformPassive": 1, "regions": [{"role": "void", "circle": {"center": [0, 0], "radius": 1}, "rect": {"min": [0, 0], "max": [1, 1]}}]}', /found circle and rect$/],
      ['{"rhoformPassive": 1, "regions": [{"role": "void", "circle": {"center": [0], "radius": 1}}]}', /^regions\[0\]\.circle\.center: expected a point \[x, y\] in mm, found an array of 1$/],
      ['{"rhoformPassive": 1, "regions": [{"role": "void", "circle": {"center": [0, "1"], "radius": 1}}]}', /^regions\[0\]\.circle\.center\[1\]: expected a number \(y, mm\), found "1"$/],
      ['{"rhoformPassive": 1, "regions": [{"role": "void", "circle": {"center": [0, 0], "radius": 1e999}}]}', /^regions\[0\]\.circle\.radius: expected a finite number, found 1e999$/],
      ['{"rhoformPassive": 1, "regions": [{"role": "void", "circle": {"center": [0, 0], "radius": 0}}]}', /radius > 0 mm, found 0$/],
      ['{"rhoformPassive": 1, "regions": [{"role": "void", "rect": {"min": [0, 5], "max": [1, 5]}}]}', /^regions\[0\]\.rect\.max\[1\]: expected a value greater than min y = 5, found 5$/],
      ['{"rhoformPassive": 1, "regions": [{"role": "void", "polygon": [[0, 0], [1, 1], [0, 0]]}]}', /^regions\[0\]\.polygon: expected at least 3 distinct points, found 2$/],
      ['{"rhoformPassive": 1, "regions": [{"role": "void", "polygon": [[0, 0], [1, 1], [2, 2]]}]}', /^regions\[0\]\.polygon: expected a polygon of non-zero area, found all points on one line$/],
      ['{"rhoformPassive": 1, "regions": [{"role": "void", "polygon": [[0, 0], [4, 0], [4, 4], [2, 0], [0, 4]]}]}', /^regions\[0\]\.polygon: expected a simple polygon/],
      ['{"rhoformPassive": 1, "regions": [{"role": "void", "circle": {"center": [0, 0], "radius": 1}, "name": 7}]}', /^regions\[0\]\.name: expected a string, found 7$/],
      ['{"rhoformPassive": 1, "regions": [{"role": "void", "role": "solid", "circle": {"center": [0, 0], "radius": 1}}]}', /^regions\[0\]\.role: expected each key once, found it repeated$/],
      ['{"rhoformPassive": 1, "regions": [{"role": "void", "circle": {"center": [2e6, 0], "radius": 1}}]}', /^regions\[0\]\.circle\.center\[0\]: expected a value within ±1000000 mm, found 2000000$/],
    ];
    for (const [text, re] of cases) {
      const e = errorOf(text);
      expect(e.code, text).toBe('E_PASSIVE_FORMAT');
      expect(e.detail, text).toMatch(re);
      expect(e.where?.line, text).toBe(1); // one-line texts: every error is on line 1
    }
  });

  it('a polygon touching itself at a vertex (figure eight) is not simple; more than 10 000 points are refused', () => {
    // the ring passes twice through (2, 2): two triangles joined at one point
    const eight = '{"rhoformPassive": 1, "regions": [{"role": "void", "polygon": [[0, 0], [2, 2], [4, 0], [4, 4], [2, 2], [0, 4]]}]}';
    expect(errorOf(eight).detail).toMatch(/simple polygon/);
    const pts = Array.from({ length: 10_001 }, (_, k) => {
      const a = (2 * Math.PI * k) / 10_001;
      return [Math.cos(a), Math.sin(a)];
    });
    const big = JSON.stringify({ rhoformPassive: 1, regions: [{ role: 'void', polygon: pts }] });
    expect(errorOf(big).detail).toBe('regions[0].polygon: expected at most 10000 points, found 10001');
    // 10 000 points on a circle: a simple (convex) polygon, accepted (the swept edge test keeps this fast; its
    // speed is the bench's business, not this test's)
    const ok = JSON.stringify({ rhoformPassive: 1, regions: [{ role: 'void', polygon: pts.slice(0, 10_000) }] });
    expect(parsePassive(ok, 'ok.json').regions[0].shape.kind).toBe('polygon');
  });
});
