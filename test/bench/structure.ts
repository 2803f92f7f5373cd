/**
 * Structural re-check bench (`--loads`, docs/structure.md, docs/performance.md). Each case runs in a fresh Node
 * process (its own peak RSS, a cold JIT as a user's run has) and reports wall and CPU time honestly: the bench
 * machine is shared, so wall time can be several times the CPU time.
 *
 * 1. `rhoform demo` without and with its loads file (the demo sets --loads by default; `--loads` cannot be
 *    removed from the command line, so "without" runs the same build through the library without the loads):
 *    the whole process, wall and CPU; the difference is what the re-check adds (three designs: input, before
 *    repair, final).
 * 2. The demo bracket resampled (bilinear) to 400 × 200 and 1000 × 500 cells over the same 240 × 120 mm domain,
 *    built with --loads and the demo's service load case: input design + final geometry; the structure stage's
 *    wall time, the CPU time of the build with and without loads, CG iterations per solve, peak RSS.
 *
 *   npm run build && node dist/test/bench/structure.js
 */
import { spawnSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { runAsync } from '../../cli/start.js';
import { loadGrid } from '../../src/input.js';
import { parseLoads } from '../../src/loads/parse.js';
import { parsePassive } from '../../src/passive/parse.js';
import { build, prepareBuild } from '../../src/pipeline.js';
import { REPAIR_IDS, resolveSettings, type Settings } from '../../src/settings.js';
import { npyFloat64 } from './npy-write.js';

const here = dirname(fileURLToPath(import.meta.url));
const root = resolve(here, '../../..');
const DEMO_GRID = join(root, 'fixtures/grids/demo-bracket.npy');
const DEMO_LOADS = join(root, 'fixtures/loads/demo-bracket.loads.json');
const DEMO_PASSIVE = join(root, 'fixtures/passive/demo-bracket.passive.json');

const cpuSeconds = (): number => {
  const u = process.cpuUsage();
  return (u.user + u.system) / 1e6;
};
const rssMb = (): number => Math.round(process.resourceUsage().maxRSS / 1024);

/** The demo grid (120 × 60 cells of 2 mm) resampled bilinearly to nx × ny cells, as NPY bytes (top row first). */
function resampledDemo(nx: number, ny: number): Uint8Array {
  const g = loadGrid({ name: 'demo-bracket.npy', bytes: readFileSync(DEMO_GRID) }, resolveSettings({ cellSize: [2, 2] })).grid;
  const out = new Float64Array(nx * ny);
  const at = (i: number, j: number): number => g.values[Math.min(g.ny - 1, Math.max(0, j)) * g.nx + Math.min(g.nx - 1, Math.max(0, i))];
  for (let r = 0; r < ny; r++) {
    const j = ny - 1 - r; // file row r from the top
    const v = ((j + 0.5) * g.ny) / ny - 0.5;
    const j0 = Math.floor(v);
    const b = v - j0;
    for (let c = 0; c < nx; c++) {
      const u = ((c + 0.5) * g.nx) / nx - 0.5;
      const i0 = Math.floor(u);
      const a = u - i0;
      out[r * nx + c] = (1 - b) * ((1 - a) * at(i0, j0) + a * at(i0 + 1, j0)) + b * ((1 - a) * at(i0, j0 + 1) + a * at(i0 + 1, j0 + 1));
    }
  }
  return npyFloat64(out, ny, nx);
}

/** Child: one case in this process; prints one JSON line. */
async function child(kind: string, size: string, withLoads: boolean): Promise<void> {
  const t0 = performance.now();
  if (kind === 'demo') {
    const quiet = { stdout: () => {}, stderr: () => {}, isTTY: false, env: {}, cwd: process.env.BENCH_DIR ?? '/tmp' };
    if (withLoads) {
      const code = await runAsync(['demo', '--out-dir', 'rhoform-bench-demo', '--quiet'], quiet);
      if (code === 2) throw new Error('demo failed');
    } else {
      // the demo's own settings and files, without its loads file, through the library
      const s = resolveSettings({ cellSize: [2, 2], process: 'waterjet-cut', thickness: 8, passive: 'p.json', repair: [...REPAIR_IDS] });
      await prepareBuild(s);
      const r = build({ name: 'demo-bracket.npy', bytes: readFileSync(DEMO_GRID) }, s, { passive: parsePassive(readFileSync(DEMO_PASSIVE, 'utf8'), 'p.json') });
      r.dxf();
      r.svg();
    }
    console.log(JSON.stringify({ kind, withLoads, wall: (performance.now() - t0) / 1000, cpu: cpuSeconds(), rssMb: rssMb() }));
    return;
  }
  const [nx, ny] = size.split('x').map(Number);
  const bytes = resampledDemo(nx, ny);
  const s: Partial<Settings> = { cellSize: [240 / nx, 120 / ny], ...(withLoads ? { loads: 'demo-bracket.loads.json' } : {}) };
  const loads = withLoads ? parseLoads(readFileSync(DEMO_LOADS, 'utf8'), 'demo-bracket.loads.json') : null;
  await prepareBuild(resolveSettings(s)); // module loading, as start-up was before the re-check was loaded on demand
  const cpu0 = cpuSeconds();
  const w0 = performance.now();
  const r = build({ name: `demo-${size}.npy`, bytes }, resolveSettings(s), { loads });
  const st = r.report.structure;
  console.log(
    JSON.stringify({
      kind,
      size,
      withLoads,
      buildWall: (performance.now() - w0) / 1000,
      buildCpu: cpuSeconds() - cpu0,
      structureWall: (r.timings.structure ?? 0) / 1000,
      iterations: st ? [st.designs.input.solver.iterations, st.designs.final.solver.iterations] : null,
      converged: st ? st.designs.input.solver.converged && st.designs.final.solver.converged : null,
      coarsened: st?.coarsened ?? null,
      complianceChange: st?.complianceChange ?? null,
      rssMb: rssMb(),
    }),
  );
}

function spawn(args: string[]): Record<string, unknown> {
  const r = spawnSync(process.execPath, [fileURLToPath(import.meta.url), ...args], { encoding: 'utf8', maxBuffer: 1 << 26, env: { ...process.env, BENCH_DIR: process.env.BENCH_DIR ?? '/tmp' } });
  if (r.status !== 0) throw new Error(`structure bench ${args.join(' ')} failed: ${r.stderr}`);
  return JSON.parse(r.stdout.trim().split('\n').pop() as string) as Record<string, unknown>;
}

const median = (xs: number[]): number => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
const f2 = (x: unknown): string => (typeof x === 'number' ? x.toFixed(2) : String(x));

if (process.argv[2] === 'child') {
  await child(process.argv[3], process.argv[4], process.argv[5] === 'loads');
} else {
  const repeat = Number(process.env.BENCH_REPEAT ?? 3);
  const rows = ['| case | without --loads: wall / CPU s | with --loads: wall / CPU s | added: wall / CPU s | structure stage wall s | CG iterations (input, final) | peak RSS MB (with) |', '|---|---|---|---|---|---|---|'];
  const demo = (w: boolean) => Array.from({ length: repeat }, () => spawn(['child', 'demo', '-', w ? 'loads' : 'none']));
  const d0 = demo(false);
  const d1 = demo(true);
  const m = (xs: Record<string, unknown>[], k: string) => median(xs.map((x) => x[k] as number));
  rows.push(
    `| demo (median of ${repeat}, whole process) | ${f2(m(d0, 'wall'))} / ${f2(m(d0, 'cpu'))} | ${f2(m(d1, 'wall'))} / ${f2(m(d1, 'cpu'))} | ${f2(m(d1, 'wall') - m(d0, 'wall'))} / ${f2(m(d1, 'cpu') - m(d0, 'cpu'))} | — | — | ${m(d1, 'rssMb')} |`,
  );
  for (const size of ['400x200', '1000x500']) {
    const a = spawn(['child', 'grid', size, 'none']);
    const b = spawn(['child', 'grid', size, 'loads']);
    const its = b.iterations as number[];
    rows.push(
      `| demo bracket at ${size.replace('x', ' × ')} (build, input + final) | ${f2(a.buildWall)} / ${f2(a.buildCpu)} | ${f2(b.buildWall)} / ${f2(b.buildCpu)} | ${f2((b.buildWall as number) - (a.buildWall as number))} / ${f2((b.buildCpu as number) - (a.buildCpu as number))} | ${f2(b.structureWall)} | ${its.join(', ')}${b.converged ? '' : ' (not converged)'} | ${b.rssMb} |`,
    );
    console.error(JSON.stringify({ a, b }));
  }
  console.log(rows.join('\n'));
}
