/**
 * Passive regions applied exactly to the smoothed outline, their second step:
 * final = ((set ∪ solid) − void) ∩ domain, by booleans on one quantum (docs/notes/passive.md). mm, y up.
 */
import { arcSagitta, circumscribedRadius, circumscribedSegments } from '../geom/circle.js';
import { booleanOp, extentOf, quantumFor, ringsOf } from '../geom/clipper.js';
import { RhoformError } from '../errors.js';
import type { Domain, Point, PolygonSet, Ring } from '../types.js';
import type { RingCircle } from '../geom/circle.js';
import { shapeRing } from './rings.js';
import type { PassiveRegions } from './types.js';
import { hypot } from '../geom/portable-math.js';

export interface PassiveExactResult {
  readonly polygons: PolygonSet;
  /** Rings that are whole passive circles, at most one per ring. */
  readonly ringCircles: RingCircle[];
  /** The solid primitives as CCW rings (mm, not clipped to the domain). */
  readonly solidRings: Ring[];
}

/** How far (mm) a passive circle's circumscribed polygon may lie outside it: tolerance/16 (docs/notes/passive.md). */
export function passiveCircleTolerance(tolerance: number): number {
  return arcSagitta(tolerance) / 4;
}

interface CircleRef {
  readonly cx: number;
  readonly cy: number;
  readonly r: number;
  readonly n: number;
  /** Vertex radius (mm): r / cos(π/n). */
  readonly R: number;
}

function onCircle(ring: Ring, c: CircleRef, eps: number): boolean {
  for (const [x, y] of ring) if (!(Math.abs(hypot(x - c.cx, y - c.cy) - c.R) <= eps)) return false;
  return true;
}

/** `tolerance` (mm, > 0): the outline's. Inputs unchanged; no regions: the set itself. */
export function applyPassiveExact(
  set: PolygonSet,
  regions: PassiveRegions,
  domain: Domain,
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
        if (!(Math.abs(hypot(first[0] - c.cx, first[1] - c.cy) - c.R) <= eps)) continue;
        if (!onCircle(ring, c, eps)) continue;
        out.push({ polygon: p, ring: k, x: c.cx, y: c.cy, r: c.r });
        break;
      }
    }
  }
  return out;
}
