/**
 * Exact polygon booleans and offsets in mm: the one wrapper around js-angusj-clipper (a WebAssembly build of
 * Angus Johnson's Clipper 6, which implements Vatti's clipping algorithm — B. R. Vatti, "A generic solution to
 * polygon clipping", Communications of the ACM 35(7):56–63, 1992, doi:10.1145/129902.129906 — and offsets by
 * Minkowski sums with a disc, square or miter joins).
 *
 * Clipper works on integers. Every call scales its coordinates by a power-of-two quantum q (mm), chosen from the
 * largest |coordinate| so that scaled values stay below 2^30 (Clipper's fast 64-bit range), and rounds to the
 * nearest integer: results are exact multiples of q, q ≤ max|x| · 2^-29 (for a 250 mm part, q ≈ 2.4e-7 mm).
 * Because q is a power of two, binary-exact coordinates (cell edges of cells such as 0.5, 1, 2 mm) map exactly.
 *
 * Frame: mm, y up. Input rings may have either orientation; they are combined with the non-zero fill rule, so
 * the usual outer-CCW / hole-CW polygons mean what they say. Output: outer rings counter-clockwise, holes
 * clockwise, each hole under its outer ring, material inside a hole as a separate polygon (DESIGN §3), no
 * repeated closing vertex.
 *
 * The WASM module is loaded on demand, once, by `loadBooleanEngine()`; callers await src/pipeline.ts
 * `prepareBuild(settings)`, which loads it exactly when the settings need booleans (passive regions, --mirror,
 * --repair) — about 35 ms of start-up the other runs do not pay. A call before it is loaded throws a RhoformError
 * that says so.
 */
import * as clipperLib from 'js-angusj-clipper';
import { RhoformError } from '../errors.js';
import type { Point, Polygon, PolygonSet, Ring } from '../types.js';

let loaded: clipperLib.ClipperLibWrapper | null = null;
let loading: Promise<void> | null = null;

/** Loads the boolean engine (WebAssembly) once; later calls return at once. Safe to call concurrently. */
export function loadBooleanEngine(): Promise<void> {
  loading ??= clipperLib.loadNativeClipperLibInstanceAsync(clipperLib.NativeClipperLibRequestedFormat.WasmWithAsmJsFallback).then((l) => {
    loaded = l;
  });
  return loading;
}

function engine(): clipperLib.ClipperLibWrapper {
  if (loaded === null) {
    throw new RhoformError(
      'E_INTERNAL',
      'the boolean engine is not loaded: await prepareBuild(settings) before build() with passive regions, --mirror or --repair',
    );
  }
  return loaded;
}

/** Scaled coordinates stay below this (Clipper's 'loRange', 2^30 − 1, where it needs no 128-bit products). */
const RANGE = 0x3fffffff;

type IntPath = { x: number; y: number }[];

export type BooleanOp = 'union' | 'intersection' | 'difference' | 'xor';
export type JoinKind = 'round' | 'miter' | 'square';

const CLIP: Record<BooleanOp, clipperLib.ClipType> = {
  union: clipperLib.ClipType.Union,
  intersection: clipperLib.ClipType.Intersection,
  difference: clipperLib.ClipType.Difference,
  xor: clipperLib.ClipType.Xor,
};
const JOIN: Record<JoinKind, clipperLib.JoinType> = {
  round: clipperLib.JoinType.Round,
  miter: clipperLib.JoinType.Miter,
  square: clipperLib.JoinType.Square,
};

/** The largest |coordinate| over some groups of rings or polylines (mm); 0 when there are none. */
export function extentOf(groups: readonly (readonly (readonly Point[])[])[]): number {
  let m = 0;
  for (const rings of groups) {
    for (const r of rings) {
      for (const p of r) {
        const a = Math.abs(p[0]);
        const b = Math.abs(p[1]);
        if (a > m) m = a;
        if (b > m) m = b;
      }
    }
  }
  return m;
}

/**
 * The power-of-two quantum (mm) for coordinates up to `extent` mm (plus `margin` mm of growth from an offset):
 * the smallest 2^k with (extent + margin) / 2^k ≤ 2^29, so that sums and offsets stay within Clipper's fast range.
 */
export function quantumFor(extent: number, margin = 0): number {
  const m = Math.max(extent + Math.abs(margin), 1e-9);
  if (!Number.isFinite(m)) throw new RhoformError('E_INTERNAL', `polygon coordinates are not finite (${m})`);
  return 2 ** Math.ceil(Math.log2(m / 2 ** 29));
}

function toInt(rings: readonly (readonly Point[])[], q: number, dropFlat = false): IntPath[] {
  const out: IntPath[] = [];
  for (const r of rings) {
    if (r.length < 2) continue;
    const path: IntPath = new Array(r.length);
    for (let k = 0; k < r.length; k++) {
      const x = Math.round(r[k][0] / q);
      const y = Math.round(r[k][1] / q);
      if (!(Math.abs(x) <= RANGE && Math.abs(y) <= RANGE)) {
        throw new RhoformError('E_INTERNAL', `a coordinate (${r[k][0]}, ${r[k][1]}) mm is outside the range of the boolean engine`);
      }
      path[k] = { x, y };
    }
    // dropFlat (booleans): a ring thinner than the quantum rounds to no area; Clipper refuses such a path
    // ("invalid paths"), and at this resolution it holds no material anyway.
    let twiceArea = 0;
    for (let k = 0, m = path.length - 1; k < path.length; m = k++) twiceArea += path[m].x * path[k].y - path[k].x * path[m].y;
    if (twiceArea !== 0 || !dropFlat) out.push(path);
  }
  return out;
}

function ringFromInt(path: readonly { x: number; y: number }[], q: number): Point[] {
  const ring: Point[] = new Array(path.length);
  for (let k = 0; k < path.length; k++) ring[k] = [path[k].x * q, path[k].y * q];
  return ring;
}

/** A Clipper PolyTree as our PolygonSet: outer nodes become polygons, their hole children their holes. */
function setFromTree(tree: clipperLib.PolyTree, q: number): PolygonSet {
  const polygons: Polygon[] = [];
  const visitOuter = (node: clipperLib.PolyNode): void => {
    if (node.contour.length < 3) return;
    const holes: Ring[] = [];
    for (const h of node.childs) {
      if (h.contour.length >= 3) holes.push(ringFromInt(h.contour, q));
      for (const island of h.childs) visitOuter(island);
    }
    polygons.push({ outer: ringFromInt(node.contour, q), holes });
  };
  for (const top of tree.childs) visitOuter(top);
  return { polygons };
}

/** Run a Clipper call, turning its bare numeric or empty-message throws into a RhoformError. */
function guarded<T>(what: string, f: () => T): T {
  try {
    return f();
  } catch (e) {
    if (e instanceof RhoformError) throw e;
    const msg = e instanceof Error && e.message ? e.message : String(e);
    throw new RhoformError('E_INTERNAL', `the boolean engine failed in ${what} (${msg})`);
  }
}

/** All rings of a polygon set, outer rings and holes (orientation kept, so non-zero fill reproduces the set). */
export function ringsOf(set: PolygonSet | readonly Polygon[]): Ring[] {
  const polys = 'polygons' in set ? set.polygons : set;
  const out: Ring[] = [];
  for (const p of polys) {
    out.push(p.outer);
    for (const h of p.holes) out.push(h);
  }
  return out;
}

/**
 * A boolean operation of two ring sets (non-zero fill each; `fill: 'positive'` for the subject): union, intersection, difference (subject minus
 * clip) or xor. `quantum` (mm) overrides the automatic one (pass the same to several calls that must agree).
 */
export function booleanOp(
  op: BooleanOp,
  subject: readonly Ring[],
  clip: readonly Ring[],
  opts: { quantum?: number; fill?: 'nonzero' | 'positive' } = {},
): PolygonSet {
  const q = opts.quantum ?? quantumFor(extentOf([subject, clip]));
  let s = toInt(subject, q, true);
  let c = toInt(clip, q, true);
  let clipType = op;
  if (s.length === 0) {
    // Nothing minus or times anything is nothing; nothing plus (or xor) the clip is the clip alone.
    if (op === 'intersection' || op === 'difference' || c.length === 0) return { polygons: [] };
    [s, c, clipType] = [c, [], 'union'];
  }
  return guarded(op, () => {
    const tree = engine().clipToPolyTree({
      clipType: CLIP[clipType],
      subjectInputs: [{ data: s, closed: true }],
      clipInputs: c.length ? [{ data: c }] : [],
      // positive: counter-clockwise outers (+1) and clockwise holes (−1) reproduce the set even where a hole
      // strays past its outer ring (the stray part has winding −1 and stays void)
      subjectFillType: opts.fill === 'positive' ? clipperLib.PolyFillType.Positive : clipperLib.PolyFillType.NonZero,
      clipFillType: clipperLib.PolyFillType.NonZero,
    });
    return setFromTree(tree, q);
  });
}

/** The union of ring sets (non-zero fill): overlapping and touching material merges. */
export function unionRings(rings: readonly Ring[], opts: { quantum?: number } = {}): PolygonSet {
  return booleanOp('union', rings, [], opts);
}

/**
 * Offset (Minkowski sum with a disc of radius `delta` mm for round joins; negative = inward) of the region
 * the closed rings bound. `arcTolerance` (mm) is the largest distance of a polygonised arc from the true arc.
 */
export function offsetRings(
  rings: readonly Ring[],
  delta: number,
  opts: { join?: JoinKind; arcTolerance: number; miterLimit?: number; quantum?: number },
): PolygonSet {
  return offsetPaths(rings, delta, clipperLib.EndType.ClosedPolygon, opts);
}

/**
 * The region within `radius` mm of open polylines (each a run of points; a single point gives a disc):
 * round joins and round ends — a union of capsules. `arcTolerance` as in offsetRings.
 */
export function bufferPolylines(lines: readonly (readonly Point[])[], radius: number, opts: { arcTolerance: number; quantum?: number }): PolygonSet {
  if (!(radius > 0)) return { polygons: [] };
  // Clipper drops 1-point paths: give a lone point a second, coincident-in-mm but distinct-in-integers vertex.
  const q = opts.quantum ?? quantumFor(extentOf([lines]), radius);
  const padded = lines.map((l) => (l.length === 1 ? [l[0], [l[0][0] + q, l[0][1]] as Point] : l));
  return offsetPaths(padded, radius, clipperLib.EndType.OpenRound, { ...opts, join: 'round', quantum: q });
}

function offsetPaths(
  rings: readonly (readonly Point[])[],
  delta: number,
  end: clipperLib.EndType,
  opts: { join?: JoinKind; arcTolerance: number; miterLimit?: number; quantum?: number },
): PolygonSet {
  if (!Number.isFinite(delta)) throw new RhoformError('E_INTERNAL', `offset distance is not finite (${delta})`);
  const q = opts.quantum ?? quantumFor(extentOf([rings]), delta);
  const paths = toInt(rings, q);
  if (paths.length === 0) return { polygons: [] };
  const arcTolerance = Math.max(opts.arcTolerance / q, 0.25);
  return guarded('offset', () => {
    const tree = engine().offsetToPolyTree({
      delta: delta / q,
      arcTolerance,
      miterLimit: opts.miterLimit ?? 2,
      offsetInputs: [{ data: paths, joinType: JOIN[opts.join ?? 'round'], endType: end }],
    });
    return tree ? setFromTree(tree, q) : { polygons: [] };
  });
}
