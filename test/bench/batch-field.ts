/** The batch benchmark's grids (test/bench/batch.ts). Not part of the library. */
import { rng } from '../support/random.js';

/**
 * A smooth random density field: a sum of 12 random low-frequency plane waves (wavelengths 40–200 cells),
 * pushed through a steep ramp so most cells are near 0 or 1 with grey edges a few cells wide, as a
 * topology-optimization result looks. Deterministic per seed. Rows top first.
 */
export function smoothField(cols: number, rows: number, seed: number): Float64Array {
  const rnd = rng(seed);
  const waves = Array.from({ length: 12 }, () => {
    const len = 40 + 160 * rnd();
    const dir = 2 * Math.PI * rnd();
    return { kx: (2 * Math.PI * Math.cos(dir)) / len, ky: (2 * Math.PI * Math.sin(dir)) / len, phase: 2 * Math.PI * rnd(), amp: 0.5 + rnd() };
  });
  const out = new Float64Array(cols * rows);
  const norm = 1 / Math.sqrt(waves.length);
  for (let r = 0; r < rows; r++) {
    for (let c = 0; c < cols; c++) {
      let f = 0;
      for (const w of waves) f += w.amp * Math.cos(w.kx * c + w.ky * r + w.phase);
      out[r * cols + c] = Math.min(1, Math.max(0, 0.5 + 2.5 * f * norm));
    }
  }
  return out;
}
