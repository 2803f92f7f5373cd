/**
 * The benchmark field: a solid plate with many round holes whose edges are grey (a linear ramp about
 * three cells wide), about one hole per 3000 cells and about 60 % solid, so boundary length grows with size.
 * Deterministic (a fixed-seed generator). Rows are returned top row first, as an NPY/CSV file holds them.
 */
import { rng } from '../support/random.js';

export function platePattern(cols: number, rows: number, seed = 7): Float64Array {
  const rnd = rng(seed);
  const cells = cols * rows;
  const holes = Math.max(1, Math.round(cells / 3000));
  // 40 % void in `holes` discs: π r² · holes = 0.4 · cells.
  const rMean = Math.sqrt((0.4 * cells) / (Math.PI * holes));
  const ramp = 3;
  // Place holes on a jittered lattice so they rarely overlap.
  const aspect = cols / rows;
  const ny = Math.max(1, Math.round(Math.sqrt(holes / aspect)));
  const nx = Math.max(1, Math.ceil(holes / ny));
  const out = new Float64Array(cells).fill(1);
  let placed = 0;
  for (let a = 0; a < ny && placed < holes; a++) {
    for (let b = 0; b < nx && placed < holes; b++, placed++) {
      const cx = ((b + 0.5 + (rnd() - 0.5) * 0.3) * cols) / nx;
      const cy = ((a + 0.5 + (rnd() - 0.5) * 0.3) * rows) / ny;
      const r = rMean * (0.85 + 0.3 * rnd());
      const x0 = Math.max(0, Math.floor(cx - r - ramp));
      const x1 = Math.min(cols - 1, Math.ceil(cx + r + ramp));
      const y0 = Math.max(0, Math.floor(cy - r - ramp));
      const y1 = Math.min(rows - 1, Math.ceil(cy + r + ramp));
      for (let y = y0; y <= y1; y++) {
        for (let x = x0; x <= x1; x++) {
          const d = Math.hypot(x + 0.5 - cx, y + 0.5 - cy);
          const v = Math.min(1, Math.max(0, 0.5 + (d - r) / ramp));
          const k = y * cols + x;
          if (v < out[k]) out[k] = v;
        }
      }
    }
  }
  return out;
}

/** The same field as CSV text (comma separated, top row first, 6 decimals like a typical export). */
export function plateCsv(values: Float64Array, cols: number, rows: number): string {
  const lines: string[] = new Array(rows);
  const row: string[] = new Array(cols);
  for (let r = 0; r < rows; r++) {
    for (let c = 0; c < cols; c++) {
      const v = values[r * cols + c];
      row[c] = v === 1 ? '1' : v === 0 ? '0' : v.toFixed(6);
    }
    lines[r] = row.join(',');
  }
  return `${lines.join('\n')}\n`;
}
