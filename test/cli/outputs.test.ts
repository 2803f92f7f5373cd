/**
 * The output options (docs/cli.md): --annotations, --arcs, --dxf-version, --formats stl,3mf. Contract tests of
 * our own interface — no outside source applies; the files themselves are checked in test/write/.
 */
import { existsSync, readFileSync, readdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { parseArgs } from '../../cli/args.js';
import { UsageError } from '../../src/errors.js';
import { cli, tempDir } from './harness.js';

/** A 20 × 10 plate with a round hole (values 0/1 with a soft rim), as CSV. */
function plateCsv(dir: string): void {
  const rows: string[] = [];
  for (let j = 0; j < 10; j++) {
    const row: string[] = [];
    for (let i = 0; i < 20; i++) row.push(Math.hypot(i + 0.5 - 10, j + 0.5 - 5) < 3 ? '0' : '1');
    rows.push(row.join(','));
  }
  writeFileSync(join(dir, 'plate.csv'), rows.join('\n') + '\n');
}

describe('output options', () => {
  it('parse strictly, naming the option', () => {
    expect(parseArgs(['build', 'g.npy', '--dxf-version', 'r12']).settings.dxfVersion).toBe('r12');
    expect(parseArgs(['build', 'g.npy', '--arcs', '--annotations']).settings).toMatchObject({ arcs: true, annotations: true });
    expect(parseArgs(['build', 'g.npy', '--formats', 'dxf,stl,3mf']).settings.formats).toEqual(['dxf', 'stl', '3mf']);
    expect(() => parseArgs(['build', 'g.npy', '--dxf-version', 'r14'])).toThrow(UsageError);
    expect(() => parseArgs(['build', 'g.npy', '--dxf-version', 'r14'])).toThrow(/--dxf-version: expected one of r12, r2000, found "r14"/);
    expect(() => parseArgs(['build', 'g.npy', '--formats', 'dxf,obj'])).toThrow(/--formats: expected one of .*stl, 3mf, found "obj"/);
    expect(() => parseArgs(['check', 'g.npy', '--arcs'])).toThrow(UsageError);
  });

  it('--formats stl without --thickness: exit 2, E_USAGE naming --thickness, nothing written', () => {
    const dir = tempDir();
    plateCsv(dir);
    const r = cli(['build', 'plate.csv', '--formats', 'dxf,stl', '--out-dir', 'out'], dir);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/E_USAGE: --formats stl: expected --thickness <mm>/);
    expect(existsSync(join(dir, 'out'))).toBe(false);
  });

  it('writes the part files only by default; --annotations adds <name>.notes.dxf beside the DXF, listed as annotations', () => {
    const dir = tempDir();
    plateCsv(dir);
    const plain = cli(['build', 'plate.csv', '--formats', 'dxf,svg,json', '--out-dir', 'a'], dir);
    expect(plain.code).toBe(0);
    expect(readdirSync(join(dir, 'a')).sort()).toEqual(['plate.dxf', 'plate.report.json', 'plate.svg']);
    const noted = cli(['build', 'plate.csv', '--formats', 'dxf,json,stl,3mf', '--thickness', '3', '--annotations', '--arcs', '--dxf-version', 'r12', '--out-dir', 'b'], dir);
    expect(noted.code).toBe(0);
    expect(readdirSync(join(dir, 'b')).sort()).toEqual(['plate.3mf', 'plate.dxf', 'plate.notes.dxf', 'plate.report.json', 'plate.stl']);
    const report = JSON.parse(readFileSync(join(dir, 'b/plate.report.json'), 'utf8'));
    expect(report.outputs.map((o: { format: string; annotations?: boolean }) => `${o.format}${o.annotations ? '+notes' : ''}`)).toEqual(['dxf', 'dxf+notes', 'json', 'stl', '3mf']);
    expect(report.settings).toMatchObject({ arcs: true, annotations: true, dxfVersion: 'r12' });
    expect(report.geometry.arcFit.segmentsAfter).toBeLessThanOrEqual(report.geometry.arcFit.segmentsBefore);
    expect(readFileSync(join(dir, 'b/plate.dxf'), 'utf8')).toContain('AC1009');
    expect(readFileSync(join(dir, 'b/plate.notes.dxf'), 'utf8')).toContain('AC1015');
  });
});
