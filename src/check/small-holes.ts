/**
 * `small-holes`: the area of the smallest hole of the part (docs/checks/small-holes.md). Unit mm²; measured ≥
 * limit passes (`--min-hole-area`, default 4 cell areas: holes below the grid's resolution).
 *
 * Frame: mm, y up. A hole is a hole ring of a polygon (clockwise, enclosed by its outer ring); void open to the
 * domain edge is not a hole. Its area is the area its ring encloses (shoelace).
 */
import { ringArea, ringPerimeter } from '../geom/area.js';
import { interiorPoint } from '../geom/interior.js';
import { formatValue } from './format.js';
import type { CheckContext, CheckDefinition, Measurement, RawLocation } from './types.js';

/**
 * Holes and islands smaller than this many cell areas are below the grid's resolution: the volume-preserving
 * level can open a hole of one or two cells where the field dips a little below it, or leave a speck where it
 * rises a little above it — artefacts of the threshold, not design (docs/checks/small-holes.md). A hole of four
 * cell areas is a disc about 2.3 cells across, the smallest feature a density filter of radius ≥ 1.5 cells lets
 * an optimizer draw on purpose (common practice, no source).
 */
export const SUB_RESOLUTION_CELLS = 4;

/** The default `--min-hole-area`, mm²: SUB_RESOLUTION_CELLS cell areas of a grid with cells hx × hy mm. */
export function defaultMinHoleArea(cellSize: readonly [number, number]): number {
  return SUB_RESOLUTION_CELLS * cellSize[0] * cellSize[1];
}

/** "2 of them below 4 cell areas (25 mm²): …" when some of `areas` (mm²) lie below the grid's resolution. */
export function subResolutionNote(areas: readonly number[], cellSize: readonly [number, number], what: string, repair: string): string | undefined {
  const floor = defaultMinHoleArea(cellSize);
  const n = areas.filter((a) => a < floor).length;
  if (n === 0) return undefined;
  return `${n} ${n === 1 ? 'is' : 'are'} below ${SUB_RESOLUTION_CELLS} cell areas (${formatValue(floor)} mm²): ${what} of the threshold at the grid's resolution, not design; --repair ${repair}`;
}

/**
 * measured = the smallest hole area (mm²), null when the part has no hole. Resolution = that hole's perimeter ×
 * ctx.tolerance (the area a band of the outline's deviation budget along the hole can hold). Locations: every
 * hole whose area is below limit + its own resolution, at a point strictly inside the hole ring
 * (src/geom/interior.ts), measured = its area. O(vertices).
 */
export function measureSmallHoles(ctx: CheckContext, limit: number): Measurement {
  const tol = ctx.tolerance > 0 ? ctx.tolerance : 0;
  let smallest = Infinity;
  let resolution = 0;
  const locations: RawLocation[] = [];
  for (const p of ctx.polygons.polygons) {
    for (const h of p.holes) {
      const area = Math.abs(ringArea(h));
      const res = ringPerimeter(h) * tol;
      if (area < smallest) {
        smallest = area;
        resolution = res;
      }
      if (area < limit + res) {
        const [x, y] = interiorPoint(h);
        locations.push({ x, y, measured: area });
      }
    }
  }
  const note = subResolutionNote(locations.map((l) => l.measured), ctx.grid.cellSize, 'pinholes', 'fills them (fill-holes)');
  return {
    measured: smallest === Infinity ? null : smallest,
    resolution,
    method: 'area enclosed by each hole ring (shoelace); resolution = hole perimeter × outline tolerance',
    locations,
    ...(note ? { note } : {}),
  };
}

export const smallHoles: CheckDefinition = {
  id: 'small-holes',
  unit: 'mm2',
  comparison: '>=',
  measure: measureSmallHoles,
};
