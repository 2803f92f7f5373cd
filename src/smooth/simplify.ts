/**
 * Ramer–Douglas–Peucker simplification of open chains and closed rings, with an explicit stack. Distances are
 * to the closed segment, so every dropped vertex lies within ε of its chord and back (docs/smoothing.md §3).
 *
 * U. Ramer, "An iterative procedure for the polygonal approximation of plane curves", Computer
 * Graphics and Image Processing 1(3):244–256, 1972, DOI 10.1016/S0146-664X(72)80017-0; D.H. Douglas and
 * T.K. Peucker, "Algorithms for the reduction of the number of points required to represent a digitized line
 * or its caricature", Cartographica 10(2):112–122, 1973, DOI 10.3138/FM57-6770-U75U-7727.
 */

import { sqSegDist } from '../geom/segments.js';

/** Marks keep[k mod n] for the vertices kept strictly inside the unwrapped span a … b (0 ≤ a < b ≤ a + n). */
export function rdpSpan(
  xy: Float64Array,
  n: number,
  a: number,
  b: number,
  epsilon: number,
  keep: Uint8Array,
  stack?: Int32Array,
): void {
  const sqEps = epsilon * epsilon;
  let st = stack && stack.length >= 2 * n + 4 ? stack : new Int32Array(2 * n + 4);
  let top = 0;
  st[top++] = a;
  st[top++] = b;
  while (top > 0) {
    const hi = st[--top];
    const lo = st[--top];
    if (hi - lo < 2) continue;
    const il = lo % n, ih = hi % n;
    const ax = xy[2 * il], ay = xy[2 * il + 1], bx = xy[2 * ih], by = xy[2 * ih + 1];
    let best = -1;
    let bestD = sqEps;
    for (let k = lo + 1; k < hi; k++) {
      const i = k % n;
      const dd = sqSegDist(xy[2 * i], xy[2 * i + 1], ax, ay, bx, by);
      if (dd > bestD) {
        bestD = dd;
        best = k;
      }
    }
    if (best < 0) continue;
    keep[best % n] = 1;
    if (top + 4 > st.length) {
      const grown = new Int32Array(st.length * 2);
      grown.set(st);
      st = grown;
    }
    st[top++] = lo;
    st[top++] = best;
    st[top++] = best;
    st[top++] = hi;
  }
}

/** RDP on an open chain (flat xy, mm), ε in mm; keeps both end points. Returns a new flat array. */
export function rdpOpen(xy: Float64Array, epsilon: number): Float64Array {
  const n = xy.length >> 1;
  if (n <= 2) return xy.slice();
  const keep = new Uint8Array(n);
  keep[0] = 1;
  keep[n - 1] = 1;
  // as a ring of n vertices the span 0 … n−1 never wraps, so it is exactly the open chain
  rdpSpan(xy, n, 0, n - 1, epsilon, keep);
  return gather(xy, keep);
}

/**
 * RDP on a closed ring (flat xy, mm), ε in mm; returns keep flags. Anchors are kept and split the ring into
 * spans (without two, it is split at the first anchor or vertex 0 and the vertex farthest from it). A ring of
 * three or more vertices keeps at least three.
 */
export function simplifyRing(
  xy: Float64Array,
  epsilon: number,
  anchors: Uint8Array | null = null,
  stack?: Int32Array,
): Uint8Array {
  const n = xy.length >> 1;
  const keep = new Uint8Array(n);
  if (n <= 3 || !(epsilon >= 0)) {
    keep.fill(1);
    return keep;
  }
  let count = 0;
  let first = -1;
  if (anchors !== null) {
    for (let i = 0; i < n; i++) {
      if (anchors[i] !== 0) {
        keep[i] = 1;
        count++;
        if (first < 0) first = i;
      }
    }
  }
  if (count < 2) {
    const a = first < 0 ? 0 : first;
    keep[a] = 1;
    keep[farthestFrom(xy, n, a)] = 1;
    first = a;
  }
  simplifySpans(xy, n, first, epsilon, keep, stack);
  // a third vertex splits a span; simplify again so the ε guarantee holds for the two new chords
  if (ensureThree(xy, n, keep)) simplifySpans(xy, n, first, epsilon, keep, stack);
  return keep;
}

/** Runs RDP on every span between consecutive kept vertices, starting at the kept vertex `first`. */
function simplifySpans(
  xy: Float64Array, n: number, first: number, epsilon: number, keep: Uint8Array, stack?: Int32Array,
): void {
  const marks: number[] = [];
  for (let k = 0; k < n; k++) if (keep[(first + k) % n] !== 0) marks.push(first + k);
  marks.push(first + n);
  for (let m = 0; m + 1 < marks.length; m++) rdpSpan(xy, n, marks[m], marks[m + 1], epsilon, keep, stack);
}

/** Coordinates of the kept vertices, in order, as a new flat array. */
export function gather(xy: Float64Array, keep: Uint8Array): Float64Array {
  let c = 0;
  for (let i = 0; i < keep.length; i++) c += keep[i];
  const out = new Float64Array(2 * c);
  let o = 0;
  for (let i = 0; i < keep.length; i++) {
    if (keep[i] !== 0) {
      out[o++] = xy[2 * i];
      out[o++] = xy[2 * i + 1];
    }
  }
  return out;
}

function farthestFrom(xy: Float64Array, n: number, a: number): number {
  const ax = xy[2 * a], ay = xy[2 * a + 1];
  let best = (a + 1) % n;
  let bestD = -1;
  for (let i = 0; i < n; i++) {
    const dx = xy[2 * i] - ax, dy = xy[2 * i + 1] - ay;
    const dd = dx * dx + dy * dy;
    if (dd > bestD) {
      bestD = dd;
      best = i;
    }
  }
  return best;
}

/** Adds the vertex farthest from the segment of the two kept ones when only two remain; true if it did. */
function ensureThree(xy: Float64Array, n: number, keep: Uint8Array): boolean {
  let c = 0;
  let a = -1, b = -1;
  for (let i = 0; i < n && c < 3; i++) {
    if (keep[i] !== 0) {
      c++;
      if (a < 0) a = i;
      else b = i;
    }
  }
  if (c >= 3 || a < 0 || b < 0) return false;
  let best = -1;
  let bestD = -1;
  for (let i = 0; i < n; i++) {
    if (i === a || i === b) continue;
    const dd = sqSegDist(xy[2 * i], xy[2 * i + 1], xy[2 * a], xy[2 * a + 1], xy[2 * b], xy[2 * b + 1]);
    if (dd > bestD) {
      bestD = dd;
      best = i;
    }
  }
  if (best < 0) return false;
  keep[best] = 1;
  return true;
}
