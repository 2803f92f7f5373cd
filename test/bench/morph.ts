/**
 * Morphology engine benchmark (not a test): the bench plate (platePattern, 1 mm cells) → contourGrid at 0.5 →
 * smoothPolygons → buildMorphology, then width(solid, 3), width(void, 3), corners(R = 3), thicknessMap(600).
 * Prints stage times (ms) and peak RSS as JSON.
 * Run: npx tsc -p tsconfig.build.json && node dist/test/bench/morph.js [cols rows]
 */
import { contourGrid } from '../../src/contour/index.js';
import { buildMorphology, choosePixel } from '../../src/morph/index.js';
import { smoothPolygons } from '../../src/smooth/smooth.js';
import type { DensityGrid } from '../../src/types.js';
import { platePattern } from './plate.js';

const cols = Number(process.argv[2] ?? 2000);
const rows = Number(process.argv[3] ?? 1000);
const top = platePattern(cols, rows);
const values = new Float64Array(cols * rows);
// the pattern is top row first; DensityGrid rows count up from the bottom
for (let j = 0; j < rows; j++) values.set(top.subarray((rows - 1 - j) * cols, (rows - j) * cols), j * cols);
const grid: DensityGrid = { nx: cols, ny: rows, cellSize: [1, 1], origin: [0, 0], values, placement: 'cells' };
const domain = [0, 0, cols, rows] as const;
const raw = contourGrid(grid, 0.5, 'decider');
const smooth = smoothPolygons(raw, { iterations: 2, lambda: 0.33, mu: -0.34, tolerance: 0.25, domain });
const pixel = choosePixel(grid.cellSize, domain);

const ms: Record<string, number> = {};
const time = <T>(name: string, f: () => T): T => {
  const t = performance.now();
  const r = f();
  ms[name] = Math.round(performance.now() - t);
  return r;
};
const m = time('build', () => buildMorphology(smooth.polygons, { domain, pixel }));
const ws = time('widthSolid', () => m.width('solid', 3));
const wv = time('widthVoid', () => m.width('void', 3));
const c = time('corners3', () => m.corners(3, 0.25));
const t = time('thickness600', () => m.thicknessMap(600));
ms.budget = ms.build + ms.widthSolid + ms.widthVoid;
console.log(
  JSON.stringify({
    cols, rows, pixel,
    ms,
    solid: { min: ws.min, places: ws.places.length },
    void: { min: wv.min, places: wv.places.length },
    corners: { min: c.min, places: c.places.length },
    thickness: { nx: t.nx, ny: t.ny },
    maxRssMb: Math.round(process.resourceUsage().maxRSS / 1024),
  }),
);
