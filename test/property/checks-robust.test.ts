/**
 * Properties of the checks on random optimizer-like fields (smoothed noise, any cell size, cells or nodes,
 * any row order): every check runs to a verdict, the report contract holds (docs/report-schema.md), and
 * every location lies in the domain and maps to a real row and column of the input file.
 * No outside value is needed beyond the contract itself and the geometry of the domain.
 */
import { describe, expect, it } from 'vitest';
import { build } from '../../src/pipeline.js';
import { resolveSettings, type Settings } from '../../src/settings.js';
import { npyFloat64 } from '../bench/npy-write.js';
import { rng } from '../support/random.js';

/** A random field: white noise blurred three times by a 3×3 box, stretched to 0..1 (top row first). */
function field(cols: number, rows: number, seed: number): Float64Array {
  const rnd = rng(seed);
  let v = Float64Array.from({ length: cols * rows }, () => rnd());
  for (let pass = 0; pass < 3; pass++) {
    const out = new Float64Array(v.length);
    for (let r = 0; r < rows; r++) {
      for (let c = 0; c < cols; c++) {
        let s = 0, n = 0;
        for (let dr = -1; dr <= 1; dr++) for (let dc = -1; dc <= 1; dc++) {
          const rr = r + dr, cc = c + dc;
          if (rr >= 0 && rr < rows && cc >= 0 && cc < cols) { s += v[rr * cols + cc]; n++; }
        }
        out[r * cols + c] = s / n;
      }
    }
    v = out;
  }
  let lo = Infinity, hi = -Infinity;
  for (const x of v) { lo = Math.min(lo, x); hi = Math.max(hi, x); }
  return v.map((x) => (x - lo) / (hi - lo));
}

describe('checks on random fields', () => {
  for (let seed = 1; seed <= 12; seed++) {
    it(`seed ${seed}: every check reaches a verdict; locations lie in the domain and in the file`, () => {
      const rnd = rng(1000 + seed);
      const cols = 20 + Math.floor(rnd() * 50);
      const rows = 20 + Math.floor(rnd() * 40);
      const h = [0.5, 1, 2.5][seed % 3];
      const nodes = seed % 4 === 0;
      const s: Partial<Settings> = {
        cellSize: [h, h],
        values: nodes ? 'nodes' : 'cells',
        rowOrder: seed % 2 === 0 ? 'bottom-up' : 'top-down',
        minMember: 2 * h + rnd() * 4 * h,
        minHole: 2 * h + rnd() * 4 * h,
        toolRadius: h * (0.5 + rnd() * 2),
        minHoleArea: 10 * h * h,
      };
      const r = build({ name: 'random.npy', bytes: npyFloat64(field(cols, rows, seed), rows, cols) }, resolveSettings(s));
      const report = r.report;
      expect(report.checks.map((c) => c.id)).toEqual([
        'volume-fraction', 'min-member-size', 'min-hole-size', 'min-inner-radius', 'islands', 'small-holes', 'outline-fidelity', 'grey-level',
      ]);
      const cellsX = nodes ? cols - 1 : cols;
      const cellsY = nodes ? rows - 1 : rows;
      for (const c of report.checks) {
        expect(['pass', 'warn', 'fail']).toContain(c.status);
        expect(c.resolution).toBeGreaterThanOrEqual(0);
        expect(c.locations.length).toBeLessThanOrEqual(Math.min(100, c.locationsTotal));
        if (c.measured !== null) expect(Number.isFinite(c.measured)).toBe(true);
        for (let k = 0; k < c.locations.length; k++) {
          const l = c.locations[k];
          // inside the domain (a hair of rounding allowed)
          expect(l.x).toBeGreaterThanOrEqual(-1e-6);
          expect(l.y).toBeGreaterThanOrEqual(-1e-6);
          expect(l.x).toBeLessThanOrEqual(cellsX * h + 1e-6);
          expect(l.y).toBeLessThanOrEqual(cellsY * h + 1e-6);
          expect(l.fileRow).toBeGreaterThanOrEqual(1);
          expect(l.fileRow).toBeLessThanOrEqual(rows);
          expect(l.fileCol).toBeGreaterThanOrEqual(1);
          expect(l.fileCol).toBeLessThanOrEqual(cols);
          // worst first
          if (k > 0) {
            const prev = c.locations[k - 1].measured;
            if (c.comparison === '>=') expect(l.measured).toBeGreaterThanOrEqual(prev);
            else expect(l.measured).toBeLessThanOrEqual(prev);
          }
        }
        // a size check's worst value is no better than its worst listed place
        if (c.comparison === '>=' && c.locations.length > 0 && c.measured !== null) expect(c.measured).toBeLessThanOrEqual(c.locations[0].measured + 1e-9);
      }
      const { pass, warn, fail } = report.summary;
      expect(pass + warn + fail).toBe(report.checks.length);
      expect(report.summary.status).toBe(fail > 0 ? 'fail' : warn > 0 ? 'warn' : 'pass');
    });
  }
});
