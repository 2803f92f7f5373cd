/**
 * Numbers stored in a binary file → float64, for the MAT, VTK and VTI readers: fixed-size integers and IEEE
 * floats of either byte order. 64-bit integers are rounded to the nearest double (exact below 2^53), as
 * numpy's `astype(float64)` rounds them.
 */

/** A stored number type: i/u = signed/unsigned integer, f = IEEE float; the digit is the size in bytes. */
export type NumKind = 'i1' | 'u1' | 'i2' | 'u2' | 'i4' | 'u4' | 'i8' | 'u8' | 'f4' | 'f8';

export const HOST_LITTLE_ENDIAN = new Uint8Array(new Uint16Array([1]).buffer)[0] === 1;

/** Size in bytes of one number of kind `kind`. */
export function kindSize(kind: NumKind): number {
  return Number(kind.slice(1));
}

type View = ArrayLike<number> | BigInt64Array | BigUint64Array;

function viewOf(buf: ArrayBuffer, offset: number, count: number, kind: NumKind): View {
  switch (kind) {
    case 'i1': return new Int8Array(buf, offset, count);
    case 'u1': return new Uint8Array(buf, offset, count);
    case 'i2': return new Int16Array(buf, offset, count);
    case 'u2': return new Uint16Array(buf, offset, count);
    case 'i4': return new Int32Array(buf, offset, count);
    case 'u4': return new Uint32Array(buf, offset, count);
    case 'i8': return new BigInt64Array(buf, offset, count);
    case 'u8': return new BigUint64Array(buf, offset, count);
    case 'f4': return new Float32Array(buf, offset, count);
    case 'f8': return new Float64Array(buf, offset, count);
  }
}

/**
 * `count` numbers of `kind` starting at `bytes[start]`, as an indexable array of JavaScript numbers. The caller
 * has checked that `start + count · size ≤ bytes.length`. Aligned host-order data are viewed in place (the result
 * shares memory with `bytes`); other data are copied once to fresh aligned memory (and byte-swapped); 64-bit
 * integers are converted into a new Float64Array.
 */
export function numbersAt(bytes: Uint8Array, start: number, count: number, kind: NumKind, littleEndian: boolean): ArrayLike<number> {
  const size = kindSize(kind);
  const abs = bytes.byteOffset + start;
  if (littleEndian === HOST_LITTLE_ENDIAN && abs % size === 0 && kind !== 'i8' && kind !== 'u8') {
    return viewOf(bytes.buffer as ArrayBuffer, abs, count, kind) as ArrayLike<number>;
  }
  if (kind !== 'i8' && kind !== 'u8') {
    // an aligned copy (native memcpy), byte-swapped natively when the file's order is not the host's
    const copy = Buffer.allocUnsafeSlow(count * size); // its own memory (never the pool), every byte written next
    copy.set(bytes.subarray(start, start + count * size));
    if (littleEndian !== HOST_LITTLE_ENDIAN) {
      if (size === 2) copy.swap16();
      else if (size === 4) copy.swap32();
      else if (size === 8) copy.swap64();
    }
    return viewOf(copy.buffer as ArrayBuffer, copy.byteOffset, count, kind) as ArrayLike<number>;
  }
  const dv = new DataView(bytes.buffer, abs, count * size);
  const out = new Float64Array(count);
  if (kind === 'i8') for (let k = 0; k < count; k++) out[k] = Number(dv.getBigInt64(8 * k, littleEndian));
  else for (let k = 0; k < count; k++) out[k] = Number(dv.getBigUint64(8 * k, littleEndian));
  return out;
}

/**
 * Grid values (values[j·nx + i], j counting up from the bottom row) from numbers stored row by row
 * (`rowMajor`: element (r, c) at r·cols + c) or column by column (element (r, c) at c·rows + r).
 * `flip`: stored row 0 is the top grid row (j = rows − 1 − r); otherwise it is the bottom row (j = r).
 * `input`: the file's bytes; a Float64Array `src` that is not a view of them may be returned as the grid's values.
 */
export function toGrid(src: ArrayLike<number>, rows: number, cols: number, rowMajor: boolean, flip: boolean, input: Uint8Array | null): Float64Array {
  if (rowMajor && src instanceof Float64Array && src.length === rows * cols) {
    // typed fast paths: whole rows at once; a fresh array (not a view of the input) is taken as it is
    if (!flip) return input !== null && src.buffer === input.buffer ? src.slice() : src;
    const out = new Float64Array(rows * cols);
    for (let r = 0; r < rows; r++) out.set(src.subarray(r * cols, (r + 1) * cols), (rows - 1 - r) * cols);
    return out;
  }
  const out = new Float64Array(rows * cols);
  if (!rowMajor) {
    // column by column to rows, in 64 × 64 tiles so that reads and writes both stay in cache
    const B = 64;
    for (let r0 = 0; r0 < rows; r0 += B) {
      const r1 = Math.min(rows, r0 + B);
      for (let c0 = 0; c0 < cols; c0 += B) {
        const c1 = Math.min(cols, c0 + B);
        for (let r = r0; r < r1; r++) {
          const base = (flip ? rows - 1 - r : r) * cols;
          for (let c = c0, k = c0 * rows + r; c < c1; c++, k += rows) out[base + c] = src[k];
        }
      }
    }
    return out;
  }
  for (let r = 0; r < rows; r++) {
    const j = flip ? rows - 1 - r : r;
    const base = j * cols;
    const s = r * cols;
    for (let c = 0; c < cols; c++) out[base + c] = src[s + c];
  }
  return out;
}
