/**
 * The prepare stage: range mapping and non-finite samples, the `--mirror` unfolding and the passive regions'
 * samples, plus the report's description of the input. Frame: mm, y up, origin at the input's lower left.
 */
import { RhoformError } from '../errors.js';
import { mirrorPlanes, unfoldGrid, unfoldLocate } from './mirror.js';
import type { MirrorPlane } from '../geom/symmetry.js';
import { describeInput, type InputFile } from '../input.js';
import { applyPassiveToGrid } from '../passive/cells.js';
import { mirrorPassive } from '../passive/mirror.js';
import type { PassiveRegions } from '../passive/types.js';
import type { ReadResult, SamplePosition } from '../read/types.js';
import type { Settings } from '../settings.js';
import type { DensityGrid, Domain, Report } from '../types.js';
import { fieldMean, gridDomain } from './mean.js';
import { prepareGrid } from './prepare.js';
import { hypot } from '../geom/portable-math.js';

/** The outline's deviation budget (mm) when `--tolerance` is not given: a quarter of the smaller cell side. */
export const DEFAULT_TOLERANCE_CELLS = 0.25;

export interface PreparedField {
  /** The report's `input` block (the file as read, before any change). */
  readonly input: Report['input'];
  readonly layout: 'grid' | 'long';
  /** The file's own spacing (VTK) or the options. */
  readonly cellSizeSource: 'options' | 'file';
  /** The grid the threshold sees: prepared, unfolded (`--mirror`), passive samples set. Values 0..1. */
  readonly grid: DensityGrid;
  /** A sample of `grid` → its place in the input file. */
  readonly locate: (i: number, j: number) => SamplePosition;
  /** In the order of `--mirror`. */
  readonly planes: readonly MirrorPlane[];
  /** The passive regions with their mirror images; null without `--passive`. */
  readonly passive: PassiveRegions | null;
  /** Samples the passive regions set to 1 and to 0; null without `--passive`. */
  readonly passiveSamples: { readonly solid: number; readonly void: number } | null;
  /** mm: the outline's deviation budget (`--tolerance`, or DEFAULT_TOLERANCE_CELLS of the smaller cell side). */
  readonly tolerance: number;
  readonly domain: Domain;
  /** mm². */
  readonly domainArea: number;
  /** Smallest and largest value of `grid`. */
  readonly min: number;
  readonly max: number;
  /** Mean of `grid` (nodal grids: the bilinear field's mean): the default volume fraction. */
  readonly mean: number;
  readonly warnings: readonly string[];
}

/** Runs `f`; a RhoformError that names no file gets `name` (the stages are pure and do not know it). */
export function withFileName<T>(name: string, f: () => T): T {
  try {
    return f();
  } catch (e) {
    if (e instanceof RhoformError && e.where && e.where.file === undefined) throw e.withFile(name);
    throw e;
  }
}

function valueRange(values: Float64Array): { min: number; max: number } {
  let min = Infinity;
  let max = -Infinity;
  for (let k = 0; k < values.length; k++) {
    const v = values[k];
    if (v < min) min = v;
    if (v > max) max = v;
  }
  return { min, max };
}

export interface PrepareStageOptions {
  /**
   * The caller hands `read` over (build does): when its values are its own (`read.ownsValues`), they are
   * prepared in place, and `read.grid` must not be used afterwards (it then holds the prepared values).
   * Default false: `read` is left as it is.
   */
  readonly consume?: boolean;
}

/** `regions`: the parsed `--passive` file, or null. Throws RhoformError on bad values (exit 2). */
export function prepareStage(file: InputFile, read: ReadResult, s: Settings, regions: PassiveRegions | null, opts: PrepareStageOptions = {}): PreparedField {
  const inPlace = opts.consume === true && read.ownsValues === true;
  const prep = withFileName(file.name, () =>
    prepareGrid(read.grid, read.locate, { valueRange: s.valueRange, clip: s.clip, nonFinite: s.nonFinite, inPlace }),
  );
  const desc = describeInput(file, read, s, prep.inputStats);
  const planes = s.mirror.length > 0 ? mirrorPlanes(prep.grid, s.mirror) : [];
  let grid = planes.length > 0 ? unfoldGrid(prep.grid, s.mirror) : prep.grid;
  const locate = planes.length > 0 ? unfoldLocate(read.locate, prep.grid, s.mirror) : read.locate;
  // With --mirror the regions' mirror images are added, so a half model's bolt hole has a true-circle twin.
  const passive = regions ? mirrorPassive(regions, planes) : null;
  const [hx, hy] = grid.cellSize;
  const tolerance = s.tolerance ?? DEFAULT_TOLERANCE_CELLS * Math.min(hx, hy);
  const cells = passive ? applyPassiveToGrid(grid, passive, { inset: hypot(hx, hy) + tolerance }) : null;
  if (cells) grid = cells.grid;
  const range = grid === prep.grid ? { min: prep.min, max: prep.max } : valueRange(grid.values);
  const domain = gridDomain(grid);
  // The target is the prepared field's mean: with passive regions, the field they set (docs/passive.md).
  const mean = grid.placement === 'nodes' || grid !== prep.grid ? fieldMean(grid) : prep.mean;
  return {
    input: desc.input,
    layout: read.layout,
    cellSizeSource: read.cellSizeSource ?? 'options',
    grid,
    locate,
    planes,
    passive,
    passiveSamples: cells ? { solid: cells.solidSamples, void: cells.voidSamples } : null,
    tolerance,
    domain,
    domainArea: (domain[2] - domain[0]) * (domain[3] - domain[1]),
    min: range.min,
    max: range.max,
    mean,
    warnings: [...read.warnings, ...prep.warnings],
  };
}
