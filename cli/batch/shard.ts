/**
 * Sharding of a batch (docs/scale.md): the files, sorted by path, are dealt round-robin — the i-th file
 * counted from 0 goes to shard (i mod n) + 1. Every file lands in exactly one of the n shards, shards differ
 * in size by at most one file, and a shard's share is fixed by the sorted list alone (the same command on any
 * machine picks the same files).
 */

/** The shard (1-based) of the i-th file (0-based) of the sorted list, for n shards. */
export function shardOf(i: number, n: number): number {
  if (!(Number.isInteger(i) && i >= 0)) throw new RangeError(`shardOf: expected an index ≥ 0, found ${i}`);
  if (!(Number.isInteger(n) && n >= 1)) throw new RangeError(`shardOf: expected n ≥ 1 shards, found ${n}`);
  return (i % n) + 1;
}

/** The items of shard k of n (1 ≤ k ≤ n) of an already sorted list, in list order; `null` = the whole list. */
export function selectShard<T>(sorted: readonly T[], shard: { readonly k: number; readonly n: number } | null): T[] {
  if (shard === null) return [...sorted];
  const { k, n } = shard;
  if (!(Number.isInteger(k) && Number.isInteger(n) && k >= 1 && k <= n)) {
    throw new RangeError(`selectShard: expected 1 ≤ k ≤ n, found ${k}/${n}`);
  }
  return sorted.filter((_x, i) => shardOf(i, n) === k);
}

/** Order of paths in a batch: by UTF-16 code units (not the locale), so every machine sorts alike. */
export function comparePaths(a: string, b: string): number {
  return a < b ? -1 : a > b ? 1 : 0;
}
