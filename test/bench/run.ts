/**
 * `npm run bench`: time each stage and the whole process, and the peak memory, on generated grids
 * (docs/performance.md; targets in the issues). Prints a Markdown table; nothing here runs in the unit tests.
 *
 * For each size, the whole CLI (`build` → DXF + SVG + JSON) runs in a fresh Node process several times;
 * the median wall time is reported with that process's peak RSS, and a second child prints the stage times.
 */
import { spawnSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { npyFloat64 } from './npy-write.js';
import { plateCsv, platePattern } from './plate.js';
import { edgeCaseRows } from './edge-cases.js';

const here = dirname(fileURLToPath(import.meta.url));
const root = resolve(here, '../../..'); // dist/test/bench → package root
const mainJs = join(root, 'dist/cli/main.js');
const childJs = join(here, 'child.js');

const SIZES: [number, number][] = [
  [500, 250],
  [1000, 500],
  [2000, 1000],
  [4000, 2000],
];
const REPEAT = Number(process.env.BENCH_REPEAT ?? 5);

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)];
}

interface ChildOut {
  timings: Record<string, number>;
  maxRssMb: number;
  wallMs: number;
  vertices: number;
}

function runChild(args: string[]): ChildOut {
  const r = spawnSync(process.execPath, [childJs, ...args], { encoding: 'utf8', maxBuffer: 1 << 26 });
  if (r.status !== 0) throw new Error(`bench child failed: ${r.stderr}`);
  return JSON.parse(r.stdout.trim().split('\n').pop() as string) as ChildOut;
}

function timeCli(args: string[]): number {
  const t = performance.now();
  const r = spawnSync(process.execPath, [mainJs, ...args], { encoding: 'utf8' });
  const ms = performance.now() - t;
  if (r.status !== 0 && r.status !== 1) throw new Error(`rhoform failed: ${r.stderr}`);
  return ms;
}

const dir = mkdtempSync(join(tmpdir(), 'rhoform-bench-'));
const out = join(dir, 'out');
mkdirSync(out);
const rows: string[] = [];
rows.push('| grid | cells | read | prepare | threshold search | contour | smooth | DXF | SVG | whole process (median wall) | peak RSS |');
rows.push('|---|---|---|---|---|---|---|---|---|---|---|');
try {
  for (const [cols, rws] of SIZES) {
    const file = join(dir, `plate-${cols}x${rws}.npy`);
    writeFileSync(file, npyFloat64(platePattern(cols, rws), rws, cols));
    const args = ['build', file, '--out-dir', out, '--force', '--formats', 'dxf,svg,json', '--quiet'];
    const walls: number[] = [];
    const n = cols * rws > 4e6 ? Math.max(3, Math.min(REPEAT, 3)) : REPEAT;
    for (let k = 0; k < n; k++) walls.push(timeCli(args));
    const c = runChild([file, out]);
    const t = c.timings;
    const f = (x: number | undefined) => (x === undefined ? '–' : `${x.toFixed(0)} ms`);
    rows.push(
      `| NPY f8 ${cols}×${rws} | ${(cols * rws / 1e6).toFixed(2)} M | ${f(t.read)} | ${f(t.prepare)} | ${f(t.threshold)} | ${f(t.contour)} | ${f(t.smooth)} | ${f(t.dxf)} | ${f(t.svg)} | **${median(walls).toFixed(0)} ms** | ${c.maxRssMb.toFixed(0)} MB |`,
    );
    console.error(`done ${cols}×${rws}`);
  }
  // CSV parse of the 2000×1000 field.
  const [cols, rws] = [2000, 1000];
  const csvFile = join(dir, `plate-${cols}x${rws}.csv`);
  writeFileSync(csvFile, plateCsv(platePattern(cols, rws), cols, rws));
  const reads: number[] = [];
  let last: ChildOut | undefined;
  for (let k = 0; k < 3; k++) {
    last = runChild([csvFile, out]);
    reads.push(last.timings.read);
  }
  const walls: number[] = [];
  for (let k = 0; k < 3; k++) walls.push(timeCli(['build', csvFile, '--out-dir', out, '--force', '--formats', 'dxf,svg,json', '--quiet']));
  rows.push(
    `| CSV ${cols}×${rws} | ${(cols * rws / 1e6).toFixed(2)} M | **${median(reads).toFixed(0)} ms** | ${last?.timings.prepare.toFixed(0)} ms | ${last?.timings.threshold.toFixed(0)} ms | ${last?.timings.contour.toFixed(0)} ms | ${last?.timings.smooth.toFixed(0)} ms | ${last?.timings.dxf.toFixed(0)} ms | ${last?.timings.svg.toFixed(0)} ms | ${median(walls).toFixed(0)} ms | ${last?.maxRssMb.toFixed(0)} MB |`,
  );
  // Checks on the 2000×1000 field: the checks stage in-process, and the whole process with and without limits.
  const checkRows: string[] = ['| 2000×1000 NPY | limits | checks stage (median) | whole process (median wall) | findings |', '|---|---|---|---|---|'];
  const plate = join(dir, 'plate-2000x1000.npy');
  const variants: [string, Record<string, number>, string[]][] = [
    ['defaults (volume, islands, fidelity, grey)', {}, []],
    ['--min-member 3 --min-hole 3', { minMember: 3, minHole: 3 }, ['--min-member', '3', '--min-hole', '3']],
    ['--min-member 3 --min-hole 3 --tool-radius 3', { minMember: 3, minHole: 3, toolRadius: 3 }, ['--min-member', '3', '--min-hole', '3', '--tool-radius', '3']],
  ];
  for (const [label, settings, flags] of variants) {
    const stage: number[] = [];
    let lastChild: (ChildOut & { checks?: { id: string; locationsTotal: number }[] }) | undefined;
    for (let k = 0; k < 3; k++) {
      lastChild = runChild([plate, out, JSON.stringify(settings)]);
      stage.push(lastChild.timings.checks ?? NaN);
    }
    const walls: number[] = [];
    for (let k = 0; k < 3; k++) walls.push(timeCli(['build', plate, '--out-dir', out, '--force', '--formats', 'dxf,svg,json', '--quiet', ...flags]));
    const findings = (lastChild?.checks ?? []).map((c) => `${c.id} ${c.locationsTotal}`).join(', ');
    checkRows.push(`| | ${label} | **${median(stage).toFixed(0)} ms** | ${median(walls).toFixed(0)} ms | ${findings} |`);
    console.error(`done checks: ${label}`);
  }
  rows.push('', ...checkRows);
  rows.push('', ...edgeCaseRows(dir, out, timeCli, 3));
} finally {
  rmSync(dir, { recursive: true, force: true });
}
console.log(`Node ${process.version}, ${new Date().toISOString().slice(0, 10)}; medians of ${REPEAT} runs (3 for the largest).`);
console.log(rows.join('\n'));
