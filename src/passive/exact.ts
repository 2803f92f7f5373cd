/**
 * Passive regions applied exactly to the smoothed outline (the second of their two steps, after smoothing and
 * before the checks and the repair):
 *
 *   final = ((set ∪ solid primitives) − void primitives) ∩ domain rectangle
 *
 * by polygon booleans (src/geom/clipper.ts: Vatti's algorithm, B. R. Vatti, "A generic solution to polygon
 * clipping", Communications of the ACM 35(7):56–63, 1992, doi:10.1145/129902.129906), all three calls on one
 * power-of-two quantum so their results agree to the last bit.
 *
 * - Void wins over solid: a void primitive inside a solid one (a bolt hole in a boss) stays a hole.
 * - Primitives reaching outside the domain are clipped to it; the domain edge stays a hard edge.
 * - Circles are polygonised as circumscribed regular polygons (edges touching the circle, vertices within
 *   `tolerance / 16` mm outside it, passiveCircleTolerance), so the polygon contains the disc: a void circle is void exactly and a solid
 *   circle solid exactly, whatever else the booleans meet there (a repair that grew material around a
 *   pass-through never leaves a sliver inside it). A circle that survives whole as a ring of the result (a bolt
 *   hole surrounded by material) is reported as a RingCircle, so the writers draw the true circle (DXF CIRCLE on
 *   the ring's own layer — `hole` for a hole — and SVG arcs). A circle cut by the outline or the domain edge
 *   (partly outside the material) stays polygonal, its vertices outside the disc.
 *
 * Frame: mm, y up, origin at the lower-left corner of the grid. Output orientation as DESIGN §3: outer rings
 * counter-clockwise, holes clockwise.
 */
import { arcSagitta, circumscribedRadius, circumscribedSegments } from '../geom/circle.js';
import { booleanOp, extentOf, quantumFor, ringsOf } from '../geom/clipper.js';
import { RhoformError } from '../errors.js';
import type { Point, PolygonSet, Ring } from '../types.js';
import type { RingCircle } from '../geom/circle.js';
import { shapeRing } from './rings.js';
import type { PassiveRegions } from './types.js';

/** What applyPassiveExact returns. */
export interface PassiveExactResult {
  /** The part with the passive regions applied, inside the domain rectangle. */
  readonly polygons: PolygonSet;
  /** Rings of `polygons` that are whole passive circles (written on the ring's own layer), at most one per ring. */
  readonly ringCircles: RingCircle[];
  /** The solid primitives as counter-clockwise rings (mm, not clipped to the domain), as used in the union. */
  readonly solidRings: Ring[];
}

/**
 * How far (mm) the vertices of a passive circle's circumscribed polygon may lie outside the circle: a quarter
 * of the arc sagitta (arcSagitta), tolerance/16. The polygon contains the disc, so a void circle removes that
 * much more than the disc at its vertices; kept this small, the walls around a bolt hole lose at most a few
 * hundredths of a millimetre to it, within the size checks' resolution (the demo's bosses measured 8.17 mm
 * before with the inscribed polygon, 8.05 with a tolerance/4 circumscribed one, a warning at the 8 mm limit).
 */
export function passiveCircleTolerance(tolerance: number): number {
  return arcSagitta(tolerance) / 4;
}

interface CircleRef {
  readonly cx: number;
  readonly cy: number;
  readonly r: number;
  /** Vertices of its polygon. */
  readonly n: number;
  /** Radius of those vertices (mm): the circumscribed polygon's, r / cos(π/n). */
  readonly R: number;
}

/** True when every vertex of `ring` lies within `eps` mm of the circle. */
function onCircle(ring: Ring, c: CircleRef, eps: number): boolean {
  for (const [x, y] of ring) if (!(Math.abs(Math.hypot(x - c.cx, y - c.cy) - c.R) <= eps)) return false;
  return true;
}

/**
 * Apply passive regions exactly to a smoothed polygon set (mm, y up; outer rings CCW, holes CW), within the
 * domain rectangle [minX, minY, maxX, maxY] (mm). `tolerance` (mm, > 0) is the outline tolerance; circles are
 * polygonised as circumscribed polygons within passiveCircleTolerance (tolerance / 16). Never mutates its inputs. With no regions the set is returned as it is.
 *
 * ringCircles: every ring of the result all of whose vertices lie on one passive circle's circumscribed polygon (within 4 quanta +
 * 1e-9·r) and whose vertex count equals that circle's polygon — the circle survived whole. Void circles (bolt
 * holes) are the usual case; a solid circle that survived whole (a free-standing boss) is listed too.
 */
export function applyPassiveExact(
  set: PolygonSet,
  regions: PassiveRegions,
  domain: readonly [minX: number, minY: number, maxX: number, maxY: number],
  tolerance: number,
): PassiveExactResult {
  if (!(tolerance > 0)) throw new RhoformError('E_INTERNAL', `passive tolerance must be > 0 mm, found ${tolerance}`);
  const [x0, y0, x1, y1] = domain;
  if (!(x1 > x0 && y1 > y0)) throw new RhoformError('E_INTERNAL', `passive domain must have x0 < x1 and y0 < y1, found ${domain.join(', ')}`);
  if (regions.regions.length === 0) return { polygons: set, ringCircles: [], solidRings: [] };

  const circleTol = passiveCircleTolerance(tolerance);
  const solidRings: Ring[] = [];
  const voidRings: Ring[] = [];
  const circles: CircleRef[] = [];
  for (const reg of regions.regions) {
    const ring = shapeRing(reg.shape, circleTol, 'circumscribed');
    (reg.role === 'solid' ? solidRings : voidRings).push(ring);
    if (reg.shape.kind === 'circle') {
      const { cx, cy, r } = reg.shape;
      const n = circumscribedSegments(r, circleTol);
      circles.push({ cx, cy, r, n, R: circumscribedRadius(r, n) });
    }
  }
  const box: Ring = [
    [x0, y0],
    [x1, y0],
    [x1, y1],
    [x0, y1],
  ];
  const partRings = ringsOf(set);
  const extent = extentOf([voidRings, solidRings, partRings, [box]]);
  const quantum = quantumFor(extent);

  let result = solidRings.length > 0 ? booleanOp('union', partRings, solidRings, { quantum }) : set;
  if (voidRings.length > 0) result = booleanOp('difference', ringsOf(result), voidRings, { quantum });
  result = booleanOp('intersection', ringsOf(result), [box], { quantum });

  return { polygons: result, ringCircles: findCircles(result, circles, quantum), solidRings };
}

/** Rings of `set` that are one of `circles` polygonised whole (same vertex count, every vertex on the circle). */
function findCircles(set: PolygonSet, circles: readonly CircleRef[], quantum: number): RingCircle[] {
  const out: RingCircle[] = [];
  if (circles.length === 0) return out;
  const byCount = new Map<number, CircleRef[]>();
  for (const c of circles) {
    const list = byCount.get(c.n);
    if (list) list.push(c);
    else byCount.set(c.n, [c]);
  }
  const polys = set.polygons;
  for (let p = 0; p < polys.length; p++) {
    const rings: readonly Ring[] = [polys[p].outer, ...polys[p].holes];
    for (let k = 0; k < rings.length; k++) {
      const ring = rings[k];
      const candidates = byCount.get(ring.length);
      if (!candidates) continue;
      const first: Point = ring[0];
      for (const c of candidates) {
        const eps = 4 * quantum + 1e-9 * c.r;
        if (!(Math.abs(Math.hypot(first[0] - c.cx, first[1] - c.cy) - c.R) <= eps)) continue;
        if (!onCircle(ring, c, eps)) continue;
        out.push({ polygon: p, ring: k, x: c.cx, y: c.cy, r: c.r });
        break;
      }
    }
  }
  return out;
}
