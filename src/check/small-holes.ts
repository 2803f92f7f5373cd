/** `small-holes`: the area (mm², shoelace) of the smallest hole ring; measured ≥ limit passes (docs/checks/small-holes.md). */
import { ringArea, ringPerimeter } from '../geom/area.js';
import { interiorPoint } from '../geom/interior.js';
import { formatValue } from './format.js';
import type { CheckContext, CheckDefinition, Measurement, RawLocation } from './types.js';

/** Holes and islands below this many cell areas are threshold artefacts (common practice, no source; docs/notes/check.md). */
export const SUB_RESOLUTION_CELLS = 4;

/** The default `--min-hole-area`, mm²: SUB_RESOLUTION_CELLS cells of hx × hy mm. */
export function defaultMinHoleArea(cellSize: readonly [number, number]): number {
  return SUB_RESOLUTION_CELLS * cellSize[0] * cellSize[1];
}

/** "2 of them below 4 cell areas (25 mm²): …" when some `areas` (mm²) lie below the grid's resolution. */
export function subResolutionNote(areas: readonly number[], cellSize: readonly [number, number], what: string, repair: string): string | undefined {
  const floor = defaultMinHoleArea(cellSize);
  const n = areas.filter((a) => a < floor).length;
  if (n === 0) return undefined;
  return `${n} ${n === 1 ? 'is' : 'are'} below ${SUB_RESOLUTION_CELLS} cell areas (${formatValue(floor)} mm²): ${what} of the threshold at the grid's resolution, not design; --repair ${repair}`;
}

/** Smallest hole area (mm²); resolution = its perimeter × tolerance; located at a point inside each small hole. */
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
