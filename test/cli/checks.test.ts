/**
 * The check part of the CLI contract (docs/checks/README.md, docs/cli.md): exit codes, --fail-on, --severity,
 * process presets, located findings in the JSON report and on the `finding` layer of the DXF.
 *
 * The grid: a 60 × 30 mm plate (1 mm cells) made of two thick blocks joined by a horizontal strut of
 * width 2 mm (analytic: the strut's width is its drawn width; grey ramps of one cell on every edge, so the
 * 0.5 iso-line is the drawn boundary).
 */
import { readFileSync, writeFileSync, existsSync } from 'node:fs';
import { join } from 'node:path';
import DxfParser from 'dxf-parser';
import { describe, expect, it } from 'vitest';
import type { Report } from '../../src/types.js';
import { cli, tempDir } from './harness.js';

const NX = 60;
const NY = 30;
/** Signed distance (mm, > 0 inside) to the union of two blocks and a strut; cell centres at (i + 0.5, j + 0.5). */
function inside(x: number, y: number, island: boolean): number {
  const box = (x0: number, y0: number, x1: number, y1: number) => Math.min(x - x0, x1 - x, y - y0, y1 - y);
  const d = Math.max(box(4, 4, 22, 26), box(38, 4, 56, 26), box(21, 14, 39, 16));
  return island ? Math.max(d, box(27, 21, 33, 27)) : d;
}
/** The plate as CSV text; with `island`, a separate 6 × 6 mm block above the strut. */
function plateCsv(island = false): string {
  const rows: string[] = [];
  for (let r = 0; r < NY; r++) {
    const y = NY - r - 0.5; // file row 1 is the top
    const cells: string[] = [];
    for (let i = 0; i < NX; i++) cells.push(Math.min(1, Math.max(0, 0.5 + inside(i + 0.5, y, island))).toFixed(4));
    rows.push(cells.join(','));
  }
  return rows.join('\n') + '\n';
}

function setup(island = false): { dir: string; file: string } {
  const dir = tempDir();
  const file = join(dir, 'struts.csv');
  writeFileSync(file, plateCsv(island));
  return { dir, file };
}

describe('checks on the command line', () => {
  it('a strut thinner than --min-member fails (exit 1), is located, and geometry is still written', () => {
    const { dir } = setup();
    const r = cli(['build', 'struts.csv', '--min-member', '4', '--json'], dir);
    expect(r.code).toBe(1); // docs/cli.md: 1 = a check failed, geometry still written
    const report = JSON.parse(r.stdout) as Report;
    const c = report.checks.find((k) => k.id === 'min-member-size');
    expect(c?.status).toBe('fail');
    // analytic: the strut is 2 mm wide; tolerance max(0.5 cell, 2 %) = 0.5 mm
    expect(Math.abs((c?.measured ?? NaN) - 2)).toBeLessThanOrEqual(0.5);
    expect(c?.locationsTotal).toBe(1);
    const loc = c!.locations[0];
    // the strut spans x 21..39, y 14..16 (mm, y up)
    expect(loc.x).toBeGreaterThan(21);
    expect(loc.x).toBeLessThan(39);
    expect(Math.abs(loc.y - 15)).toBeLessThan(1);
    // 1-based file position: column = floor(x) + 1; row counted from the top: 30 − floor(y)
    expect(loc.fileCol).toBe(Math.floor(loc.x) + 1);
    expect(loc.fileRow).toBe(NY - Math.floor(loc.y));
    expect(report.summary.fail).toBe(1);
    for (const ext of ['dxf', 'svg', 'report.json', 'report.html']) expect(existsSync(join(dir, `struts.${ext}`))).toBe(true);
  });

  it('the finding goes to the finding layer of the annotations DXF, never into the part DXF (read back by dxf-parser)', () => {
    const { dir } = setup();
    cli(['build', 'struts.csv', '--min-member', '4', '--quiet', '--annotations'], dir);
    const Parser = DxfParser as unknown as new () => { parseSync(s: string): { entities: { type: string; layer: string; text?: string; position?: { x: number; y: number } }[] } };
    // DESIGN §8: the part file holds the part only
    const part = new Parser().parseSync(readFileSync(join(dir, 'struts.dxf'), 'utf8'));
    expect(part.entities.filter((e) => e.layer !== 'outline' && e.layer !== 'hole')).toEqual([]);
    const dxf = new Parser().parseSync(readFileSync(join(dir, 'struts.notes.dxf'), 'utf8'));
    const onLayer = dxf.entities.filter((e) => e.layer === 'finding');
    expect(onLayer.length).toBeGreaterThan(0);
    const label = onLayer.find((e) => e.type === 'TEXT' || e.type === 'MTEXT');
    expect(label?.text).toContain('1 min-member-size');
  });

  it('a limit the strut meets passes (exit 0)', () => {
    const { dir } = setup();
    const r = cli(['build', 'struts.csv', '--min-member', '1', '--json'], dir);
    expect(r.code).toBe(0);
    const report = JSON.parse(r.stdout) as Report;
    expect(report.checks.find((c) => c.id === 'min-member-size')?.status).toBe('pass');
    expect(report.summary.status).toBe('pass');
  });

  it('an island warns (exit 0) and is located with its area; --fail-on warn makes that exit 1', () => {
    const { dir } = setup(true);
    const r = cli(['check', 'struts.csv', '--json'], dir);
    expect(r.code).toBe(0);
    const c = (JSON.parse(r.stdout) as Report).checks.find((k) => k.id === 'islands');
    expect(c?.status).toBe('warn');
    expect(c?.locationsTotal).toBe(1);
    // analytic: the island is a 6 × 6 mm square (36 mm²); smoothing rounds its corners a little
    expect(Math.abs((c?.measured ?? NaN) - 36) / 36).toBeLessThan(0.05);
    expect(Math.abs(c!.locations[0].x - 30)).toBeLessThan(3);
    expect(Math.abs(c!.locations[0].y - 24)).toBeLessThan(3);
    expect(cli(['check', 'struts.csv', '--fail-on', 'warn', '--quiet', '--force'], dir).code).toBe(1);
  });

  it('--severity <id>=off removes a check; =warn makes a failure a warning (exit 0)', () => {
    const { dir } = setup();
    const off = JSON.parse(cli(['check', 'struts.csv', '--min-member', '4', '--severity', 'min-member-size=off', '--json'], dir).stdout) as Report;
    expect(off.checks.map((c) => c.id)).not.toContain('min-member-size');
    const w = cli(['check', 'struts.csv', '--min-member', '4', '--severity', 'min-member-size=warn', '--json', '--force'], dir);
    expect(w.code).toBe(0);
    expect((JSON.parse(w.stdout) as Report).checks.find((c) => c.id === 'min-member-size')?.status).toBe('warn');
    const fw = cli(['check', 'struts.csv', '--min-member', '4', '--severity', 'min-member-size=warn', '--fail-on', 'warn', '--quiet', '--force'], dir);
    expect(fw.code).toBe(1);
  });

  it('default checks run without any limit: volume-fraction, islands, small-holes (4 cell areas), outline-fidelity, grey-level', () => {
    const { dir } = setup();
    const report = JSON.parse(cli(['check', 'struts.csv', '--json'], dir).stdout) as Report;
    expect(report.checks.map((c) => c.id)).toEqual(['volume-fraction', 'islands', 'small-holes', 'outline-fidelity', 'grey-level']);
    // docs/checks/README.md: the default hole-area limit is 4 cell areas (cell 1 mm here: 4 mm²)
    expect(report.checks.find((c) => c.id === 'small-holes')!.limit).toBe(4 * report.input.cellSize[0] * report.input.cellSize[1]);
  });

  it('process presets: sheet processes need --thickness (exit 2 naming it); the report prints the values used', () => {
    const { dir } = setup();
    const bad = cli(['check', 'struts.csv', '--process', 'laser-cut'], dir);
    expect(bad.code).toBe(2);
    expect(bad.stderr).toContain('--thickness');
    expect(bad.stdout).toBe('');
    const ok = cli(['check', 'struts.csv', '--process', 'laser-cut', '--thickness', '3', '--json'], dir);
    const report = JSON.parse(ok.stdout) as Report;
    expect(report.process?.id).toBe('laser-cut');
    expect(report.settings.minMember).toBe(report.process?.values.minMember?.value);
    // an explicit option wins over the preset
    const over = JSON.parse(cli(['check', 'struts.csv', '--process', 'laser-cut', '--thickness', '3', '--min-member', '1.5', '--json', '--force'], dir).stdout) as Report;
    expect(over.settings.minMember).toBe(1.5);
  });

  it('bad check options are usage errors naming the option (exit 2)', () => {
    const { dir } = setup();
    for (const [args, name] of [
      [['--min-member', '0'], '--min-member'],
      [['--min-hole', 'x'], '--min-hole'],
      [['--severity', 'min-member=off'], '--severity'],
      [['--severity', 'islands=loud'], '--severity'],
      [['--process', 'plasma'], '--process'],
      [['--fail-on', 'never'], '--fail-on'],
      [['--grey-warn', '120'], '--grey-warn'],
      [['--tool-radius', '500'], '--tool-radius'], // wider than the 60 mm part
    ] as const) {
      const r = cli(['check', 'struts.csv', ...args], dir);
      expect(r.code, args.join(' ')).toBe(2);
      expect(r.stderr).toContain(name);
    }
  });
});
