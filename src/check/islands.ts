/**
 * `islands`: pieces of material not joined to the main body (docs/checks/islands.md). Unit mm²; measured ≤
 * limit passes (an island up to `--min-island-area` is tolerated; 0 makes every extra piece an island).
 *
 * Frame: mm, y up. A piece is one polygon of ctx.polygons (outer ring CCW with its CW holes); polygons never
 * overlap, and material inside a hole is a piece of its own. The main body is the largest piece by net area.
 */
import { polygonArea, ringPerimeter } from '../geom/area.js';
import { interiorPoint } from '../geom/interior.js';
import type { Polygon, PolygonSet } from '../types.js';
import type { CheckContext, CheckDefinition, Measurement, RawLocation } from './types.js';

/**
 * Which pieces count as joined (1) rather than islands (0), given their net areas (mm²): the main body, the
 * largest piece (the first of equal largest ones).
 *
 * This is the one place that decides what "joined" means: passive-solid regions, when the pipeline has them,
 * will mark here every piece that touches one as joined too.
 */
export function joinedPieces(set: PolygonSet, areas: Float64Array): Uint8Array {
  const joined = new Uint8Array(set.polygons.length);
  let main = -1;
  for (let k = 0; k < areas.length; k++) if (main < 0 || areas[k] > areas[main]) main = k;
  if (main >= 0) joined[main] = 1;
  return joined;
}

/** Boundary length (mm) of a piece: its outer ring and its holes. */
function piecePerimeter(p: Polygon): number {
  let s = ringPerimeter(p.outer);
  for (const h of p.holes) s += ringPerimeter(h);
  return s;
}

/**
 * Net area (mm², shoelace: outer minus holes) of every piece not joined to the main body. measured = the area of
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
  const joined = joinedPieces(ctx.polygons, areas);
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
  return {
    measured: worst < 0 ? null : worst,
    resolution,
    method: 'net area of every piece not joined to the main body (the largest piece); resolution = perimeter × outline tolerance',
    locations,
  };
}

export const islands: CheckDefinition = {
  id: 'islands',
  unit: 'mm2',
  comparison: '<=',
  measure: measureIslands,
};
