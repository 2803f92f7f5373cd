import { existsSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { VERSION } from '../../src/version.js';
import { cli, tempDir } from './harness.js';

/** A 12×8 grid (CSV, top-down) with a grey-edged disc of solid in a void field. */
function discCsv(): string {
  const rows: string[] = [];
  for (let r = 0; r < 8; r++) {
    const row: string[] = [];
    for (let c = 0; c < 12; c++) {
      const d = Math.hypot(c + 0.5 - 6, r + 0.5 - 4);
      row.push(Math.min(1, Math.max(0, 0.5 + (3 - d) / 2)).toFixed(4));
    }
    rows.push(row.join(','));
  }
  return `${rows.join('\n')}\n`;
}

describe('CLI contract (docs/cli.md)', () => {
  it('build writes DXF, SVG, JSON and HTML and exits 0', () => {
    const dir = tempDir();
    writeFileSync(join(dir, 'disc.csv'), discCsv());
    const r = cli(['build', 'disc.csv', '--cell-size', '2', '--out-dir', 'out'], dir);
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    expect(readdirSync(join(dir, 'out')).sort()).toEqual(['disc.dxf', 'disc.report.html', 'disc.report.json', 'disc.svg']);
    const report = JSON.parse(readFileSync(join(dir, 'out/disc.report.json'), 'utf8'));
    expect(report.schemaVersion).toBe(1);
    expect(report.input.cellSize).toEqual([2, 2]);
    expect(report.geometry.polygons).toBe(1);
    expect(report.outputs).toHaveLength(4);
    expect(report.cautions.length).toBeGreaterThan(0);
    expect(r.stdout).toMatch(/^caution  Re-analyse|caution  This geometry/m);
  });

  it('--json prints the report on stdout and nothing else', () => {
    const dir = tempDir();
    writeFileSync(join(dir, 'disc.csv'), discCsv());
    const r = cli(['build', 'disc.csv', '--json', '--formats', 'dxf'], dir);
    expect(r.code).toBe(0);
    const report = JSON.parse(r.stdout);
    expect(report.tool).toEqual({ name: 'rhoform', version: VERSION });
    expect(report.settings.formats).toEqual(['dxf']);
    expect(report.settings.cellSizeDefaulted).toBe(true);
  });

  it('bad input: exit 2, file:line:col in the message, stdout empty, nothing written', () => {
    const dir = tempDir();
    writeFileSync(join(dir, 'bad.csv'), '0,1,0\n0,abc,1\n');
    const r = cli(['build', 'bad.csv', '--json', '--out-dir', 'out'], dir);
    expect(r.code).toBe(2);
    expect(r.stdout).toBe('');
    expect(r.stderr).toMatch(/E_CSV_TOKEN: bad\.csv:2:3: expected a number/);
    expect(existsSync(join(dir, 'out'))).toBe(false);
  });

  it('refusals of the grid name the file, line and column (non-finite, out of range)', () => {
    const dir = tempDir();
    writeFileSync(join(dir, 'nan.csv'), '0,1\nnan,0.5\n');
    writeFileSync(join(dir, 'over.csv'), '0,1\n0.5,1.3\n');
    const a = cli(['build', 'nan.csv'], dir);
    expect(a.code).toBe(2);
    expect(a.stderr).toMatch(/E_GRID_NONFINITE: nan\.csv:2:1: expected finite densities, found NaN \(1 non-finite value/);
    const b = cli(['build', 'over.csv'], dir);
    expect(b.code).toBe(2);
    expect(b.stderr).toMatch(/E_GRID_RANGE: over\.csv:2:5: expected values within 0\.\.1.*found 1\.3/);
    expect(readdirSync(dir).sort()).toEqual(['nan.csv', 'over.csv']);
    expect(cli(['build', 'nan.csv', '--non-finite', 'void', '--formats', 'json'], dir).code).toBe(0);
    expect(cli(['build', 'over.csv', '--clip', '--formats', 'json'], dir).code).toBe(0);
  });

  it('never overwrites without --force, and never the input', () => {
    const dir = tempDir();
    writeFileSync(join(dir, 'disc.csv'), discCsv());
    writeFileSync(join(dir, 'disc.svg'), 'keep me');
    const r = cli(['build', 'disc.csv'], dir);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/E_OUTPUT_EXISTS/);
    expect(readFileSync(join(dir, 'disc.svg'), 'utf8')).toBe('keep me');
    expect(existsSync(join(dir, 'disc.dxf'))).toBe(false); // all or nothing
    expect(cli(['build', 'disc.csv', '--force'], dir).code).toBe(0);
    expect(readFileSync(join(dir, 'disc.svg'), 'utf8')).toMatch(/^<\?xml|^<svg/);
    // A CSV that happens to be called part.svg would be its own SVG output.
    writeFileSync(join(dir, 'part.svg'), discCsv());
    const same = cli(['build', 'part.svg', '--force'], dir);
    expect(same.code).toBe(2);
    expect(same.stderr).toMatch(/E_OUTPUT_IS_INPUT/);
    expect(readFileSync(join(dir, 'part.svg'), 'utf8')).toBe(discCsv());
  });

  it('usage errors name the option and exit 2', () => {
    const dir = tempDir();
    expect(cli(['build', 'x.csv', '--bogus'], dir).stderr).toMatch(/E_USAGE: unknown option --bogus/);
    const r = cli(['build', 'x.csv', '--smooth', '-1'], dir);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/--smooth: expected a whole number/);
    expect(cli(['build', 'x.csv', '--saddle=diag'], dir).stderr).toMatch(/--saddle: expected one of decider, join, split, found "diag"/);
    expect(cli(['frobnicate'], dir).code).toBe(2);
    expect(cli(['build', 'missing.csv'], dir).stderr).toMatch(/E_INPUT_READ: missing\.csv: cannot read the input \(no such file\)/);
  });

  it('--version and --help exit 0', () => {
    const dir = tempDir();
    expect(cli(['--version'], dir)).toEqual({ code: 0, stdout: `${VERSION}\n`, stderr: '' });
    expect(cli(['--help'], dir).stdout).toMatch(/rhoform build/);
  });

  it('the version constant equals package.json', () => {
    const pkg = JSON.parse(readFileSync(new URL('../../package.json', import.meta.url), 'utf8'));
    expect(VERSION).toBe(pkg.version);
  });

  it('inspect --json gives input statistics and a histogram; non-finite values never fail it', () => {
    const dir = tempDir();
    writeFileSync(join(dir, 'g.csv'), '0,0.5,1\nnan,0.25,1\n');
    const r = cli(['inspect', 'g.csv', '--json'], dir);
    expect(r.code).toBe(0);
    const j = JSON.parse(r.stdout);
    expect(j.input.nonFinite).toBe(1);
    expect(j.input.nx).toBe(3);
    expect(j.input.ny).toBe(2);
    expect(j.input.mean).toBeCloseTo(2.75 / 5, 12);
    expect(j.histogram.counts.reduce((a: number, b: number) => a + b, 0)).toBe(5);
  });

  it('check writes the report only', () => {
    const dir = tempDir();
    writeFileSync(join(dir, 'disc.csv'), discCsv());
    const r = cli(['check', 'disc.csv', '--out-dir', 'o'], dir);
    expect(r.code).toBe(0);
    expect(readdirSync(join(dir, 'o')).sort()).toEqual(['disc.report.html', 'disc.report.json']);
  });

  it('check without --out-dir or --formats writes no file: the verdict goes to the terminal only', () => {
    // docs/cli.md: `check` asks for a verdict; report files only when told where (--out-dir)
    const dir = tempDir();
    writeFileSync(join(dir, 'disc.csv'), discCsv());
    const r = cli(['check', 'disc.csv'], dir);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/^result +(PASS|WARN) /m);
    expect(r.stdout).not.toMatch(/^wrote/m);
    expect(readdirSync(dir)).toEqual(['disc.csv']);
    const j = cli(['check', 'disc.csv', '--json'], dir);
    expect(j.code).toBe(0);
    const report = JSON.parse(j.stdout);
    expect(report.outputs).toEqual([]);
    expect(report.settings.formats).toEqual([]);
    expect(readdirSync(dir)).toEqual(['disc.csv']);
  });

  it('check --out-dir . writes the two reports in the working folder, and never geometry', () => {
    const dir = tempDir();
    writeFileSync(join(dir, 'disc.csv'), discCsv());
    expect(cli(['check', 'disc.csv', '--out-dir', '.'], dir).code).toBe(0);
    expect(readdirSync(dir).sort()).toEqual(['disc.csv', 'disc.report.html', 'disc.report.json']);
  });

  it('colour only on a TTY and never with NO_COLOR or --no-color', () => {
    const dir = tempDir();
    writeFileSync(join(dir, 'disc.csv'), discCsv());
    expect(cli(['build', 'disc.csv', '--formats', 'json', '--force'], dir, {}, true).stdout).toMatch(/\u001b\[/);
    expect(cli(['build', 'disc.csv', '--formats', 'json', '--force'], dir, { NO_COLOR: '1' }, true).stdout).not.toMatch(/\u001b\[/);
    expect(cli(['build', 'disc.csv', '--formats', 'json', '--force', '--no-color'], dir, {}, true).stdout).not.toMatch(/\u001b\[/);
    expect(cli(['build', 'disc.csv', '--formats', 'json', '--force'], dir, {}, false).stdout).not.toMatch(/\u001b\[/);
  });

  it('long form (x;y;density, decimal comma, shuffled) builds the same part as the grid form; its cell size is inferred', () => {
    const dir = tempDir();
    const grid = discCsv();
    writeFileSync(join(dir, 'disc.csv'), grid);
    // The same values as centroids of 2 mm cells, y up (file row 1 is the top row), in a scrambled order.
    const rows = grid.trim().split('\n').map((l) => l.split(','));
    const lines: string[] = [];
    rows.forEach((row, r) => row.forEach((v, c) => lines.push(`${c * 2 + 1};${(rows.length - 1 - r) * 2 + 1};${v.replace('.', ',')}`)));
    lines.sort((a, b) => (a.length * 31 + a.charCodeAt(2)) % 17 - (b.length * 31 + b.charCodeAt(2)) % 17 || a.localeCompare(b));
    writeFileSync(join(dir, 'long.csv'), `x;y;density\n${lines.join('\n')}\n`);
    const a = JSON.parse(cli(['build', 'disc.csv', '--cell-size', '2', '--json', '--formats', 'json'], dir).stdout);
    const b = JSON.parse(cli(['build', 'long.csv', '--decimal-comma', '--json', '--formats', 'json'], dir).stdout);
    expect(b.settings.layout).toBe('long');
    expect(b.settings.cellSizeDefaulted).toBe(false);
    expect(b.input.cellSize).toEqual([2, 2]);
    expect(b.threshold.level).toBeCloseTo(a.threshold.level, 12);
    expect(b.geometry.area).toBeCloseTo(a.geometry.area, 9);
  });

  it('demo writes into its folder and replaces its own earlier output', () => {
    const dir = tempDir();
    const a = cli(['demo', '--out-dir', 'd', '--quiet'], dir);
    expect(a.code).toBe(0);
    const files = readdirSync(join(dir, 'd')).sort();
    expect(files).toEqual(['demo-bracket.dxf', 'demo-bracket.report.html', 'demo-bracket.report.json', 'demo-bracket.svg']);
    expect(cli(['demo', '--out-dir', 'd', '--quiet'], dir).code).toBe(0);
  });
});
