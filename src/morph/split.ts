/** How many lanes (src/parallel) a raster pass of the morphology engine splits over. */
import { laneCount } from '../parallel/lanes.js';

/**
 * Smallest raster (pixels) whose passes are split: below it one thread is faster, since handing a band to
 * another thread and joining costs about a millisecond and the first task of a process starts the threads.
 */
export const SPLIT_PIXELS = 1_000_000;

/** Lanes for a pass over a raster of `pixels` pixels (1 = the calling thread only). */
export function rasterLanes(pixels: number): number {
  return laneCount(pixels, SPLIT_PIXELS);
}
