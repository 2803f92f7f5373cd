/** Lanes (src/parallel) for a raster pass of the morphology engine. */
import { laneCount } from '../parallel/lanes.js';

/**
 * Smallest raster (pixels) whose passes are split: the split part is ~0.2 s of CPU per M pixels, so below 2 M a
 * second thread saves less than its start-up (~0.1 s to the first answer).
 */
export const SPLIT_PIXELS = 2_000_000;

/** Lanes for a pass over a raster of `pixels` pixels (1 = the calling thread only). */
export function rasterLanes(pixels: number): number {
  return laneCount(pixels, SPLIT_PIXELS);
}
