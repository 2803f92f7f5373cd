/** Shared pieces of the repairs. mm, y up; outer rings CCW, holes CW; booleans via src/geom/clipper.ts. */
import { polygonArea, polygonSetArea, ringArea, ringPerimeter } from '../geom/area.js';
import { booleanOp, offsetRings, quantumFor, ringsOf, unionRings } from '../geom/clipper.js';
import { ringBounds, ringContains } from '../geom/contains.js';
import { interiorPoint } from '../geom/interior.js';
import { nearestOnRing } from '../geom/near.js';
import { arcSagitta } from '../geom/circle.js';
import type { Point, Polygon, PolygonSet, Ring } from '../types.js';
import type { RepairInput } from './types.js';
import { hypot } from '../geom/portable-math.js';

const COS_HALF_STEP = Math.cos((6 * Math.PI) / 180);

/** Largest distance (mm) of a polygonised arc of about `radius` mm from its circle (docs/notes/repair.md, "Arc tolerance"). */
export function arcToleranceOf(input: Pick<RepairInput, 'tolerance' | 'pixel'>, radius: number, fillet = false): number {
  const coarse = Math.min(arcSagitta(input.tolerance), radius * (1 - COS_HALF_STEP));
  return Math.max(fillet ? Math.min(coarse, input.pixel / 1600) : coarse, radius * 1e-4);
}

/** The margin δ (mm) that lifts a repaired width clear of the re-check's ± pixel/2 band (docs/notes/repair.md). */
export function marginOf(input: Pick<RepairInput, 'tolerance' | 'pixel'>, radius: number, fillet = false): number {
  return arcToleranceOf(input, radius, fillet) + input.pixel / 2;
}

/** One quantum (mm) for every boolean of a repair, from the domain's extent and the largest offset radius. */
export function quantumOf(domain: RepairInput['domain'], radius: number): number {
  const ext = Math.max(Math.abs(domain[0]), Math.abs(domain[1]), Math.abs(domain[2]), Math.abs(domain[3]));
  return quantumFor(ext, 2 * radius);
}

export function domainRing(d: RepairInput['domain']): Ring {
  return [[d[0], d[1]], [d[2], d[1]], [d[2], d[3]], [d[0], d[3]]];
}

/**
 * Closing of the solid by a disc of radius ρ (mm): dilate, erode, round joins (Serra, "Image analysis and
 * mathematical morphology", Academic Press 1982). Fillets within `fillet` mm, the dilation's arcs within `grow`.
 */
export function closing(set: PolygonSet, rho: number, grow: number, fillet: number, quantum: number): PolygonSet {
  const grown = offsetRings(ringsOf(set), rho, { join: 'round', arcTolerance: grow, quantum });
  return offsetRings(ringsOf(grown), -rho, { join: 'round', arcTolerance: fillet, quantum });
}

/** 2·area/perimeter, mm. */
function meanThickness(p: Polygon): number {
  let per = ringPerimeter(p.outer);
  for (const h of p.holes) per += ringPerimeter(h);
  return per > 0 ? (2 * polygonArea(p)) / per : 0;
}

export interface Added {
  readonly polygons: PolygonSet;
  readonly changed: PolygonSet;
  readonly area: number;
}

/**
 * Adds `extra` (rings, mm) to `set` within the domain, never into passive voids; pieces holding no piece of `set`
 * are dropped, so the piece count never grows. Returns `set` itself when nothing is added.
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

/** Half the width (mm) of the cracks sealCracks closes: pixel/4. */
export function crackOf(input: Pick<RepairInput, 'pixel'>): number {
  return input.pixel / 4;
}

/** Closes cracks narrower than 2·eps mm (miter joins, so corners come back exactly); only adds material. */
export function sealCracks(set: PolygonSet, eps: number, quantum: number): PolygonSet {
  if (!(eps > 0) || set.polygons.length === 0) return set;
  const grown = offsetRings(ringsOf(set), eps, { join: 'miter', miterLimit: 10, arcTolerance: eps, quantum });
  const back = offsetRings(ringsOf(grown), -eps, { join: 'miter', miterLimit: 10, arcTolerance: eps, quantum });
  // only the cracks are added, so rings away from them keep their vertices
  const cracks = booleanOp('difference', ringsOf(back), ringsOf(set), { quantum }).polygons.filter((p) => meanThickness(p) > eps * 1e-3);
  if (cracks.length === 0) return set;
  return cleanSet(unionRings([...ringsOf(set), ...ringsOf(cracks)], { quantum }), eps * 1e-3);
}

/** Whether a point of a set lies in p's material. Points: xs sorted (mm), their indices `order`, y by index. */
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

/** Whether (x, y) lies within `d` mm of p (holes count as material). */
export function nearPiece(p: Polygon, x: number, y: number, d: number): boolean {
  const b = ringBounds(p.outer);
  if (x < b[0] - d || x > b[2] + d || y < b[1] - d || y > b[3] + d) return false;
  if (ringContains(p.outer, [x, y]) >= 0) return true;
  return nearestOnRing(p.outer, x, y).d <= d;
}

export function inPiece(p: Polygon, q: Point): boolean {
  if (ringContains(p.outer, q) < 0) return false;
  for (const h of p.holes) if (ringContains(h, q) > 0) return false;
  return true;
}

/** The pieces of `after` (⊇ `before`) that contain a piece of `before`. */
export function anchored(after: PolygonSet, before: PolygonSet): PolygonSet {
  const anchors = before.polygons.map((p) => interiorPoint(p.outer, p.holes));
  const keep = after.polygons.filter((p) => {
    const b = ringBounds(p.outer);
    return anchors.some((q) => q[0] >= b[0] && q[0] <= b[2] && q[1] >= b[1] && q[1] <= b[3] && inPiece(p, q));
  });
  return keep.length === after.polygons.length ? after : { polygons: keep };
}

/** The ring without zero-length edges and needle tips (within `needle` mm), by a stack walk, O(n). */
function cleanRing(r: Ring, needle: number): Ring {
  const out: Point[] = [];
  const spike = (a: Point, b: Point, c: Point): boolean => {
    const ux = b[0] - a[0], uy = b[1] - a[1], vx = c[0] - b[0], vy = c[1] - b[1];
    if (ux * vx + uy * vy >= 0) return false;
    const lu = hypot(ux, uy), lv = hypot(vx, vy);
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

/** cleanRing on every ring; drops rings under 3 vertices and holes thinner than `needle` mm (filling them only adds material). */
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
