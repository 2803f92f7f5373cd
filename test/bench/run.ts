/**
 * `npm run bench`: time each stage and the whole process, and the peak memory, on generated grids
 * (docs/performance.md; targets in the issues). Prints Markdown tables; nothing here runs in the unit tests.
 *
 * First the table of issue 15: the whole CLI in a fresh Node process on the plate field, against the floor
 * (a fresh process that reads the same file and touches every value once), runs interleaved, medians of
 * BENCH_REPEAT (5): wall time, CPU time (user + system, from GNU time) and peak RSS, and the ratios to the
 * floor. Then the linear-time table (constant, checkerboard, noise, a part touching every edge, the plate at
 * two sizes), then the stage times in-process (child.ts), the checks and the edge cases.
 * BENCH_ONLY=issue,linear,stages,checks,edge picks sections.
 */
import { spawnSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { npyFloat32, npyFloat64 } from './npy-write.js';
import { plateCsv, platePattern } from './plate.js';
import { edgeCaseRows } from './edge-cases.js';
import { field, type FieldKind } from './fields.js';
import { measure, median, type Measured } from './measure.js';

const here = dirname(fileURLToPath(import.meta.url));
const root = resolve(here, '../../..'); // dist/test/bench → package root
/** BENCH_CLI: another compiled CLI to measure (an older build, for before/after figures). */
const mainJs = process.env.BENCH_CLI ?? join(root, 'dist/cli/main.js');
const childJs = join(here, 'child.js');
const floorJs = join(here, 'floor.js');
const ONLY = new Set((process.env.BENCH_ONLY ?? 'issue,linear,stages,checks,edge').split(','));

const SIZES: [number, number][] = [
  [500, 250],
  [1000, 500],
  [2000, 1000],
  [4000, 2000],
];
const REPEAT = Number(process.env.BENCH_REPEAT ?? 5);


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
const s = (ms: number) => `${(ms / 1000).toFixed(2)} s`;
const mb = (b: number) => `${(b / 2 ** 20).toFixed(0)} MB`;

/** Issue 15's table: each case and the floor on its file, interleaved, medians of `n`. */
function issueTable(): string[] {
  const table = ['| grid | what | wall (median) | CPU (median) | peak RSS | minor faults | floor wall | floor CPU | floor faults | wall / floor | CPU / floor | target |', '|---|---|---|---|---|---|---|---|---|---|---|---|'];
  const p2 = join(dir, 'issue-plate-2000x1000-f8.npy');
  const p4 = join(dir, 'issue-plate-4000x2000-f4.npy');
  writeFileSync(p2, npyFloat64(platePattern(2000, 1000), 1000, 2000));
  writeFileSync(p4, npyFloat32(platePattern(4000, 2000), 2000, 4000));
  const base = ['--out-dir', out, '--force', '--quiet'];
  const cases: [string, string, string, string[], string][] = [
    ['2000×1000 f8', 'DXF + SVG + JSON', p2, ['--formats', 'dxf,svg,json'], '≤ 0.6 s, ≤ 3× floor'],
    ['4000×2000 f4', 'DXF + SVG + JSON', p4, ['--formats', 'dxf,svg,json'], '≤ 1.8 s, ≤ 1 GB'],
    ['4000×2000 f4', '+ `--min-member 3 --min-hole 3 --tool-radius 1` + HTML', p4, ['--formats', 'dxf,svg,json,html', '--min-member', '3', '--min-hole', '3', '--tool-radius', '1'], '≤ 3 s, ≤ 1.2 GB'],
  ];
  for (const [grid, what, file, flags, target] of cases) {
    const runs: Measured[] = [];
    const floors: Measured[] = [];
    for (let k = 0; k < REPEAT; k++) {
      const m = measure([mainJs, 'build', file, ...base, ...flags]);
      if (m.status !== 0 && m.status !== 1) throw new Error(`rhoform failed: ${m.stderr}`);
      runs.push(m);
      floors.push(measure([floorJs, file]));
    }
    const w = median(runs.map((m) => m.wallMs)), c = median(runs.map((m) => m.cpuMs));
    const fw = median(floors.map((m) => m.wallMs)), fc = median(floors.map((m) => m.cpuMs));
    const flt = (ms: Measured[]) => median(ms.map((m) => m.faults)).toFixed(0);
    table.push(`| ${grid} | ${what} | ${s(w)} | **${s(c)}** | ${mb(median(runs.map((m) => m.maxRss)))} | ${flt(runs)} | ${s(fw)} | ${s(fc)} | ${flt(floors)} | ${(w / fw).toFixed(1)}× | ${(c / fc).toFixed(1)}× | ${target} |`);
    console.error(`done issue case: ${grid} ${what}`);
  }
  return table;
}

/**
 * Linear time whatever the content: each field at two sizes (4× the cells), the whole CLI with the default outputs
 * (DXF, SVG, JSON and the HTML report), CPU medians of 3. A ratio of 4 or below is linear (the start-up is shared);
 * a quadratic stage would show as 16.
 */
function linearTable(): string[] {
  const table = ['| field | CPU 250×125 | CPU 500×250 | ratio (4× the cells) |', '|---|---|---|---|'];
  const kinds: FieldKind[] = ['constant', 'checkerboard', 'noise', 'edges', 'plate'];
  for (const kind of kinds) {
    const cpu: number[] = [];
    for (const [cols, rws] of [[250, 125], [500, 250]] as const) {
      const file = join(dir, `linear-${kind}-${cols}.npy`);
      writeFileSync(file, npyFloat64(kind === 'plate' ? platePattern(cols, rws) : field(kind, cols, rws), rws, cols));
      const runs: number[] = [];
      for (let k = 0; k < 3; k++) {
        const m = measure([mainJs, 'build', file, '--out-dir', out, '--force', '--quiet']);
        if (m.status !== 0 && m.status !== 1) throw new Error(`rhoform failed on ${kind}: ${m.stderr}`);
        runs.push(m.cpuMs);
      }
      cpu.push(median(runs));
      console.error(`done linear: ${kind} ${cols}×${rws}`);
    }
    table.push(`| ${kind} | ${s(cpu[0])} | ${s(cpu[1])} | ${(cpu[1] / cpu[0]).toFixed(1)} |`);
  }
  return table;
}

try {
  if (ONLY.has('issue')) rows.push('Issue 15 (whole process; CPU = user + system from GNU time; wall depends on the machine\'s load):', '', ...issueTable(), '');
  if (ONLY.has('linear')) rows.push(...linearTable(), '');
  if (ONLY.has('stages')) rows.push('| grid | cells | read | prepare | threshold search | contour | smooth | DXF | SVG | whole process (median wall) | peak RSS |', '|---|---|---|---|---|---|---|---|---|---|---|');
  for (const [cols, rws] of ONLY.has('stages') ? SIZES : []) {
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
  if (ONLY.has('stages')) {
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
  }
  // Checks on the 2000×1000 field: the checks stage in-process, and the whole process with and without limits.
  if (ONLY.has('checks')) {
  writeFileSync(join(dir, 'plate-2000x1000.npy'), npyFloat64(platePattern(2000, 1000), 1000, 2000));
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
  }
  if (ONLY.has('edge')) rows.push('', ...edgeCaseRows(dir, out, (args) => measure([mainJs, ...args]).cpuMs, 3, 'CPU (median, user + system)'));
} finally {
  rmSync(dir, { recursive: true, force: true });
}
console.log(`Node ${process.version}, ${new Date().toISOString().slice(0, 10)}; medians of ${REPEAT} runs (3 for the largest).`);
console.log(rows.join('\n'));
