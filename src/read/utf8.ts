/**
 * Where UTF-8 goes wrong: the strict well-formedness of the Unicode Standard (chapter 3, table 3-7, "Well-Formed
 * UTF-8 Byte Sequences"), the same rule a fatal TextDecoder applies — no overlong forms, no surrogates
 * (ED A0–BF), nothing past U+10FFFF.
 */

/** Byte offset of the first byte that does not start or continue a well-formed sequence; -1 when all do. */
export function firstInvalidUtf8(bytes: Uint8Array): number {
  const n = bytes.length;
  let k = 0;
  while (k < n) {
    const b = bytes[k];
    if (b < 0x80) {
      k++;
      continue;
    }
    let len: number;
    let lo = 0x80;
    let hi = 0xbf;
    if (b >= 0xc2 && b <= 0xdf) len = 2;
    else if (b >= 0xe0 && b <= 0xef) {
      len = 3;
      if (b === 0xe0) lo = 0xa0;
      else if (b === 0xed) hi = 0x9f;
    } else if (b >= 0xf0 && b <= 0xf4) {
      len = 4;
      if (b === 0xf0) lo = 0x90;
      else if (b === 0xf4) hi = 0x8f;
    } else return k;
    if (k + 1 >= n || bytes[k + 1] < lo || bytes[k + 1] > hi) return k;
    for (let t = 2; t < len; t++) if (k + t >= n || (bytes[k + t] & 0xc0) !== 0x80) return k;
    k += len;
  }
  return -1;
}
