/**
 * Reader bench (docs/performance.md): the same 2000×1000 field in each input format, read by `readGrid`
 * (detection included). Each format is timed in a fresh Node process of its own (the heap of one reader's run
 * does not slow the next), several reads each; the best and the median are reported, and the ratio of the best
 * to the NPY reader's best. Targets (issue 13): within 1.5× of NPY for plain binary formats, 3× for PNG and
 * compressed data. ASCII formats are shown for information; they parse text, like CSV, and have no target.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { loadReaders, readGrid } from '../../src/read/detect.js';
import { DEFAULT_READ_OPTIONS } from '../../src/read/types.js';
import { matDouble, pngGrey, vti, vtkLegacy } from './format-writers.js';
import { npyFloat64 } from './npy-write.js';
import { platePattern } from './plate.js';

const COLS = 2000;
const ROWS = 1000;
const REPEAT = Number(process.env.BENCH_REPEAT ?? 9);

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)];
}

const options = { ...DEFAULT_READ_OPTIONS, maxCells: 1e8 };
await loadReaders();
const gc = (globalThis as { gc?: () => void }).gc;

function timeOnce(bytes: Uint8Array, name: string): number {
  gc?.();
  const t0 = performance.now();
  const r = readGrid(bytes, name, options);
  const ms = performance.now() - t0;
  if (r.grid.values.length !== COLS * ROWS) throw new Error(`${name}: wrong size`);
  return ms;
}

/** Child mode: `readers.js --time <file> <name>` prints the times of REPEAT reads as JSON. */
if (process.argv[2] === '--time') {
  const bytes = new Uint8Array(readFileSync(process.argv[3]));
  timeOnce(bytes, process.argv[4]); // warm up
  const t: number[] = [];
  for (let k = 0; k < REPEAT; k++) t.push(timeOnce(bytes, process.argv[4]));
  console.log(JSON.stringify(t));
  process.exit(0);
}

const values = platePattern(COLS, ROWS);

/** The same field as an NPY file in Fortran order (column by column), the memory order of a MAT-file. */
function npyFortran(v: Float64Array, rows: number, cols: number): Uint8Array {
  const c = npyFloat64(v, rows, cols);
  const text = new TextDecoder('latin1').decode(c.subarray(0, 128));
  const start = text.indexOf('{');
  const header = text.slice(start, text.indexOf('\n') + 1).replace("'fortran_order': False", "'fortran_order': True ");
  const out = c.slice();
  out.set(new TextEncoder().encode(header), start);
  const data = new Float64Array(out.buffer, c.length - v.byteLength, v.length);
  for (let r = 0; r < rows; r++) for (let k = 0; k < cols; k++) data[k * rows + r] = v[r * cols + k];
  return out;
}
// the NPY writer takes rows top first; the field is symmetric enough that this does not matter for timing
const cases: { name: string; file: string; bytes: Uint8Array; limit: number | null }[] = [
  { name: 'NPY f8 (reference)', file: 'a.npy', bytes: npyFloat64(values, ROWS, COLS), limit: null },
  { name: 'NPY f8, Fortran order (as MAT stores it)', file: 'f.npy', bytes: npyFortran(values, ROWS, COLS), limit: null },
  { name: 'MAT double', file: 'a.mat', bytes: matDouble(values, ROWS, COLS, false), limit: 1.5 },
  { name: 'MAT double, compressed', file: 'a.mat', bytes: matDouble(values, ROWS, COLS, true), limit: 3 },
  { name: 'VTK legacy BINARY double', file: 'a.vtk', bytes: vtkLegacy(values, ROWS, COLS, true), limit: 1.5 },
  { name: 'VTI appended raw Float64', file: 'a.vti', bytes: vti(values, ROWS, COLS, 'appended-raw'), limit: 1.5 },
  { name: 'VTI appended raw, zlib', file: 'a.vti', bytes: vti(values, ROWS, COLS, 'appended-raw-zlib'), limit: 3 },
  { name: 'VTI base64 Float64', file: 'a.vti', bytes: vti(values, ROWS, COLS, 'base64'), limit: 3 },
  { name: 'VTI base64, zlib', file: 'a.vti', bytes: vti(values, ROWS, COLS, 'base64-zlib'), limit: 3 },
  { name: 'PNG grey 8-bit', file: 'a.png', bytes: pngGrey(values, ROWS, COLS, 8), limit: 3 },
  { name: 'PNG grey 16-bit', file: 'a.png', bytes: pngGrey(values, ROWS, COLS, 16), limit: 3 },
  { name: 'VTK legacy ASCII (no target)', file: 'a.vtk', bytes: vtkLegacy(values, ROWS, COLS, false), limit: null },
];

// BENCH_ONLY=<text>: only the formats whose name contains it (and NPY), to look at one reader.
const only = process.env.BENCH_ONLY;
if (only) cases.splice(1, cases.length, ...cases.slice(1).filter((c) => c.name.includes(only)));
const dir = mkdtempSync(join(tmpdir(), 'rhoform-readers-'));
const self = fileURLToPath(import.meta.url);
const times: number[][] = cases.map(() => []);
// Two rounds over the formats, each format in a fresh process, so that load from other processes spreads over all.
for (let round = 0; round < 2; round++) {
  cases.forEach((c, i) => {
    const path = join(dir, `${i}-${c.file}`);
    writeFileSync(path, c.bytes);
    const r = spawnSync(process.execPath, ['--expose-gc', self, '--time', path, c.file], { encoding: 'utf8', env: { ...process.env } });
    if (r.status !== 0) throw new Error(`bench child failed for ${c.name}: ${r.stderr}`);
    times[i].push(...(JSON.parse(r.stdout.trim().split('\n').pop() as string) as number[]));
  });
}
rmSync(dir, { recursive: true, force: true });
// Ratios use the best time of each format: on a shared machine the minimum is the estimate least disturbed by
// other processes; the median is shown beside it.
const best = (xs: number[]): number => Math.min(...xs);
const base = best(times[0]);
const rows: string[] = ['| format (2000×1000) | file MB | read ms (best) | ms (median) | × NPY (best) | target | ok |', '| --- | ---: | ---: | ---: | ---: | ---: | --- |'];
let failed = 0;
cases.forEach((c, i) => {
  const ms = best(times[i]);
  const ratio = ms / base;
  const ok = c.limit === null ? '' : ratio <= c.limit ? 'yes' : 'NO';
  if (ok === 'NO') failed++;
  rows.push(`| ${c.name} | ${(c.bytes.length / 1e6).toFixed(1)} | ${ms.toFixed(1)} | ${median(times[i]).toFixed(1)} | ${ratio.toFixed(2)} | ${c.limit === null ? '' : `≤ ${c.limit}`} | ${ok} |`);
});
console.log(rows.join('\n'));
console.log(failed === 0 ? '\nreaders: every target met' : `\nreaders: ${failed} target(s) missed`);
