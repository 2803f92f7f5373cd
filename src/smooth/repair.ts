/**
 * Domain-edge flags and one round of local repair after validation, on per-raw-vertex flags keep[i] and
 * useRaw[i]. Repairs only set flags, so the rounds end, and keep the bound of docs/smoothing.md §3
 * (docs/notes/outline.md §7). mm, y up.
 */

import type { Domain } from '../types.js';
import type { FlatRings } from '../geom/segments.js';
import type { RingRoles, Validation } from './validate.js';

/**
 * fixed[i] = 1 on a domain edge (within 1e-9 of the domain size: never moved); anchor[i] = 1 at domain corners
 * and where the outline leaves an edge (always kept).
 */
export function edgeFlags(
  rings: FlatRings,
  domain: Domain,
): { fixed: Uint8Array; anchor: Uint8Array } {
  const { xy, start } = rings;
  const n = start[start.length - 1];
  const [x0, y0, x1, y1] = domain;
  const tol = 1e-9 * Math.max(x1 - x0, y1 - y0);
  const mask = new Uint8Array(n);
  for (let i = 0; i < n; i++) {
    const x = xy[2 * i], y = xy[2 * i + 1];
    mask[i] = (Math.abs(x - x0) <= tol ? 1 : 0) | (Math.abs(y - y0) <= tol ? 2 : 0) |
      (Math.abs(x - x1) <= tol ? 4 : 0) | (Math.abs(y - y1) <= tol ? 8 : 0);
  }
  const fixed = new Uint8Array(n);
  const anchor = new Uint8Array(n);
  for (let r = 0; r + 1 < start.length; r++) {
    const a = start[r], b = start[r + 1];
    for (let i = a; i < b; i++) {
      const m = mask[i];
      if (m === 0) continue;
      fixed[i] = 1;
      const prev = mask[i === a ? b - 1 : i - 1], next = mask[i + 1 === b ? a : i + 1];
      const corner = (m & (m - 1)) !== 0;
      if (corner || (m & prev) === 0 || (m & next) === 0) anchor[i] = 1;
    }
  }
  return { fixed, anchor };
}

/**
 * One repair round. Each flagged segment first gets the vertices simplification dropped under it back; a
 * flagged segment between two neighbouring raw vertices gets a window of 2^round vertices on each side reset to
 * raw positions (with the dropped vertices up to the next kept ones restored). Each flagged or blamed ring is
 * first restored in full (all smoothed vertices), then set to raw. With `last`, every ring involved goes
 * straight to raw. Returns false when nothing could change (everything involved is already raw and complete).
 */
export function repairRound(
  raw: FlatRings,
  roles: RingRoles,
  keep: Uint8Array,
  useRaw: Uint8Array,
  final: { rings: FlatRings; index: Int32Array },
  v: Validation,
  round: number,
  last: boolean,
): boolean {
  const nRings = raw.start.length - 1;
  let changed = false;
  const set = (arr: Uint8Array, i: number): void => {
    if (arr[i] === 0) { arr[i] = 1; changed = true; }
  };
  const escalate = new Uint8Array(nRings);
  const fs = final.rings.start;
  for (let r = 0; r < nRings; r++) {
    if (v.ringHit[r] || v.blamed[r]) escalate[r] = 1;
    if (v.ringHit[r] && roles.hole[r]) escalate[roles.owner[r]] = 1;
  }
  for (let r = 0; r < nRings; r++) {
    for (let f = fs[r]; f < fs[r + 1]; f++) {
      if (!v.segmentHit[f]) continue;
      if (last) { escalate[r] = 1; continue; }
      const s = raw.start[r], n = raw.start[r + 1] - s;
      const a = final.index[f] - s;
      const b = final.index[f + 1 === fs[r + 1] ? fs[r] : f + 1] - s;
      const gap = (b - a + n) % n;
      if (gap > 1) {
        for (let k = 1; k < gap; k++) set(keep, s + ((a + k) % n));
        continue;
      }
      const w = 2 ** Math.min(round, 20);
      const from = a - w, span = gap + 2 * w;
      if (span + 1 >= n) { escalate[r] = 1; continue; }
      for (let k = 0; k <= span; k++) {
        const i = s + ((((from + k) % n) + n) % n);
        set(useRaw, i);
        set(keep, i);
      }
      // restore dropped vertices between the window and the kept vertices around it
      for (let k = 1; k < n; k++) {
        const i = s + ((((from - k) % n) + n) % n);
        if (keep[i]) break;
        set(keep, i);
      }
      for (let k = 1; k < n; k++) {
        const i = s + ((from + span + k) % n);
        if (keep[i]) break;
        set(keep, i);
      }
    }
  }
  for (let r = 0; r < nRings; r++) {
    if (!escalate[r]) continue;
    const a = raw.start[r], b = raw.start[r + 1];
    let full = true;
    for (let i = a; i < b && full; i++) if (!keep[i]) full = false;
    for (let i = a; i < b; i++) {
      set(keep, i);
      if (full || last) set(useRaw, i);
    }
  }
  return changed;
}
