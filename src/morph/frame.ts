/**
 * The raster frame of the morphology engine: the domain plus `pad` pixels of open space on every side, square
 * pixels of `pixel` mm. Inside, pixel (i, j) is centred at (i, j): mm (x0 + (i + ½)·pixel, y0 + (j + ½)·pixel).
 */
import type { Domain } from '../types.js';

export interface Frame {
  /** Pixel size, mm. */
  readonly pixel: number;
  /** Pixels of open space on each side. */
  readonly pad: number;
  /** Pixels across / up, margin included. */
  readonly nx: number;
  readonly ny: number;
  /** mm coordinates of the lower-left corner of pixel (0, 0). */
  readonly x0: number;
  readonly y0: number;
  /** Domain rectangle in mm [minX, minY, maxX, maxY]. */
  readonly domain: Domain;
  /** Domain rectangle in pixel units [minU, minV, maxU, maxV]. */
  readonly box: readonly [number, number, number, number];
}

/** Builds the frame over `domain` (mm) with square pixels of `pixel` mm and `pad` void pixels on every side. */
export function makeFrame(domain: Domain, pixel: number, pad: number): Frame {
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
