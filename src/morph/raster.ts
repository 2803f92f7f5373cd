/**
 * The raster frame and the phase mask.
 *
 * Frame: millimetres, y up, origin at the lower-left corner of the grid. The raster covers the domain rectangle
 * plus `pad` pixels of open space (void) on every side, with square pixels of size `pixel` (mm). Internally
 * everything is in pixel units: pixel (i, j) is centred at (i, j), i.e. at mm
 * (x0 + (i + ½)·pixel, y0 + (j + ½)·pixel) with x0 = minX − pad·pixel, y0 = minY − pad·pixel.
 */
import type { SegmentSet } from './segments.js';

export interface Frame {
  /** Pixel size, mm. */
  readonly pixel: number;
  /** Pixels of open space added on each side of the domain. */
  readonly pad: number;
  /** Pixels across / up, padding included. */
  readonly nx: number;
  readonly ny: number;
  /** mm coordinates of the lower-left corner of pixel (0, 0). */
  readonly x0: number;
  readonly y0: number;
  /** Domain rectangle in mm [minX, minY, maxX, maxY]. */
  readonly domain: readonly [number, number, number, number];
  /** Domain rectangle in pixel units [minU, minV, maxU, maxV]. */
  readonly box: readonly [number, number, number, number];
}

/** Builds the frame over `domain` (mm) with square pixels of `pixel` mm and `pad` void pixels on every side. */
export function makeFrame(domain: readonly [number, number, number, number], pixel: number, pad: number): Frame {
  const w = domain[2] - domain[0];
  const h = domain[3] - domain[1];
  const cx = Math.max(1, Math.ceil(w / pixel - 1e-9));
  const cy = Math.max(1, Math.ceil(h / pixel - 1e-9));
  return {
    pixel,
    pad,
    nx: cx + 2 * pad,
    ny: cy + 2 * pad,
    x0: domain[0] - pad * pixel,
    y0: domain[1] - pad * pixel,
    domain,
    box: [pad - 0.5, pad - 0.5, pad - 0.5 + w / pixel, pad - 0.5 + h / pixel],
  };
}

/** mm coordinates of a pixel-unit point. */
export function toMm(frame: Frame, u: number, v: number): { x: number; y: number } {
  return { x: frame.x0 + (u + 0.5) * frame.pixel, y: frame.y0 + (v + 0.5) * frame.pixel };
}

/**
 * Phase mask: 1 where the pixel centre is solid, 0 where it is void, by an even-odd scanline fill of all rings
 * (outer rings and holes alike) at pixel centres; a centre exactly on a rising edge counts as inside (half-open
 * rule, so shared edges are counted once). Outside the domain everything is void.
 */
export function phaseMask(frame: Frame, set: SegmentSet): Uint8Array {
  const { nx, ny } = frame;
  const { geo, n } = set;
  const count = new Int32Array(ny + 1);
  for (let s = 0; s < n; s++) {
    const ay = geo[5 * s + 1];
    const by = ay + geo[5 * s + 3];
    const lo = Math.max(0, Math.ceil(Math.min(ay, by)));
    const hi = Math.min(ny, Math.ceil(Math.max(ay, by)));
    for (let j = lo; j < hi; j++) count[j + 1]++;
  }
  for (let j = 0; j < ny; j++) count[j + 1] += count[j];
  const xs = new Float64Array(count[ny]);
  const fill = count.slice(0, ny);
  for (let s = 0; s < n; s++) {
    const o = 5 * s;
    const ax = geo[o], ay = geo[o + 1], dx = geo[o + 2], dy = geo[o + 3];
    if (dy === 0) continue;
    const by = ay + dy;
    const lo = Math.max(0, Math.ceil(Math.min(ay, by)));
    const hi = Math.min(ny, Math.ceil(Math.max(ay, by)));
    for (let j = lo; j < hi; j++) xs[fill[j]++] = ax + ((j - ay) * dx) / dy;
  }
  const mask = new Uint8Array(nx * ny);
  for (let j = 0; j < ny; j++) {
    const row = xs.subarray(count[j], count[j + 1]);
    row.sort();
    for (let k = 0; k + 1 < row.length; k += 2) {
      const i0 = Math.max(0, Math.ceil(row[k]));
      const i1 = Math.min(nx, Math.ceil(row[k + 1]));
      if (i1 > i0) mask.fill(1, j * nx + i0, j * nx + i1);
    }
  }
  return mask;
}
