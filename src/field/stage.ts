/**
 * The prepare stage: the read grid made ready for the threshold (docs/threshold.md, docs/symmetry.md,
 * docs/passive.md) — range mapping, clipping and non-finite samples (prepare.ts), the `--mirror` unfolding
 * (mirror.ts), and the passive regions' first act on the samples (src/passive/cells.ts). It also describes the
 * input for the report (the same statistics, gathered in the same pass).
 *
 * Frame: mm, y up, origin at the lower-left corner of the input grid; the unfolded grid keeps that frame.
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

/** What the prepare stage hands on. */
export interface PreparedField {
  /** The report's `input` block (the file as read, before any change). */
  readonly input: Report['input'];
  /** Layout read ('long' infers the cell size from the coordinates). */
  readonly layout: 'grid' | 'long';
  /** Where the cell size came from: the options, or the file itself (a VTK file's spacing). */
  readonly cellSizeSource: 'options' | 'file';
  /** The grid the threshold sees: prepared, unfolded (`--mirror`), passive samples set. Values 0..1. */
  readonly grid: DensityGrid;
  /** Maps a sample of `grid` to its place in the input file (through the unfolding). */
  readonly locate: (i: number, j: number) => SamplePosition;
  /** Symmetry planes of the unfolding, in the order of `--mirror`; empty without. */
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

/** Smallest and largest finite value of a grid (after passive regions changed some samples). */
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

/**
 * Prepare a read grid. `file` is the input as given (its name and bytes, for the report's `input`); `regions`
 * the parsed `--passive` file, or null. Throws RhoformError on bad values (exit 2).
 */
export function prepareStage(file: InputFile, read: ReadResult, s: Settings, regions: PassiveRegions | null): PreparedField {
  const prep = withFileName(file.name, () =>
    prepareGrid(read.grid, read.locate, { valueRange: s.valueRange, clip: s.clip, nonFinite: s.nonFinite }),
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
