/** Checks as data: a check returns a Measurement; the runner gives the verdict. mm, y up (docs/conventions.md). */
import type { FeAnalysis } from '../fe/analyse.js';
import type { ReachFinding } from '../fe/reach.js';
import type { Morphology } from '../morph/types.js';
import type { CheckResult, DensityGrid, Domain, PolygonSet, Ring, ThresholdSummary } from '../types.js';
import type { CheckId } from './ids.js';

export type CheckUnit = CheckResult['unit'];

/** A place (mm, y up) and the value measured there, in the check's unit. */
export interface RawLocation {
  readonly x: number;
  readonly y: number;
  readonly measured: number;
}

export interface Measurement {
  /** Worst value in the check's unit; null when there is nothing to measure. */
  readonly measured: number | null;
  /** ± accuracy, in the check's unit. */
  readonly resolution: number;
  readonly method: string;
  /** Places breaking the limit or within `resolution` of it, any order. */
  readonly locations: readonly RawLocation[];
  /** 'warn' caps the status when the run reports rather than fails the break (the volume a repair moved). */
  readonly atMost?: 'warn';
  readonly note?: string;
}

/** Everything a check may look at; mm, y up, outer rings CCW, holes CW. */
export interface CheckContext {
  readonly polygons: PolygonSet;
  readonly raw: PolygonSet;
  /** The outline right after smoothing when later steps changed it: outline-fidelity measures this one. */
  readonly smoothed?: PolygonSet;
  readonly domain: Domain;
  readonly grid: DensityGrid;
  readonly threshold: ThresholdSummary;
  /** M_nd of the input, %. */
  readonly greyLevel: number;
  /** The resolved `--tolerance`, mm. */
  readonly tolerance: number;
  /** The smoothing stage's bound: h(outline, raw) ≤ max + resolution, mm. */
  readonly smoothingDeviation?: { readonly max: number; readonly resolution: number };
  /** Passive-solid rings: a piece touching one counts as joined. */
  readonly passiveSolid?: readonly Ring[];
  /** `polygons` is the repaired outline (volume-fraction then measures it). */
  readonly repaired?: boolean;
  /** With `repaired`: the area the files hold, mm² (true circles). */
  readonly writtenArea?: number;
  /** The structural re-check (`--loads`, docs/structure.md). */
  readonly structure?: StructureCheckInput;
  morphology(): Morphology;
}

export interface StructureCheckInput {
  readonly input: FeAnalysis;
  readonly geometry: FeAnalysis;
  readonly reach: readonly ReachFinding[];
  /** Lower-left corner of the analysis grid, mm. */
  readonly x0: number;
  readonly y0: number;
}

export interface CheckDefinition {
  readonly id: CheckId;
  readonly unit: CheckUnit;
  /** '>=': measured ≥ limit passes (sizes); '<=': measured ≤ limit passes (errors, areas). */
  readonly comparison: '>=' | '<=';
  measure(ctx: CheckContext, limit: number): Measurement;
}
