/**
 * Stand-in for `node:crypto` in the browser bundle: only what src/ uses — createHash('sha256') over bytes with
 * a hex digest (src/input.ts). Anything else throws, so a new use shows up at once instead of going wrong.
 */
import { sha256Hex } from './sha256.js';

export function createHash(algorithm: string) {
  if (algorithm !== 'sha256') throw new Error(`node:crypto stand-in: only sha256, found ${algorithm}`);
  const parts: Uint8Array[] = [];
  const hash = {
    update(data: Uint8Array) {
      parts.push(data);
      return hash;
    },
    digest(encoding: string) {
      if (encoding !== 'hex') throw new Error(`node:crypto stand-in: only hex digests, found ${encoding}`);
      const all = new Uint8Array(parts.reduce((n, p) => n + p.length, 0));
      let o = 0;
      for (const p of parts) {
        all.set(p, o);
        o += p.length;
      }
      return sha256Hex(all);
    },
  };
  return hash;
}
