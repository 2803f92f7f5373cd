/**
 * Batch throughput (docs/performance.md, "Batch throughput"): 200 grids of 400×200 cells, each a smooth random
 * density field, built by `rhoform batch` with 1 and with 2 worker threads. Reports grids per second and the
 * speed-up. Run after `npm run build`: `node dist/test/bench/batch.js` (BENCH_REPEAT runs per setting, median;
 * BENCH_GRIDS, BENCH_JOBS="1,2", BENCH_FORMATS="dxf,svg,json,html" to change the set-up). Each run is a fresh
 * `rhoform` process, so the times include Node start-up, worker start-up and writing the outputs.
 */
import { spawnSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { availableParallelism, cpus, loadavg, tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { smoothField } from './batch-field.js';
import { npyFloat64 } from './npy-write.js';

const here = dirname(fileURLToPath(import.meta.url));
const root = resolve(here, '../../..'); // dist/test/bench → package root
const mainJs = join(root, 'dist/cli/main.js');

const GRIDS = Number(process.env.BENCH_GRIDS ?? 200);
const REPEAT = Number(process.env.BENCH_REPEAT ?? 3);
const JOBS = (process.env.BENCH_JOBS ?? '1,2').split(',').map(Number);
/**
 * The outputs per grid: by default all four, as `rhoform batch` writes them (the HTML report's pictures cost
 * more than the build at this size); BENCH_FORMATS=dxf,svg,json measures the bare build, where Node's and the
 * workers' start-up dominate.
 */
const FORMATS = process.env.BENCH_FORMATS ?? 'dxf,svg,json,html';
const COLS = 400;
const ROWS = 200;

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)];
}

const dir = mkdtempSync(join(tmpdir(), 'rhoform-batch-bench-'));
const inputs = join(dir, 'grids');
mkdirSync(inputs);
try {
  for (let k = 0; k < GRIDS; k++) {
    writeFileSync(join(inputs, `field-${String(k).padStart(3, '0')}.npy`), npyFloat64(smoothField(COLS, ROWS, 1000 + k), ROWS, COLS));
  }
  // Settings interleaved run by run (1, 2, 1, 2, …) so that load from other processes hits both alike;
  // on a shared machine the best run estimates the undisturbed time, the median the typical one.
  const walls = new Map<number, number[]>(JOBS.map((j) => [j, []]));
  const load0 = loadavg()[0];
  for (let rep = 0; rep < REPEAT; rep++) {
    for (const jobs of JOBS) {
      const out = join(dir, `out-${jobs}-${rep}`);
      const t = performance.now();
      const r = spawnSync(process.execPath, [mainJs, 'batch', inputs, '--out-dir', out, '--jobs', String(jobs), '--formats', FORMATS, '--quiet'], { encoding: 'utf8' });
      const wall = performance.now() - t;
      if ((r.status ?? 2) === 2) throw new Error(`rhoform batch failed: ${r.stderr}`);
      walls.get(jobs)?.push(wall);
      rmSync(out, { recursive: true, force: true });
      console.error(`jobs ${jobs} run ${rep + 1}/${REPEAT}: ${(wall / 1000).toFixed(2)} s`);
    }
  }
  const load1 = loadavg()[0];
  const best = (j: number) => Math.min(...(walls.get(j) ?? []));
  const med = (j: number) => median(walls.get(j) ?? []);
  const lines = [
    `Machine: ${availableParallelism()} cores (${cpus()[0]?.model ?? 'unknown CPU'}), Node ${process.version}; load average ${load0.toFixed(1)} before, ${load1.toFixed(1)} after.`,
    `${GRIDS} grids of ${COLS}×${ROWS} (NPY float64), --formats ${FORMATS}; ${REPEAT} runs per setting, interleaved; whole process (start-up included).`,
    '',
    '| workers | best wall | median wall | all runs | grids/s (best) | speed-up (best) | speed-up (median) |',
    '|---|---|---|---|---|---|---|',
    ...JOBS.map(
      (j) =>
        `| ${j} | ${(best(j) / 1000).toFixed(2)} s | ${(med(j) / 1000).toFixed(2)} s | ${(walls.get(j) ?? []).map((w) => (w / 1000).toFixed(2)).join(', ')} s | ` +
        `${(GRIDS / (best(j) / 1000)).toFixed(1)} | ${(best(JOBS[0]) / best(j)).toFixed(2)}× | ${(med(JOBS[0]) / med(j)).toFixed(2)}× |`,
    ),
  ];
  console.log(lines.join('\n'));
} finally {
  rmSync(dir, { recursive: true, force: true });
}
