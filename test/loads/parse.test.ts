import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { RhoformError } from '../../src/errors.js';
import { analyse } from '../../src/fe/analyse.js';
import { parseLoads } from '../../src/loads/parse.js';
import { rhoformErrorOf } from '../support/errors.js';

const bad = (name: string): string => readFileSync(new URL(`../../fixtures/loads/bad/${name}`, import.meta.url), 'utf8');

/** 1-based line and column of the nth `needle`, by splitting the text into lines (independent of the parser's scanner). */
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

function errorOf(f: () => unknown): RhoformError {
  return rhoformErrorOf(f, 'expected a RhoformError');
}

// The demo grid: 120 × 60 cells of 2 mm (fixtures/grids/demo-bracket.md).
const demo = { nx: 120, ny: 60, hx: 2, hy: 2 };
const solid = { kind: 'density' as const, values: new Float64Array(120 * 60).fill(1) };

describe('parseLoads: bad files (fixtures/loads/bad/) give the right code, key path and line:col', () => {
  // The contract is DESIGN §12 and docs/passive.md's style: `file:line:col: key.path: expected …, found …`.
  const cases: [file: string, code: string, detail: RegExp, needle: string, nth?: number][] = [
    ['syntax-missing-comma.json', 'E_LOADS_JSON', /^expected JSON, found a syntax error/, '"thickness"'],
    ['unknown-key.json', 'E_LOADS_FORMAT', /^supports\[0\]\.torque: expected one of the keys fix, edge, point, segment, circle, rect, name, found the unknown key "torque"$/, '"torque"'],
    ['repeated-key.json', 'E_LOADS_FORMAT', /^material\.E: expected each key once, found it repeated$/, '"E"', 2],
    ['wrong-type.json', 'E_LOADS_FORMAT', /^material\.E: expected Young's modulus in MPa, found "70 GPa"$/, '"70 GPa"'],
    ['missing-loads.json', 'E_LOADS_FORMAT', /^loads: expected an array of loads, found nothing$/, '{'],
    ['two-selectors.json', 'E_LOADS_FORMAT', /^loads\[1\]: expected exactly one of the keys edge, point, segment, circle, rect, found point and rect$/, '"rect"'],
    ['bad-fix.json', 'E_LOADS_FORMAT', /^supports\[0\]\.fix: expected "x", "y" or "xy", found "z"$/, '"z"'],
    ['nu-half.json', 'E_LOADS_FORMAT', /^material\.nu: expected Poisson's ratio in \(−1, 0\.5\) \(plane stress\), found 0\.5$/, '0.5'],
  ];
  for (const [file, code, detail, needle, nth] of cases) {
    it(`${file} → ${code}`, () => {
      const text = bad(file);
      const e = errorOf(() => parseLoads(text, file));
      expect(e.code).toBe(code);
      expect(e.detail).toMatch(detail);
      const at = positionOf(text, needle, nth);
      // JSON syntax errors point at the first character JSON.parse rejects: the key after the missing comma
      expect(e.where).toEqual({ file, line: at.line, col: at.col });
      expect(e.message.startsWith(`${file}:${at.line}:${at.col}: `)).toBe(true);
    });
  }

  it('the load case errors name the entry (path and name) at its line: a point outside the domain, a selector that catches no node, supports that leave the part free', () => {
    const outside = bad('point-outside.json');
    let e = errorOf(() => analyse(demo, solid, parseLoads(outside, 'point-outside.json')));
    expect(e.code).toBe('E_LOADS_CASE');
    expect(e.detail).toBe('loads[1] ("cable pull"): the point [260, 30] lies outside the domain x 0…240, y 0…120 mm');
    // the entry's opening brace
    const p = positionOf(outside, '{ "force": [300');
    expect(e.where).toEqual({ file: 'point-outside.json', line: p.line, col: p.col });

    const nothing = bad('catches-nothing.json');
    e = errorOf(() => analyse(demo, solid, parseLoads(nothing, 'catches-nothing.json')));
    expect(e.code).toBe('E_LOADS_CASE');
    expect(e.detail).toMatch(/^supports\[1\] \("stop"\): the rect catches no node of the grid/);
    expect(e.where?.line).toBe(positionOf(nothing, '"stop"').line);

    const rigid = bad('rigid-body.json');
    e = errorOf(() => analyse(demo, solid, parseLoads(rigid, 'rigid-body.json')));
    expect(e.code).toBe('E_LOADS_CASE');
    const s = positionOf(rigid, '[{ "fix"');
    expect(e.where).toEqual({ file: 'rigid-body.json', line: s.line, col: s.col });
    expect(e.detail).toBe('supports: expected supports that hold the part still (no rigid-body motion), found rotation left free by supports[0] ("one bolt")');
  });
});

describe('parseLoads: good files', () => {
  it('reads the example of DESIGN §12 / docs/structure.md with defaults for the interpolation', () => {
    const doc = readFileSync(new URL('../../docs/structure.md', import.meta.url), 'utf8');
    const example = /```json\n([\s\S]*?)```/.exec(doc);
    expect(example).not.toBeNull();
    const s = parseLoads(example![1], 'doc.json');
    expect(s.material).toEqual({ E: 70000, nu: 0.33 });
    expect(s.thickness).toBe(8);
    expect(s.supports.length).toBeGreaterThan(0);
    expect(s.loads[0].force).toEqual([0, -1200]);
    const bare = parseLoads('{"rhoformLoads":1,"material":{"E":1,"nu":0.3},"supports":[{"fix":"xy","edge":"left"}],"loads":[{"force":[1,0],"edge":"right"}]}', 'b.json');
    // DESIGN §12: interpolation defaults p = 3, minimum stiffness 1e-9; thickness may come from --thickness
    expect(bare.interpolation).toEqual({ penal: 3, minStiffness: 1e-9 });
    expect(bare.thickness).toBeNull();
    const e = errorOf(() => analyse({ nx: 4, ny: 2, hx: 1, hy: 1 }, { kind: 'density', values: new Float64Array(8).fill(1) }, bare));
    expect(e.code).toBe('E_LOADS_FORMAT');
    expect(e.detail).toMatch(/^thickness: expected a thickness in mm/);
    expect(analyse({ nx: 4, ny: 2, hx: 1, hy: 1 }, { kind: 'density', values: new Float64Array(8).fill(1) }, bare, { thickness: 2 }).compliance).toBeGreaterThan(0);
  });
});
