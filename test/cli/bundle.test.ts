/**
 * The binary as shipped: the CLI bundle (scripts/bundle-cli.mjs) in a temporary package, run as users run it.
 * What can break in a bundle and not in tsc's output: files found relative to a module (the demo's fixtures, the
 * worker scripts), the lazily loaded parts (HTML report, repairs, re-check, boolean engine), and the lanes, whose
 * threads import a module by URL and call an export by name. Oracle: the same commands run in-process from the
 * TypeScript sources (test/cli/harness.ts), and for the lane thread the analytic 1-D distance transform.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { bundleCli, laneEntry, LANE_MODULES } from '../../scripts/bundle-cli.mjs';
import { cli, tempDir } from './harness.js';

const root = resolve(import.meta.dirname, '../..');
const pkg = mkdtempSync(join(tmpdir(), 'rhoform-bundle-'));
const mainJs = join(pkg, 'dist/cli/main.js');
const bin = join(pkg, 'dist/bin');

function rhoform(args: string[], cwd: string): { code: number; stdout: string; stderr: string } {
  const r = spawnSync(process.execPath, [mainJs, ...args], { cwd, encoding: 'utf8', env: { ...process.env, NO_COLOR: '1' } });
  return { code: r.status ?? -1, stdout: r.stdout, stderr: r.stderr };
}

/** A node script's stdout as JSON. */
function nodeJson(script: string): unknown {
  const file = join(pkg, `script-${Math.random().toString(36).slice(2)}.mjs`);
  writeFileSync(file, script);
  const r = spawnSync(process.execPath, [file], { encoding: 'utf8' });
  expect(r.stderr).toBe('');
  return JSON.parse(r.stdout);
}

/** The report without its run figures (they differ from run to run): timings, peak memory, the solver's seconds. */
const steady = (json: string): string =>
  json.replace(/"timings": \{[^}]*\},\s*"peakMemory": \d+,?/, '').replace(/"seconds": [0-9.e+-]+/g, '"seconds": 0');

beforeAll(async () => {
  // the package as installed: package.json, the bundle, the demo's fixtures, the dependencies
  await bundleCli(join(pkg, 'dist'));
  writeFileSync(join(pkg, 'package.json'), readFileSync(join(root, 'package.json')));
  symlinkSync(join(root, 'node_modules'), join(pkg, 'node_modules'));
  symlinkSync(join(root, 'fixtures'), join(pkg, 'fixtures'));
}, 60_000);

afterAll(() => rmSync(pkg, { recursive: true, force: true }));

describe('the bundled binary', () => {
  it('answers --version and a usage error as the sources do', () => {
    const dir = tempDir();
    const version = rhoform(['--version'], dir);
    expect(version.code).toBe(0);
    expect(version.stdout).toBe(`${JSON.parse(readFileSync(join(root, 'package.json'), 'utf8')).version}\n`);
    const bad = rhoform(['build', 'x.csv', '--bogus'], dir);
    const same = cli(['build', 'x.csv', '--bogus'], dir);
    expect(bad.code).toBe(2);
    expect(bad.code).toBe(same.code);
    expect(bad.stderr).toBe(same.stderr);
    expect(bad.stdout).toBe('');
  });

  it('runs the demo (fixtures beside the package, passive regions, repairs, re-check, HTML) with the bytes of the sources', () => {
    // the same output folder name in two folders: the report lists its outputs
    const [b, s] = [tempDir(), tempDir()];
    const bundled = rhoform(['demo', '--out-dir', 'out', '--quiet'], b);
    expect(bundled.stderr).toBe('');
    expect(bundled.code).toBe(0);
    const sources = cli(['demo', '--out-dir', 'out', '--quiet'], s);
    expect(sources.code).toBe(0);
    for (const f of ['demo-bracket.dxf', 'demo-bracket.svg', 'demo-bracket.report.html']) {
      expect(readFileSync(join(b, 'out', f)).equals(readFileSync(join(s, 'out', f))), f).toBe(true);
    }
    const json = (d: string) => steady(readFileSync(join(d, 'out', 'demo-bracket.report.json'), 'utf8'));
    expect(json(b)).toContain('"structure"');
    expect(json(b)).toBe(json(s));
  }, 60_000);
});

describe('the lanes from the bundle', () => {
  /** Task names each lane module hands to the lanes: runSplit(here, 'name', …) and { …, name: 'name', … }. */
  const taskNames = (module: string): string[] => {
    const text = readFileSync(join(root, module), 'utf8');
    return [...text.matchAll(/runSplit\((?:here|import\.meta\.url), '(\w+)'|\bname: '(\w+)'/g)].map((m) => m[1] ?? m[2]);
  };

  it('gives every module that hands tasks to the lanes an entry exporting each task by name', () => {
    const expected = LANE_MODULES.map((m) => [laneEntry(m), taskNames(m)] as const);
    for (const [, names] of expected) expect(names.length).toBeGreaterThan(0);
    const got = nodeJson(
      [
        `const out = {};`,
        ...expected.map(([entry, names]) =>
          `{ const m = await import(${JSON.stringify(pathToFileURL(join(bin, entry)).href)}); out[${JSON.stringify(entry)}] = ${JSON.stringify(names)}.filter((n) => typeof m[n] === 'function'); }`,
        ),
        `console.log(JSON.stringify(out));`,
      ].join('\n'),
    );
    expect(got).toEqual(Object.fromEntries(expected.map(([entry, names]) => [entry, names])));
  });

  it("runs a task on the bundled lane thread: the column pass of the distance transform", () => {
    // Felzenszwalb & Huttenlocher 2012 (src/morph/edt.ts): with f = 0 at row 2 and +Infinity elsewhere, the 1-D
    // transform down each column is the squared distance (j − 2)² and its minimiser is row 2.
    const nx = 3;
    const ny = 6;
    const got = nodeJson(`
      import { Worker, MessageChannel, receiveMessageOnPort } from 'node:worker_threads';
      const nx = ${nx}, ny = ${ny};
      const f = new Float64Array(new SharedArrayBuffer(8 * nx * ny)).fill(Infinity);
      for (let i = 0; i < nx; i++) f[2 * nx + i] = 0;
      const arg = new Int32Array(new SharedArrayBuffer(4 * nx * ny));
      const done = new Int32Array(new SharedArrayBuffer(4));
      const { port1, port2 } = new MessageChannel();
      const w = new Worker(new URL(${JSON.stringify(pathToFileURL(join(bin, 'worker.js')).href)}), { workerData: { port: port2, done, slot: 0 }, transferList: [port2] });
      w.postMessage({ module: ${JSON.stringify(pathToFileURL(join(bin, laneEntry('src/morph/edt.ts'))).href)}, name: 'columnPass', args: [f, arg, nx, ny, 0, nx] });
      Atomics.wait(done, 0, 0, 30000);
      const answer = receiveMessageOnPort(port1)?.message;
      await w.terminate();
      console.log(JSON.stringify({ answer, f: [...f], arg: [...arg] }));
    `) as { answer: { error?: string }; f: number[]; arg: number[] };
    expect(got.answer.error).toBeUndefined();
    for (let j = 0; j < ny; j++) {
      for (let i = 0; i < nx; i++) {
        expect(got.f[j * nx + i]).toBe((j - 2) ** 2);
        expect(got.arg[j * nx + i]).toBe(2);
      }
    }
  }, 60_000);
});
