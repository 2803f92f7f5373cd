/**
 * Stand-in for `node:zlib` in the browser bundle: only what src/ uses — inflateSync of zlib streams (the MAT and
 * VTI readers), with `maxOutputLength` and `finishFlush: Z_SYNC_FLUSH` (inflate what a cut stream holds), by
 * pako's Inflate (a JavaScript port of zlib; inflating is exact, whichever implementation does it). The page only
 * inflates input that `rhoform preview` already read without error in Node; error wording may differ from Node's.
 */
import { Inflate } from 'pako';

export const constants = { Z_SYNC_FLUSH: 2, Z_FINISH: 4 } as const;

export function inflateSync(data: Uint8Array, opts: { maxOutputLength?: number; finishFlush?: number; chunkSize?: number } = {}): Uint8Array {
  const chunks: Uint8Array[] = [];
  let total = 0;
  const inf = new Inflate({ chunkSize: 1 << 16 });
  inf.onData = (c: Uint8Array) => {
    total += c.length;
    if (opts.maxOutputLength !== undefined && total > opts.maxOutputLength) {
      throw new RangeError(`inflated data larger than maxOutputLength (${opts.maxOutputLength} bytes)`);
    }
    chunks.push(c);
  };
  const partial = opts.finishFlush === constants.Z_SYNC_FLUSH;
  inf.push(data, partial ? constants.Z_SYNC_FLUSH : true);
  if (inf.err) throw new Error(inf.msg || 'invalid zlib data');
  if (!partial && !inf.ended) throw new Error('unexpected end of file');
  const out = new Uint8Array(total);
  let o = 0;
  for (const c of chunks) {
    out.set(c, o);
    o += c.length;
  }
  return out;
}
