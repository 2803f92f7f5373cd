/**
 * Batch pieces in-process: sharding, input collection, output placement, the summary table (CSV read back
 * by an RFC 4180 reader written here), the exit-code rule, progress on stderr, merge, and the worker pool's
 * crash handling. The end-to-end runs on worker threads are in batch-e2e.test.ts.
 */
import { mkdirSync, mkdtempSync, readFileSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { describe, expect, it } from 'vitest';
import { collectInputs } from '../../cli/batch/collect.js';
import { placeOutputs } from '../../cli/batch/layout.js';
import { mergeSummaries, parseSummary } from '../../cli/batch/merge.js';
import { runPool } from '../../cli/batch/pool.js';
import { BatchProgress, buildNotice, progressMode } from '../../cli/batch/progress.js';
import { comparePaths, selectShard, shardOf } from '../../cli/batch/shard.js';
import {
  batchExitCode,
  COLUMNS,
  errorRow,
  makeSummary,
  summaryCsv,
  summaryJson,
  type SummaryRow,
} from '../../cli/batch/summary.js';
import { runAsync } from '../../cli/start.js';
import { rng } from '../support/random.js';
import { readCsv } from './batch-csv-reader.js';

function tmp(): string {
  return mkdtempSync(join(tmpdir(), 'rhoform-batch-'));
}

function row(file: string, status: SummaryRow['status'], exitCode: number): SummaryRow {
  if (status === 'error') return errorRow(file, 'E_CSV_TOKEN', `${file}:1:1: expected a number, found "x"`);
  return {
    file,
    status,
    level: 0.5,
    achievedFraction: 0.4,
    finalFraction: 0.4,
    thinnestMember: null,
    smallestHole: 1.25,
    findings: status === 'pass' ? 0 : 2,
    exitCode,
    timeMs: 12,
    errorCode: null,
    error: null,
  };
}

describe('sharding: the i-th file of the sorted list goes to shard (i mod n) + 1', () => {
  it('a worked example: 10 files in 3 shards', () => {
    // spec (docs/scale.md): round-robin over the sorted list, written out by hand
    const files = Array.from({ length: 10 }, (_x, i) => `f${String(i + 1).padStart(2, '0')}.npy`);
    expect(selectShard(files, { k: 1, n: 3 })).toEqual(['f01.npy', 'f04.npy', 'f07.npy', 'f10.npy']);
    expect(selectShard(files, { k: 2, n: 3 })).toEqual(['f02.npy', 'f05.npy', 'f08.npy']);
    expect(selectShard(files, { k: 3, n: 3 })).toEqual(['f03.npy', 'f06.npy', 'f09.npy']);
    expect(selectShard(files, null)).toEqual(files);
  });

  it('property: over random lists the shards are disjoint, their union is the list, sizes differ by ≤ 1', () => {
    const rnd = rng(4242);
    for (let trial = 0; trial < 200; trial++) {
      const len = Math.floor(rnd() * 40);
      const set = new Set<string>();
      while (set.size < len) set.add(`d${Math.floor(rnd() * 5)}/g${Math.floor(rnd() * 1000)}.${rnd() < 0.5 ? 'npy' : 'csv'}`);
      const sorted = [...set].sort(comparePaths);
      const n = 1 + Math.floor(rnd() * 9);
      const shards = Array.from({ length: n }, (_x, k) => selectShard(sorted, { k: k + 1, n }));
      const all = shards.flat();
      expect(all.length).toBe(sorted.length); // no file twice
      expect(new Set(all).size).toBe(sorted.length);
      expect([...all].sort(comparePaths)).toEqual(sorted); // union = the whole list
      const sizes = shards.map((s) => s.length);
      expect(Math.max(...sizes) - Math.min(...sizes)).toBeLessThanOrEqual(1);
      sorted.forEach((f, i) => expect(shards[(i % n)].includes(f)).toBe(true)); // the defining formula
      sorted.forEach((_f, i) => expect(shardOf(i, n)).toBe((i % n) + 1));
    }
  });

  it('the order is by code unit, not the locale (same on every machine)', () => {
    expect(['b.npy', 'B.npy', 'a.npy', 'A.npy', 'ä.npy'].sort(comparePaths)).toEqual(['A.npy', 'B.npy', 'a.npy', 'b.npy', 'ä.npy']);
  });
});

describe('collecting the inputs', () => {
  it('expands folders recursively to *.csv, *.tsv, *.txt, *.npy, sorted, without duplicates; a missing path is an entry with its error', () => {
    const dir = tmp();
    mkdirSync(join(dir, 'runs/b'), { recursive: true });
    mkdirSync(join(dir, 'runs/.hidden'), { recursive: true });
    for (const f of ['runs/z.npy', 'runs/b/y.CSV', 'runs/b/x.tsv', 'runs/a.txt', 'runs/notes.md', 'runs/x.report.json', 'runs/.hidden/h.npy', 'runs/batch-summary.csv', 'runs/batch-summary.shard-1-of-2.csv']) {
      writeFileSync(join(dir, f), '0,1\n1,0\n');
    }
    symlinkSync(join(dir, 'runs/z.npy'), join(dir, 'runs/b/link-to-z.npy'));
    const { inputs, notes } = collectInputs(['runs', './runs/z.npy', 'runs/b', 'missing.npy'], dir);
    // z.npy is reached three times (folder, explicitly, through a link): once, under the name that sorts first
    expect(inputs.map((f) => f.file)).toEqual(['missing.npy', 'runs/a.txt', 'runs/b/link-to-z.npy', 'runs/b/x.tsv', 'runs/b/y.CSV']);
    const missing = inputs[0];
    expect(missing.error?.code).toBe('E_INPUT_READ');
    expect(missing.error?.message).toMatch(/missing\.npy: no such file or folder/);
    expect(inputs.slice(1).every((f) => f.error === null)).toBe(true);
    expect(notes).toEqual([]);
  });

  it('a folder without grids is a note, not an error', () => {
    const dir = tmp();
    mkdirSync(join(dir, 'empty'));
    const { inputs, notes } = collectInputs(['empty'], dir);
    expect(inputs).toEqual([]);
    expect(notes[0]).toMatch(/^empty: no grid files/);
  });
});

describe('output folders', () => {
  const input = (file: string) => ({ file, path: `/w/${file}`, error: null });

  it('distinct stems: every output straight into the out-dir', () => {
    const { placed, mirrored } = placeOutputs([input('a/x.npy'), input('b/y.npy')], '/out');
    expect(mirrored).toBe(false);
    expect(placed.map((p) => p.outDir)).toEqual(['/out', '/out']);
  });

  it('a shared stem: every input keeps its folder below the deepest common folder', () => {
    const { placed, mirrored } = placeOutputs([input('runs/a/x.npy'), input('runs/b/x.npy'), input('runs/c.npy')], '/out');
    expect(mirrored).toBe(true);
    expect(placed.map((p) => p.outDir)).toEqual(['/out/a', '/out/b', '/out']);
    expect(placed.every((p) => p.error === null)).toBe(true);
  });

  it('same folder, same stem (x.csv, X.npy): both refused, neither chosen silently', () => {
    const { placed } = placeOutputs([input('r/X.npy'), input('r/other/x.npy'), input('r/x.csv')], '/out');
    expect(placed[0].error?.code).toBe('E_USAGE');
    expect(placed[0].error?.message).toMatch(/r\/x\.csv/);
    expect(placed[1].error).toBeNull();
    expect(placed[1].outDir).toBe('/out/other');
    expect(placed[2].error?.code).toBe('E_USAGE');
  });
});

describe('summary table', () => {
  it('CSV: header, RFC 4180 quoting, "." decimal; read back by an independent reader equals the rows', () => {
    const tricky = errorRow('odd, "name"\nx.csv', 'E_CSV_RAGGED', 'odd:3:4: expected 5 values, found "4"');
    const rows = [row('a.npy', 'pass', 0), tricky, { ...row('b.npy', 'warn', 0), level: 1e-7, thinnestMember: 0.125 }];
    const csv = summaryCsv(rows);
    // RFC 4180 §2.6–2.7: the field with a comma, quote and line break is quoted, the quotes doubled
    expect(csv).toContain('"odd, ""name""\nx.csv",error,');
    const back = readCsv(csv);
    expect(back[0]).toEqual([...COLUMNS]);
    expect(back).toHaveLength(4);
    rows.forEach((r, k) => {
      const rec = back[k + 1];
      COLUMNS.forEach((c, j) => {
        const v = r[c];
        if (v === null) expect(rec[j]).toBe('');
        else if (typeof v === 'number') expect(Number(rec[j])).toBe(v);
        else expect(rec[j]).toBe(v);
      });
    });
    expect(csv.split('\r\n')[1]).toBe('a.npy,pass,0.5,0.4,0.4,,1.25,0,0,12,,'); // known string
  });

  it('JSON: schemaVersion 1, totals, exit code, rows with every column', () => {
    const rows = [row('a.npy', 'pass', 0), row('b.npy', 'fail', 1), row('c.npy', 'error', 2)];
    const s = JSON.parse(summaryJson(makeSummary({ name: 'rhoform', version: '9' }, { smooth: 2 }, { k: 2, n: 3 }, rows)));
    expect(s.schemaVersion).toBe(1);
    expect(s.shard).toEqual({ k: 2, n: 3 });
    expect(s.totals).toEqual({ files: 3, pass: 1, warn: 0, fail: 1, error: 1 });
    expect(s.exitCode).toBe(2);
    expect(Object.keys(s.files[0])).toEqual([...COLUMNS]);
  });

  it('exit code: 2 if any file could not be processed, else 1 if any file exit code is 1, else 0 (docs/cli.md)', () => {
    expect(batchExitCode([])).toBe(0);
    expect(batchExitCode([row('a', 'pass', 0), row('b', 'warn', 0)])).toBe(0);
    expect(batchExitCode([row('a', 'pass', 0), row('b', 'warn', 1)])).toBe(1); // --fail-on warn
    expect(batchExitCode([row('a', 'fail', 1), row('b', 'pass', 0)])).toBe(1);
    expect(batchExitCode([row('a', 'fail', 1), row('b', 'error', 2), row('c', 'pass', 0)])).toBe(2);
    expect(batchExitCode([row('b', 'error', 2)])).toBe(2);
  });
});

describe('progress on stderr', () => {
  it('a terminal gets one line redrawn with \\r, ended by a newline at the finish', () => {
    let err = '';
    const p = new BatchProgress((t) => (err += t), 3, progressMode(false, true), { now: () => 0 });
    p.fileDone('a.npy', 'pass', 100);
    p.fileDone('b.npy', 'fail', 100);
    expect(err).not.toContain('\n');
    expect(err.split('\r').length).toBeGreaterThanOrEqual(3);
    expect(err).toMatch(/\[#+\.+\] 2\/3 1 failed/);
    p.note('rhoform: warning: b.npy: something');
    expect(err).toMatch(/\r\u001b\[Krhoform: warning: b\.npy: something\n\r/);
    p.fileDone('c.npy', 'pass', 100);
    p.finish();
    expect(err.endsWith('\n')).toBe(true);
    expect(err).toMatch(/\[#{20}\] 3\/3/);
  });

  it('elsewhere one terse line per file', () => {
    let err = '';
    const p = new BatchProgress((t) => (err += t), 12, progressMode(false, false));
    p.fileDone('runs/a.npy', 'pass', 812);
    p.fileDone('runs/b.csv', 'error', 3, 'E_CSV_RAGGED 3:4: expected 5 values, found 4');
    p.finish();
    expect(err).toBe('rhoform: [ 1/12] runs/a.npy: pass (0.8 s)\nrhoform: [ 2/12] runs/b.csv: error E_CSV_RAGGED 3:4: expected 5 values, found 4 (0.0 s)\n');
  });

  it('--quiet prints nothing', () => {
    let err = '';
    const p = new BatchProgress((t) => (err += t), 2, progressMode(true, true));
    p.fileDone('a.npy', 'pass', 1);
    p.finish();
    expect(err).toBe('');
    buildNotice((t) => (err += t), progressMode(true, false), 'big.npy', 1e9)();
    expect(err).toBe('');
  });

  it('a single build: a start line only for a large input (≥ 8 MB), erased again on a terminal', () => {
    let err = '';
    buildNotice((t) => (err += t), 'lines', 'small.npy', 1e6)();
    expect(err).toBe('');
    buildNotice((t) => (err += t), 'lines', 'big.npy', 64 * 1024 * 1024)();
    expect(err).toBe('rhoform: building big.npy (64 MB)…\n');
    err = '';
    const done = buildNotice((t) => (err += t), 'bar', 'big.npy', 64 * 1024 * 1024);
    expect(err).toBe('rhoform: building big.npy (64 MB)…');
    done();
    expect(err.endsWith('\r\u001b[K')).toBe(true);
  });

  it('a single build of a large grid (1100×1000 float64, 8.4 MB): the notice on stderr, nothing of it on stdout', async () => {
    const dir = tmp();
    const rows = 1000;
    const cols = 1100;
    // NPY 1.0 (numpy's format spec): magic, version, header length, dict header padded to 64 bytes
    let header = `{'descr': '<f8', 'fortran_order': False, 'shape': (${rows}, ${cols}), }`;
    header += ' '.repeat((64 - ((10 + header.length + 1) % 64)) % 64) + '\n';
    const bytes = new Uint8Array(10 + header.length + rows * cols * 8);
    bytes.set([0x93, 0x4e, 0x55, 0x4d, 0x50, 0x59, 1, 0, header.length & 0xff, header.length >> 8]);
    for (let k = 0; k < header.length; k++) bytes[10 + k] = header.charCodeAt(k);
    new Float64Array(bytes.buffer, 10 + header.length).fill(1); // constant solid: no threshold search, fast
    writeFileSync(join(dir, 'big.npy'), bytes);
    const runIt = async (argv: string[], stderrIsTTY: boolean) => {
      let out = '';
      let err = '';
      const code = await runAsync(argv, { stdout: (t) => (out += t), stderr: (t) => (err += t), isTTY: false, stderrIsTTY, env: {}, cwd: dir });
      return { code, out, err };
    };
    const a = await runIt(['check', 'big.npy', '--out-dir', 'o1'], false);
    expect(a.code).toBe(0);
    expect(a.err).toMatch(/^rhoform: building big\.npy \(8 MB\)…\n/);
    expect(a.out).not.toContain('building');
    const b = await runIt(['check', 'big.npy', '--out-dir', 'o2', '--quiet'], true);
    expect(b.code).toBe(0);
    expect(b.err).not.toContain('building');
    const c = await runIt(['check', 'big.npy', '--out-dir', 'o3', '--json'], true);
    expect(c.err.startsWith('rhoform: building big.npy (8 MB)…\r\u001b[K')).toBe(true);
    expect(JSON.parse(c.out).input.nx).toBe(cols);
  });
});

describe('merge', () => {
  const settings = { smooth: 2, formats: ['dxf'] };
  const shardText = (k: number, n: number, rows: SummaryRow[], s: Record<string, unknown> = settings) =>
    summaryJson(makeSummary({ name: 'rhoform', version: '0' }, s, { k, n }, rows));

  it('joins shards sorted by file, recomputes totals and exit code', () => {
    const a = parseSummary('s1.json', shardText(1, 2, [row('a.npy', 'pass', 0), row('c.npy', 'fail', 1)]));
    const b = parseSummary('s2.json', shardText(2, 2, [row('b.npy', 'warn', 0)]));
    const { summary, notes } = mergeSummaries([{ name: 's2.json', summary: b }, { name: 's1.json', summary: a }], { name: 'rhoform', version: '0' });
    expect(summary.files.map((r) => r.file)).toEqual(['a.npy', 'b.npy', 'c.npy']);
    expect(summary.totals).toEqual({ files: 3, pass: 1, warn: 1, fail: 1, error: 0 });
    expect(summary.exitCode).toBe(1);
    expect(summary.shard).toBeNull();
    expect(notes).toEqual([]);
  });

  it('names a missing shard of the split', () => {
    const a = parseSummary('s1.json', shardText(1, 3, [row('a.npy', 'pass', 0)]));
    expect(mergeSummaries([{ name: 's1.json', summary: a }], { name: 'rhoform', version: '0' }).notes[0]).toMatch(/shards 2\/3, 3\/3 not given/);
  });

  it('refuses a file present in two summaries, naming both', async () => {
    const dir = tmp();
    writeFileSync(join(dir, 's1.json'), shardText(1, 2, [row('a.npy', 'pass', 0), row('x.npy', 'pass', 0)]));
    writeFileSync(join(dir, 's2.json'), shardText(2, 2, [row('x.npy', 'fail', 1)]));
    let out = '';
    let err = '';
    const code = await runAsync(['merge', 's1.json', 's2.json', '--out-dir', 'm'], { stdout: (t) => (out += t), stderr: (t) => (err += t), isTTY: false, env: {}, cwd: dir });
    expect(code).toBe(2);
    expect(out).toBe('');
    expect(err).toMatch(/E_SUMMARY_FORMAT: s2\.json: expected each file in one summary only, found x\.npy in both s1\.json and s2\.json/);
  });

  it('refuses bad summaries with the file name and what was wrong', async () => {
    const dir = tmp();
    const cases: [string, string, RegExp][] = [
      ['notjson.json', '{"schemaVersion": 1,\n  "files": [1 2]}', /notjson\.json:2:15: expected a batch summary \(JSON\), found text that is not JSON/],
      ['notjson2.json', 'file,status\r\n', /notjson2\.json:1:1: expected a batch summary \(JSON\), found text that is not JSON/],
      ['v2.json', '{"schemaVersion": 2, "files": []}', /v2\.json: schemaVersion: expected 1, found 2/],
      ['nofiles.json', '{"schemaVersion": 1, "settings": {}}', /nofiles\.json: files: expected an array of rows, found nothing/],
      ['badrow.json', shardText(1, 1, [row('a.npy', 'pass', 0)]).replace('"pass"', '"great"'), /badrow\.json: files\[0\]\.status: expected one of pass, warn, fail, error, found "great"/],
      ['nosettings.json', '{"schemaVersion": 1, "files": []}', /nosettings\.json: settings: expected an object/],
      ['array.json', '[]', /array\.json: expected a batch summary \(a JSON object\), found an array/],
    ];
    for (const [name, text, re] of cases) {
      writeFileSync(join(dir, name), text);
      let err = '';
      const code = await runAsync(['merge', name], { stdout: () => {}, stderr: (t) => (err += t), isTTY: false, env: {}, cwd: dir });
      expect(code, name).toBe(2);
      expect(err, name).toMatch(/E_SUMMARY_FORMAT/);
      expect(err, name).toMatch(re);
    }
    let err = '';
    expect(await runAsync(['merge', 'absent.json'], { stdout: () => {}, stderr: (t) => (err += t), isTTY: false, env: {}, cwd: dir })).toBe(2);
    expect(err).toMatch(/E_INPUT_READ: absent\.json: cannot read the summary \(no such file\)/);
  });

  it('refuses shards built with different settings', () => {
    const a = parseSummary('s1.json', shardText(1, 2, [row('a.npy', 'pass', 0)]));
    const b = parseSummary('s2.json', shardText(2, 2, [row('b.npy', 'pass', 0)], { ...settings, smooth: 5 }));
    expect(() => mergeSummaries([{ name: 's1.json', summary: a }, { name: 's2.json', summary: b }], { name: 'rhoform', version: '0' })).toThrow(
      /s2\.json: expected the settings of s1\.json, found a different smooth/,
    );
  });

  it('writes batch-summary.csv/.json into --out-dir, respects --force, prints the table (or only JSON with --json)', async () => {
    const dir = tmp();
    writeFileSync(join(dir, 's1.json'), shardText(1, 2, [row('a.npy', 'pass', 0)]));
    writeFileSync(join(dir, 's2.json'), shardText(2, 2, [row('b.npy', 'error', 2)]));
    const go = async (argv: string[]) => {
      let out = '';
      let err = '';
      const code = await runAsync(argv, { stdout: (t) => (out += t), stderr: (t) => (err += t), isTTY: false, env: {}, cwd: dir });
      return { code, out, err };
    };
    const r1 = await go(['merge', 's1.json', 's2.json', '--out-dir', 'm']);
    expect(r1.code).toBe(2);
    expect(r1.err).toBe('');
    expect(r1.out).toMatch(/2 files: 1 pass, 0 warn, 0 fail, 1 error; exit code 2/);
    const written = JSON.parse(readFileSync(join(dir, 'm/batch-summary.json'), 'utf8'));
    expect(written.files.map((f: SummaryRow) => f.file)).toEqual(['a.npy', 'b.npy']);
    expect(readCsv(readFileSync(join(dir, 'm/batch-summary.csv'), 'utf8'))).toHaveLength(3);
    const r2 = await go(['merge', 's1.json', 's2.json', '--out-dir', 'm']);
    expect(r2.code).toBe(2);
    expect(r2.err).toMatch(/E_OUTPUT_EXISTS/);
    const r3 = await go(['merge', 's1.json', 's2.json', '--out-dir', 'm', '--force', '--json']);
    expect(JSON.parse(r3.out)).toEqual(written);
    expect(r3.err).toBe('');
    const r4 = await go(['merge', 's1.json', 's2.json', '--out-dir', 'm', '--force', '--quiet']);
    expect(r4.out + r4.err).toBe('');
  });
});

describe('worker pool', () => {
  it('a worker that throws or exits costs only its task; the rest of the queue runs on fresh workers, results in task order', async () => {
    const dir = tmp();
    const script = join(dir, 'worker.mjs');
    // A protocol-conforming worker of the test's own: answers { id, result }, or dies as the task asks.
    writeFileSync(
      script,
      `import { parentPort } from 'node:worker_threads';
parentPort.on('message', ({ id, task }) => {
  if (task === 'throw') throw new Error('boom in the worker');
  if (task === 'exit') process.exit(7);
  if (task === 'log') console.log('worker says hi');
  parentPort.postMessage({ id, result: 'ok:' + task });
});
`,
    );
    const seen: number[] = [];
    let output = '';
    const tasks = ['a', 'throw', 'b', 'exit', 'c', 'log', 'd'];
    const results = await runPool<string, string>(tasks, {
      workerUrl: pathToFileURL(script),
      workerData: null,
      jobs: 2,
      crashed: (t, reason) => `crashed:${t}:${reason}`,
      onResult: (k) => seen.push(k),
      onOutput: (t) => (output += t),
    });
    expect(results[0]).toBe('ok:a');
    expect(results[1]).toMatch(/^crashed:throw:.*boom in the worker/);
    expect(results[2]).toBe('ok:b');
    expect(results[3]).toMatch(/^crashed:exit:.*exit code 7/);
    expect(results.slice(4)).toEqual(['ok:c', 'ok:log', 'ok:d']);
    expect([...seen].sort((x, y) => x - y)).toEqual([0, 1, 2, 3, 4, 5, 6]);
    expect(output).toContain('worker says hi'); // worker stdout is handed over, never written to stdout
  });

  it('no tasks: no workers, no results', async () => {
    expect(await runPool([], { workerUrl: new URL('file:///nonexistent.mjs'), workerData: null, jobs: 4, crashed: () => 0 })).toEqual([]);
  });
});
