/**
 * Golden files of the writers: a few small grids built through the CLI, their DXF, SVG, JSON and HTML bytes
 * compared with the committed files in test/golden/<case>/. An unintended change of any output shows as a diff.
 *
 * The goldens were written by this code; what they mean is tested elsewhere against outside oracles (dxf-parser,
 * d3-contour, analytic shapes in test/reference/). Here they pin the bytes, so a refactor proves it changed none.
 * The tool version and the report's run figures (timings, peak memory) are the only volatile parts and are masked. To regenerate after an intended change:
 * `RHOFORM_UPDATE_GOLDEN=1 npx vitest run test/golden`; on a mismatch `<file>-changed` is written beside the
 * golden (not under CI) so the two can be diffed.
 */
import { copyFileSync, existsSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { basename, dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { VERSION } from '../../src/version.js';
import { cli, tempDir } from '../cli/harness.js';
import '../support/boolean-engine.js';

const here = dirname(fileURLToPath(import.meta.url));
const root = resolve(here, '../..');

interface GoldenCase {
  readonly name: string;
  /** The grid, relative to the package root; copied into a fresh folder and built there by its base name. */
  readonly input: string;
  /** Other files the arguments name (copied beside the grid and named by their base names). */
  readonly extra?: readonly string[];
  readonly args: readonly string[];
}

export const CASES: readonly GoldenCase[] = [
  // A plain build with default settings: threshold, contour, smooth, checks, write.
  { name: 'lbracket', input: 'fixtures/grids/realistic-lbracket-60x60.npy', args: [] },
  // A half model unfolded about its left edge (exact symmetry), inches in the geometry files.
  { name: 'halfmbb-mirror', input: 'fixtures/grids/realistic-halfmbb-60x20.npy', args: ['--mirror', 'left', '--units', 'in'] },
  // Passive regions, every repair, true circles, a process preset: the longest path through the stages.
  {
    name: 'demo-passive-repair',
    input: 'fixtures/grids/demo-bracket.npy',
    extra: ['fixtures/passive/demo-bracket.passive.json'],
    args: ['--cell-size', '2', '--passive', 'demo-bracket.passive.json', '--repair', '--circles', '--process', 'waterjet-cut', '--thickness', '8'],
  },
  // A small CSV grid with rectangular cells, a fixed level, size checks and nodal values.
  { name: 'csv-nodes', input: 'fixtures/csv/grid-header.csv', args: ['--values', 'nodes', '--cell-size', '2,1', '--level', '0.5', '--min-member', '1', '--min-hole', '1'] },
];

const FILES = (stem: string) => [`${stem}.dxf`, `${stem}.svg`, `${stem}.report.json`, `${stem}.report.html`];

/**
 * The report's run figures — `timings` (stage → ms) and `peakMemory` (bytes) — differ between runs of the same
 * input: checked for their shape, then cut out of the text (they are the report's last two fields). Every other
 * byte is compared.
 */
function maskRunFigures(text: string): string {
  const r = JSON.parse(text) as { timings?: Record<string, unknown>; peakMemory?: unknown };
  expect(Object.keys(r).slice(-2)).toEqual(['timings', 'peakMemory']);
  const stages = Object.entries(r.timings ?? {});
  expect(stages.map(([k]) => k).slice(0, 3)).toEqual(['read', 'prepare', 'threshold']);
  for (const [, ms] of stages) expect(typeof ms === 'number' && ms >= 0).toBe(true);
  expect(Number.isInteger(r.peakMemory) && (r.peakMemory as number) > 0).toBe(true);
  const cut = text.replace(/,\n {2}"timings": \{\n(?: {4}"[a-z]+": [0-9.e+-]+,?\n)+ {2}\},\n {2}"peakMemory": [0-9]+\n\}\n$/, '\n}\n');
  expect(cut, 'timings and peakMemory are cut out exactly').not.toBe(text);
  return cut;
}

/** The version string is the only thing that changes between releases without a change of behaviour. */
function mask(name: string, text: string): string {
  if (name.endsWith('.report.json')) {
    const r = JSON.parse(text) as { tool: { version: string } };
    expect(r.tool.version).toBe(VERSION);
    return maskRunFigures(text).replace(`"version": ${JSON.stringify(VERSION)}`, '"version": "<version>"');
  }
  if (name.endsWith('.html')) return text.split(`rhoform ${VERSION}`).join('rhoform <version>');
  return text;
}

function stemOf(file: string): string {
  const b = basename(file);
  return b.slice(0, b.lastIndexOf('.'));
}

describe('golden outputs (bytes of every writer)', () => {
  for (const c of CASES) {
    it(c.name, () => {
      // Built in a fresh folder from copies, so the names in the reports (input, outputs) are the same on any machine.
      const out = tempDir();
      for (const f of [c.input, ...(c.extra ?? [])]) copyFileSync(join(root, f), join(out, basename(f)));
      const r = cli(['build', basename(c.input), ...c.args], out);
      expect(r.stderr).not.toMatch(/error/);
      expect([0, 1]).toContain(r.code);
      const dir = join(here, c.name);
      const update = process.env.RHOFORM_UPDATE_GOLDEN === '1';
      for (const f of FILES(stemOf(c.input))) {
        const got = mask(f, readFileSync(join(out, f), 'utf8'));
        const path = join(dir, f);
        if (update) {
          writeFileSync(path, got);
          continue;
        }
        const want = readFileSync(path, 'utf8');
        const changed = `${path}-changed`;
        if (got !== want && !process.env.CI) writeFileSync(changed, got);
        else if (existsSync(changed)) rmSync(changed);
        expect(got, `${c.name}/${f} differs from its golden (see ${f}-changed)`).toBe(want);
      }
    });
  }
});
