/**
 * Checks as data (docs/checks/README.md): a check measures and returns a Measurement; the runner (run.ts) applies the
 * limit, the resolution band and the severity, and turns it into a CheckResult of the report.
 *
 * Frame: millimetres, y up, origin at the lower-left corner of the grid (docs/conventions.md).
 */
import type { FeAnalysis } from '../fe/analyse.js';
import type { ReachFinding } from '../fe/reach.js';
import type { Morphology } from '../morph/types.js';
import type { CheckResult, DensityGrid, PolygonSet, Ring, ThresholdSummary } from '../types.js';
import type { CheckId } from './ids.js';

export type CheckUnit = CheckResult['unit'];

/** A place in the report frame (mm, y up) with the value measured there (in the check's unit). */
export interface RawLocation {
  readonly x: number;
  readonly y: number;
  readonly measured: number;
}

/** What a check's measurement returns: data only, no verdict. */
export interface Measurement {
  /** The worst value found (check's unit); null when there is nothing to measure. */
  readonly measured: number | null;
  /** ± accuracy of the method, in the check's unit. */
  readonly resolution: number;
  /** One line: how the value was measured (shown in the report). */
  readonly method: string;
  /**
   * Places that break the limit or come within `resolution` of it, in any order (the runner sorts them
   * worst first and keeps 100). Each is one finding: a thin strut, a small hole, a tight corner, an island.
   */
  readonly locations: readonly RawLocation[];
  /**
   * The most severe status this measurement may take (additive; absent = the planned severity): 'warn' when the
   * limit is broken by something the run reports rather than fails (the volume a repair moved).
   */
  readonly atMost?: 'warn';
  /** Why, in a few words, appended to the message (additive; absent = none). */
  readonly note?: string;
}

/** Everything a check may look at. Built once per run by the pipeline; read-only. */
export interface CheckContext {
  /** The final outline (after smoothing), mm, y up; outer rings CCW, holes CW. */
  readonly polygons: PolygonSet;
  /** The raw iso-contour the outline came from, mm. */
  readonly raw: PolygonSet;
  /**
   * The outline right after smoothing, before symmetry, passive regions and repair, when those changed it:
   * outline-fidelity measures this one, because what they change on purpose is reported, not failed
   * (DESIGN §4). Absent when `polygons` is the smoothed outline itself.
   */
  readonly smoothed?: PolygonSet;
  /** Domain rectangle [minX, minY, maxX, maxY], mm. */
  readonly domain: readonly [number, number, number, number];
  /** The prepared density grid (values 0..1). */
  readonly grid: DensityGrid;
  /** The threshold stage's choice: the target and the achieved (smoothed) fraction. */
  readonly threshold: ThresholdSummary;
  /** M_nd of the input, % (Sigmund 2007; the report's `input.greyLevel`). */
  readonly greyLevel: number;
  /** The outline's deviation budget, mm (the resolved `--tolerance`). */
  readonly tolerance: number;
  /**
   * The smoothing stage's own deviation measure (mm): the true directed Hausdorff distance from the outline to
   * the raw contour is at most `max + resolution`. Lets outline-fidelity skip its located search when the
   * outline is clearly within its limit. Absent when the caller has none.
   */
  readonly smoothingDeviation?: { readonly max: number; readonly resolution: number };
  /**
   * Passive-solid regions (`--passive`) applied to the outline, mm, y up (additive; absent without): a piece
   * that touches or overlaps one counts as joined for `islands` (and for the `drop-islands` repair).
   */
  readonly passiveSolid?: readonly Ring[];
  /**
   * True when `polygons` is the outline after `--repair` (the geometry written, fixed parts applied again):
   * volume-fraction then measures its area instead of the threshold's (additive; absent before repair).
   */
  readonly repaired?: boolean;
  /**
   * With `repaired`: the area of the part as the files hold it, mm² (true circles as circles, rings cleaned as
   * written; src/report/geometry.ts). Absent: the polygon area of `polygons`.
   */
  readonly writtenArea?: number;
  /**
   * The structural re-check of this outline (`--loads`, docs/structure.md; additive, absent without): the input
   * design's analysis, this outline's, and what this outline no longer reaches.
   */
  readonly structure?: StructureCheckInput;
  /** The morphology engine for this outline, built on first use and shared by the size checks. */
  morphology(): Morphology;
}

/** What the structural checks read (stiffness-change, peak-stress, load-path). */
export interface StructureCheckInput {
  readonly input: FeAnalysis;
  /** The outline being checked, analysed. */
  readonly geometry: FeAnalysis;
  readonly reach: readonly ReachFinding[];
  /** Lower-left corner of the analysis grid, mm. */
  readonly x0: number;
  readonly y0: number;
}

/** A registered check: its id, unit, comparison and how to measure; the runner does the rest. */
export interface CheckDefinition {
  readonly id: CheckId;
  readonly unit: CheckUnit;
  /** '>=': measured ≥ limit passes (sizes); '<=': measured ≤ limit passes (errors, areas of islands). */
  readonly comparison: '>=' | '<=';
  /** Measures against `limit` (in the check's unit). */
  measure(ctx: CheckContext, limit: number): Measurement;
}
