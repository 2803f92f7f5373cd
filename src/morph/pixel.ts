/** Raster resolution of the morphology engine (mm, y up, origin at the lower-left corner of the grid). */

import type { Domain } from '../types.js';

/** Largest subdivision of a grid cell tried by choosePixel. */
export const MAX_SUBDIVISION = 8;

/**
 * Pixel size (mm) for the morphology raster: min(hx, hy)/k with the largest integer k in [1, 8] such that the
 * raster over `domain` ([minX, minY, maxX, maxY], mm) has at most `maxPixels` pixels
 * (ceil(W/pixel)·ceil(H/pixel)); k = 1 when even that is over. `cellSize` = [hx, hy], mm, both > 0.
 */
export function choosePixel(
  cellSize: readonly [number, number],
  domain: Domain,
  maxPixels = 4_000_000,
): number {
  const [hx, hy] = cellSize;
  if (!(hx > 0) || !(hy > 0) || !Number.isFinite(hx) || !Number.isFinite(hy)) {
    throw new RangeError(`choosePixel: expected cell sizes > 0, found ${hx}, ${hy}`);
  }
  const w = domain[2] - domain[0];
  const h = domain[3] - domain[1];
  if (!(w > 0) || !(h > 0) || !Number.isFinite(w) || !Number.isFinite(h)) {
    throw new RangeError(`choosePixel: expected a domain with positive width and height, found ${domain.join(', ')}`);
  }
  if (!(maxPixels >= 1)) throw new RangeError(`choosePixel: expected maxPixels ≥ 1, found ${maxPixels}`);
  const base = Math.min(hx, hy);
  for (let k = MAX_SUBDIVISION; k >= 1; k--) {
    const p = base / k;
    if (Math.ceil(w / p - 1e-9) * Math.ceil(h / p - 1e-9) <= maxPixels) return p;
  }
  return base;
}
