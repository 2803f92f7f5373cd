/**
 * Small helpers shared by the DXF and SVG writers: input validation, unit scale and ring length.
 */
import { RhoformError } from '../errors.js';
import type { Ring } from '../types.js';
import type { WriterInput } from './types.js';

/** Millimetres per inch (exact by definition, ISO 31 / NIST SP 811). */
export const MM_PER_INCH = 25.4;

/** The divisor that turns mm into output units: 1 for 'mm', 25.4 for 'in'. Throws for anything else. */
export function unitDivisor(units: WriterInput['units']): number {
  if (units === 'mm') return 1;
  if (units === 'in') return MM_PER_INCH;
  throw new RhoformError('E_INTERNAL', `expected units "mm" or "in", found ${JSON.stringify(String(units))}`);
}

/** Checks the domain rectangle (mm): finite, minX < maxX, minY < maxY. Returns it unchanged. */
export function checkDomain(domain: WriterInput['domain']): WriterInput['domain'] {
  const [minX, minY, maxX, maxY] = domain;
  if (!(Number.isFinite(minX) && Number.isFinite(minY) && maxX > minX && maxY > minY && Number.isFinite(maxX) && Number.isFinite(maxY))) {
    throw new RhoformError(
      'E_INTERNAL',
      `expected a finite domain with minX < maxX and minY < maxY, found [${domain.map(String).join(', ')}]`,
    );
  }
  return domain;
}

/**
 * How many points of `ring` to write: a repeated closing point (last equal to first) is dropped, because
 * rings are implicitly closed. Returns 0 for rings of fewer than 3 distinct-end points, which enclose no
 * area and are not written.
 */
export function ringLength(ring: Ring): number {
  let n = ring.length;
  if (n >= 2) {
    const a = ring[0];
    const b = ring[n - 1];
    if (a[0] === b[0] && a[1] === b[1]) n -= 1;
  }
  return n >= 3 ? n : 0;
}

/** Checks a circle radius (mm): finite and > 0. Returns it unchanged. */
export function checkRadius(r: number): number {
  if (!(r > 0 && Number.isFinite(r))) {
    throw new RhoformError('E_INTERNAL', `expected a circle radius > 0, found ${String(r)}`);
  }
  return r;
}
