/** `drop-islands` (→ `islands`): removes whole the pieces src/check/islands.ts `joinedPieces` calls islands. */
import { joinedPieces } from '../check/islands.js';
import { polygonArea } from '../geom/area.js';
import { interiorPoint } from '../geom/interior.js';
import type { Polygon, PolygonSet } from '../types.js';
import type { RepairInput, StepResult } from './types.js';

/** Removes whole every island larger than the island limit (mm²). */
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
