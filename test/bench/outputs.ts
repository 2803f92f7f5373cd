/**
 * `npm run bench`, output options on the 2000×1000 plate (targets of the issue on formats: `--arcs` adds at most
 * 0.3 s; STL and 3MF of the part at most 0.5 s each). The added stages are timed in-process on the built part,
 * wall and CPU time (the CPU time is what an unloaded machine would take when other jobs share the cores),
 * medians of five runs; results go to docs/performance.md by hand.
 */
import { fitOutlineArcs } from '../../src/write/arcs-outline.js';
import { build } from '../../src/pipeline.js';
import { resolveSettings } from '../../src/settings.js';
import { writeSolid } from '../../src/write/solid.js';
import { npyFloat64 } from './npy-write.js';
import { platePattern } from './plate.js';

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

/** Runs f five times; median wall and CPU (user + system) milliseconds, and f's last result. */
function time<T>(f: () => T): { wall: number; cpu: number; value: T } {
  const walls: number[] = [];
  const cpus: number[] = [];
  let value!: T;
  for (let k = 0; k < 5; k++) {
    const c = process.cpuUsage();
    const t = performance.now();
    value = f();
    walls.push(performance.now() - t);
    const u = process.cpuUsage(c);
    cpus.push((u.user + u.system) / 1000);
  }
  return { wall: median(walls), cpu: median(cpus), value };
}

const [cols, rows] = [2000, 1000];
const built = build({ name: 'plate.npy', bytes: npyFloat64(platePattern(cols, rows), rows, cols) }, resolveSettings({ thickness: 5 }));
const polygons = built.pictures().polygons ?? { polygons: [] };
const tolerance = built.report.smoothing.tolerance;
const arcs = time(() => fitOutlineArcs({ polygons, ringCircles: [], passive: null, domain: [0, 0, cols, rows], tolerance, raw: built.raw }));
const stl = time(() => writeSolid('stl', { polygons, thickness: 5, tolerance }));
const tmf = time(() => writeSolid('3mf', { polygons, thickness: 5, tolerance }));
const f = (t: { wall: number; cpu: number }) => `**${t.wall.toFixed(0)} ms** (CPU ${t.cpu.toFixed(0)} ms)`;
const fit = arcs.value.summary;
console.log(`Node ${process.version}, ${new Date().toISOString().slice(0, 10)}; NPY f8 ${cols}×${rows} plate (${built.report.geometry.vertices} vertices), medians of 5 runs.`);
console.log('| output | added time | note |');
console.log('|---|---|---|');
console.log(`| --arcs | ${f(arcs)} | ${fit.segmentsBefore} → ${fit.segmentsAfter} segments, ${fit.arcs} arcs, largest sampled deviation ${fit.maxDeviation.toFixed(3)} mm (tolerance ${tolerance} mm) |`);
console.log(`| STL | ${f(stl)} | ${(stl.value.length / 1e6).toFixed(1)} MB, ${(stl.value.length - 84) / 50} triangles |`);
console.log(`| 3MF | ${f(tmf)} | ${(tmf.value.length / 1e6).toFixed(1)} MB |`);
