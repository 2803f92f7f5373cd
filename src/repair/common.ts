/**
 * Shared pieces of the repairs: the margin δ, the arc tolerance, the closing by a disc, adding material without
 * touching passive voids or making new pieces, and point-in-piece tests.
 *
 * Frame: millimetres, y up, origin at the lower-left corner of the grid. Polygons: outer rings counter-clockwise,
 * holes clockwise (DESIGN §3). Booleans and offsets: src/geom/clipper.ts (Vatti 1992, doi:10.1145/129902.129906).
 */
import { polygonArea, polygonSetArea, ringArea, ringPerimeter } from '../geom/area.js';
import { booleanOp, offsetRings, quantumFor, ringsOf, unionRings } from '../geom/clipper.js';
import { ringBounds, ringContains } from '../geom/contains.js';
import { interiorPoint } from '../geom/interior.js';
import { arcSagitta } from '../geom/circle.js';
import type { Point, Polygon, PolygonSet, Ring } from '../types.js';
import type { RepairInput } from './types.js';

/** cos 6°: arcs get a vertex at least every 12° of turn. */
const COS_HALF_STEP = Math.cos((6 * Math.PI) / 180);

/**
 * Largest distance (mm) of a polygonised arc of radius about `radius` mm from its true circle: a quarter of the
 * outline budget, but fine enough that the polygon turns by at most 12° per vertex (sagitta ρ(1 − cos 6°)) — the
 * inner-radius check treats a vertex turning by 15° or more as a sharp corner (docs/checks/min-inner-radius.md).
 * `fillet`: arcs the inner-radius check will measure as fillets (the closings of open-corners and fill-holes) are
 * polygonised to a sagitta of pixel/1600: their chords then poke into a tangent disc by at most ρΔ²/2 = 4·sagitta
 * = pixel/400, a quarter of the check's own slack (pixel/100), and the check measures their radius rather than
 * their vertices (cost: about 360 vertices per full turn at ρ = 16 pixels, paid only where the outline turns). Never below radius·10⁻⁴ (`--tolerance 0`).
 */
export function arcToleranceOf(input: Pick<RepairInput, 'tolerance' | 'pixel'>, radius: number, fillet = false): number {
  const coarse = Math.min(arcSagitta(input.tolerance), radius * (1 - COS_HALF_STEP));
  return Math.max(fillet ? Math.min(coarse, input.pixel / 1600) : coarse, radius * 1e-4);
}

/**
 * The margin δ (mm) added to a disc radius of about `radius` mm so that the re-check passes rather than landing
 * in its ± pixel/2 "too close to call" band: δ = arc tolerance + pixel/2. Per side of a member (or a void, or a
 * fillet) the discs then reach limit/2 + pixel/2 less the arc tolerance (chords lie inside the true circle), the
 * scallops between discs whose centres lie up to a pixel apart along an axis (s²/(8ρ) ≤ pixel/8 for ρ ≥ pixel)
 * and the raster measure's own error (about 0.01–0.05 pixel on exact polygons, docs/checks/min-member-size.md):
 * a width of at least limit + 0.7 pixel, above the band of ± pixel/2.
 */
export function marginOf(input: Pick<RepairInput, 'tolerance' | 'pixel'>, radius: number, fillet = false): number {
  return arcToleranceOf(input, radius, fillet) + input.pixel / 2;
}

/** One quantum (mm) for every boolean of a repair, from the domain's extent and the largest offset radius. */
export function quantumOf(domain: RepairInput['domain'], radius: number): number {
  const ext = Math.max(Math.abs(domain[0]), Math.abs(domain[1]), Math.abs(domain[2]), Math.abs(domain[3]));
  return quantumFor(ext, 2 * radius);
}

/** The domain rectangle as a counter-clockwise ring. */
export function domainRing(d: RepairInput['domain']): Ring {
  return [[d[0], d[1]], [d[2], d[1]], [d[2], d[3]], [d[0], d[3]]];
}

/**
 * Closing of the solid by a disc of radius ρ (mm) in the plane: dilate by ρ, erode by ρ, round joins
 * (Serra, "Image analysis and mathematical morphology", Academic Press 1982 — the textbook definition). The
 * result is the complement of the union of all discs of radius ρ in the void: every concave corner gets a fillet
 * of radius ρ and every void narrower than 2ρ is filled. Outside the domain is open space (no clipping here).
 * The fillets are the erosion's round joins, polygonised within `fillet` mm; the dilation's arcs (at convex
 * corners, which the erosion takes back) within the coarser `grow` mm — they only round the convex corners of
 * the closing inward by up to `grow`, which the caller's union with the solid restores.
 */
export function closing(set: PolygonSet, rho: number, grow: number, fillet: number, quantum: number): PolygonSet {
  const grown = offsetRings(ringsOf(set), rho, { join: 'round', arcTolerance: grow, quantum });
  return offsetRings(ringsOf(grown), -rho, { join: 'round', arcTolerance: fillet, quantum });
}

/** Mean thickness (mm) of a polygon, 2·area/perimeter: a needle left by rounding has almost none. */
function meanThickness(p: Polygon): number {
  let per = ringPerimeter(p.outer);
  for (const h of p.holes) per += ringPerimeter(h);
  return per > 0 ? (2 * polygonArea(p)) / per : 0;
}

/** What adding material did: the new outline, the region really added and its area (mm²). */
export interface Added {
  readonly polygons: PolygonSet;
  readonly changed: PolygonSet;
  readonly area: number;
}

/**
 * Adds the region `extra` (rings, non-zero fill, mm) to the outline `set`: clipped to the domain, minus the
 * passive voids (never filled), minus what is solid already; needles thinner than pixel/1000 (rounding of
 * coinciding edges) are left out. Pieces of the result that contain no piece of `set` are dropped, so the
 * number of pieces never grows (adding material can only join pieces). Returns `set` itself when nothing is
 * added.
 */
export function addMaterial(set: PolygonSet, extra: readonly Ring[], input: RepairInput, quantum: number): Added {
  const none: Added = { polygons: set, changed: { polygons: [] }, area: 0 };
  if (extra.length === 0) return none;
  const inDomain = booleanOp('intersection', extra, [domainRing(input.domain)], { quantum });
  const solid = ringsOf(set);
  const diff = booleanOp('difference', ringsOf(inDomain), [...solid, ...input.passiveVoid], { quantum });
  const needle = input.pixel * 1e-3;
  const kept = diff.polygons.filter((p) => meanThickness(p) > needle);
  if (kept.length === 0) return none;
  const merged = sealCracks(cleanSet(unionRings([...solid, ...ringsOf(kept)], { quantum }), needle), crackOf(input), quantum);
  const polygons = anchored(merged, set);
  // a floating bit dropped by anchored() is not part of the change
  const changed: PolygonSet = polygons === merged ? { polygons: kept } : booleanOp('difference', ringsOf(polygons), solid, { quantum });
  return { polygons, changed, area: polygonSetArea(polygons) - polygonSetArea(set) };
}

/** Half the width (mm) of the cracks sealCracks closes: pixel/4, so cracks up to pixel/2 wide (below the raster's resolution). */
export function crackOf(input: Pick<RepairInput, 'pixel'>): number {
  return input.pixel / 4;
}

/**
 * Seals cracks: a closing by `eps` mm with miter joins (offset +eps then −eps, miter limit 10). Void narrower
 * than 2·eps — a slit left where added material and the old outline meet up to a polygonised arc's chord
 * error — is filled; corners (concave and convex, turning by less than about 170°) come back exactly, so
 * nothing else changes. Only adds material (the closing contains the set).
 */
export function sealCracks(set: PolygonSet, eps: number, quantum: number): PolygonSet {
  if (!(eps > 0) || set.polygons.length === 0) return set;
  const grown = offsetRings(ringsOf(set), eps, { join: 'miter', miterLimit: 10, arcTolerance: eps, quantum });
  const back = offsetRings(ringsOf(grown), -eps, { join: 'miter', miterLimit: 10, arcTolerance: eps, quantum });
  // only the cracks themselves are added (pieces of real thickness), so rings away from them keep their vertices
  const cracks = booleanOp('difference', ringsOf(back), ringsOf(set), { quantum }).polygons.filter((p) => meanThickness(p) > eps * 1e-3);
  if (cracks.length === 0) return set;
  return cleanSet(unionRings([...ringsOf(set), ...ringsOf(cracks)], { quantum }), eps * 1e-3);
}

/**
 * Whether a point of a set lies in the material of p. Points: xs (sorted x, mm), their original indices
 * `order`, and y by original index. Binary search on the bounding box's x range.
 */
export function holdsPoint(p: Polygon, xs: Float64Array, order: readonly number[], y: Float64Array): boolean {
  const b = ringBounds(p.outer);
  let lo = 0, hi = xs.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (xs[mid] < b[0]) lo = mid + 1; else hi = mid;
  }
  for (let m = lo; m < xs.length && xs[m] <= b[2]; m++) {
    const yy = y[order[m]];
    if (yy < b[1] || yy > b[3]) continue;
    if (inPiece(p, [xs[m], yy])) return true;
  }
  return false;
}

/** Whether (x, y) lies within `d` mm of polygon p (in it, or within d of its outer ring; holes count as material). */
export function nearPiece(p: Polygon, x: number, y: number, d: number): boolean {
  const b = ringBounds(p.outer);
  if (x < b[0] - d || x > b[2] + d || y < b[1] - d || y > b[3] + d) return false;
  if (ringContains(p.outer, [x, y]) >= 0) return true;
  const r = p.outer, d2 = d * d;
  for (let i = 0, j = r.length - 1; i < r.length; j = i++) {
    const ax = r[j][0], ay = r[j][1], ex = r[i][0] - ax, ey = r[i][1] - ay;
    const l2 = ex * ex + ey * ey;
    let t = l2 > 0 ? ((x - ax) * ex + (y - ay) * ey) / l2 : 0;
    t = t < 0 ? 0 : t > 1 ? 1 : t;
    const dx = x - ax - t * ex, dy = y - ay - t * ey;
    if (dx * dx + dy * dy <= d2) return true;
  }
  return false;
}

/** Whether point q lies in the material of polygon p (inside the outer ring, in none of its holes). */
export function inPiece(p: Polygon, q: Point): boolean {
  if (ringContains(p.outer, q) < 0) return false;
  for (const h of p.holes) if (ringContains(h, q) > 0) return false;
  return true;
}

/**
 * The pieces of `after` that contain a piece of `before` (tested at a point strictly inside each piece of
 * `before`). `after` must contain `before`; then every piece of `before` lies in exactly one piece of `after`
 * and the count of pieces cannot grow.
 */
export function anchored(after: PolygonSet, before: PolygonSet): PolygonSet {
  const anchors = before.polygons.map((p) => interiorPoint(p.outer, p.holes));
  const keep = after.polygons.filter((p) => {
    const b = ringBounds(p.outer);
    return anchors.some((q) => q[0] >= b[0] && q[0] <= b[2] && q[1] >= b[1] && q[1] <= b[3] && inPiece(p, q));
  });
  return keep.length === after.polygons.length ? after : { polygons: keep };
}

/**
 * A ring without repeated consecutive vertices (zero-length edges) and without needles: a vertex where the ring
 * turns back on itself (the next edge runs back along the previous one, within `needle` mm of its line) is the
 * tip of a spike of no area — the boolean engine leaves them where two outlines share an edge — and is removed,
 * repeatedly (a stack walk, O(n)).
 */
function cleanRing(r: Ring, needle: number): Ring {
  const out: Point[] = [];
  const spike = (a: Point, b: Point, c: Point): boolean => {
    const ux = b[0] - a[0], uy = b[1] - a[1], vx = c[0] - b[0], vy = c[1] - b[1];
    if (ux * vx + uy * vy >= 0) return false;
    const lu = Math.hypot(ux, uy), lv = Math.hypot(vx, vy);
    return Math.abs(ux * vy - uy * vx) <= needle * Math.max(lu, lv);
  };
  for (const p of r) {
    const q = out[out.length - 1];
    if (q && q[0] === p[0] && q[1] === p[1]) continue;
    out.push(p);
    while (out.length >= 3 && spike(out[out.length - 3], out[out.length - 2], out[out.length - 1])) {
      out.splice(out.length - 2, 1);
      const a = out[out.length - 2], b = out[out.length - 1];
      if (a[0] === b[0] && a[1] === b[1]) out.pop(); // the needle's base came back to where it left
    }
  }
  // the seam: the last and first vertices
  let changed = true;
  while (changed && out.length >= 3) {
    changed = false;
    const n = out.length;
    if (out[0][0] === out[n - 1][0] && out[0][1] === out[n - 1][1]) { out.pop(); changed = true; continue; }
    if (spike(out[n - 2], out[n - 1], out[0])) { out.pop(); changed = true; continue; }
    if (spike(out[n - 1], out[0], out[1])) { out.shift(); changed = true; }
  }
  return out.length === r.length ? r : out;
}

/**
 * The set without zero-length edges and needles (cleanRing); rings left with fewer than 3 vertices are dropped, and so are holes whose
 * mean thickness 2·area/perimeter is below `needle` mm (slits left where added material meets the solid up to
 * rounding: they are filled, which only adds material).
 */
export function cleanSet(set: PolygonSet, needle: number): PolygonSet {
  const polygons: Polygon[] = [];
  for (const p of set.polygons) {
    const outer = cleanRing(p.outer, needle);
    if (outer.length < 3) continue;
    const holes = p.holes.map((h) => cleanRing(h, needle)).filter((h) => h.length >= 3 && (2 * Math.abs(ringArea(h))) / ringPerimeter(h) >= needle);
    polygons.push({ outer, holes });
  }
  return { polygons };
}
