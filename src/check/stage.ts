/**
 * The check stage (docs/checks/README.md): which checks run with which limits (`planChecks`), then the checks on
 * one outline. Checks see the geometry and the records they need, never the report. One morphology engine per
 * outline, built on first use and shared by the size checks.
 *
 * Frame: mm, y up, origin at the lower-left corner of the input grid (docs/conventions.md).
 */
import { UsageError } from '../errors.js';
import { buildMorphology, choosePixel } from '../morph/index.js';
import type { Morphology } from '../morph/types.js';
import type { SamplePosition } from '../read/types.js';
import type { Settings } from '../settings.js';
import type { CheckResult, DensityGrid, Domain, PolygonSet, Ring, ThresholdSummary } from '../types.js';
import { resolveLimits, type ProcessReport } from './limits.js';
import { locator } from './locate.js';
import { planChecks, type ResolvedLimits } from './registry.js';
import { runChecks, type LocateInFile, type PlannedCheck } from './run.js';
import type { CheckContext, StructureCheckInput } from './types.js';

/** Which checks run, with which limits, and how findings are placed. */
export interface CheckPlan {
  readonly limits: ResolvedLimits;
  /** The process preset's values with their sources (report `process`); null without `--process`. */
  readonly process: ProcessReport | null;
  readonly planned: readonly PlannedCheck[];
  /** Morphology raster pixel, mm (choosePixel). */
  readonly pixel: number;
  /** Maps a point (mm) to its 1-based file row and column. */
  readonly locate: LocateInFile;
}

/** What the plan needs of the prepared field. */
export interface PlanInput {
  readonly grid: DensityGrid;
  readonly locate: (i: number, j: number) => SamplePosition;
  readonly domain: Domain;
  readonly tolerance: number;
}

/** Plan the checks. Throws RhoformError on limits that cannot be used (a preset without its thickness, …). */
export function planStage(field: PlanInput, mode: ThresholdSummary['mode'], s: Settings): CheckPlan {
  const { limits, process } = resolveLimits(s, field.grid.cellSize);
  const { domain } = field;
  // A tool wider than the part cannot mill any pocket of it, and its open-space margin would need a raster
  // many times the grid: refuse it as a usage error rather than spend the memory.
  const span = Math.max(domain[2] - domain[0], domain[3] - domain[1]);
  if (limits.toolRadius !== null && !(limits.toolRadius <= span)) {
    throw new UsageError(`--tool-radius: expected a radius up to the larger side of the domain (${span} mm), found ${limits.toolRadius} mm`);
  }
  return {
    limits,
    process,
    planned: planChecks(s, { tolerance: field.tolerance, limits, mode }),
    pixel: choosePixel(field.grid.cellSize, domain),
    locate: locator(field.grid, field.locate),
  };
}

/** Everything the checks look at besides the outline itself. */
export interface CheckInput {
  /** The raw iso-contour, mm. */
  readonly raw: PolygonSet;
  /** The smoothed outline and the smoothing stage's own deviation measure (mm). */
  readonly smoothed: { readonly polygons: PolygonSet; readonly maxDeviation: number; readonly deviationResolution: number };
  readonly grid: DensityGrid;
  readonly domain: Domain;
  readonly tolerance: number;
  readonly threshold: ThresholdSummary;
  /** M_nd of the input, %. */
  readonly greyLevel: number;
  /** True for the re-check after `--repair`: the outline judged is the one written (CheckContext.repaired). */
  readonly repaired?: boolean;
  /** With `repaired`: the area the files hold, mm² (true circles, cleaned rings; CheckContext.writtenArea). */
  readonly writtenArea?: number;
}

export interface CheckRecord {
  readonly results: CheckResult[];
  /** The morphology engine of this outline when a check built one (the HTML picture reuses it). */
  morphology(): Morphology | undefined;
}

/**
 * Run the planned checks on `polygons` (the outline to judge), with the passive-solid rings of the exact passive
 * step (`islands` counts a piece touching one as joined).
 */
export function checkStage(
  polygons: PolygonSet,
  passiveSolid: readonly Ring[] | null,
  input: CheckInput,
  plan: CheckPlan,
  structure: StructureCheckInput | null = null,
): CheckRecord {
  let morph: Morphology | undefined;
  const { domain } = input;
  const ctx: CheckContext = {
    polygons,
    raw: input.raw,
    ...(polygons !== input.smoothed.polygons ? { smoothed: input.smoothed.polygons } : {}),
    domain,
    grid: input.grid,
    threshold: input.threshold,
    greyLevel: input.greyLevel,
    tolerance: input.tolerance,
    smoothingDeviation: { max: input.smoothed.maxDeviation, resolution: input.smoothed.deviationResolution },
    morphology: () => (morph ??= buildMorphology(polygons, { domain, pixel: plan.pixel })),
    ...(passiveSolid ? { passiveSolid } : {}),
    ...(input.repaired ? { repaired: true } : {}),
    ...(input.writtenArea !== undefined ? { writtenArea: input.writtenArea } : {}),
    ...(structure ? { structure } : {}),
  };
  return { results: runChecks(plan.planned, ctx, plan.locate), morphology: () => morph };
}
