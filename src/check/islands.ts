/** `islands`: pieces not joined to the main body (docs/checks/islands.md). mm², y up; measured ≤ limit passes. */
import { polygonArea, ringPerimeter } from '../geom/area.js';
import { ringBounds, ringContains } from '../geom/contains.js';
import { interiorPoint } from '../geom/interior.js';
import { segmentsIntersect, sqSegDist } from '../geom/segments.js';
import type { Polygon, PolygonSet, Ring } from '../types.js';
import { subResolutionNote } from './small-holes.js';
import type { CheckContext, CheckDefinition, Measurement, RawLocation } from './types.js';

/**
 * 1 for each piece joined to the main body (the largest piece, or one touching a passive-solid ring), 0 for an island.
 * The one definition of "joined", shared by the `islands` check and the `drop-islands` repair.
 */
export function joinedPieces(set: PolygonSet, areas: Float64Array, passiveSolid: readonly Ring[] = []): Uint8Array {
  const joined = new Uint8Array(set.polygons.length);
  let main = -1;
  for (let k = 0; k < areas.length; k++) if (main < 0 || areas[k] > areas[main]) main = k;
  if (main >= 0) joined[main] = 1;
  if (passiveSolid.length === 0) return joined;
  const boxes = passiveSolid.map((r) => ringBounds(r));
  for (let k = 0; k < set.polygons.length; k++) {
    if (joined[k]) continue;
    const p = set.polygons[k];
    const pb = ringBounds(p.outer);
    for (let m = 0; m < passiveSolid.length && !joined[k]; m++) {
      const eps = 1e-9 * Math.max(1, Math.abs(pb[0]), Math.abs(pb[1]), Math.abs(pb[2]), Math.abs(pb[3]));
      const b = boxes[m];
      if (b[0] > pb[2] + eps || pb[0] > b[2] + eps || b[1] > pb[3] + eps || pb[1] > b[3] + eps) continue;
      if (touchesRing(p, passiveSolid[m], eps)) joined[k] = 1;
    }
  }
  return joined;
}

/** Whether piece `p` and the region bounded by `ring` share a point, up to `eps` mm. O(n·m). */
export function touchesRing(p: Polygon, ring: Ring, eps: number): boolean {
  const e2 = eps * eps;
  const rings = [p.outer, ...p.holes];
  for (const r of rings) {
    for (let i = 0, j = r.length - 1; i < r.length; j = i++) {
      const ax = r[j][0], ay = r[j][1], bx = r[i][0], by = r[i][1];
      for (let u = 0, v = ring.length - 1; u < ring.length; v = u++) {
        const cx = ring[v][0], cy = ring[v][1], dx = ring[u][0], dy = ring[u][1];
        if (Math.max(ax, bx) < Math.min(cx, dx) - eps || Math.max(cx, dx) < Math.min(ax, bx) - eps) continue;
        if (Math.max(ay, by) < Math.min(cy, dy) - eps || Math.max(cy, dy) < Math.min(ay, by) - eps) continue;
        if (segmentsIntersect(ax, ay, bx, by, cx, cy, dx, dy)) return true;
        if (sqSegDist(ax, ay, cx, cy, dx, dy) <= e2 || sqSegDist(bx, by, cx, cy, dx, dy) <= e2) return true;
        if (sqSegDist(cx, cy, ax, ay, bx, by) <= e2 || sqSegDist(dx, dy, ax, ay, bx, by) <= e2) return true;
      }
    }
  }
  if (ring.length > 0 && ringContains(p.outer, ring[0]) > 0 && !p.holes.some((h) => ringContains(h, ring[0]) >= 0)) return true;
  return p.outer.length > 0 && ringContains(ring, p.outer[0]) > 0;
}

function piecePerimeter(p: Polygon): number {
  let s = ringPerimeter(p.outer);
  for (const h of p.holes) s += ringPerimeter(h);
  return s;
}

/** Net area (mm²) of the largest island; resolution = its perimeter × tolerance, 0 under limit 0 (docs/notes/check.md). */
export function measureIslands(ctx: CheckContext, limit: number): Measurement {
  const polys = ctx.polygons.polygons;
  const areas = new Float64Array(polys.length);
  for (let k = 0; k < polys.length; k++) areas[k] = polygonArea(polys[k]);
  const joined = joinedPieces(ctx.polygons, areas, ctx.passiveSolid ?? []);
  const tol = ctx.tolerance > 0 && limit > 0 ? ctx.tolerance : 0;
  let worst = -1;
  let resolution = 0;
  const locations: RawLocation[] = [];
  for (let k = 0; k < polys.length; k++) {
    if (joined[k]) continue;
    const res = piecePerimeter(polys[k]) * tol;
    if (areas[k] > worst) {
      worst = areas[k];
      resolution = res;
    }
    if (areas[k] > limit - res) {
      const [x, y] = interiorPoint(polys[k].outer, polys[k].holes);
      locations.push({ x, y, measured: areas[k] });
    }
  }
  const note = subResolutionNote(locations.map((l) => l.measured), ctx.grid.cellSize, 'specks', 'drops them (drop-islands)');
  return {
    measured: worst < 0 ? null : worst,
    resolution,
    method: 'net area of every piece not joined to the main body (the largest piece) or to a passive-solid region; resolution = perimeter × outline tolerance',
    locations,
    ...(note ? { note } : {}),
  };
}

export const islands: CheckDefinition = {
  id: 'islands',
  unit: 'mm2',
  comparison: '<=',
  measure: measureIslands,
};
