/** The check stage: plan the checks, then run them on one outline (mm, y up); checks never see the report. */
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

export interface CheckPlan {
  readonly limits: ResolvedLimits;
  readonly process: ProcessReport | null;
  readonly planned: readonly PlannedCheck[];
  /** Morphology raster pixel, mm. */
  readonly pixel: number;
  readonly locate: LocateInFile;
}

export interface PlanInput {
  readonly grid: DensityGrid;
  readonly locate: (i: number, j: number) => SamplePosition;
  readonly domain: Domain;
  readonly tolerance: number;
}

/** Throws RhoformError on limits that cannot be used (a preset without its thickness, …). */
export function planStage(field: PlanInput, mode: ThresholdSummary['mode'], s: Settings): CheckPlan {
  const { limits, process } = resolveLimits(s, field.grid.cellSize);
  const { domain } = field;
  // a tool wider than the part mills no pocket and would need a huge raster: refuse it
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

export interface CheckInput {
  readonly raw: PolygonSet;
  /** mm. */
  readonly smoothed: { readonly polygons: PolygonSet; readonly maxDeviation: number; readonly deviationResolution: number };
  readonly grid: DensityGrid;
  readonly domain: Domain;
  readonly tolerance: number;
  readonly threshold: ThresholdSummary;
  /** %. */
  readonly greyLevel: number;
  readonly repaired?: boolean;
  /** mm²; see CheckContext. */
  readonly writtenArea?: number;
}

export interface CheckRecord {
  readonly results: CheckResult[];
  morphology(): Morphology | undefined;
}

/** Runs the planned checks on `polygons`, mm, y up; `passiveSolid` rings join the pieces that touch them. */
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
