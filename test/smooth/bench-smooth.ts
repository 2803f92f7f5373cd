/**
 * Timing of the smoothing stage on a plate with many round holes (not a test; prints numbers).
 * Build and run:  npx tsc -p tsconfig.json --outDir /tmp/rhoform-bench && node /tmp/rhoform-bench/test/smooth/bench-smooth.js
 */
import { smoothPolygons } from '../../src/smooth/smooth.js';
import { plateWithHoles } from './gen.js';
import { contourGrid } from '../../src/contour/contour.js';
import type { DensityGrid } from '../../src/types.js';

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

// the same plate traced by the contour stage from a density grid (2000 × 1000 cells of 1 mm; one ramp per hole)
function plateGrid(nx: number, ny: number, cols: number, rows: number, r: number): DensityGrid {
  const values = new Float64Array(nx * ny);
  for (let j = 0; j < ny; j++) {
    for (let i = 0; i < nx; i++) {
      const x = i + 0.5, y = j + 0.5;
      const ci = Math.min(cols - 1, Math.floor((x / nx) * cols)), cj = Math.min(rows - 1, Math.floor((y / ny) * rows));
      const cx = (nx * (ci + 0.5)) / cols + 0.123, cy = (ny * (cj + 0.5)) / rows + 0.071;
      const d = Math.hypot(x - cx, y - cy);
      values[j * nx + i] = Math.max(0, Math.min(1, 0.5 + (d - r) / 3));
    }
  }
  return { nx, ny, cellSize: [1, 1], origin: [0, 0], values, placement: 'cells' };
}
{
  const raw = contourGrid(plateGrid(2000, 1000, 37, 18, 24), 0.5, 'decider');
  for (const iterations of [2, 0]) {
    const options = { iterations, lambda: 0.33, mu: -0.34, tolerance: 0.25, domain: [0, 0, 2000, 1000] as const };
    const times: number[] = [];
    let res = smoothPolygons(raw, options);
    for (let k = 0; k < runs; k++) {
      const t0 = performance.now();
      res = smoothPolygons(raw, options);
      times.push(performance.now() - t0);
    }
    times.sort((a, b) => a - b);
    console.log(`contourGrid 2000×1000 cells, 37×18 holes r = 24 mm, iterations ${iterations}, tolerance 0.25 mm: median ${times[runs >> 1].toFixed(1)} ms ` +
      `(min ${times[0].toFixed(1)}), vertices ${res.verticesBefore} → ${res.verticesAfter}, maxDeviation ${res.maxDeviation.toFixed(4)} mm, ` +
      `area ${res.areaBefore.toFixed(1)} → ${res.areaAfter.toFixed(1)} mm² (${(((res.areaAfter - res.areaBefore) / res.areaBefore) * 100).toFixed(4)} %), dropped ${res.ringsDropped}`);
  }
}
