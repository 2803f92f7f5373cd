/**
 * `--loads` on the command line (docs/cli.md, docs/structure.md): build, check and demo with a loads file, the
 * options that go with it, the thickness conflict, and every kind of bad loads file → exit 2 with the parser's
 * message, nothing written.
 */
import { copyFileSync, existsSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { parseArgs } from '../../cli/args.js';
import { FE_MAX_ELEMENTS } from '../../src/fe/analyse.js';
import { DEFAULT_SETTINGS } from '../../src/settings.js';
import { cli, tempDir } from './harness.js';

const ROOT = fileURLToPath(new URL('../../', import.meta.url));
const DEMO_GRID = join(ROOT, 'fixtures/grids/demo-bracket.npy');
const DEMO_LOADS = join(ROOT, 'fixtures/loads/demo-bracket.loads.json');
const BAD = join(ROOT, 'fixtures/loads/bad');

/** A temp folder with the demo grid and the given loads file (as loads.json). */
function setup(loads: string): string {
  const dir = tempDir();
  copyFileSync(DEMO_GRID, join(dir, 'demo-bracket.npy'));
  copyFileSync(loads, join(dir, 'loads.json'));
  return dir;
}

describe('--loads options', () => {
  it('parses --loads, --max-stiffness-loss, --allowable-stress, --fe-max-elements; the default limit is the core FE_MAX_ELEMENTS', () => {
    const a = parseArgs(['build', 'g.npy', '--loads', 'l.json', '--max-stiffness-loss', '5', '--allowable-stress=120', '--fe-max-elements', '1000']);
    expect(a.settings).toMatchObject({ loads: 'l.json', maxStiffnessLoss: 5, allowableStress: 120, feMaxElements: 1000 });
    expect(DEFAULT_SETTINGS.feMaxElements).toBe(FE_MAX_ELEMENTS);
    expect(parseArgs(['batch', 'd/', '--loads', 'l.json']).settings.loads).toBe('l.json');
  });

  it('rejects bad values and the re-check options without --loads', () => {
    expect(() => parseArgs(['build', 'g.npy', '--loads', 'l.json', '--allowable-stress', '-3'])).toThrow(/--allowable-stress: expected a stress in MPa > 0/);
    expect(() => parseArgs(['build', 'g.npy', '--loads', 'l.json', '--fe-max-elements', '2.5'])).toThrow(/--fe-max-elements/);
    expect(() => parseArgs(['build', 'g.npy', '--loads', ''])).toThrow(/--loads: expected a loads file/);
    expect(() => parseArgs(['check', 'g.npy', '--allowable-stress', '100'])).toThrow(/needs --loads/);
    expect(() => parseArgs(['inspect', 'g.npy', '--loads', 'l.json'])).toThrow(/does not apply to 'inspect'/);
  });
});

describe('--loads runs', () => {
  it('check: the report has the structure block and the structural checks; the text shows the compliance change', () => {
    const dir = setup(DEMO_LOADS);
    const r = cli(['check', 'demo-bracket.npy', '--cell-size', '2', '--loads', 'loads.json', '--allowable-stress', '30', '--out-dir', 'out'], dir);
    expect(r.code).toBe(1); // peak-stress fails: the clamped corner of the bracket is above 30 MPa
    const report = JSON.parse(readFileSync(join(dir, 'out/demo-bracket.report.json'), 'utf8'));
    expect(report.structure.loadsFile).toBe('loads.json');
    expect(report.structure.elements).toEqual([120, 60]);
    expect(report.checks.map((c: { id: string }) => c.id)).toEqual(expect.arrayContaining(['stiffness-change', 'peak-stress', 'load-path']));
    const peak = report.checks.find((c: { id: string }) => c.id === 'peak-stress');
    expect(peak.status).toBe('fail');
    expect(peak.locations[0].fileRow).toBeGreaterThanOrEqual(1);
    expect(r.stdout).toMatch(/Structural re-check \(--loads loads\.json/);
    expect(r.stdout).toMatch(/change {8}compliance [+−]?[\d.]+ % final vs input design/);
    expect(readdirSync(join(dir, 'out')).sort()).toEqual(['demo-bracket.report.html', 'demo-bracket.report.json']);
  });

  it('build: the loads file is an input (an output can never be it) and the geometry is written', () => {
    const dir = setup(DEMO_LOADS);
    const r = cli(['build', 'demo-bracket.npy', '--cell-size', '2', '--loads', 'loads.json', '--formats', 'dxf,json', '--out-dir', 'out', '--quiet'], dir);
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    expect(readdirSync(join(dir, 'out')).sort()).toEqual(['demo-bracket.dxf', 'demo-bracket.report.json']);
    const report = JSON.parse(readFileSync(join(dir, 'out/demo-bracket.report.json'), 'utf8'));
    expect(report.settings.loads).toBe('loads.json');
    expect(report.structure.designs.beforeRepair).toBeUndefined();
  });

  it('demo: runs its own service load case and prints the stiffness change of the repaired bracket', () => {
    const dir = tempDir();
    const r = cli(['demo', '--out-dir', 'd'], dir);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/stiffness-change/);
    expect(r.stdout).toMatch(/before repair compliance/);
    const report = JSON.parse(readFileSync(join(dir, 'd/demo-bracket.report.json'), 'utf8'));
    expect(report.structure.loadsFile).toBe('fixtures/loads/demo-bracket.loads.json');
    expect(report.structure.designs.beforeRepair).toBeDefined();
    expect(report.checksBeforeRepair.map((c: { id: string }) => c.id)).toContain('stiffness-change');
  });

  it('--thickness that differs from the file is a usage error (exit 2, nothing written); the same value is fine', () => {
    const dir = setup(DEMO_LOADS);
    const r = cli(['check', 'demo-bracket.npy', '--cell-size', '2', '--loads', 'loads.json', '--thickness', '6', '--out-dir', 'out'], dir);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/E_USAGE: --thickness 6 mm conflicts with "thickness": 8 in loads\.json/);
    expect(existsSync(join(dir, 'out'))).toBe(false);
    const ok = cli(['check', 'demo-bracket.npy', '--cell-size', '2', '--loads', 'loads.json', '--thickness', '8', '--out-dir', 'out', '--quiet'], dir);
    expect(ok.code).toBe(0);
  });

  it('--thickness supplies a thickness the file leaves out', () => {
    const dir = tempDir();
    copyFileSync(DEMO_GRID, join(dir, 'demo-bracket.npy'));
    const spec = JSON.parse(readFileSync(DEMO_LOADS, 'utf8'));
    delete spec.thickness;
    writeFileSync(join(dir, 'loads.json'), JSON.stringify(spec));
    const none = cli(['check', 'demo-bracket.npy', '--cell-size', '2', '--loads', 'loads.json', '--out-dir', 'out', '--quiet'], dir);
    expect(none.code).toBe(2);
    expect(none.stderr).toMatch(/E_LOADS_FORMAT: .*thickness: expected a thickness in mm/);
    expect(existsSync(join(dir, 'out'))).toBe(false);
    const r = cli(['check', 'demo-bracket.npy', '--cell-size', '2', '--loads', 'loads.json', '--thickness', '4', '--json'], dir);
    expect(r.code).toBe(0);
    expect(JSON.parse(r.stdout).structure.thickness).toBe(4);
  });
});

describe('bad loads files → exit 2 with the message, nothing written', () => {
  // The messages of docs/structure.md ("Errors"), one per kind; the case errors are resolved on the demo grid
  // (120 × 60 cells of 2 mm).
  const cases: [file: string, code: string, text: RegExp][] = [
    ['syntax-missing-comma.json', 'E_LOADS_JSON', /:4:3: expected JSON, found a syntax error/],
    ['unknown-key.json', 'E_LOADS_FORMAT', /:5:47: supports\[0\]\.torque: expected one of the keys/],
    ['repeated-key.json', 'E_LOADS_FORMAT', /:3:41: material\.E: expected each key once/],
    ['wrong-type.json', 'E_LOADS_FORMAT', /:3:22: material\.E: expected Young's modulus in MPa, found "70 GPa"/],
    ['missing-loads.json', 'E_LOADS_FORMAT', /:1:1: loads: expected an array of loads, found nothing/],
    ['two-selectors.json', 'E_LOADS_FORMAT', /:8:47: loads\[1\]: expected exactly one of the keys/],
    ['bad-fix.json', 'E_LOADS_FORMAT', /:5:25: supports\[0\]\.fix: expected "x", "y" or "xy", found "z"/],
    ['nu-half.json', 'E_LOADS_FORMAT', /:3:35: material\.nu: expected Poisson's ratio/],
    ['point-outside.json', 'E_LOADS_CASE', /:8:5: loads\[1\] \("cable pull"\): the point \[260, 30\] lies outside the domain/],
    ['catches-nothing.json', 'E_LOADS_CASE', /:7:5: supports\[1\] \("stop"\): the rect catches no node of the grid/],
    ['rigid-body.json', 'E_LOADS_CASE', /:5:15: supports: expected supports that hold the part still .*rotation left free/],
  ];
  for (const [file, code, text] of cases) {
    it(file, () => {
      const dir = setup(join(BAD, file));
      const r = cli(['build', 'demo-bracket.npy', '--cell-size', '2', '--loads', 'loads.json', '--out-dir', 'out'], dir);
      expect(r.code).toBe(2);
      expect(r.stdout).toBe('');
      expect(r.stderr).toContain(`rhoform: error ${code}: loads.json:`);
      expect(r.stderr).toMatch(text);
      expect(existsSync(join(dir, 'out'))).toBe(false);
    });
  }
  it('all fixtures of fixtures/loads/bad are covered', () => {
    expect(readdirSync(BAD).sort()).toEqual(cases.map((c) => c[0]).sort());
  });
  it('a missing loads file is an input error naming it', () => {
    const dir = setup(DEMO_LOADS);
    const r = cli(['build', 'demo-bracket.npy', '--cell-size', '2', '--loads', 'nope.json', '--out-dir', 'out'], dir);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/nope\.json/);
    expect(existsSync(join(dir, 'out'))).toBe(false);
  });
});
