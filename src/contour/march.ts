/**
 * Marching squares over the contour lattice (the area lattice plus a −∞ node at each end of each axis): every
 * edge crossing once, linked into directed boundary segments by `next`. Memory O(one row + boundary).
 * W.E. Lorensen, H.E. Cline, "Marching Cubes: A High Resolution 3D Surface Construction Algorithm",
 * SIGGRAPH '87, DOI 10.1145/37401.37422, in two dimensions.
 */
import type { DensityGrid } from '../types.js';
import type { GridLattice } from './lattice.js';
import { fillRow } from './lattice.js';
import { crossing, ENTRY_EDGE, EXIT_EDGE, joinsSolid, type SaddleRule } from './saddle.js';
import type { ContourScratch } from './scratch.js';

/** The crossings of one level (mm, y up) and their links; ids 0 … count − 1 (the arrays may be longer). */
export interface Crossings {
  readonly count: number;
  readonly x: Float64Array;
  readonly y: Float64Array;
  /** Following crossing along the boundary, solid on the left. */
  readonly next: Int32Array;
  /**
   * For a crossing on a horizontal lattice edge: 2·i + (1 if the left node is solid), i = the edge's column
   * in the contour lattice; −1 for a crossing on a vertical edge.
   */
  readonly hKey: Int32Array;
  /** Crossings on horizontal edges of contour-lattice row j are the ids hStart[j] … hEnd[j] − 1, in x order. */
  readonly hStart: Int32Array;
  readonly hEnd: Int32Array;
}

/** The crossings of one build, in `scratch`'s arrays when given (grown there, so the next build finds them). */
class Store {
  n = 0;
  x: Float64Array;
  y: Float64Array;
  next: Int32Array;
  hKey: Int32Array;
  /**
   * `cap`: crossings to make room for when the scratch has no store yet; `bound`: the most the caller expects
   * (a regrowth makes room for at least that many).
   */
  constructor(
    cap: number,
    private readonly bound: number,
    private readonly scratch: ContourScratch | undefined,
  ) {
    if (scratch && scratch.x.length > 0) {
      this.x = scratch.x;
      this.y = scratch.y;
      this.next = scratch.next;
      this.hKey = scratch.hKey;
    } else {
      this.x = new Float64Array(cap);
      this.y = new Float64Array(cap);
      this.next = new Int32Array(cap);
      this.hKey = new Int32Array(cap);
      this.lend();
    }
  }
  add(x: number, y: number, hKey: number): number {
    if (this.n === this.x.length) this.grow();
    const id = this.n++;
    this.x[id] = x;
    this.y[id] = y;
    this.hKey[id] = hKey;
    this.next[id] = -1;
    return id;
  }
  private grow(): void {
    const cap = Math.max(this.x.length * 2, this.bound, 1024);
    const x = new Float64Array(cap);
    const y = new Float64Array(cap);
    const next = new Int32Array(cap);
    const hKey = new Int32Array(cap);
    x.set(this.x);
    y.set(this.y);
    next.set(this.next);
    hKey.set(this.hKey);
    this.x = x;
    this.y = y;
    this.next = next;
    this.hKey = hKey;
    this.lend();
  }
  private lend(): void {
    const s = this.scratch;
    if (!s) return;
    s.x = this.x;
    s.y = this.y;
    s.next = this.next;
    s.hKey = this.hKey;
  }
}

/** Contour-lattice coordinates: the area-lattice nodes with the first and last repeated. */
function padded(c: Float64Array): Float64Array {
  const out = new Float64Array(c.length + 2);
  out.set(c, 1);
  out[0] = c[0];
  out[out.length - 1] = c[c.length - 1];
  return out;
}

/**
 * Crossings at most, with `straddling` cells of the area lattice straddling the level. A crossing edge inside
 * the area lattice borders two straddling cells, one on its edge borders one, and every straddling cell has at
 * most four; the rest lie on the edges from a domain-edge node out to the −∞ border, at most 2·(NX + NY). So
 * crossings ≤ 2·straddling + ½·(edges on the domain edge) + 2·(NX + NY) ≤ 2·straddling + 3·(NX + NY).
 */
export function crossingBound(straddling: number, NX: number, NY: number): number {
  return 2 * straddling + 3 * (NX + NY);
}

/**
 * Marching squares at `level` (solid: value ≥ level; NaN void); `lat` = gridLattice(grid). The crossings live
 * in `scratch` when given (then they are valid until its next use). `straddling`: at most how many lattice
 * cells straddle the level, when the caller knows (the level search's band): sizes the store at once.
 */
export function march(grid: DensityGrid, lat: GridLattice, level: number, rule: SaddleRule, scratch?: ContourScratch, straddling?: number): Crossings {
  const L = level;
  const xs = padded(lat.x.coords);
  const ys = padded(lat.y.coords);
  const NX = xs.length;
  const NY = ys.length;
  const bound = straddling !== undefined && straddling >= 0 ? crossingBound(straddling, NX, NY) : 0;
  const st = new Store(Math.max(1024, bound > 0 ? bound : 4 * (NX + NY)), bound, scratch);
  const w = new RowPair(NX, NY);
  // one call per row: V8 optimizes marchRow as an ordinary function early, where one long loop ran in the
  // interpreter until on-stack replacement and then deoptimized at branches it had not yet seen
  // (docs/performance.md, "Cold code")
  for (let j = 0; j < NY - 1; j++) marchRow(grid, lat, L, rule, j, xs, ys, st, w);
  const { hStart, hEnd } = w;
  return { count: st.n, x: st.x, y: st.y, next: st.next, hKey: st.hKey, hStart, hEnd };
}

/** march's rows: the lattice values, solid flags and horizontal crossing ids of the rows below and above. */
class RowPair {
  lo: Float64Array;
  hi: Float64Array;
  sLo: Uint8Array;
  sHi: Uint8Array;
  hLo: Int32Array;
  hHi: Int32Array;
  readonly vRow: Int32Array;
  readonly hStart: Int32Array;
  readonly hEnd: Int32Array;
  readonly ends = new Int32Array(4);
  constructor(
    readonly NX: number,
    readonly NY: number,
  ) {
    this.lo = new Float64Array(NX).fill(-Infinity);
    this.hi = new Float64Array(NX).fill(-Infinity);
    this.sLo = new Uint8Array(NX);
    this.sHi = new Uint8Array(NX);
    this.hLo = new Int32Array(NX - 1);
    this.hHi = new Int32Array(NX - 1);
    this.vRow = new Int32Array(NX);
    this.hStart = new Int32Array(NY);
    this.hEnd = new Int32Array(NY);
  }
}

/** march's cell row j: the crossings of lattice row j + 1 and of the row's vertical edges, and their links. */
function marchRow(
  grid: DensityGrid,
  lat: GridLattice,
  L: number,
  rule: SaddleRule,
  j: number,
  xs: Float64Array,
  ys: Float64Array,
  st: Store,
  w: RowPair,
): void {
  const { NX, NY, lo, hi, sLo, sHi, hLo, hHi, vRow, hStart, hEnd, ends } = w;
  // lattice row j + 1: the outermost row (NY − 1) is void, others carry grid row y.sample[j]
  const r = j + 1;
  let any = 0;
  if (r === NY - 1) {
    hi.fill(-Infinity);
    sHi.fill(0);
  } else {
    fillRow(grid, lat.x.sample, lat.y.sample[r - 1], hi, 1);
    hi[0] = -Infinity;
    hi[NX - 1] = -Infinity;
    for (let i = 0; i < NX; i++) {
      const s = hi[i] >= L ? 1 : 0;
      sHi[i] = s;
      any |= s;
    }
  }
  // crossings on the horizontal edges of row r, left to right
  hStart[r] = st.n;
  if (any) {
    const yr = ys[r];
    for (let i = 0; i < NX - 1; i++) {
      const a = sHi[i];
      if (a === sHi[i + 1]) continue;
      const s = a ? i : i + 1;
      const q = a ? i + 1 : i;
      const t = crossing(hi[s], hi[q], L);
      hHi[i] = st.add(xs[s] + t * (xs[q] - xs[s]), yr, 2 * i + a);
    }
  }
  hEnd[r] = st.n;
  // crossings on the vertical edges of cell row j
  let cross = hEnd[r] > hStart[r] || hEnd[j] > hStart[j];
  for (let i = 0; i < NX; i++) {
    const a = sLo[i];
    if (a === sHi[i]) continue;
    cross = true;
    let t: number;
    let y: number;
    if (a) {
      t = crossing(lo[i], hi[i], L);
      y = ys[j] + t * (ys[r] - ys[j]);
    } else {
      t = crossing(hi[i], lo[i], L);
      y = ys[r] + t * (ys[j] - ys[r]);
    }
    vRow[i] = st.add(xs[i], y, -1);
  }
  if (cross) {
    const next = st.next;
    for (let i = 0; i < NX - 1; i++) {
      const c = sLo[i] | (sLo[i + 1] << 1) | (sHi[i + 1] << 2) | (sHi[i] << 3);
      if (c === 0 || c === 15) continue;
      ends[0] = hLo[i];
      ends[1] = vRow[i + 1];
      ends[2] = hHi[i];
      ends[3] = vRow[i];
      if (c === 5) {
        // bottom-left and top-right solid
        if (joinsSolid(lo[i], hi[i + 1], lo[i + 1], hi[i], L, rule)) {
          next[ends[0]] = ends[1];
          next[ends[2]] = ends[3];
        } else {
          next[ends[0]] = ends[3];
          next[ends[2]] = ends[1];
        }
      } else if (c === 10) {
        // bottom-right and top-left solid
        if (joinsSolid(lo[i + 1], hi[i], lo[i], hi[i + 1], L, rule)) {
          next[ends[1]] = ends[2];
          next[ends[3]] = ends[0];
        } else {
          next[ends[1]] = ends[0];
          next[ends[3]] = ends[2];
        }
      } else {
        next[ends[EXIT_EDGE[c]]] = ends[ENTRY_EDGE[c]];
      }
    }
  }
  w.lo = hi;
  w.hi = lo;
  w.sLo = sHi;
  w.sHi = sLo;
  w.hLo = hHi;
  w.hHi = hLo;
}
