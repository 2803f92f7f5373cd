/**
 * `--arcs` on the final outline: every ring that is not written as a true circle is fitted with circular arcs
 * and lines (src/geom/arcs.ts) that stay within `--tolerance` of the raw iso-contour — the same bound the
 * outline-fidelity check holds the smoothed outline to. Where the final outline does not follow the raw
 * contour (a repair moved it, a passive region cut it) no piece is feasible and the polygon's edges stay.
 *
 * What the fit never moves: vertices on a passive region's boundary (a circle's circumscribed polygon, a
 * rectangle's or polygon's edges — src/passive/exact.ts) and on the domain edge are grouped by the boundary
 * they lie on, and a piece never spans two groups; so a passive void stays void exactly, a passive circle's
 * arc is that polygon's circumscribed circle (outside the disc), and the domain edge stays straight. No arc
 * leaves the domain. Frame: mm, y up.
 */
import { passiveCircleTolerance } from '../passive/exact.js';
import type { PassiveRegions } from '../passive/types.js';
import type { ArcFitSummary, Domain, Point, Polygon, PolygonSet, Ring } from '../types.js';
import type { RingBulges } from '../geom/bulge.js';
import type { RingCircle } from '../geom/circle.js';
import { fitRingArcs } from '../geom/arcs.js';
import { flattenSet } from '../geom/flat.js';
import { nearDistance } from '../geom/near.js';
import { circumscribedRadius, circumscribedSegments } from '../geom/circle.js';
import { sqSegDist } from '../geom/segments.js';
import { hypot } from '../geom/portable-math.js';

export interface OutlineArcsInput {
  readonly polygons: PolygonSet;
  readonly ringCircles: readonly RingCircle[];
  readonly passive: PassiveRegions | null;
  readonly domain: Domain;
  /** mm: the outline tolerance. */
  readonly tolerance: number;
  /** The raw iso-contour the tolerance is measured from. */
  readonly raw: PolygonSet;
}

export interface OutlineArcs {
  /** The rings reduced to their break points (same polygons and rings, in the same order). */
  readonly polygons: PolygonSet;
  readonly bulges: RingBulges;
  readonly summary: ArcFitSummary;
}

type Boundary = (x: number, y: number) => boolean;

/** The boundaries whose vertices keep their own group, each as a membership test within `eps` mm. */
function boundaries(input: OutlineArcsInput, eps: number): Boundary[] {
  const out: Boundary[] = [];
  const [x0, y0, x1, y1] = input.domain;
  out.push((x, y) => Math.abs(y - y0) <= eps, (x) => Math.abs(x - x1) <= eps, (x, y) => Math.abs(y - y1) <= eps, (x) => Math.abs(x - x0) <= eps);
  for (const r of input.passive?.regions ?? []) {
    const shape = r.shape;
    if (shape.kind === 'circle') {
      // as src/passive/exact.ts polygonises it: circumscribed, within passiveCircleTolerance
      const R = circumscribedRadius(shape.r, circumscribedSegments(shape.r, passiveCircleTolerance(input.tolerance)));
      out.push((x, y) => Math.abs(hypot(x - shape.cx, y - shape.cy) - R) <= eps);
    } else {
      const pts: Point[] =
        shape.kind === 'rect'
          ? [[shape.x0, shape.y0], [shape.x1, shape.y0], [shape.x1, shape.y1], [shape.x0, shape.y1]]
          : [...shape.points];
      out.push((x, y) => {
        for (let i = 0; i < pts.length; i++) {
          const a = pts[i], b = pts[(i + 1) % pts.length];
          if (sqSegDist(x, y, a[0], a[1], b[0], b[1]) <= eps * eps) return true;
        }
        return false;
      });
    }
  }
  return out;
}

/** Fits the outline (see the header). A tolerance ≤ 0 leaves every ring straight. */
export function fitOutlineArcs(input: OutlineArcsInput): OutlineArcs {
  const budget = input.tolerance;
  // a sample within a third of the tolerance lets the next one be two thirds further on: near enough
  const rawDistance = nearDistance(flattenSet(input.raw), budget, budget / 3);
  const [dx0, dy0, dx1, dy1] = input.domain;
  const span = Math.max(dx1 - dx0, dy1 - dy0);
  const eps = Math.max(1e-9 * span, 1e-7);
  const groups = boundaries(input, eps);
  const inside = (box: readonly number[]) => box[0] >= dx0 - eps && box[1] >= dy0 - eps && box[2] <= dx1 + eps && box[3] <= dy1 + eps;
  const circles = new Set(input.ringCircles.map((c) => `${c.polygon}:${c.ring}`));
  let before = 0;
  let after = 0;
  let arcs = 0;
  let worst = 0;
  const bulges: (number[] | null)[][] = [];
  const polygons: Polygon[] = input.polygons.polygons.map((p, i) => {
    const rings = [p.outer, ...p.holes];
    const ringBulges: (number[] | null)[] = [];
    const fitted = rings.map((ring, k): Ring => {
      if (circles.has(`${i}:${k}`) || ring.length < 4 || !(budget > 0)) {
        ringBulges.push(null);
        if (!circles.has(`${i}:${k}`)) {
          before += ring.length;
          after += ring.length;
        }
        return ring;
      }
      const n = ring.length;
      const xy = new Float64Array(2 * n);
      const label = new Int32Array(n);
      for (let v = 0; v < n; v++) {
        const [x, y] = ring[v];
        xy[2 * v] = x;
        xy[2 * v + 1] = y;
        label[v] = groups.findIndex((g) => g(x, y)) + 1;
      }
      const fit = fitRingArcs(xy, budget, rawDistance, label, inside);
      before += n;
      after += fit.keep.length;
      for (const b of fit.bulge) if (b !== 0) arcs++;
      if (fit.maxDeviation > worst) worst = fit.maxDeviation;
      ringBulges.push(Array.from(fit.bulge));
      return Array.from(fit.keep, (v) => ring[v]);
    });
    bulges.push(ringBulges);
    return { outer: fitted[0], holes: fitted.slice(1) };
  });
  return {
    polygons: { polygons },
    bulges,
    summary: { segmentsBefore: before, segmentsAfter: after, arcs, maxDeviation: worst, tolerance: budget },
  };
}
