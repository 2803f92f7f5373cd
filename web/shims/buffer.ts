/**
 * Stand-in for Node's global `Buffer` in the browser bundle: only what src/ uses — base64 of a byte range
 * (src/report/png.ts dataUrl). Anything else throws.
 */
const ALPHABET = 'ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789+/';

/** Base64 (RFC 4648 §4, with padding) of `b`. */
export function base64(b: Uint8Array): string {
  const out: string[] = [];
  let k = 0;
  for (; k + 2 < b.length; k += 3) {
    const n = (b[k] << 16) | (b[k + 1] << 8) | b[k + 2];
    out.push(ALPHABET[n >> 18] + ALPHABET[(n >> 12) & 63] + ALPHABET[(n >> 6) & 63] + ALPHABET[n & 63]);
  }
  if (k < b.length) {
    const n = (b[k] << 16) | ((k + 1 < b.length ? b[k + 1] : 0) << 8);
    out.push(ALPHABET[n >> 18] + ALPHABET[(n >> 12) & 63] + (k + 1 < b.length ? ALPHABET[(n >> 6) & 63] : '=') + '=');
  }
  return out.join('');
}

export const Buffer = {
  from(buffer: ArrayBufferLike, byteOffset = 0, length?: number) {
    if (!(buffer instanceof ArrayBuffer)) throw new Error('Buffer stand-in: only Buffer.from(arrayBuffer, offset, length)');
    const bytes = new Uint8Array(buffer, byteOffset, length ?? buffer.byteLength - byteOffset);
    return {
      toString(encoding: string) {
        if (encoding !== 'base64') throw new Error(`Buffer stand-in: only base64, found ${encoding}`);
        return base64(bytes);
      },
    };
  },
};
