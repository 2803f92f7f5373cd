/**
 * Types of the repair engine (`--repair[=list]`, docs/repair.md): each repair turns an outline that fails a size
 * check into one that passes, tied to check ids (DESIGN §5).
 *
 * Frame: millimetres, y up, origin at the lower-left corner of the grid (docs/conventions.md). Polygons: outer
 * rings counter-clockwise, holes clockwise, material inside a hole a polygon of its own.
 */
import type { CheckId } from '../check/ids.js';
import type { RepairName } from '../settings.js';
import type { PolygonSet, Ring } from '../types.js';

/** The limits the repairs work to (mm, mm²); null = that limit is off and its repair does nothing. */
export interface RepairLimits {
  /** Member limit (`--min-member` or the process preset), mm: thicken. */
  readonly minMember: number | null;
  /** Hole limit (`--min-hole`), mm: fill-holes by width. */
  readonly minHole: number | null;
  /** Tool radius (`--tool-radius`), mm: open-corners. */
  readonly toolRadius: number | null;
  /** `--min-island-area`, mm²: drop-islands removes islands larger than this (0 = every island). */
  readonly minIslandArea: number;
  /** The hole-area limit in force (`--min-hole-area`, default 4 cell areas), mm²: fill-holes fills whole holes smaller than this. */
  readonly minHoleArea: number | null;
}

export interface RepairInput {
  /** The outline to repair (after smoothing and passive booleans). */
  readonly polygons: PolygonSet;
  /** Domain rectangle [minX, minY, maxX, maxY], mm. Outside it is open space (docs/checks/README.md). */
  readonly domain: readonly [number, number, number, number];
  /** The outline's deviation budget, mm (`--tolerance`); arcs are polygonised within tolerance/4. */
  readonly tolerance: number;
  readonly limits: RepairLimits;
  /** Passive-solid regions (rings, mm): a piece touching one is joined (never dropped). */
  readonly passiveSolid: readonly Ring[];
  /** Passive-void regions (rings, mm): never filled; the area they cover is not counted as added. */
  readonly passiveVoid: readonly Ring[];
  /** Morphology raster pixel, mm (choosePixel(grid.cellSize, domain) from src/morph/index.ts). */
  readonly pixel: number;
}

/** What one repair did (all its rounds together). */
export interface RepairAction {
  readonly id: RepairName;
  /** The checks this repair answers. */
  readonly checks: CheckId[];
  /** mm², signed: material added (+) or removed (−). */
  readonly area: number;
  /**
   * Where it acted, worst first, measured before the repair, one per connected region it changed (the worst
   * value measured there): thin width (mm) for thicken; narrow width (mm) for fill-holes, or for a hole filled
   * for its area the area (mm²); corner radius (mm) for open-corners; island area (mm²) for drop-islands.
   */
  readonly locations: { x: number; y: number; measured: number }[];
  /** The region added or removed (for the `repair` layer of DXF/SVG). */
  readonly changed: PolygonSet;
  /** Why it did nothing (no limit given), or null. */
  readonly skipped: string | null;
  /**
   * What its checks would still find on the repaired outline (before the pipeline re-applies symmetry and the
   * passive regions) and the likely reason — "2 thin places still below 8 mm (thinnest 7.8 mm at x 99, y 70):
   * beside a passive-void region, which the repairs never fill" — or null when nothing is left.
   */
  readonly unresolved: string | null;
}

/** The checks each repair answers (DESIGN §5). */
export const REPAIR_CHECKS: Readonly<Record<RepairName, CheckId[]>> = {
  thicken: ['min-member-size'],
  'fill-holes': ['min-hole-size', 'small-holes'],
  'open-corners': ['min-inner-radius'],
  'drop-islands': ['islands'],
};

/** One repair step on the current geometry: its new geometry (the same object when nothing changed). */
export interface StepResult {
  readonly polygons: PolygonSet;
  readonly area: number;
  readonly locations: { x: number; y: number; measured: number }[];
  readonly changed: PolygonSet;
  readonly skipped: string | null;
}
