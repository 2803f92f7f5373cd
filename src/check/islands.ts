/**
 * `islands`: pieces of material not joined to the main body (docs/checks/islands.md). Unit mm²; measured ≤
 * limit passes (an island up to `--min-island-area` is tolerated; 0 makes every extra piece an island).
 *
 * Frame: mm, y up. A piece is one polygon of ctx.polygons (outer ring CCW with its CW holes); polygons never
 * overlap, and material inside a hole is a piece of its own. The main body is the largest piece by net area; a
 * piece touching or overlapping a passive-solid region (ctx.passiveSolid) is joined too.
 */
import { polygonArea, ringPerimeter } from '../geom/area.js';
import { ringBounds, ringContains } from '../geom/contains.js';
import { interiorPoint } from '../geom/interior.js';
import { segmentsIntersect, sqSegDist } from '../geom/segments.js';
import type { Polygon, PolygonSet, Ring } from '../types.js';
import { subResolutionNote } from './small-holes.js';
import type { CheckContext, CheckDefinition, Measurement, RawLocation } from './types.js';

/**
 * Which pieces count as joined (1) rather than islands (0), given their net areas (mm²): the main body, the
 * largest piece (the first of equal largest ones), and every piece that touches or overlaps a passive-solid
 * ring (`passiveSolid`, mm, either orientation; see touchesRing). This is the one place that decides what
 * "joined" means, shared by the `islands` check and the `drop-islands` repair.
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

/**
 * Whether piece `p` (outer ring with holes) and the region bounded by `ring` share a point, up to `eps` mm:
 * their boundaries come within eps of each other, or a vertex of one lies inside the other (the ring inside
 * the piece's material, or the piece inside the ring). O(n·m) segment pairs; used on islands only.
 */
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
  // no boundary contact: one lies wholly inside the other, or they are apart
  if (ring.length > 0 && ringContains(p.outer, ring[0]) > 0 && !p.holes.some((h) => ringContains(h, ring[0]) >= 0)) return true;
  return p.outer.length > 0 && ringContains(ring, p.outer[0]) > 0;
}

/** Boundary length (mm) of a piece: its outer ring and its holes. */
function piecePerimeter(p: Polygon): number {
  let s = ringPerimeter(p.outer);
  for (const h of p.holes) s += ringPerimeter(h);
  return s;
}

/**
 * Net area (mm², shoelace: outer minus holes) of every piece not joined to the main body (nor to a passive-solid
 * region, ctx.passiveSolid). measured = the area of
 * the largest island; null when there is none. Resolution = that island's perimeter × ctx.tolerance, the area a
 * band of the outline's deviation budget around it can hold — but 0 under the limit 0 ("every extra piece"):
 * whether a piece exists is not uncertain, only how large it is. Locations: one per island whose area is above
 * limit − its own resolution, at a point strictly inside the island (src/geom/interior.ts), measured = its area.
 * O(vertices).
 */
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
