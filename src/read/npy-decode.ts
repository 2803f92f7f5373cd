/**
 * NPY data bytes → grid values (Float64Array, values[j * nx + i], j counting up from the bottom row).
 *
 * The array is (rows, cols) as numpy shows it. Element (r, c) is stored at element index r·cols + c
 * (C order) or c·rows + r (Fortran order) after the header (NEP 1; numpy reads Fortran data as
 * `reshape(shape[::-1]).T`). With top-down row order, array row r becomes grid row j = rows − 1 − r.
 *
 * Two paths give identical results: a typed-array path for little-endian data on a little-endian host
 * (rows copied with `TypedArray.set`, which converts element types natively; f8 C-order rows are plain
 * byte copies, so any data offset works; aligned f8 C-order data stored bottom row first is returned as a
 * view of `bytes`, without a copy — and so is top-down data when the caller lets the decoder consume `bytes`:
 * the rows are then swapped in place; aligned f4 C-order data are widened to f8 in place when the caller's
 * buffer has room for them after the file, see npyInPlaceBytes) and a general DataView path for everything else.
 * Non-finite values are kept as they are (NaN, ±Infinity); booleans become 0/1; 64-bit integers are
 * rounded to the nearest float64 (exact below 2^53).
 */
import type { NpyDtype } from './npy-dtype.js';

export interface NpyDataLayout {
  readonly dtype: NpyDtype;
  /** Byte offset of element 0 in `bytes`. */
  readonly dataOffset: number;
  readonly rows: number;
  readonly cols: number;
  readonly fortranOrder: boolean;
}

/** 'auto' takes the typed-array path when it applies; 'general' always uses DataView (for tests). */
export type NpyDecodePath = 'auto' | 'general';

const HOST_LITTLE_ENDIAN = new Uint8Array(new Uint16Array([1]).buffer)[0] === 1;

/** Grid values, and whether they are a view of the file's bytes (shared memory) rather than a fresh array. */
export interface NpyValues {
  readonly values: Float64Array;
  readonly view: boolean;
}

/**
 * Decodes rows × cols elements into grid order. The caller has checked that the data fit in `bytes`.
 * @param topDown true: array row 0 is the top grid row (j = rows − 1); false: it is the bottom row.
 * @param consume true: the caller hands `bytes` over, and the decoder may rearrange them in place (only the
 *   data; the header is left as it is) to return a view instead of a copy.
 * @param room with `consume`: bytes of `bytes.buffer` right after `bytes` that the decoder may use as well.
 */
export function decodeNpyData(bytes: Uint8Array, layout: NpyDataLayout, topDown: boolean, path: NpyDecodePath = 'auto', consume = false, room = 0): NpyValues {
  const { dtype } = layout;
  const typed = path === 'auto' && HOST_LITTLE_ENDIAN && dtype.littleEndian && !(dtype.kind === 'i' && dtype.size === 8) && !(dtype.kind === 'u' && dtype.size === 8);
  if (typed) {
    const view = viewF8(bytes, layout, topDown, consume) ?? (consume ? widenF4(bytes, layout, topDown, room) : null);
    if (view !== null) return { values: view, view: true };
  }
  const out = typed ? decodeTyped(bytes, layout, topDown) : decodeGeneral(bytes, layout, topDown);
  if (dtype.kind === 'f' && dtype.size === 2) {
    const half = halfTable();
    for (let k = 0; k < out.length; k++) out[k] = half[out[k]];
  } else if (dtype.kind === 'b') {
    for (let k = 0; k < out.length; k++) out[k] = out[k] !== 0 ? 1 : 0;
  }
  return { values: out, view: false };
}

type TypedCtor = Float64ArrayConstructor | Float32ArrayConstructor | Int8ArrayConstructor | Int16ArrayConstructor | Int32ArrayConstructor | Uint8ArrayConstructor | Uint16ArrayConstructor | Uint32ArrayConstructor;

/** Typed-array constructor for a little-endian dtype; f2 is read as its raw uint16 bits. */
function ctorOf(dtype: NpyDtype): TypedCtor {
  switch (dtype.kind) {
    case 'f':
      return dtype.size === 8 ? Float64Array : dtype.size === 4 ? Float32Array : Uint16Array;
    case 'i':
      return dtype.size === 1 ? Int8Array : dtype.size === 2 ? Int16Array : Int32Array;
    case 'u':
      return dtype.size === 1 ? Uint8Array : dtype.size === 2 ? Uint16Array : Uint32Array;
    case 'b':
      return Uint8Array;
  }
}

/**
 * Little-endian f8 in C order, 8-byte aligned: a Float64Array view of the data, or null. Stored bottom row first,
 * the bytes are already the grid; stored top row first, they become the grid when the rows are swapped in place,
 * which only a decoder that may consume `bytes` does.
 */
function viewF8(bytes: Uint8Array, layout: NpyDataLayout, topDown: boolean, consume: boolean): Float64Array | null {
  const { dtype, dataOffset, rows, cols, fortranOrder } = layout;
  const abs = bytes.byteOffset + dataOffset;
  if (!(dtype.kind === 'f' && dtype.size === 8 && !fortranOrder && abs % 8 === 0) || (topDown && !consume)) return null;
  const view = new Float64Array(bytes.buffer as ArrayBuffer, abs, rows * cols);
  if (topDown) swapRows(view, rows, cols);
  return view;
}

/**
 * Little-endian f4 in C order, 8-byte aligned, when `bytes` and the `room` after them hold 8 bytes a sample from
 * the data offset: the values widened to f8 where they are, from the last to the first (value k is written over
 * the f4 values 2k and 2k + 1, which are read by then), then the rows swapped when stored top row first.
 * Otherwise null.
 */
function widenF4(bytes: Uint8Array, layout: NpyDataLayout, topDown: boolean, room: number): Float64Array | null {
  const { dtype, dataOffset, rows, cols, fortranOrder } = layout;
  const n = rows * cols;
  const abs = bytes.byteOffset + dataOffset;
  const fits = dataOffset + 8 * n <= bytes.length + room && abs + 8 * n <= bytes.buffer.byteLength;
  if (!(dtype.kind === 'f' && dtype.size === 4 && !fortranOrder && abs % 8 === 0 && fits)) return null;
  const narrow = new Float32Array(bytes.buffer as ArrayBuffer, abs, n);
  const wide = new Float64Array(bytes.buffer as ArrayBuffer, abs, n);
  for (let k = n - 1; k >= 0; k--) wide[k] = narrow[k];
  if (topDown) swapRows(wide, rows, cols);
  return wide;
}

/** Reverses the order of the rows of a rows × cols array in place. */
function swapRows(values: Float64Array, rows: number, cols: number): void {
  const row = new Float64Array(cols);
  for (let a = 0, b = rows - 1; a < b; a++, b--) {
    row.set(values.subarray(a * cols, (a + 1) * cols));
    values.copyWithin(a * cols, b * cols, (b + 1) * cols);
    values.set(row, b * cols);
  }
}

function decodeTyped(bytes: Uint8Array, layout: NpyDataLayout, topDown: boolean): Float64Array {
  const { dtype, dataOffset, rows, cols, fortranOrder } = layout;
  const n = rows * cols;
  const size = dtype.size;
  const abs = bytes.byteOffset + dataOffset;
  const out = new Float64Array(n);
  if (dtype.kind === 'f' && size === 8 && !fortranOrder) {
    // byte copies: no alignment needed, no per-element work
    const outBytes = new Uint8Array(out.buffer);
    const rowBytes = cols * 8;
    if (!topDown) outBytes.set(bytes.subarray(dataOffset, dataOffset + n * 8));
    else for (let r = 0; r < rows; r++) {
      const src = dataOffset + r * rowBytes;
      outBytes.set(bytes.subarray(src, src + rowBytes), (rows - 1 - r) * rowBytes);
    }
    return out;
  }
  const Ctor = ctorOf(dtype);
  let view: InstanceType<TypedCtor>;
  if (abs % size === 0) view = new Ctor(bytes.buffer as ArrayBuffer, abs, n);
  else {
    view = new Ctor(n); // unaligned (old or hand-made headers): one aligned copy
    new Uint8Array(view.buffer).set(bytes.subarray(dataOffset, dataOffset + n * size));
  }
  if (!fortranOrder) {
    if (!topDown) out.set(view);
    else for (let r = 0; r < rows; r++) out.set(view.subarray(r * cols, (r + 1) * cols), (rows - 1 - r) * cols);
    return out;
  }
  // Fortran order: convert once, then transpose with a monomorphic loop
  let src: Float64Array;
  if (view instanceof Float64Array) src = view;
  else {
    src = new Float64Array(n);
    src.set(view);
  }
  // in 16×16 tiles, so the strided writes stay in cache
  const T = 16;
  for (let c0 = 0; c0 < cols; c0 += T) {
    const c1 = Math.min(c0 + T, cols);
    for (let r0 = 0; r0 < rows; r0 += T) {
      const r1 = Math.min(r0 + T, rows);
      for (let c = c0; c < c1; c++) {
        const base = c * rows;
        for (let r = r0; r < r1; r++) out[(topDown ? rows - 1 - r : r) * cols + c] = src[base + r];
      }
    }
  }
  return out;
}

type Getter = (dv: DataView, at: number, le: boolean) => number;

function getterOf(dtype: NpyDtype): Getter {
  switch (dtype.kind) {
    case 'f':
      if (dtype.size === 8) return (dv, at, le) => dv.getFloat64(at, le);
      if (dtype.size === 4) return (dv, at, le) => dv.getFloat32(at, le);
      return (dv, at, le) => dv.getUint16(at, le); // raw half bits; mapped by the caller
    case 'i':
      if (dtype.size === 1) return (dv, at) => dv.getInt8(at);
      if (dtype.size === 2) return (dv, at, le) => dv.getInt16(at, le);
      if (dtype.size === 4) return (dv, at, le) => dv.getInt32(at, le);
      // hi·2^32 is exact and the sum is rounded once, as Number(BigInt) would be
      return (dv, at, le) => dv.getInt32(le ? at + 4 : at, le) * 4294967296 + dv.getUint32(le ? at : at + 4, le);
    case 'u':
      if (dtype.size === 1) return (dv, at) => dv.getUint8(at);
      if (dtype.size === 2) return (dv, at, le) => dv.getUint16(at, le);
      if (dtype.size === 4) return (dv, at, le) => dv.getUint32(at, le);
      return (dv, at, le) => dv.getUint32(le ? at + 4 : at, le) * 4294967296 + dv.getUint32(le ? at : at + 4, le);
    case 'b':
      return (dv, at) => dv.getUint8(at);
  }
}

function decodeGeneral(bytes: Uint8Array, layout: NpyDataLayout, topDown: boolean): Float64Array {
  const { dtype, dataOffset, rows, cols, fortranOrder } = layout;
  const out = new Float64Array(rows * cols);
  const dv = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const get = getterOf(dtype);
  const le = dtype.littleEndian;
  const size = dtype.size;
  let at = dataOffset;
  if (!fortranOrder) {
    for (let r = 0; r < rows; r++) {
      const base = (topDown ? rows - 1 - r : r) * cols;
      for (let c = 0; c < cols; c++, at += size) out[base + c] = get(dv, at, le);
    }
  } else {
    for (let c = 0; c < cols; c++) {
      for (let r = 0; r < rows; r++, at += size) out[(topDown ? rows - 1 - r : r) * cols + c] = get(dv, at, le);
    }
  }
  return out;
}

let HALF: Float64Array | undefined;

/**
 * IEEE 754 binary16 → float64 for all 65 536 bit patterns: 1 sign bit, 5 exponent bits (bias 15),
 * 10 fraction bits; exponent 0 is zero/subnormal (f·2^−24), exponent 31 is ±Infinity or NaN.
 * Source: IEEE Std 754-2008 §3.4 (binary16 is the "binary16" interchange format).
 */
export function halfTable(): Float64Array {
  if (HALF) return HALF;
  const t = new Float64Array(65536);
  for (let h = 0; h < 65536; h++) {
    const sign = h & 0x8000 ? -1 : 1;
    const e = (h >> 10) & 0x1f;
    const f = h & 0x3ff;
    if (e === 0) t[h] = sign * f * 2 ** -24;
    else if (e === 31) t[h] = f === 0 ? sign * Infinity : NaN;
    else t[h] = sign * (1 + f / 1024) * 2 ** (e - 15);
  }
  HALF = t;
  return t;
}
