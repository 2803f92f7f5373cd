/**
 * `rhoform batch` end to end, on worker threads: the binary as shipped (tsc into a temporary folder, then the
 * CLI bundle, scripts/bundle-cli.mjs; worker threads cannot load the TypeScript sources) runs on
 * fixtures/batch/ (three valid grids, one ragged CSV).
 *
 * Oracle: each file's own single build (`rhoform build <file> --json`, in-process from the TypeScript
 * sources) — the summary row must repeat its report's numbers, and the broken file's row its error code.
 */
import { execFileSync, spawn, spawnSync } from 'node:child_process';
import { copyFileSync, existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Report } from '../../src/types.js';
import { readCsv } from './batch-csv-reader.js';
import { cli } from './harness.js';
import { bundleCli } from '../../scripts/bundle-cli.mjs';

const root = resolve(import.meta.dirname, '../..');
const FIX = 'fixtures/batch';
const GOOD = ['fixtures/batch/cantilever-100x50.npy', 'fixtures/batch/halfmbb-60x20.csv', 'fixtures/batch/nested/lbracket-60x60.npy'];
const BROKEN = 'fixtures/batch/broken-ragged.csv';
/** Check limits so that the four statuses all occur (fixtures/make/README.md). */
const CHECKS = ['--min-member', '1.5', '--min-hole', '1.5'];

let build = '';
let mainJs = '';
const work = mkdtempSync(join(tmpdir(), 'rhoform-batch-e2e-'));

function rhoform(args: string[], cwd = root): { code: number; stdout: string; stderr: string } {
  const r = spawnSync(process.execPath, [mainJs, ...args], { cwd, encoding: 'utf8', env: { ...process.env, NO_COLOR: '1' } });
  return { code: r.status ?? -1, stdout: r.stdout, stderr: r.stderr };
}

beforeAll(async () => {
  build = mkdtempSync(join(tmpdir(), 'rhoform-dist-'));
  const tsc = join(root, 'node_modules/typescript/bin/tsc');
  // Type errors elsewhere in the tree must not stop the emit; the check below is that the binary exists.
  spawnSync(process.execPath, [tsc, '-p', join(root, 'tsconfig.build.json'), '--outDir', join(build, 'dist')], { encoding: 'utf8' });
  writeFileSync(join(build, 'package.json'), '{"type":"module"}\n');
  symlinkSync(join(root, 'node_modules'), join(build, 'node_modules'));
  await bundleCli(join(build, 'dist'));
  mainJs = join(build, 'dist/cli/main.js');
  expect(existsSync(join(build, 'dist/bin/batch/worker.js'))).toBe(true);
}, 120_000);

afterAll(() => {
  rmSync(build, { recursive: true, force: true });
  rmSync(work, { recursive: true, force: true });
});

interface Row {
  file: string;
  status: string;
  level: number | null;
  achievedFraction: number | null;
  finalFraction: number | null;
  thinnestMember: number | null;
  smallestHole: number | null;
  findings: number | null;
  exitCode: number;
  timeMs: number;
  errorCode: string | null;
  error: string | null;
}

describe('rhoform batch fixtures/batch', () => {
  let summary: { schemaVersion: number; settings: Record<string, unknown>; shard: unknown; files: Row[]; totals: Record<string, number>; exitCode: number };
  let run: { code: number; stdout: string; stderr: string };
  const out = join(work, 'all');

  beforeAll(() => {
    run = rhoform(['batch', FIX, '--out-dir', out, '--jobs', '2', ...CHECKS]);
    summary = JSON.parse(readFileSync(join(out, 'batch-summary.json'), 'utf8'));
  }, 60_000);

  it('exits 2 (one file could not be processed) and lists every file once, sorted', () => {
    expect(run.code).toBe(2);
    expect(summary.schemaVersion).toBe(1);
    expect(summary.shard).toBeNull();
    expect(summary.files.map((r) => r.file)).toEqual([BROKEN, ...GOOD]);
    expect(summary.totals).toEqual({ files: 4, pass: 1, warn: 1, fail: 1, error: 1 });
    expect(summary.exitCode).toBe(2);
  });

  it("each good row repeats the file's own single-build report", () => {
    const single = join(work, 'single');
    for (const file of GOOD) {
      const r = cli(['build', file, '--json', '--formats', 'json', '--out-dir', single, '--force', ...CHECKS], root);
      const report = JSON.parse(r.stdout) as Report;
      const row = summary.files.find((x) => x.file === file) as Row;
      expect(row.status, file).toBe(report.summary.status);
      expect(row.exitCode, file).toBe(r.code);
      expect(row.level, file).toBe(report.threshold.level);
      expect(row.achievedFraction, file).toBe(report.threshold.achievedFraction);
      expect(row.finalFraction, file).toBe(report.geometry.finalFraction);
      expect(row.thinnestMember, file).toBe(report.checks.find((c) => c.id === 'min-member-size')?.measured);
      expect(row.smallestHole, file).toBe(report.checks.find((c) => c.id === 'min-hole-size')?.measured);
      const findings = report.checks.filter((c) => c.status !== 'pass').reduce((s, c) => s + c.locationsTotal, 0);
      expect(row.findings, file).toBe(findings);
      expect(row.errorCode).toBeNull();
      expect(row.timeMs).toBeGreaterThanOrEqual(0);
    }
    // the batch's settings: the options as given, defaults filled (the per-file choices, such as the layout, stay in each report)
    expect(summary.settings).toMatchObject({ minMember: 1.5, minHole: 1.5, cellSize: [1, 1], cellSizeDefaulted: true, formats: ['dxf', 'svg', 'json', 'html'] });
  });

  it("the broken file's row carries the reader's error, as its single build reports it", () => {
    const row = summary.files[0];
    const r = cli(['build', BROKEN, '--out-dir', join(work, 'single-broken')], root);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain(`error ${row.errorCode}: ${row.error}`);
    expect(row).toMatchObject({ status: 'error', errorCode: 'E_CSV_RAGGED', exitCode: 2, level: null, findings: null });
  });

  it('outputs for every good file, none for the broken one', () => {
    const names = readdirSync(out).sort();
    for (const stem of ['cantilever-100x50', 'halfmbb-60x20', 'lbracket-60x60']) {
      for (const ext of ['.dxf', '.svg', '.report.json', '.report.html']) expect(names).toContain(stem + ext);
    }
    expect(names.some((n) => n.startsWith('broken-ragged'))).toBe(false);
    expect(names.some((n) => n.endsWith('.tmp'))).toBe(false);
  });

  it('the CSV summary reads back (RFC 4180) to the JSON rows', () => {
    const recs = readCsv(readFileSync(join(out, 'batch-summary.csv'), 'utf8'));
    const cols = recs[0];
    expect(recs).toHaveLength(5);
    recs.slice(1).forEach((rec, k) => {
      const row = summary.files[k] as unknown as Record<string, unknown>;
      cols.forEach((c, j) => {
        const v = row[c];
        expect(rec[j], `${k}.${c}`).toBe(v === null ? '' : String(v));
      });
    });
  });

  it('stdout holds the table and totals; progress lines go to stderr', () => {
    expect(run.stdout).toMatch(/^status/);
    expect(run.stdout).toContain('4 files: 1 pass, 1 warn, 1 fail, 1 error; exit code 2');
    expect(run.stdout).not.toContain('rhoform: [');
    const lines = run.stderr.trim().split('\n');
    expect(lines).toHaveLength(4);
    for (const l of lines) expect(l).toMatch(/^rhoform: \[\d\/4\] fixtures\/batch\/\S+: (pass|warn|fail|error)/);
    expect(run.stderr).toContain('fixtures/batch/broken-ragged.csv: error E_CSV_RAGGED 3:10:');
  });

  it('--json: the summary JSON on stdout and nothing else; --quiet: nothing on stderr', () => {
    const j = rhoform(['batch', FIX, '--out-dir', join(work, 'json'), '--json', '--quiet', ...CHECKS]);
    expect(j.code).toBe(2);
    expect(j.stderr).toBe('');
    const s = JSON.parse(j.stdout);
    expect(s.files.map((r: Row) => ({ ...r, timeMs: 0 }))).toEqual(summary.files.map((r) => ({ ...r, timeMs: 0 })));
    const q = rhoform(['batch', GOOD[0], '--out-dir', join(work, 'quiet'), '--quiet']);
    expect(q.code).toBe(0);
    expect(q.stdout + q.stderr).toBe('');
  });

  it('shards 1/2 and 2/2, merged, equal the unsharded summary (times aside)', () => {
    const dir = join(work, 'shards');
    const s1 = rhoform(['batch', FIX, '--out-dir', dir, '--shard', '1/2', '--quiet', ...CHECKS]);
    const s2 = rhoform(['batch', FIX, '--out-dir', dir, '--shard', '2/2', '--quiet', ...CHECKS]);
    expect(s1.code).toBe(2); // shard 1 holds files 0 and 2 of the sorted list: the broken CSV and the CSV beam
    expect(s2.code).toBe(1); // shard 2 holds files 1 and 3: a pass and a fail
    const one = JSON.parse(readFileSync(join(dir, 'batch-summary.shard-1-of-2.json'), 'utf8'));
    expect(one.shard).toEqual({ k: 1, n: 2 });
    expect(one.files.map((r: Row) => r.file)).toEqual([BROKEN, GOOD[1]]);
    expect(existsSync(join(dir, 'batch-summary.shard-2-of-2.csv'))).toBe(true);
    const m = rhoform(['merge', join(dir, 'batch-summary.shard-2-of-2.json'), join(dir, 'batch-summary.shard-1-of-2.json'), '--out-dir', join(dir, 'merged'), '--json']);
    expect(m.code).toBe(2);
    expect(m.stderr).toBe('');
    const merged = JSON.parse(m.stdout);
    const noTimes = (s: typeof summary) => ({ ...s, files: s.files.map((r) => ({ ...r, timeMs: 0 })) });
    expect(noTimes(merged)).toEqual(noTimes(summary));
    expect(JSON.parse(readFileSync(join(dir, 'merged/batch-summary.json'), 'utf8'))).toEqual(merged);
  });
});

describe('rhoform batch: overwrite guard, out-dir layout, exit codes', () => {
  it('an existing summary stops the batch before any work; existing outputs are that file\'s error; --force replaces', () => {
    const out = join(work, 'guard');
    expect(rhoform(['batch', GOOD[0], GOOD[1], '--out-dir', out, '--quiet']).code).toBe(0);
    const again = rhoform(['batch', GOOD[0], GOOD[1], '--out-dir', out]);
    expect(again.code).toBe(2);
    expect(again.stdout).toBe('');
    expect(again.stderr).toMatch(/E_OUTPUT_EXISTS: .*batch-summary\.csv/);
    rmSync(join(out, 'batch-summary.csv'));
    rmSync(join(out, 'batch-summary.json'));
    const perFile = rhoform(['batch', GOOD[0], GOOD[1], '--out-dir', out, '--json']);
    expect(perFile.code).toBe(2);
    const rows = JSON.parse(perFile.stdout).files as Row[];
    expect(rows.map((r) => r.errorCode)).toEqual(['E_OUTPUT_EXISTS', 'E_OUTPUT_EXISTS']);
    const forced = rhoform(['batch', GOOD[0], GOOD[1], '--out-dir', out, '--force', '--json']);
    expect(forced.code).toBe(0);
    expect((JSON.parse(forced.stdout).files as Row[]).map((r) => r.status)).toEqual(['pass', 'warn']);
  });

  it('inputs with the same name keep their folders under the out-dir; a missing path is a row, not a crash', () => {
    const src = join(work, 'runs');
    mkdirSync(join(src, 'a'), { recursive: true });
    mkdirSync(join(src, 'b'), { recursive: true });
    copyFileSync(join(root, GOOD[0]), join(src, 'a/x.npy'));
    copyFileSync(join(root, GOOD[2]), join(src, 'b/x.npy'));
    const r = rhoform(['batch', 'runs', 'nothing-here.npy', '--out-dir', 'out', '--json', '--quiet'], work);
    expect(r.code).toBe(2);
    const rows = JSON.parse(r.stdout).files as Row[];
    expect(rows.map((x) => [x.file, x.status, x.errorCode])).toEqual([
      ['nothing-here.npy', 'error', 'E_INPUT_READ'],
      ['runs/a/x.npy', 'pass', null],
      ['runs/b/x.npy', 'pass', null],
    ]);
    expect(existsSync(join(work, 'out/a/x.dxf'))).toBe(true);
    expect(existsSync(join(work, 'out/b/x.dxf'))).toBe(true);
    expect(readFileSync(join(work, 'out/a/x.dxf'))).not.toEqual(readFileSync(join(work, 'out/b/x.dxf')));
  });

  it('exit 1 when a check fails (or warns under --fail-on warn) and nothing is broken (exit 0 with a warning: the first run of the guard test)', () => {
    expect(rhoform(['batch', GOOD[2], '--out-dir', join(work, 'e1'), '--quiet', ...CHECKS]).code).toBe(1);
    expect(rhoform(['batch', GOOD[1], '--out-dir', join(work, 'e3'), '--quiet', '--fail-on', 'warn']).code).toBe(1);
  });

  it('a named pipe (FIFO) called x.npy is an error row, and the summary is written (it used to block forever)', () => {
    const dir = join(work, 'fifo');
    mkdirSync(dir, { recursive: true });
    execFileSync('mkfifo', [join(dir, 'x.npy')]);
    const r = spawnSync(process.execPath, [mainJs, 'batch', dir, GOOD[0], '--out-dir', join(work, 'fifo-out'), '--quiet'], {
      cwd: root,
      encoding: 'utf8',
      timeout: 60_000,
    });
    expect(r.signal).toBeNull(); // not killed by the timeout
    expect(r.status).toBe(2);
    const summary = JSON.parse(readFileSync(join(work, 'fifo-out/batch-summary.json'), 'utf8')) as { files: Row[] };
    const fifo = summary.files.find((row) => row.file.endsWith('x.npy'));
    expect(fifo?.errorCode).toBe('E_INPUT_READ');
    expect(fifo?.error).toMatch(/expected the input to be a regular file, found a named pipe \(FIFO\)$/);
  });

  it('SIGTERM during a batch removes its temp files and ends by that signal', async () => {
    const out = join(work, 'term-out');
    const child = spawn(process.execPath, [mainJs, 'batch', ...GOOD, '--out-dir', out, '--quiet', '--jobs', '1', '--force'], { cwd: root, stdio: 'ignore' });
    // listen before anything else: on a fast machine the batch may be done before the signal is sent
    const exited = new Promise<NodeJS.Signals | null>((r) => child.on('exit', (_code, sig) => r(sig)));
    // let the pool start, then stop the batch while it works
    await new Promise((r) => setTimeout(r, 1500));
    if (child.exitCode === null && child.signalCode === null) child.kill('SIGTERM');
    const signal = await exited;
    const leftovers = existsSync(out) ? readdirSync(out, { recursive: true }).filter((f) => String(f).endsWith('.tmp')) : [];
    expect(leftovers).toEqual([]);
    // it finished before the signal, or the signal ended it
    expect(signal === 'SIGTERM' || signal === null).toBe(true);
  });

  it.skipIf(!existsSync('/usr/bin/script'))('on a terminal the progress is one line redrawn with \\r', () => {
    // util-linux script(1) gives the command a pseudo-terminal, so stderr.isTTY is true
    const cmd = [process.execPath, mainJs, 'batch', GOOD[0], GOOD[1], '--out-dir', join(work, 'tty')].map((a) => `'${a}'`).join(' ');
    const text = execFileSync('/usr/bin/script', ['-qec', cmd, '/dev/null'], { cwd: root, encoding: 'utf8', env: { ...process.env, NO_COLOR: '1' } });
    expect(text).toMatch(/\rrhoform \[#{20}\] 2\/2/);
    expect(text).not.toMatch(/rhoform: \[1\/2\]/);
  });
});
