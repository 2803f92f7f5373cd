/**
 * Shared pieces of the repairs: the margin δ, the arc tolerance, the closing by a disc, adding material without
 * touching passive voids or making new pieces, and point-in-piece tests.
 *
 * Frame: millimetres, y up, origin at the lower-left corner of the grid. Polygons: outer rings counter-clockwise,
 * holes clockwise (DESIGN §3). Booleans and offsets: src/geom/clipper.ts (Vatti 1992, doi:10.1145/129902.129906).
 */
import { polygonArea, polygonSetArea, ringPerimeter } from '../geom/area.js';
import { booleanOp, offsetRings, quantumFor, ringsOf, unionRings } from '../geom/clipper.js';
import { ringBounds, ringContains } from '../geom/contains.js';
import { interiorPoint } from '../geom/interior.js';
import type { Point, Polygon, PolygonSet, Ring } from '../types.js';
import type { RepairInput } from './types.js';

/**
 * Largest distance (mm) of a polygonised arc from its true circle: a quarter of the outline budget, as the brief
 * of the outline asks for arcs (never below pixel/100, so `--tolerance 0` still gives finite polygons).
 */
export function arcToleranceOf(input: Pick<RepairInput, 'tolerance' | 'pixel'>): number {
  return Math.max(input.tolerance / 4, input.pixel / 100);
}

/**
 * The margin δ (mm) added to every disc radius so that the re-check measures at least the limit: the arc
 * tolerance (polygon chords lie up to that far inside the true circle) plus pixel/8 (the scallops between discs
 * whose centres lie up to a pixel apart along an axis, s²/(8ρ) ≤ pixel/8 for ρ ≥ pixel, and the raster
 * measure's own error, about 0.01–0.05 pixel on exact polygons — docs/checks/min-member-size.md).
 */
export function marginOf(input: Pick<RepairInput, 'tolerance' | 'pixel'>): number {
  return arcToleranceOf(input) + input.pixel / 8;
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
 */
export function closing(set: PolygonSet, rho: number, arcTolerance: number, quantum: number): PolygonSet {
  const grown = offsetRings(ringsOf(set), rho, { join: 'round', arcTolerance, quantum });
  return offsetRings(ringsOf(grown), -rho, { join: 'round', arcTolerance, quantum });
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
  const merged = unionRings([...solid, ...ringsOf(kept)], { quantum });
  const polygons = anchored(merged, set);
  // a floating bit dropped by anchored() is not part of the change
  const changed: PolygonSet = polygons === merged ? { polygons: kept } : booleanOp('difference', ringsOf(polygons), solid, { quantum });
  return { polygons, changed, area: polygonSetArea(polygons) - polygonSetArea(set) };
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
