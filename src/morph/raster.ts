/** The phase mask of an outline on the raster frame (frame.ts). mm, y up. */
import type { Frame } from './frame.js';
import type { SegmentSet } from './segments.js';
import { rasterLanes } from './split.js';

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
  // shared memory when the medial pass will be split (medial.ts), so that its lanes read the mask without a copy
  const mask = rasterLanes(nx * ny) > 1 ? new Uint8Array(new SharedArrayBuffer(nx * ny)) : new Uint8Array(nx * ny);
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
