/**
 * Taubin smoothing, then Ramer–Douglas–Peucker simplification under one deviation budget, then validation and
 * local repair (docs/smoothing.md). Frame: mm, y up; rings keep their orientation. Methods: G. Taubin, "Curve and surface smoothing without shrinkage", ICCV 1995,
 * DOI 10.1109/ICCV.1995.466848; U. Ramer, CGIP 1(3):244–256, 1972, DOI 10.1016/S0146-664X(72)80017-0;
 * D.H. Douglas & T.K. Peucker, Cartographica 10(2):112–122, 1973, DOI 10.3138/FM57-6770-U75U-7727.
 */

import { RhoformError } from '../errors.js';
import type { Point, Polygon, PolygonSet } from '../types.js';
import { flatSet, type FlatPolygonSet } from '../contour/flat.js';
import type { FlatRings } from '../geom/segments.js';
import { flatRingArea } from '../geom/area.js';
import { spanDeviation, totalArea } from './deviation.js';
import { simplifyRing } from './simplify.js';
import { taubinRingInPlace } from './taubin.js';
import { type RingRoles, validateRings } from './validate.js';
import { edgeFlags, repairRound } from './repair.js';
import type { SmoothScratch } from './scratch.js';
import { hypot } from '../geom/portable-math.js';

export interface SmoothOptions {
  /** Taubin λ|μ pairs; 0 = off. */
  iterations: number;
  /** Taubin λ, 0 < λ < 1 (default 0.33). */
  lambda: number;
  /** Taubin μ, −1 < μ ≤ 0 (default −0.34). */
  mu: number;
  /** mm: total budget for the largest distance of the final outline from the raw contour. */
  tolerance: number;
  /** mm; vertices on its edges stay on them. */
  domain: readonly [minX: number, minY: number, maxX: number, maxY: number];
}

export interface SmoothResult {
  /** Built on first read (the volume search builds candidates it never reports). */
  readonly polygons: PolygonSet;
  /**
   * mm: sampled directed Hausdorff distance from the final rings to the raw rings (docs/smoothing.md §4).
   * Measured on first read (the volume search builds candidates it never reports).
   */
  readonly maxDeviation: number;
  /** mm: how far the true distance may exceed `maxDeviation` (docs/smoothing.md §4); Infinity at tolerance 0. */
  readonly deviationResolution: number;
  /** mm², raw (outer areas minus hole areas). */
  areaBefore: number;
  /** mm², final. */
  areaAfter: number;
  verticesBefore: number;
  verticesAfter: number;
  /** Rings with fewer than three distinct vertices or zero area (with their holes). */
  ringsDropped: number;
}

/** Share of the tolerance smoothing may use; simplification gets the rest (plus whatever smoothing left). */
export const SMOOTH_SHARE = 0.5;
/** Rounds of local repair before offending rings fall back to their raw form. */
const LOCAL_FIX_ROUNDS = 8;

/**
 * Smooths and simplifies a polygon set within `tolerance` (mm) of the raw rings: smoothing may move a vertex
 * SMOOTH_SHARE of it, simplification gets the rest (docs/smoothing.md §3). Domain-edge vertices never move;
 * invalid results are repaired by restoring dropped, then raw, vertices around each problem. Input unchanged.
 */
export function smoothPolygons(raw: PolygonSet, options: SmoothOptions): SmoothResult {
  return smoothFlat(flatSet(raw), options);
}

/**
 * smoothPolygons on flat rings (src/contour/flat.ts), with the same result. The result may share `raw`'s arrays
 * (neither is ever written). `scratch`: working arrays to reuse from an earlier smoothing; the result never
 * aliases them.
 */
export function smoothFlat(raw: FlatPolygonSet, options: SmoothOptions, scratch?: SmoothScratch): SmoothResult {
  checkOptions(options);
  const { tolerance, domain } = options;
  const { rawFlat, roles, verticesBefore, ringsDropped } = flatten(raw);
  const nRings = rawFlat.start.length - 1;
  const n = rawFlat.start[nRings];
  const R = rawFlat.xy;

  // 1. Taubin smoothing with the displacement cap
  const { fixed, anchor } = edgeFlags(rawFlat, domain);
  const S = scratch ? scratch.positions(R.length) : new Float64Array(R.length);
  S.set(R);
  let used = 0;
  if (options.iterations > 0 && tolerance > 0) {
    const taubin = { iterations: options.iterations, lambda: options.lambda, mu: options.mu,
      maxShift: SMOOTH_SHARE * tolerance, box: domain };
    const scratch = new Float64Array(2 * maxRingSize(rawFlat.start));
    for (let r = 0; r < nRings; r++) {
      const a = rawFlat.start[r], b = rawFlat.start[r + 1];
      const shift = taubinRingInPlace(S.subarray(2 * a, 2 * b), R.subarray(2 * a, 2 * b),
        fixed.subarray(a, b), taubin, scratch);
      if (shift > used) used = shift;
    }
  }
  // 2. RDP with the rest of the budget
  const eps = Math.max(0, tolerance - used);
  const keep = new Uint8Array(n);
  const stack = new Int32Array(2 * maxRingSize(rawFlat.start) + 4);
  for (let r = 0; r < nRings; r++) {
    const a = rawFlat.start[r], b = rawFlat.start[r + 1];
    keep.set(simplifyRing(S.subarray(2 * a, 2 * b), eps, anchor.subarray(a, b), stack), a);
  }
  // 3. validate; repair locally until valid (or every offending ring is raw)
  const useRaw = new Uint8Array(n);
  let final = assemble(rawFlat, S, keep, useRaw);
  for (let round = 0; round <= LOCAL_FIX_ROUNDS; round++) {
    const v = validateRings(final.rings, roles, scratch);
    if (v.problems === 0) break;
    const changed = repairRound(rawFlat, roles, keep, useRaw, final, v, round, round === LOCAL_FIX_ROUNDS);
    if (!changed) break; // what is left is already raw: the input itself is invalid there (docs/smoothing.md §5)
    final = assemble(rawFlat, S, keep, useRaw);
  }

  // 4. nested rings and the deviation measure when they are asked for
  const measured = final;
  let polygons: PolygonSet | undefined;
  let maxDeviation: number | undefined;
  let spacing: number | undefined;
  const deviationSpacing = () => (spacing ??= sampleSpacing(measured.rings, tolerance));
  return {
    get polygons(): PolygonSet {
      return (polygons ??= rebuild(measured.rings, roles));
    },
    get maxDeviation(): number {
      return (maxDeviation ??= spanDeviation(measured.rings, measured.index, rawFlat, deviationSpacing()));
    },
    get deviationResolution(): number {
      return deviationSpacing() / 2;
    },
    areaBefore: totalArea(rawFlat),
    areaAfter: totalArea(final.rings),
    verticesBefore,
    verticesAfter: final.rings.start[nRings],
    ringsDropped,
  };
}

function checkOptions(o: SmoothOptions): void {
  const bad = (name: string, expected: string, found: unknown): never => {
    throw new RhoformError('E_USAGE', `smooth ${name}: expected ${expected}, found ${String(found)}`);
  };
  if (!(Number.isInteger(o.iterations) && o.iterations >= 0)) bad('iterations', 'an integer ≥ 0', o.iterations);
  if (!(o.lambda > 0 && o.lambda < 1)) bad('lambda', 'a number in (0, 1)', o.lambda);
  if (!(o.mu <= 0 && o.mu > -1)) bad('mu', 'a number in (−1, 0]', o.mu);
  if (!(o.tolerance >= 0 && Number.isFinite(o.tolerance))) bad('tolerance', 'a finite length ≥ 0 mm', o.tolerance);
  const d = o.domain;
  if (!(d && d.length === 4 && d.every(Number.isFinite) && d[2] > d[0] && d[3] > d[1])) {
    bad('domain', '[minX, minY, maxX, maxY] with minX < maxX and minY < maxY', JSON.stringify(d));
  }
}

/**
 * True when flatten would copy every ring as it is: exactly sized, each ring of three or more finite vertices
 * with no point repeating the one before it (the last counting before the first) and a non-zero area, every
 * hole after an outer ring and owned by the nearest one before it. The contour's rings always are.
 */
function alreadyClean(raw: FlatPolygonSet): boolean {
  const { xy, start, hole, owner } = raw;
  const ringCount = start.length - 1;
  if (xy.length !== 2 * start[ringCount]) return false;
  let outer = -1;
  for (let q = 0; q < ringCount; q++) {
    const a = start[q], b = start[q + 1];
    if (b - a < 3) return false;
    if (hole[q] === 0) {
      if (owner[q] !== -1) return false;
      outer = q;
    } else if (outer < 0 || owner[q] !== outer) return false;
    let px = xy[2 * b - 2], py = xy[2 * b - 1];
    for (let i = a; i < b; i++) {
      const x = xy[2 * i], y = xy[2 * i + 1];
      if (!Number.isFinite(x) || !Number.isFinite(y) || (x === px && y === py)) return false;
      px = x;
      py = y;
    }
    if (flatRingArea(xy, a, b) === 0) return false;
  }
  return true;
}

/**
 * The rings without repeated points; drops degenerate or non-finite rings (an outer with its holes). Rings
 * that need none of that are taken as they are (shared, not copied).
 */
function flatten(raw: FlatPolygonSet): { rawFlat: FlatRings; roles: RingRoles; verticesBefore: number; ringsDropped: number } {
  const ringCount = raw.start.length - 1;
  if (alreadyClean(raw)) {
    return {
      rawFlat: { xy: raw.xy, start: raw.start },
      roles: { hole: raw.hole, owner: raw.owner },
      verticesBefore: raw.start[ringCount],
      ringsDropped: 0,
    };
  }
  const src = raw.xy;
  const verticesBefore = raw.start[ringCount];
  const xy = new Float64Array(2 * verticesBefore);
  const start = new Int32Array(ringCount + 1);
  const hole = new Uint8Array(ringCount);
  const owner = new Int32Array(ringCount);
  let rings = 0, used = 0, ringsDropped = 0;
  // writes ring q at `used`; returns the new end when the ring is kept, else `used`
  const push = (q: number): number => {
    let o = used;
    for (let i = raw.start[q]; i < raw.start[q + 1]; i++) {
      const x = src[2 * i], y = src[2 * i + 1];
      if (o > used && xy[2 * o - 2] === x && xy[2 * o - 1] === y) continue;
      xy[2 * o] = x;
      xy[2 * o + 1] = y;
      o++;
    }
    while (o - used >= 2 && xy[2 * o - 2] === xy[2 * used] && xy[2 * o - 1] === xy[2 * used + 1]) o--;
    let finite = true;
    for (let i = 2 * used; i < 2 * o; i++) if (!Number.isFinite(xy[i])) finite = false;
    return o - used >= 3 && finite && flatRingArea(xy, used, o) !== 0 ? o : used;
  };
  let outerIndex = -1;
  for (let q = 0; q < ringCount; q++) {
    if (raw.hole[q] === 0) {
      const end = push(q);
      if (end === used) {
        outerIndex = -1;
        ringsDropped++;
        continue;
      }
      outerIndex = rings;
      hole[rings] = 0; owner[rings] = -1; start[rings] = used; rings++; used = end;
    } else {
      if (outerIndex < 0) { ringsDropped++; continue; }
      const e = push(q);
      if (e === used) { ringsDropped++; continue; }
      hole[rings] = 1; owner[rings] = outerIndex; start[rings] = used; rings++; used = e;
    }
  }
  start[rings] = used;
  return {
    rawFlat: { xy: xy.slice(0, 2 * used), start: start.slice(0, rings + 1) },
    roles: { hole: hole.slice(0, rings), owner: owner.slice(0, rings) },
    verticesBefore,
    ringsDropped,
  };
}

function maxRingSize(start: Int32Array): number {
  let m = 0;
  for (let r = 0; r + 1 < start.length; r++) m = Math.max(m, start[r + 1] - start[r]);
  return m;
}

/** Kept vertices, raw where useRaw is set; index: final → raw vertex. */
function assemble(raw: FlatRings, S: Float64Array, keep: Uint8Array, useRaw: Uint8Array): { rings: FlatRings; index: Int32Array } {
  let count = 0;
  for (let i = 0; i < keep.length; i++) count += keep[i];
  const xy = new Float64Array(2 * count);
  const index = new Int32Array(count);
  const start = new Int32Array(raw.start.length);
  let o = 0;
  for (let r = 0; r + 1 < raw.start.length; r++) {
    start[r] = o;
    for (let i = raw.start[r]; i < raw.start[r + 1]; i++) {
      if (keep[i] === 0) continue;
      const src = useRaw[i] !== 0 ? raw.xy : S;
      xy[2 * o] = src[2 * i];
      xy[2 * o + 1] = src[2 * i + 1];
      index[o++] = i;
    }
  }
  start[raw.start.length - 1] = o;
  return { rings: { xy, start }, index };
}

/** Sample spacing for the deviation measure: a quarter of the tolerance, at most 4 million samples. */
function sampleSpacing(rings: FlatRings, tolerance: number): number {
  if (!(tolerance > 0)) return Infinity;
  const { xy, start } = rings;
  let perimeter = 0;
  for (let r = 0; r + 1 < start.length; r++) {
    for (let i = start[r]; i < start[r + 1]; i++) {
      const j = i + 1 === start[r + 1] ? start[r] : i + 1;
      perimeter += hypot(xy[2 * j] - xy[2 * i], xy[2 * j + 1] - xy[2 * i + 1]);
    }
  }
  return Math.max(tolerance / 4, perimeter / 4e6);
}

function rebuild(rings: FlatRings, roles: RingRoles): PolygonSet {
  const { xy, start } = rings;
  const polygons: Polygon[] = [];
  let current: { outer: Point[]; holes: Point[][] } | null = null;
  for (let r = 0; r + 1 < start.length; r++) {
    const pts: Point[] = new Array(start[r + 1] - start[r]);
    for (let i = start[r]; i < start[r + 1]; i++) pts[i - start[r]] = [xy[2 * i], xy[2 * i + 1]];
    if (roles.hole[r] === 0) {
      current = { outer: pts, holes: [] };
      polygons.push(current);
    } else if (current) {
      current.holes.push(pts);
    }
  }
  return { polygons };
}
