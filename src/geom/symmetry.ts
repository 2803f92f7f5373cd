/**
 * Exact mirror symmetry of an outline about the planes of a `--mirror` unfolding (docs/symmetry.md).
 */
import { RhoformError } from '../errors.js';
import type { Point, PolygonSet, Ring } from '../types.js';
import { booleanOp, quantumFor, ringsOf, unionRings } from './clipper.js';

/** A symmetry plane in the frame of the input grid (mm, y up): the line `axis` = `at`. */
export interface MirrorPlane {
  /** 'x': the vertical line x = at (from `left`/`right`); 'y': the horizontal line y = at (`bottom`/`top`). */
  readonly axis: 'x' | 'y';
  /** mm, in the input grid's frame (unchanged by unfolding). */
  readonly at: number;
  /** The side the input lies on: 'above' = coordinates ≥ at, 'below' = coordinates ≤ at. */
  readonly keep: 'below' | 'above';
}


/**
 * Makes an outline of an unfolded grid exactly symmetric about the mirror planes: the part on the input's
 * side of every plane is kept and its mirror images replace the rest.
 *
 * Why after smoothing at all: the unfolded field is exactly symmetric and so is its marching-squares contour,
 * and Taubin smoothing (uniform weights, symmetric in a ring's two neighbours) keeps that symmetry; but
 * Ramer–Douglas–Peucker simplification keeps a vertex set that depends on where each ring starts, and a ring
 * and its mirror image start at unrelated vertices. The two smoothed halves can therefore differ by up to the
 * deviation budget (`--tolerance`). This step restores exact symmetry without leaving that budget: the kept
 * half is within the budget of the raw contour, and its mirror image is within the budget of the raw
 * contour's mirror image, which is the raw contour of the other half.
 *
 * Method (exact booleans of src/geom/clipper.ts, Vatti's algorithm — B. R. Vatti, "A generic solution to
 * polygon clipping", Communications of the ACM 35(7):56–63, 1992, doi:10.1145/129902.129906):
 * 1. Translate so that every plane is the line 0 of its axis, and pick ONE power-of-two quantum q
 *    (quantumFor) for all steps: in Clipper's integer space every plane is then the integer 0.
 * 2. Intersect the set once with the input's side of all planes (a half or a quadrant of the domain,
 *    widened on the other sides so that rounding can never trim it). Doing the cut once, rather than once per
 *    plane, means every cut point is computed one time only, so a quarter model is 4-fold symmetric exactly.
 * 3. For each plane in turn: reflect what there is (u ↦ −u, an exact integer map; each ring's vertex order
 *    is reversed, so outer rings stay counter-clockwise and holes clockwise) and union it with itself. The two
 *    halves share their edges on the plane exactly, so pieces crossing the plane merge into one polygon with
 *    no sliver, gap or pair of seam vertices (Clipper also drops the collinear vertices left on the plane).
 * 4. Translate back. Coordinates on the domain edges (in integer space) are set to the exact domain values,
 *    so material at the domain edge still reaches it exactly.
 *
 * Exactness: in integer space the result is exactly mirror-invariant (reflection maps integers to integers
 * and the unions add no new vertex off the planes). Back in mm, a vertex x = at + X·q has its partner
 * at + (−X)·q, both products exact (q is a power of two); so x + x' = 2·at up to the rounding of the two
 * final additions (an ulp of the coordinates, ~1e-14 mm for parts under 100 mm). Every vertex moves by at
 * most q/2 (q < extent · 2^-27, under 7.5e-7 mm for a 100 mm part) from where the input put it, plus the cut points
 * on the planes.
 *
 * Frame: mm, y up; `planes` in the frame of the set (MirrorPlane.at, from mirrorPlanes: the input grid's frame,
 * which the unfolded grid shares); `domain` = [minX, minY, maxX, maxY] of the UNFOLDED grid (gridDomain).
 * At most one plane per axis. Input: outer rings CCW, holes CW (non-zero fill); output likewise, each hole
 * under its outer ring, no repeated closing vertex. No planes: the set itself. The input is not modified.
 * Cost: two or three boolean operations on the outline, O(n log n) in its vertices.
 */
export function symmetrize(
  set: PolygonSet,
  planes: readonly MirrorPlane[],
  domain: readonly [minX: number, minY: number, maxX: number, maxY: number],
): PolygonSet {
  if (planes.length === 0) return set;
  const { px, py } = planesByAxis(planes);
  if (!domain.every(Number.isFinite) || !(domain[2] >= domain[0] && domain[3] >= domain[1])) {
    throw new RhoformError('E_INTERNAL', `symmetrize: expected a domain [minX, minY, maxX, maxY], found [${domain.join(', ')}]`);
  }
  const sx = px?.at ?? 0;
  const sy = py?.at ?? 0;
  const shifted: Ring[] = ringsOf(set).map((r) => r.map((p): Point => [p[0] - sx, p[1] - sy]));
  if (shifted.length === 0) return { polygons: [] };

  // 1. one quantum for every step, from the largest shifted coordinate (set and domain); B bounds everything.
  const d: [number, number, number, number] = [domain[0] - sx, domain[1] - sy, domain[2] - sx, domain[3] - sy];
  let extent = Math.max(...d.map(Math.abs));
  for (const r of shifted) for (const p of r) extent = Math.max(extent, Math.abs(p[0]), Math.abs(p[1]));
  const q = quantumFor(2 * extent);
  const B = Math.ceil((2 * extent) / q) * q;
  const opts = { quantum: q };

  // 2. the input's side of every plane, in one cut
  const range = (p: MirrorPlane | null): [number, number] => (p === null ? [-B, B] : p.keep === 'above' ? [0, B] : [-B, 0]);
  const [x0, x1] = range(px);
  const [y0, y1] = range(py);
  const side: Ring = [[x0, y0], [x1, y0], [x1, y1], [x0, y1]];
  let cur = booleanOp('intersection', shifted, [side], opts);

  // 3. reflect and unite, plane by plane
  for (const p of [px, py]) {
    if (p === null || cur.polygons.length === 0) continue;
    const rings = ringsOf(cur);
    const image = rings.map((r) => {
      const out: Point[] = new Array(r.length);
      for (let k = 0, n = r.length; k < n; k++) {
        const v = r[n - 1 - k];
        out[k] = p.axis === 'x' ? [-v[0], v[1]] : [v[0], -v[1]];
      }
      return out;
    });
    cur = unionRings([...rings, ...image], opts);
  }

  // 4. back to the set's frame, with domain-edge coordinates exact
  const snapX = edgeSnap(d[0], d[2], px, q, domain[0], domain[2], sx);
  const snapY = edgeSnap(d[1], d[3], py, q, domain[1], domain[3], sy);
  const back = (r: Ring): Point[] => r.map((v): Point => [snapX(v[0]), snapY(v[1])]);
  return { polygons: cur.polygons.map((poly) => ({ outer: back(poly.outer), holes: poly.holes.map(back) })) };
}

/**
 * The area (mm²) that `symmetrize(set, planes, domain)` gives, without the booleans: 2^(number of planes)
 * times the signed area of the set's part on the input's side of every plane. Each ring is clipped to the
 * half-planes by the Sutherland–Hodgman algorithm (I. E. Sutherland & G. W. Hodgman, "Reentrant polygon
 * clipping", Communications of the ACM 17(1):32–42, 1974, doi:10.1145/360767.360802): for a half-plane the
 * clipped ring may run back and forth along the plane, but those edges bound no area, so its shoelace area is
 * the area of the ring's part on that side. O(vertices), no allocation per vertex beyond one ring's clip.
 * Meant for the volume search, which needs the final area at every candidate level: it agrees with
 * symmetrize's area up to the booleans' rounding (perimeter × quantum: under 3e-4 mm² for 400 mm of outline on a 100 mm part).
 * Frame, planes and orientation as in symmetrize (outer rings CCW count positive, holes CW negative).
 */
export function symmetricArea(set: PolygonSet, planes: readonly MirrorPlane[]): number {
  const { px, py } = planesByAxis(planes);
  const sx = px?.at ?? 0;
  const sy = py?.at ?? 0;
  let total = 0;
  let bufA = new Float64Array(0);
  let bufB = new Float64Array(0);
  for (const ring of ringsOf(set)) {
    const n = ring.length;
    if (n < 3) continue;
    // each half-plane clip adds at most one vertex per edge: at most 4n vertices (8n numbers) after two planes
    if (bufA.length < 8 * n) {
      bufA = new Float64Array(8 * n);
      bufB = new Float64Array(8 * n);
    }
    for (let k = 0; k < n; k++) {
      bufA[2 * k] = ring[k][0] - sx;
      bufA[2 * k + 1] = ring[k][1] - sy;
    }
    let m = n;
    for (const p of planes) {
      const c = p.axis === 'x' ? 0 : 1;
      const sign = p.keep === 'above' ? 1 : -1;
      let out = 0;
      for (let k = 0; k < m; k++) {
        const a = 2 * k;
        const b = 2 * ((k + 1) % m);
        const va = sign * bufA[a + c];
        const vb = sign * bufA[b + c];
        if (va >= 0) {
          bufB[2 * out] = bufA[a];
          bufB[2 * out + 1] = bufA[a + 1];
          out++;
        }
        if (va >= 0 !== vb >= 0) {
          // the crossing point lies on the plane (coordinate 0 in the shifted frame)
          const t = va / (va - vb);
          bufB[2 * out] = c === 0 ? 0 : bufA[a] + t * (bufA[b] - bufA[a]);
          bufB[2 * out + 1] = c === 1 ? 0 : bufA[a + 1] + t * (bufA[b + 1] - bufA[a + 1]);
          out++;
        }
      }
      [bufA, bufB] = [bufB, bufA];
      m = out;
    }
    let s = 0;
    for (let k = 0; k < m; k++) {
      const a = 2 * k;
      const b = 2 * ((k + 1) % m);
      s += bufA[a] * bufA[b + 1] - bufA[b] * bufA[a + 1];
    }
    total += s / 2;
  }
  return total * 2 ** planes.length;
}

/** The planes by axis; refuses two planes on one axis and a non-finite position. */
function planesByAxis(planes: readonly MirrorPlane[]): { px: MirrorPlane | null; py: MirrorPlane | null } {
  let px: MirrorPlane | null = null;
  let py: MirrorPlane | null = null;
  for (const p of planes) {
    if (!Number.isFinite(p.at)) throw new RhoformError('E_INTERNAL', `symmetrize: expected a finite plane position, found ${p.at}`);
    if (p.axis === 'x' ? px !== null : py !== null) {
      throw new RhoformError('E_INTERNAL', `symmetrize: expected at most one plane per axis, found two on ${p.axis}`);
    }
    if (p.axis === 'x') px = p;
    else py = p;
  }
  return { px, py };
}

/**
 * From a shifted coordinate u = X·q (X an integer) back to the set's frame: u + shift, except that the
 * integers of the two domain edges give the exact domain values. With a plane, the edge on the input's side
 * defines both integers (±K), so a vertex and its mirror image are snapped together.
 */
function edgeSnap(
  lo: number,
  hi: number,
  plane: MirrorPlane | null,
  q: number,
  exactLo: number,
  exactHi: number,
  shift: number,
): (u: number) => number {
  let kLo = Math.round(lo / q);
  let kHi = Math.round(hi / q);
  if (plane !== null) {
    if (plane.keep === 'above') kLo = -kHi;
    else kHi = -kLo;
  }
  return (u) => {
    const k = Math.round(u / q);
    return k === kLo ? exactLo : k === kHi ? exactHi : u + shift;
  };
}
