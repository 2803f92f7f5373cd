/**
 * Hand-built check contexts for the check tests: only the fields a check reads are meaningful; morphology()
 * throws, so a check that must not need the morphology engine fails loudly if it calls it.
 */
import type { CheckContext } from '../../src/check/types.js';
import type { DensityGrid, Point, PolygonSet, Report, Ring } from '../../src/types.js';

export interface ContextParts {
  polygons?: PolygonSet;
  raw?: PolygonSet;
  domain?: readonly [number, number, number, number];
  tolerance?: number;
  threshold?: Partial<Report['threshold']>;
  greyLevel?: number;
  maxDeviation?: number;
  grid?: DensityGrid;
}

export function makeContext(parts: ContextParts): CheckContext {
  const domain = parts.domain ?? [0, 0, 100, 100];
  const grid: DensityGrid = parts.grid ?? {
    nx: 1, ny: 1, cellSize: [domain[2] - domain[0], domain[3] - domain[1]], origin: [domain[0], domain[1]],
    values: new Float64Array([0.5]), placement: 'cells',
  };
  const tolerance = parts.tolerance ?? 0.25;
  const polygons = parts.polygons ?? { polygons: [] };
  return {
    polygons,
    raw: parts.raw ?? polygons,
    domain,
    grid,
    tolerance,
    threshold: { mode: 'volume', level: 0.5, targetFraction: 0.5, achievedFraction: 0.5, pixelFraction: 0.5, ...parts.threshold },
    greyLevel: parts.greyLevel ?? 0,
    morphology() {
      throw new Error('this check must not use the morphology engine');
    },
  };
}

/** Regular n-gon of radius r about (cx, cy), counter-clockwise, first vertex at angle `phase` (radians). */
export function ngon(cx: number, cy: number, r: number, n: number, phase = 0): Point[] {
  return Array.from({ length: n }, (_, k) => {
    const a = phase + (2 * Math.PI * k) / n;
    return [cx + r * Math.cos(a), cy + r * Math.sin(a)] as Point;
  });
}

/** The same ring turning the other way (for holes, which are clockwise). */
export const reversed = (ring: Ring): Point[] => [...ring].reverse();

/** Axis-aligned rectangle, counter-clockwise. */
export const rect = (x0: number, y0: number, x1: number, y1: number): Point[] => [[x0, y0], [x1, y0], [x1, y1], [x0, y1]];

/** Independent even–odd point-in-ring test (ray casting), for checking that a location is inside. */
export function insideRing(ring: Ring, x: number, y: number): boolean {
  let c = false;
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
    const [xi, yi] = ring[i], [xj, yj] = ring[j];
    if (yi > y !== yj > y && x < ((xj - xi) * (y - yi)) / (yj - yi) + xi) c = !c;
  }
  return c;
}
