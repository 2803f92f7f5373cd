/**
 * Exact polygon booleans and offsets in mm: the one wrapper of js-angusj-clipper (Clipper 6; B. R. Vatti, "A
 * generic solution to polygon clipping", CACM 35(7):56–63, 1992, doi:10.1145/129902.129906). Power-of-two
 * quantum and orientation rules: docs/notes/geom.md. Output: outer rings CCW, holes CW (DESIGN §3).
 */
import * as clipperLib from 'js-angusj-clipper';
import { RhoformError } from '../errors.js';
import type { Point, Polygon, PolygonSet, Ring } from '../types.js';

let loaded: clipperLib.ClipperLibWrapper | null = null;
let loading: Promise<void> | null = null;

/** Loads the WebAssembly engine once (src/pipeline.ts `prepareBuild`); safe to call concurrently. */
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

/** Clipper's 'loRange' (2^30 − 1): no 128-bit products below it. */
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

/** Largest |coordinate|, mm; 0 for none. */
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

/** The smallest 2^k mm with (extent + margin) / 2^k ≤ 2^29. */
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
    // a ring thinner than the quantum holds no material, and Clipper refuses it
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

/** Turns Clipper's bare numeric or empty-message throws into a RhoformError. */
function guarded<T>(what: string, f: () => T): T {
  try {
    return f();
  } catch (e) {
    if (e instanceof RhoformError) throw e;
    const msg = e instanceof Error && e.message ? e.message : String(e);
    throw new RhoformError('E_INTERNAL', `the boolean engine failed in ${what} (${msg})`);
  }
}

/** Outer rings and holes, orientation kept (non-zero fill reproduces the set). */
export function ringsOf(set: PolygonSet | readonly Polygon[]): Ring[] {
  const polys = 'polygons' in set ? set.polygons : set;
  const out: Ring[] = [];
  for (const p of polys) {
    out.push(p.outer);
    for (const h of p.holes) out.push(h);
  }
  return out;
}

/** `fill: 'positive'` for the subject, else non-zero; pass one `quantum` (mm) to calls that must agree. */
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
    if (op === 'intersection' || op === 'difference' || c.length === 0) return { polygons: [] };
    [s, c, clipType] = [c, [], 'union'];
  }
  return guarded(op, () => {
    const tree = engine().clipToPolyTree({
      clipType: CLIP[clipType],
      subjectInputs: [{ data: s, closed: true }],
      clipInputs: c.length ? [{ data: c }] : [],
      // positive fill: a hole straying past its outer ring (winding −1) stays void
      subjectFillType: opts.fill === 'positive' ? clipperLib.PolyFillType.Positive : clipperLib.PolyFillType.NonZero,
      clipFillType: clipperLib.PolyFillType.NonZero,
    });
    return setFromTree(tree, q);
  });
}

export function unionRings(rings: readonly Ring[], opts: { quantum?: number } = {}): PolygonSet {
  return booleanOp('union', rings, [], opts);
}

/** Offset by `delta` mm (negative = inward); arcs within `arcTolerance` mm. */
export function offsetRings(
  rings: readonly Ring[],
  delta: number,
  opts: { join?: JoinKind; arcTolerance: number; miterLimit?: number; quantum?: number },
): PolygonSet {
  return offsetPaths(rings, delta, clipperLib.EndType.ClosedPolygon, opts);
}

/** The region within `radius` mm of open polylines (a lone point gives a disc): a union of capsules. */
export function bufferPolylines(lines: readonly (readonly Point[])[], radius: number, opts: { arcTolerance: number; quantum?: number }): PolygonSet {
  if (!(radius > 0)) return { polygons: [] };
  // Clipper drops 1-point paths: a second vertex one quantum away
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
