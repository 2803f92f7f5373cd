/**
 * A 120 × 60 cell plate (1 mm cells) with five round holes, one of them cut by the domain edge, and linear
 * grey ramps three cells wide (value = 0.5 + distance/3, clipped): the hole boundaries are known analytically.
 * Rows j count up from the bottom (DensityGrid order).
 */
import type { DensityGrid } from '../../src/types.js';

export const HOLE_PLATE_HOLES: readonly (readonly [cx: number, cy: number, r: number])[] = [
  [20.3, 20.2, 9],
  [55.1, 35.7, 12],
  [95.4, 18.9, 7],
  [118, 45, 10],
  [60, 8, 3],
];

export function holePlateGrid(): DensityGrid {
  const nx = 120, ny = 60;
  const values = new Float64Array(nx * ny);
  for (let j = 0; j < ny; j++) {
    for (let i = 0; i < nx; i++) {
      let d = Infinity;
      for (const [cx, cy, r] of HOLE_PLATE_HOLES) d = Math.min(d, Math.hypot(i + 0.5 - cx, j + 0.5 - cy) - r);
      values[j * nx + i] = Math.max(0, Math.min(1, 0.5 + d / 3));
    }
  }
  return { nx, ny, cellSize: [1, 1], origin: [0, 0], values, placement: 'cells' };
}
