/**
 * Timing of the smoothing stage on a plate with many round holes (not a test; prints numbers).
 * Build and run:  npx tsc -p tsconfig.json --outDir /tmp/rhoform-bench && node /tmp/rhoform-bench/test/smooth/bench-smooth.js
 */
import { smoothPolygons } from '../../src/smooth/smooth.js';
import { plateWithHoles } from './gen.js';

const runs = 7;
const cases = [
  { name: '2000×1000 mm plate, h = 0.5 mm, 37×18 holes r = 18 mm', set: plateWithHoles(2000, 1000, 37, 18, 18, 0.5), h: 0.5 },
  { name: '2000×1000 mm plate, h = 1 mm, 37×18 holes r = 12 mm', set: plateWithHoles(2000, 1000, 37, 18, 12, 1), h: 1 },
];
for (const c of cases) {
  for (const iterations of [2, 0]) {
    const options = { iterations, lambda: 0.33, mu: -0.34, tolerance: 0.25 * c.h, domain: [0, 0, 2000, 1000] as const };
    const times: number[] = [];
    let res = smoothPolygons(c.set, options);
    for (let k = 0; k < runs; k++) {
      const t0 = performance.now();
      res = smoothPolygons(c.set, options);
      times.push(performance.now() - t0);
    }
    times.sort((a, b) => a - b);
    console.log(`${c.name}, iterations ${iterations}, tolerance ${options.tolerance} mm: median ${times[runs >> 1].toFixed(1)} ms ` +
      `(min ${times[0].toFixed(1)}), vertices ${res.verticesBefore} → ${res.verticesAfter}, maxDeviation ${res.maxDeviation.toFixed(4)} mm, ` +
      `area ${res.areaBefore.toFixed(1)} → ${res.areaAfter.toFixed(1)} mm² (${(((res.areaAfter - res.areaBefore) / res.areaBefore) * 100).toFixed(4)} %), dropped ${res.ringsDropped}`);
  }
}
