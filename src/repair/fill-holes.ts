/**
 * `fill-holes` (→ `min-hole-size`, `small-holes`, docs/repair.md): holes and gaps narrower than the hole limit
 * are filled, and holes whose area is below the hole-area limit (`--min-hole-area`, default 4 cell areas) are filled whole.
 *
 * Frame: millimetres, y up, origin at the lower-left corner of the grid.
 *
 * By width (limit L): the void the disc of radius ρ = L/2 + δ cannot enter is the closing of the solid by that
 * disc minus the solid (common.ts `closing`; outside the domain is open space). Of that region, only the
 * connected parts that hold a counted thin void sample (θ-simplified medial axis, the check's own samples with
 * local width < L + pixel/2, the check's "too close to call" band included — Foskey, Lin & Manocha 2003, DOI 10.1145/781606.781623) are added: a small round hole (its
 * medial axis is its centre) fills whole, a narrow slot fills along its length with round ends of radius ρ where
 * it opens into wider void, and the 90° corners elsewhere (θ = 90°, not thin) are left alone. Filling the whole
 * unreachable part, rather than only the discs at the samples, leaves the remaining void a union of discs of
 * radius ρ there: no sliver wedge where a disc would cross a wall at a grazing angle.
 *
 * Then the thin samples the closing left alone — a neck between a sharp convex corner and a wall, where a disc of
 * radius ρ passes beside the corner — get their own inscribed disc, enlarged by δ, and the convex hull of the
 * discs of neighbouring samples (discs.ts); samples within ρ + pixel of a part the closing filled are left to
 * the next round, which measures the changed walls afresh. A disc that reaches past the domain edge is clipped
 * there (a neck between the part and the domain edge fills up to the edge).
 *
 * By area (limit A): every hole ring enclosing less than A mm² (shoelace) is filled (after the width step).
 *
 * Never fills a passive-void region, and does not count its area (addMaterial subtracts them).
 */
import { ringArea } from '../geom/area.js';
import { ringBounds } from '../geom/contains.js';
import { booleanOp, ringsOf } from '../geom/clipper.js';
import { interiorPoint } from '../geom/interior.js';
import type { Morphology } from '../morph/types.js';
import type { Polygon, PolygonSet, Ring } from '../types.js';
import { addMaterial, arcToleranceOf, closing, holdsPoint, marginOf, nearPiece, quantumOf } from './common.js';
import { discHulls } from './discs.js';
import { thinOut } from './thicken.js';
import type { RepairInput, StepResult } from './types.js';

/**
 * `(x, y) → whether some piece lies within d mm` (nearPiece), through a bucket grid of the pieces' bounding
 * boxes grown by d, so that n samples against k pieces cost about n + k box tests rather than n·k ring walks
 * (a plate with thousands of filled holes).
 */
function nearIndex(pieces: readonly Polygon[], d: number): (x: number, y: number) => boolean {
  if (pieces.length === 0) return () => false;
  const boxes = pieces.map((p) => {
    const b = ringBounds(p.outer);
    return [b[0] - d, b[1] - d, b[2] + d, b[3] + d] as const;
  });
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity, sum = 0;
  for (const b of boxes) {
    minX = Math.min(minX, b[0]); minY = Math.min(minY, b[1]); maxX = Math.max(maxX, b[2]); maxY = Math.max(maxY, b[3]);
    sum += Math.max(b[2] - b[0], b[3] - b[1]);
  }
  // cells about the size of an average box: each box lands in a few cells, each cell holds a few boxes
  const cell = Math.max(sum / boxes.length, ((maxX - minX) + (maxY - minY)) / 4096, 1e-9);
  const cols = Math.max(1, Math.ceil((maxX - minX) / cell));
  const rows = Math.max(1, Math.ceil((maxY - minY) / cell));
  const buckets = new Map<number, number[]>();
  const ci = (x: number): number => Math.min(cols - 1, Math.max(0, Math.floor((x - minX) / cell)));
  const cj = (y: number): number => Math.min(rows - 1, Math.max(0, Math.floor((y - minY) / cell)));
  const big: number[] = []; // boxes over many cells are tested always (few: cells fit the average box)
  boxes.forEach((b, k) => {
    if ((cj(b[3]) - cj(b[1]) + 1) * (ci(b[2]) - ci(b[0]) + 1) > 64) {
      big.push(k);
      return;
    }
    for (let j = cj(b[1]); j <= cj(b[3]); j++) {
      for (let i = ci(b[0]); i <= ci(b[2]); i++) {
        const key = j * cols + i;
        const list = buckets.get(key);
        if (list) list.push(k);
        else buckets.set(key, [k]);
      }
    }
  });
  const test = (k: number, x: number, y: number): boolean => {
    const b = boxes[k];
    return x >= b[0] && x <= b[2] && y >= b[1] && y <= b[3] && nearPiece(pieces[k], x, y, d);
  };
  return (x, y) => {
    if (x < minX || x > maxX || y < minY || y > maxY) return false;
    for (const k of buckets.get(cj(y) * cols + ci(x)) ?? []) if (test(k, x, y)) return true;
    for (const k of big) if (test(k, x, y)) return true;
    return false;
  };
}

/** Fills the narrow and the small holes of `set`; `morph` is the morphology of `set`. */
export function fillHoles(set: PolygonSet, input: RepairInput, morph: Morphology): StepResult {
  const { minHole: L, minHoleArea: A } = input.limits;
  if (L === null && A === null) {
    return { polygons: set, area: 0, locations: [], changed: { polygons: [] }, skipped: 'no hole limit (--min-hole, --min-hole-area or --process)' };
  }
  let current = set;
  let area = 0;
  const changed: Polygon[] = [];
  const locations: { x: number; y: number; measured: number }[] = [];
  if (L !== null) {
    // the check warns within its resolution (pixel/2) of the limit: gaps in that band are filled too
    const below = L + 0.5 * morph.pixel;
    const pts = morph.medial('void', below);
    if (pts.count > 0) {
      const rho = L / 2 + marginOf(input, L / 2, true);
      const quantum = quantumOf(input.domain, rho);
      const closed = closing(current, rho, arcToleranceOf(input, L / 2), arcToleranceOf(input, L / 2, true), quantum);
      const unreachable = booleanOp('difference', ringsOf(closed), ringsOf(current), { quantum });
      const keep = thinOut(pts.x, pts.y, pts.count, input.pixel, input.domain[0], input.domain[1]);
      const order = keep.sort((a, b) => pts.x[a] - pts.x[b]);
      const xs = Float64Array.from(order, (k) => pts.x[k]);
      const chosen = unreachable.polygons.filter((p) => holdsPoint(p, xs, order, pts.y));
      const added = addMaterial(current, ringsOf(chosen), input, quantum);
      if (added.polygons !== current) {
        current = added.polygons;
        area += added.area;
        changed.push(...added.changed.polygons);
      }
      // the samples the closing left alone (a neck beside a sharp convex corner, which a disc of radius ρ passes):
      // their own inscribed discs, enlarged by δ, with the hulls of neighbouring discs (discs.ts). A sample within
      // ρ of a filled part is not taken: the fill changed the walls there (the samples of a wedge between its
      // new fillet and the disc that made it are no longer thin), and the next round measures it afresh.
      const reach = rho + input.pixel;
      const near = nearIndex(chosen, reach);
      const left = order.filter((k) => !near(pts.x[k], pts.y[k]));
      if (left.length > 0) {
        const delta = marginOf(input, L / 2);
        const rings = discHulls(
          left.map((k) => pts.x[k]), left.map((k) => pts.y[k]), left.map((k) => pts.radius[k] + delta), left.length,
          input.pixel, input.domain[0], input.domain[1], arcToleranceOf(input, L / 2),
        );
        const more = addMaterial(current, rings, input, quantum);
        if (more.polygons !== current) {
          current = more.polygons;
          area += more.area;
          changed.push(...more.changed.polygons);
        }
      }
      for (const p of morph.width('void', below).places) locations.push({ x: p.x, y: p.y, measured: p.width });
    }
  }
  if (A !== null) {
    const small: Ring[] = [];
    const where: { x: number; y: number; measured: number }[] = [];
    for (const p of current.polygons) {
      for (const h of p.holes) {
        const a = Math.abs(ringArea(h));
        if (!(a < A)) continue;
        small.push(h);
        const [x, y] = interiorPoint(h);
        where.push({ x, y, measured: a });
      }
    }
    if (small.length > 0) {
      const quantum = quantumOf(input.domain, 0);
      // a hole ring is clockwise: reversed it bounds the hole's own region (non-zero fill either way)
      const added = addMaterial(current, small.map((h) => [...h].reverse()), input, quantum);
      if (added.polygons !== current) {
        current = added.polygons;
        area += added.area;
        changed.push(...added.changed.polygons);
      }
      locations.push(...where.sort((a, b) => a.measured - b.measured));
    }
  }
  return { polygons: current, area, locations, changed: { polygons: changed }, skipped: null };
}
