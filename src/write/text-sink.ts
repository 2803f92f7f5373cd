/**
 * A growable byte buffer for writing large text outputs (hundreds of thousands of coordinates) without
 * allocating one string per number: ASCII is copied byte by byte, numbers are written digit by digit with
 * exactly the rules of `formatNumber`, and the buffer is decoded once (UTF-8) at the end.
 */
import { formatNumber } from './number.js';

const SCALES = [1, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6] as const;
/** Same fast-path bound as formatNumber: below it, scaling and rounding are exact in integers. */
const EXACT_LIMIT = 1e15;
const encoder = new TextEncoder();
const decoder = new TextDecoder('utf-8');

export class TextSink {
  private buf: Uint8Array;
  private len = 0;

  /** `capacity`: expected size in bytes (a hint; the buffer grows as needed). */
  constructor(capacity = 1 << 16) {
    this.buf = new Uint8Array(Math.max(1 << 10, Math.min(Math.ceil(capacity), 1 << 30)));
  }

  private reserve(n: number): void {
    if (this.len + n <= this.buf.length) return;
    let size = this.buf.length * 2;
    while (size < this.len + n) size *= 2;
    const next = new Uint8Array(size);
    next.set(this.buf.subarray(0, this.len));
    this.buf = next;
  }

  /** Appends a string (ASCII fast path; other characters as UTF-8). */
  str(s: string): this {
    const n = s.length;
    this.reserve(n);
    const buf = this.buf;
    let len = this.len;
    for (let i = 0; i < n; i++) {
      const c = s.charCodeAt(i);
      if (c > 0x7f) {
        this.len = len;
        return this.utf8(s.slice(i));
      }
      buf[len++] = c;
    }
    this.len = len;
    return this;
  }

  private utf8(s: string): this {
    const bytes = encoder.encode(s);
    this.reserve(bytes.length);
    this.buf.set(bytes, this.len);
    this.len += bytes.length;
    return this;
  }

  /** Appends `value` formatted exactly as `formatNumber(value, decimals)` would format it. */
  num(value: number, decimals: number): this {
    const scale = SCALES[decimals];
    const scaled = Math.abs(value) * (scale ?? NaN);
    if (!(scaled < EXACT_LIMIT)) return this.str(formatNumber(value, decimals)); // rare path; rejects NaN/±∞
    const k = Math.round(scaled);
    this.reserve(40);
    const buf = this.buf;
    let len = this.len;
    if (k === 0) {
      buf[len] = 0x30;
      this.len = len + 1;
      return this;
    }
    if (value < 0) buf[len++] = 0x2d;
    let frac = k % scale;
    len = putUint(buf, len, (k - frac) / scale);
    if (frac !== 0) {
      let digits = decimals;
      while (frac % 10 === 0) {
        frac /= 10;
        digits--;
      }
      buf[len++] = 0x2e;
      // frac < 10^digits ≤ 10^6: exactly `digits` digits, zero-padded on the left, in int32 arithmetic
      let end = len + digits;
      len = end;
      for (let i = 0; i < digits; i++) {
        const q = (frac / 10) | 0;
        buf[--end] = 0x30 + (frac - q * 10);
        frac = q;
      }
    }
    this.len = len;
    return this;
  }

  /** Bytes written so far. */
  get length(): number {
    return this.len;
  }

  /** A copy of the bytes written so far (UTF-8). */
  bytes(): Uint8Array {
    return this.buf.slice(0, this.len);
  }

  /** Decodes everything written as one string. */
  text(): string {
    return decoder.decode(this.buf.subarray(0, this.len));
  }
}

/** Writes a non-negative integer below 2^53 in decimal at `buf[at]`; returns the end. */
function putUint(buf: Uint8Array, at: number, n: number): number {
  let digits = 1;
  for (let p = 10; p <= n; p *= 10) digits++;
  let end = at + digits;
  if (n <= 0x7fffffff) {
    let m = n | 0;
    do {
      const q = (m / 10) | 0;
      buf[--end] = 0x30 + (m - q * 10);
      m = q;
    } while (m > 0);
  } else {
    do {
      const q = Math.floor(n / 10);
      buf[--end] = 0x30 + (n - q * 10);
      n = q;
    } while (n > 0);
  }
  return at + digits;
}
