/**
 * Arrays one contour build lends to the next (the level search contours the same grid at two or three levels):
 * the crossing store of march.ts and the stitcher's buffers. Fresh memory costs more than the work done in it,
 * so a later build writes over the pages an earlier one touched instead of faulting in new ones.
 *
 * Only intermediate values live here: nothing contourFlat returns aliases these arrays, so a build may reuse
 * them while the rings of earlier builds are still in use. One scratch serves one build at a time.
 */
export class ContourScratch {
  /** Crossing store: positions (mm), links and horizontal-edge keys of up to `x.length` crossings. */
  x: Float64Array = new Float64Array(0);
  y: Float64Array = new Float64Array(0);
  next: Int32Array = new Int32Array(0);
  hKey: Int32Array = new Int32Array(0);
  /** Stitcher: ring id of each crossing, and the cleaned rings (xy pairs, at most one per crossing). */
  ringOf: Int32Array = new Int32Array(0);
  rings: Float64Array = new Float64Array(0);
  /** Stitcher: the ring being cleaned, as a stack of x and y. */
  ox: Float64Array = new Float64Array(256);
  oy: Float64Array = new Float64Array(256);

  /** The stitcher's buffers for `n` crossings (grown, never shrunk; contents undefined). */
  stitchBuffers(n: number): { ringOf: Int32Array; rings: Float64Array } {
    if (this.ringOf.length < n) this.ringOf = new Int32Array(n);
    if (this.rings.length < 2 * n) this.rings = new Float64Array(2 * n);
    return { ringOf: this.ringOf, rings: this.rings };
  }
}
