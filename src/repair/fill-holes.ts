/** `fill-holes` (→ `min-hole-size`, `small-holes`): by width, then by area (method: docs/notes/repair.md). mm, y up. */
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

/** Whether some piece lies within d mm of (x, y), through a bucket grid of the pieces' grown boxes. */
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
  // cells about the size of an average box
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

/** `morph` is the morphology of `set`. */
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
    // the check's "too close to call" band is filled too
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
      // necks beside a sharp convex corner; samples near a part just filled wait for the next round
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
      // a reversed hole ring bounds the hole's own region
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
