/** Types of the repairs (docs/repair.md). mm, y up; outer rings CCW, holes CW. */
import type { CheckId } from '../check/ids.js';
import type { RepairName } from '../settings.js';
import type { Domain, PolygonSet, Ring } from '../types.js';

/** Limits in mm (areas mm²); null = off, and its repair does nothing. minIslandArea 0: every island. */
export interface RepairLimits {
  readonly minMember: number | null;
  readonly minHole: number | null;
  readonly toolRadius: number | null;
  readonly minIslandArea: number;
  readonly minHoleArea: number | null;
}

export interface RepairInput {
  readonly polygons: PolygonSet;
  /** Outside it is open space (docs/checks/README.md). */
  readonly domain: Domain;
  /** `--tolerance`, mm. */
  readonly tolerance: number;
  readonly limits: RepairLimits;
  /** Rings, mm: a piece touching one is joined. */
  readonly passiveSolid: readonly Ring[];
  /** Rings, mm: never filled, not counted as added. */
  readonly passiveVoid: readonly Ring[];
  /** Morphology raster pixel, mm. */
  readonly pixel: number;
}

export interface RepairAction {
  readonly id: RepairName;
  readonly checks: CheckId[];
  /** mm², signed: added (+) or removed (−). */
  readonly area: number;
  /** One per changed region, worst first, measured before the repair (mm, or mm² for areas). */
  readonly locations: { x: number; y: number; measured: number }[];
  readonly changed: PolygonSet;
  /** Why it did nothing, or null. */
  readonly skipped: string | null;
  /** What its checks would still find, and why ("… beside a passive-void region, which the repairs never fill"), or null. */
  readonly unresolved: string | null;
}

/** The checks each repair answers (DESIGN §5). */
export const REPAIR_CHECKS: Readonly<Record<RepairName, CheckId[]>> = {
  thicken: ['min-member-size'],
  'fill-holes': ['min-hole-size', 'small-holes'],
  'open-corners': ['min-inner-radius'],
  'drop-islands': ['islands'],
};

/** Its new geometry: the same object when nothing changed. */
export interface StepResult {
  readonly polygons: PolygonSet;
  readonly area: number;
  readonly locations: { x: number; y: number; measured: number }[];
  readonly changed: PolygonSet;
  readonly skipped: string | null;
}
