/**
 * `drop-islands` (→ `islands`, docs/repair.md): pieces not joined to the main body (the largest piece) nor to a
 * passive-solid region, with net area above `--min-island-area` (0: every such piece), are removed whole.
 *
 * Frame: millimetres, y up. "Joined" is decided in one place, src/check/islands.ts joinedPieces, shared with the
 * check, so the check and the repair agree. Only whole pieces go: nothing is cut, so no piece is split.
 */
import { joinedPieces } from '../check/islands.js';
import { polygonArea } from '../geom/area.js';
import { interiorPoint } from '../geom/interior.js';
import type { Polygon, PolygonSet } from '../types.js';
import type { RepairInput, StepResult } from './types.js';

/** Removes the islands of `set` larger than the island limit. */
export function dropIslands(set: PolygonSet, input: RepairInput): StepResult {
  const polys = set.polygons;
  const areas = new Float64Array(polys.length);
  for (let k = 0; k < polys.length; k++) areas[k] = polygonArea(polys[k]);
  const joined = joinedPieces(set, areas, input.passiveSolid);
  const limit = input.limits.minIslandArea;
  const kept: Polygon[] = [];
  const dropped: Polygon[] = [];
  const locations: { x: number; y: number; measured: number }[] = [];
  let area = 0;
  for (let k = 0; k < polys.length; k++) {
    if (joined[k] || !(areas[k] > limit)) {
      kept.push(polys[k]);
      continue;
    }
    dropped.push(polys[k]);
    area -= areas[k];
    const [x, y] = interiorPoint(polys[k].outer, polys[k].holes);
    locations.push({ x, y, measured: areas[k] });
  }
  if (dropped.length === 0) return { polygons: set, area: 0, locations: [], changed: { polygons: [] }, skipped: null };
  locations.sort((a, b) => b.measured - a.measured);
  return { polygons: { polygons: kept }, area, locations, changed: { polygons: dropped }, skipped: null };
}
