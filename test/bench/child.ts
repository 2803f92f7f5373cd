/** Bench child: one build in this process, printing stage times (ms), wall time and peak RSS as JSON. */
import { readFileSync } from 'node:fs';
import { build, prepareBuild } from '../../src/pipeline.js';
import { formatJson } from '../../src/report/json.js';
import { resolveSettings } from '../../src/settings.js';

const [file, , extra] = process.argv.slice(2);
/** Optional third argument: settings as JSON (e.g. the check limits), merged over the defaults. */
const settings = resolveSettings(extra ? (JSON.parse(extra) as Record<string, unknown>) : {});
const t0 = performance.now();
const bytes = readFileSync(file);
const readFile = performance.now() - t0;
await prepareBuild(settings, { name: file, bytes });
const r = build({ name: file, bytes }, settings);
const timings: Record<string, number> = { ...r.timings };
timings.read += readFile;
let t = performance.now();
const dxf = r.dxf();
timings.dxf = performance.now() - t;
t = performance.now();
const svg = r.svg();
timings.svg = performance.now() - t;
// the solids, when a thickness is given (`--formats stl,3mf`)
const solidBytes: Record<string, number> = {};
if (settings.thickness !== null) {
  for (const f of ['stl', '3mf'] as const) {
    t = performance.now();
    solidBytes[f] = r.solid(f).length;
    timings[f] = performance.now() - t;
  }
}
t = performance.now();
const json = formatJson(r.report);
timings.json = performance.now() - t;
void dxf.length;
void svg.length;
void json.length;
console.log(
  JSON.stringify({
    timings,
    wallMs: performance.now() - t0,
    maxRssMb: process.resourceUsage().maxRSS / 1024,
    vertices: r.report.geometry.vertices,
    solidBytes,
    arcFit: r.report.geometry.arcFit ?? null,
    builds: r.builds,
    checks: r.report.checks.map((c) => ({ id: c.id, status: c.status, measured: c.measured, locationsTotal: c.locationsTotal })),
    relErr: Math.abs(r.report.threshold.achievedFraction - r.report.threshold.targetFraction) / r.report.threshold.targetFraction,
  }),
);
