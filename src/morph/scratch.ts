/**
 * One raster-sized scratch buffer (8 bytes a pixel) that the engine's steps lend each other in turn: the feature
 * transform's squared distances, then the tool corners' power transform input, and the pixel-owner tables of the
 * width places and corner groups. Memory a process has not touched before costs far more than reusing memory it
 * has (docs/performance.md, "Memory: the checks and the pictures"), so one buffer serves every step. The steps run
 * one after another on the calling thread; `use` refuses a second lease while one is open.
 */
import { float64 } from '../parallel/lanes.js';

export class RasterScratch {
  /** Pixels of the raster. */
  readonly pixels: number;
  private readonly f64: Float64Array;
  private readonly i32: Int32Array;
  private busy = false;

  /** `shared`: in shared memory, for passes split over lanes (src/parallel). */
  constructor(pixels: number, shared: boolean) {
    this.pixels = pixels;
    this.f64 = float64(pixels, shared);
    this.i32 = new Int32Array(this.f64.buffer, 0, pixels);
  }

  /**
   * Lends the buffer to `step` as a Float64Array of `pixels` values and, over its first half, an Int32Array of
   * `pixels` values (the two views share memory). Contents on entry are whatever the last step left.
   */
  use<T>(step: (f64: Float64Array, i32: Int32Array) => T): T {
    if (this.busy) throw new Error('RasterScratch: already in use');
    this.busy = true;
    try {
      return step(this.f64, this.i32);
    } finally {
      this.busy = false;
    }
  }
}
