/**
 * Arrays one smoothing lends to the next (the level search smooths two or three outlines of one grid): the
 * smoothed positions and the validation's segment arrays. Only intermediate values live here — nothing
 * smoothFlat returns aliases them, not even its lazily measured deviation — so a later smoothing may write
 * over them while earlier results are still in use. One scratch serves one smoothing at a time.
 */
export class SmoothScratch {
  private pos: Float64Array = new Float64Array(0);
  private seg: Float64Array = new Float64Array(0);
  private segRing: Int32Array = new Int32Array(0);

  /** `length` numbers for the smoothed positions (contents undefined). */
  positions(length: number): Float64Array {
    if (this.pos.length < length) this.pos = new Float64Array(length);
    return this.pos.subarray(0, length);
  }

  /** Four coordinate arrays and a ring id array of `n` segments each (contents undefined). */
  segments(n: number): { x0: Float64Array; y0: Float64Array; x1: Float64Array; y1: Float64Array; ring: Int32Array } {
    if (this.seg.length < 4 * n) this.seg = new Float64Array(4 * n);
    if (this.segRing.length < n) this.segRing = new Int32Array(n);
    const s = this.seg;
    return { x0: s.subarray(0, n), y0: s.subarray(n, 2 * n), x1: s.subarray(2 * n, 3 * n), y1: s.subarray(3 * n, 4 * n), ring: this.segRing.subarray(0, n) };
  }
}
