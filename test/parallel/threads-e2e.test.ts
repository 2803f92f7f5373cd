/**
 * Both cores, end to end: the binary as shipped (tsc into a temporary folder, then the CLI bundle,
 * scripts/bundle-cli.mjs; worker threads cannot load the TypeScript sources) builds the same grid with RHOFORM_THREADS=1 and =2. The grid is large enough that the
 * morphology raster (2.4 M pixels) and the density picture (605 KB of samples) are split over the threads;
 * every output file must be the same bytes, the report's run figures (timings, peak memory) aside.
 */
import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { afterAll, beforeAll, expect, it } from 'vitest';
import { npyFloat64 } from '../bench/npy-write.js';
import { platePattern } from '../bench/plate.js';
import { bundleCli } from '../../scripts/bundle-cli.mjs';

const root = resolve(import.meta.dirname, '../..');
const work = mkdtempSync(join(tmpdir(), 'rhoform-threads-'));
let mainJs = '';
let distSrc = '';

beforeAll(async () => {
  const build = join(work, 'pkg');
  mkdirSync(build);
  const tsc = join(root, 'node_modules/typescript/bin/tsc');
  spawnSync(process.execPath, [tsc, '-p', join(root, 'tsconfig.build.json'), '--outDir', join(build, 'dist')], { encoding: 'utf8' });
  writeFileSync(join(build, 'package.json'), '{"type":"module"}\n');
  symlinkSync(join(root, 'node_modules'), join(build, 'node_modules'));
  await bundleCli(join(build, 'dist'));
  mainJs = join(build, 'dist/cli/main.js');
  distSrc = join(build, 'dist/src');
  expect(existsSync(join(build, 'dist/src/parallel/worker.js'))).toBe(true);
  writeFileSync(join(work, 'plate.npy'), npyFloat64(platePattern(1100, 550), 550, 1100));
}, 120_000);

afterAll(() => rmSync(work, { recursive: true, force: true }));

function buildWith(threads: string): Map<string, string> {
  const out = join(work, 'out');
  rmSync(out, { recursive: true, force: true });
  mkdirSync(out);
  const r = spawnSync(
    process.execPath,
    [mainJs, 'build', 'plate.npy', '--out-dir', 'out', '--quiet', '--min-member', '3', '--min-hole', '3', '--tool-radius', '1'],
    { cwd: work, encoding: 'utf8', env: { ...process.env, RHOFORM_THREADS: threads } },
  );
  expect([0, 1]).toContain(r.status);
  const files = new Map<string, string>();
  for (const name of ['plate.dxf', 'plate.svg', 'plate.report.json', 'plate.report.html']) {
    // the run figures differ from run to run
    const text = readFileSync(join(out, name), 'latin1');
    files.set(name, text.replace(/"timings": \{[^}]*\},\s*"peakMemory": \d+/, '').replace(/"timings":\{[^}]*\},"peakMemory":\d+/, ''));
  }
  return files;
}

it('runs a task on another thread and answers on the calling one', () => {
  // the compiled lanes: each call reports the thread it ran on (0 = the main thread)
  writeFileSync(join(work, 'tid.mjs'), "import { threadId } from 'node:worker_threads'; export function tid(k) { return [k, threadId]; }\n");
  const script = [
    `import { startLanes } from '${pathToFileURL(join(distSrc, 'parallel/node.js')).href}';`,
    `import { runSplit } from '${pathToFileURL(join(distSrc, 'parallel/lanes.js')).href}';`,
    `import { tid } from '${pathToFileURL(join(work, 'tid.mjs')).href}';`,
    `const lanes = startLanes(3);`,
    `console.log(JSON.stringify({ lanes, got: runSplit('${pathToFileURL(join(work, 'tid.mjs')).href}', 'tid', tid, [[0], [1], [2], [3]]) }));`,
  ].join('\n');
  writeFileSync(join(work, 'lanes.mjs'), script);
  const r = spawnSync(process.execPath, [join(work, 'lanes.mjs')], { encoding: 'utf8' });
  const { lanes, got } = JSON.parse(r.stdout) as { lanes: number; got: [number, number][] };
  expect(lanes).toBe(3);
  expect(got.map(([k]) => k)).toEqual([0, 1, 2, 3]);
  expect(got[0][1]).toBe(0);
  for (const [, thread] of got.slice(1)) expect(thread).toBeGreaterThan(0);
  expect(new Set(got.slice(1).map(([, t]) => t)).size).toBe(2);
}, 60_000);

it('writes the same bytes with one thread and with two', () => {
  const one = buildWith('1');
  const two = buildWith('2');
  expect(one.get('plate.report.json')).toContain('"min-member-size"');
  expect(one.get('plate.report.html')).toContain('data:image/png;base64,');
  for (const [name, text] of one) expect(two.get(name) === text, name).toBe(true);
}, 120_000);
