/**
 * Repair benchmark and convergence probe (not a test), run from the package root: `npx tsc -p tsconfig.json --outDir /tmp/rb &&
 * node /tmp/rb/test/repair/bench.js [demo|plate|props] …`.
 * - demo: the bundled demo through build() (all four repairs), the repair stage's time and the re-check;
 * - plate [cols rows]: the bench plate (test/bench/plate.ts, 1 mm cells) contoured and smoothed as in
 *   test/bench/morph.ts, then runRepairs with member, hole and tool radius 3 mm; time and vertex counts;
 * - props: the 36 random parts of property.test.ts, how many pass the size checks after the repairs.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';

import { parsePassive } from '../../src/passive/parse.js';
import { build, prepareBuild } from '../../src/pipeline.js';
import { resolveSettings, REPAIR_IDS } from '../../src/settings.js';
import { contourGrid } from '../../src/contour/index.js';
import { choosePixel } from '../../src/morph/index.js';
import { smoothPolygons } from '../../src/smooth/smooth.js';
import { runRepairs } from '../../src/repair/index.js';
import type { DensityGrid, PolygonSet } from '../../src/types.js';
import { platePattern } from '../bench/plate.js';
import { writeFileSync } from 'node:fs';
import { gridDomain } from '../../src/field/mean.js';
import { applyFixedParts } from '../../src/passive/fixed-parts.js';
import { shapeRing } from '../../src/passive/rings.js';
import { randomPart, sizeChecks, type Box } from './support.js';

await prepareBuild({ passive: null, mirror: [], repair: [...REPAIR_IDS] });


const root = process.cwd(); // run from the package root
const verts = (s: PolygonSet): number => s.polygons.reduce((n, p) => n + p.outer.length + p.holes.reduce((m, h) => m + h.length, 0), 0);

function demo(): void {
  const file = 'fixtures/grids/demo-bracket.npy';
  const passiveFile = 'fixtures/passive/demo-bracket.passive.json';
  const bytes = readFileSync(join(root, file));
  const passive = parsePassive(readFileSync(join(root, passiveFile), 'utf8'), passiveFile);
  const s = resolveSettings({ cellSize: [2, 2], process: 'waterjet-cut', thickness: 8, passive: passiveFile, repair: [...REPAIR_IDS] });
  const r = build({ name: file, bytes: new Uint8Array(bytes) }, s, { passive });
  const rep = r.report;
  console.log(`repair stage ${Math.round(r.timings.repair)} ms`);
  for (const c of rep.checks) console.log(`${c.id.padEnd(18)} ${c.status} ${c.measured} (${c.locationsTotal})`, c.locations.slice(0, 8).map((l) => `${l.x.toFixed(2)},${l.y.toFixed(2)}:${l.measured.toPrecision(3)}`).join(' '));
  for (const a of rep.repairs) console.log(`${a.id.padEnd(14)} ${a.area.toFixed(1)} mm² ${a.locationsTotal} places ${JSON.stringify((a as unknown as { unresolved?: unknown }).unresolved ?? null)}`);
}

/** The demo's repair stage by hand (as src/repair/stage.ts repairStage does), with crops of the findings as SVG. */
function demoDirect(): void {
  const file = 'fixtures/grids/demo-bracket.npy';
  const passiveFile = 'fixtures/passive/demo-bracket.passive.json';
  const passive = parsePassive(readFileSync(join(root, passiveFile), 'utf8'), passiveFile);
  const s = resolveSettings({ cellSize: [2, 2], process: 'waterjet-cut', thickness: 8, passive: passiveFile, repair: [] });
  const r = build({ name: file, bytes: new Uint8Array(readFileSync(join(root, file))) }, s, { passive });
  const domain = gridDomain(r.grid);
  const tolerance = r.report.settings.tolerance as number;
  const pixel = choosePixel(r.grid.cellSize, domain);
  const before = applyFixedParts(r.smoothed.polygons, [], passive, domain, tolerance);
  const ring = (role: string) => passive.regions.filter((x) => x.role === role).map((x) => shapeRing(x.shape, tolerance / 4));
  const limits = { minMember: 8, minHole: 8, toolRadius: 0.381, minIslandArea: 0, minHoleArea: null };
  const t = performance.now();
  const run = runRepairs(REPAIR_IDS, { polygons: before.polygons, domain, tolerance, limits, passiveSolid: ring('solid'), passiveVoid: ring('void'), pixel });
  const ms = performance.now() - t;
  const after = applyFixedParts(run.polygons, [], passive, domain, tolerance);
  console.log(`runRepairs ${Math.round(ms)} ms; vertices ${verts(before.polygons)} → ${verts(after.polygons)}`);
  for (const a of run.actions) console.log(`${a.id.padEnd(14)} ${a.area.toFixed(1)} mm² ${a.locations.length} places ${JSON.stringify((a as unknown as { unresolved?: unknown }).unresolved ?? null)}`);
  const cs = sizeChecks(after.polygons, domain as unknown as Box, tolerance, pixel, limits);
  const raw = sizeChecks(run.polygons, domain as unknown as Box, tolerance, pixel, limits);
  for (const c of cs) console.log(`${c.id.padEnd(18)} ${c.status} ${c.measured?.toPrecision(4)} (${c.locationsTotal})`, c.locations.slice(0, 8).map((l) => `${l.x.toFixed(2)},${l.y.toFixed(2)}:${l.measured.toPrecision(3)}`).join(' '));
  console.log('(before the fixed parts again:)', raw.filter((c) => c.status !== 'pass').map((c) => `${c.id} ${c.status} ${c.measured?.toPrecision(4)} ${c.locations.slice(0, 8).map((l) => `${l.x.toFixed(2)},${l.y.toFixed(2)}:${l.measured.toPrecision(3)}`).join(' ')}`).join('; '));
  const spots = cs.filter((c) => c.status !== 'pass').flatMap((c) => c.locations);
  spots.forEach((l, k) => writeFileSync(`/tmp/crop_${k}.svg`, cropSvg(before.polygons, after.polygons, l.x, l.y, 4, spots)));
  const rspots = raw.filter((c) => c.status !== 'pass').flatMap((c) => c.locations);
  rspots.forEach((l, k) => writeFileSync(`/tmp/rcrop_${k}.svg`, cropSvg(before.polygons, run.polygons, l.x, l.y, Number(process.env.CROP ?? 1.5), rspots)));
  writeFileSync('/tmp/demo_after.json', JSON.stringify(after.polygons));
  writeFileSync('/tmp/demo_raw.json', JSON.stringify(run.polygons));
  writeFileSync('/tmp/demo_before.json', JSON.stringify(before.polygons));
}

/** A square crop (half side h mm) around (cx, cy): before as a black line, after filled, spots as red dots. */
export function cropSvg(before: PolygonSet, after: PolygonSet, cx: number, cy: number, h: number, spots: readonly { x: number; y: number }[]): string {
  const path = (s: PolygonSet) => s.polygons.flatMap((p) => [p.outer, ...p.holes]).map((r) => 'M' + r.map((q) => `${q[0].toFixed(4)} ${(-q[1]).toFixed(4)}`).join('L') + 'Z').join('');
  const w = h / 150;
  return `<svg xmlns="http://www.w3.org/2000/svg" width="600" height="600" viewBox="${cx - h} ${-cy - h} ${2 * h} ${2 * h}">
<rect x="${cx - h}" y="${-cy - h}" width="${2 * h}" height="${2 * h}" fill="white"/>
<path d="${path(after)}" fill="#9db4c8" fill-rule="evenodd" stroke="#1f3a52" stroke-width="${w}"/>
<path d="${path(before)}" fill="none" stroke="black" stroke-width="${w}" stroke-dasharray="${4 * w}"/>
${spots.map((l) => `<circle cx="${l.x}" cy="${-l.y}" r="${3 * w}" fill="red"/>`).join('')}
</svg>`;
}

function plate(cols: number, rows: number): void {
  const top = platePattern(cols, rows);
  const values = new Float64Array(cols * rows);
  for (let j = 0; j < rows; j++) values.set(top.subarray((rows - 1 - j) * cols, (rows - j) * cols), j * cols);
  const grid: DensityGrid = { nx: cols, ny: rows, cellSize: [1, 1], origin: [0, 0], values, placement: 'cells' };
  const domain = [0, 0, cols, rows] as const;
  const smooth = smoothPolygons(contourGrid(grid, 0.5, 'decider'), { iterations: 2, lambda: 0.33, mu: -0.34, tolerance: 0.25, domain });
  const pixel = choosePixel(grid.cellSize, domain);
  const limits = { minMember: 3, minHole: 3, toolRadius: 3, minIslandArea: 0, minHoleArea: null };
  const t = performance.now();
  const out = runRepairs(REPAIR_IDS, { polygons: smooth.polygons, domain, tolerance: 0.25, limits, passiveSolid: [], passiveVoid: [], pixel });
  const ms = performance.now() - t;
  console.log(`plate ${cols}×${rows}: repair ${Math.round(ms)} ms, vertices ${verts(smooth.polygons)} → ${verts(out.polygons)}`);
  for (const a of out.actions) console.log(`  ${a.id.padEnd(14)} ${a.area.toFixed(1)} mm² ${a.locations.length} places ${JSON.stringify((a as unknown as { unresolved?: unknown }).unresolved ?? null)}`);
  if (process.argv.includes('--check')) {
    const cs = sizeChecks(out.polygons, domain as unknown as Box, 0.25, pixel, limits);
    for (const c of cs) console.log(`  ${c.id.padEnd(18)} ${c.status} ${c.measured} (${c.locationsTotal})`);
  }
}

function props(): void {
  const domain: Box = [0, 0, 100, 60];
  const limits = { minMember: 4, minHole: 4, toolRadius: 1.5, minIslandArea: 0, minHoleArea: 10 };
  let pass = 0, warn = 0, fail = 0;
  const t = performance.now();
  for (let k = 0; k < 36; k++) {
    const seed = 1000 + k;
    const part = randomPart(seed);
    const out = runRepairs(REPAIR_IDS, { polygons: part, domain, tolerance: 0.25, limits, passiveSolid: [], passiveVoid: [], pixel: 0.5 });
    const cs = sizeChecks(out.polygons, domain, 0.25, 0.5, limits);
    const bad = cs.filter((c) => c.status !== 'pass');
    if (bad.some((c) => c.status === 'fail')) fail++;
    else if (bad.length) warn++;
    else pass++;
    if (process.argv[3] === String(seed)) {
      const spots = bad.flatMap((c) => c.locations);
      spots.forEach((l, i) => writeFileSync(`/tmp/pcrop_${i}.svg`, cropSvg(part, out.polygons, l.x, l.y, Number(process.env.CROP ?? 3), spots)));
      writeFileSync('/tmp/p_before.json', JSON.stringify(part));
      writeFileSync('/tmp/p_after.json', JSON.stringify(out.polygons));
    }
    if (bad.length) console.log(`seed ${seed}: ${bad.map((c) => `${c.id} ${c.status} ${c.measured?.toPrecision(3)} @${c.locations.slice(0, 3).map((l) => `${l.x.toFixed(1)},${l.y.toFixed(1)}`).join(' ')}`).join('; ')}`);
  }
  console.log(`props: ${pass} pass, ${warn} warn only, ${fail} fail of 36 (${Math.round(performance.now() - t)} ms)`);
}

const what = process.argv[2] ?? 'demo';
if (what === 'demo') demo();
else if (what === 'direct') demoDirect();
else if (what === 'plate') plate(Number(process.argv[3] ?? 2000), Number(process.argv[4] ?? 1000));
else props();
