/**
 * Structural re-check bench (docs/structure.md): the input design (densities through SIMP) and the final
 * geometry (exact area fractions of a PolygonSet) of a perforated cantilever plate — a lattice of round holes,
 * void 1e-9 inside them — at 400 × 200 and 1000 × 500 cells. Each size runs in a fresh Node process so that its
 * peak RSS is its own. Prints a Markdown table: seconds, CG iterations, multigrid levels, peak RSS.
 *
 *   npm run build && node dist/test/bench/fe.js            (all sizes)
 *   node dist/test/bench/fe.js 400x200                      (one size, in this process)
 */
import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { analyse, coverage, FE_MAX_ELEMENTS } from '../../src/fe/index.js';
import { parseLoads } from '../../src/loads/parse.js';
import type { Point, PolygonSet, Ring } from '../../src/types.js';

/** A W × H plate (mm) with a jittered lattice of round holes, about 35 % void; holes clockwise. */
export function perforatedPlate(W: number, H: number, seed = 5): PolygonSet {
  let s = seed;
  const rnd = (): number => {
    s = (s * 1664525 + 1013904223) >>> 0;
    return s / 2 ** 32;
  };
  const holes: Ring[] = [];
  const pitch = H / 4;
  for (let y = pitch / 2; y < H; y += pitch) {
    for (let x = pitch / 2; x < W - pitch / 4; x += pitch) {
      const r = pitch * (0.3 + 0.08 * rnd());
      const cx = x + (rnd() - 0.5) * 0.1 * pitch;
      const cy = y + (rnd() - 0.5) * 0.1 * pitch;
      const ring: Point[] = [];
      for (let k = 0; k < 96; k++) ring.push([cx + r * Math.cos((-2 * Math.PI * k) / 96), cy + r * Math.sin((-2 * Math.PI * k) / 96)]);
      holes.push(ring);
    }
  }
  return { polygons: [{ outer: [[0, 0], [W, 0], [W, H], [0, H]], holes }] };
}

function runCase(nx: number, ny: number, maxElements: number): Record<string, number | string> {
  const h = 1;
  const polygons = perforatedPlate(nx * h, ny * h);
  const spec = parseLoads(
    JSON.stringify({
      rhoformLoads: 1,
      material: { E: 70000, nu: 0.33 },
      thickness: 8,
      supports: [{ fix: 'xy', edge: 'left' }],
      loads: [{ force: [0, -1000], edge: 'right' }],
    }),
    'bench.json',
  );
  const t0 = performance.now();
  const cpu0 = process.cpuUsage();
  const density = coverage(polygons, { nx, ny, hx: h, hy: h });
  const tCov = (performance.now() - t0) / 1000;
  const input = analyse({ nx, ny, hx: h, hy: h }, { kind: 'density', values: density }, spec, { maxElements });
  const final = analyse({ nx, ny, hx: h, hy: h }, { kind: 'geometry', polygons }, spec, { maxElements });
  const total = (performance.now() - t0) / 1000;
  const cpu = process.cpuUsage(cpu0);
  return {
    grid: `${nx}×${ny}`,
    coarsened: input.coarsened,
    coverageSeconds: +tCov.toFixed(3),
    inputSeconds: +input.solver.seconds.toFixed(2),
    inputIterations: input.solver.iterations,
    inputResidual: input.solver.relativeResidual,
    finalSeconds: +final.solver.seconds.toFixed(2),
    finalIterations: final.solver.iterations,
    finalResidual: final.solver.relativeResidual,
    levels: input.levels,
    totalSeconds: +total.toFixed(2),
    cpuSeconds: +((cpu.user + cpu.system) / 1e6).toFixed(2),
    peakRssMb: Math.round(process.resourceUsage().maxRSS / 1024),
    complianceChange: +(final.compliance / input.compliance - 1).toFixed(4),
  };
}

const arg = process.argv[2];
const maxElements = Number(process.env.FE_MAX_ELEMENTS ?? FE_MAX_ELEMENTS);
if (arg) {
  const [nx, ny] = arg.split('x').map(Number);
  console.log(JSON.stringify(runCase(nx, ny, maxElements)));
} else {
  const me = fileURLToPath(import.meta.url);
  const rows = ['| grid | coarsened | input: s / CG its | final: s / CG its | MG levels | total wall s (with coverage) | CPU s | peak RSS MB |', '|---|---|---|---|---|---|---|---|'];
  for (const size of ['400x200', '1000x500']) {
    const r = spawnSync(process.execPath, [me, size], { encoding: 'utf8', env: process.env });
    if (r.status !== 0) throw new Error(`fe bench ${size} failed: ${r.stderr}`);
    const o = JSON.parse(r.stdout.trim().split('\n').pop() as string) as Record<string, number | string>;
    rows.push(`| ${o.grid} | ${o.coarsened} | ${o.inputSeconds} / ${o.inputIterations} | ${o.finalSeconds} / ${o.finalIterations} | ${o.levels} | ${o.totalSeconds} | ${o.cpuSeconds} | ${o.peakRssMb} |`);
    console.error(JSON.stringify(o));
  }
  console.log(rows.join('\n'));
}
