import { readGrid } from './dist/src/read/detect.js';
import { DEFAULT_READ_OPTIONS } from './dist/src/read/types.js';
import { pngGrey } from './dist/test/bench/format-writers.js';
import { platePattern } from './dist/test/bench/plate.js';
import { decode } from 'fast-png';
const v = platePattern(2000, 1000);
const b8 = pngGrey(v, 1000, 2000, 8), b16 = pngGrey(v, 1000, 2000, 16);
const o = { ...DEFAULT_READ_OPTIONS, maxCells: 1e8 };
for (let k = 0; k < 8; k++) {
  let t = performance.now(); decode(b8); const a = performance.now() - t;
  t = performance.now(); readGrid(b8, 'x', o); const b = performance.now() - t;
  t = performance.now(); readGrid(b16, 'x', o); const c = performance.now() - t;
  console.log(a.toFixed(1), b.toFixed(1), c.toFixed(1));
}
