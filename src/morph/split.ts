/** Lanes (src/parallel) for a raster pass of the morphology engine. */
import { laneCount } from '../parallel/lanes.js';

/** Smallest raster (pixels) whose passes are split; below it the threads' start-up costs more than they save. */
export const SPLIT_PIXELS = 1_000_000;

/** Lanes for a pass over a raster of `pixels` pixels (1 = the calling thread only). */
export function rasterLanes(pixels: number): number {
  return laneCount(pixels, SPLIT_PIXELS);
}
