/**
 * Grouping of raster items into connected places: union-find over the pixels the items fall in, joining items
 * whose pixels are at most `gap` + 1 apart along each axis (8-connectivity that tolerates `gap` empty pixels).
 *
 * Frame: pixel units of raster.ts; an item at (u, v) falls in pixel (round(u), round(v)).
 */

/**
 * Returns a cluster label (0 … count − 1) per item. Items are given as pixel indices i, j (nx × ny raster).
 * `owner`: a scratch table of at least nx·ny entries (overwritten; scratch.ts), a new one when not given.
 */
export function clusterPixels(
  ii: Int32Array,
  jj: Int32Array,
  nx: number,
  ny: number,
  gap: number,
  scratch?: Int32Array,
): { label: Int32Array; count: number } {
  const n = ii.length;
  const parent = new Int32Array(n);
  for (let k = 0; k < n; k++) parent[k] = k;
  const find = (k: number): number => {
    while (parent[k] !== k) {
      parent[k] = parent[parent[k]];
      k = parent[k];
    }
    return k;
  };
  const union = (a: number, b: number): void => {
    const ra = find(a), rb = find(b);
    if (ra !== rb) parent[Math.max(ra, rb)] = Math.min(ra, rb);
  };
  if (scratch !== undefined && scratch.length < nx * ny) {
    throw new RangeError(`clusterPixels: expected a scratch of at least ${nx * ny} entries, found ${scratch.length}`);
  }
  const owner = scratch ? scratch.fill(-1, 0, nx * ny) : new Int32Array(nx * ny).fill(-1);
  for (let k = 0; k < n; k++) {
    const p = jj[k] * nx + ii[k];
    if (owner[p] < 0) owner[p] = k;
    else union(owner[p], k);
  }
  const reach = gap + 1;
  for (let k = 0; k < n; k++) {
    const i = ii[k], j = jj[k];
    if (owner[j * nx + i] !== k) continue;
    for (let b = Math.max(0, j - reach); b <= Math.min(ny - 1, j + reach); b++) {
      for (let a = Math.max(0, i - reach); a <= Math.min(nx - 1, i + reach); a++) {
        const o = owner[b * nx + a];
        if (o >= 0 && o !== k) union(k, o);
      }
    }
  }
  const label = new Int32Array(n).fill(-1);
  const map = new Int32Array(n).fill(-1);
  let count = 0;
  for (let k = 0; k < n; k++) {
    const r = find(k);
    if (map[r] < 0) map[r] = count++;
    label[k] = map[r];
  }
  return { label, count };
}
