/**
 * The geometry of VTK image data (legacy STRUCTURED_POINTS and XML ImageData) → the 2-D grid: which two axes
 * carry the grid, its size in samples, and the cell size.
 *
 * VTK's frame is ours: x to the right, y up, samples numbered with x fastest, then y, then z (VTK User's Guide,
 * "VTK File Formats"). Point data sit on the points (our nodal placement, `--values nodes`); cell data on the
 * cells between them (our cell centres). A 3-D set is read when one axis has a single sample (a point
 * dimension of 1, or one layer of cells); the remaining two axes become x and y of the grid in the order x, y, z.
 */
import { RhoformError, type ErrorCode, type Where } from '../errors.js';

export interface ImageGeometry {
  /** Samples along the grid's x and y (points, or cells, per placement). */
  readonly cols: number;
  readonly rows: number;
  /** Cell size in mm: the file's spacing of the two axes, or the options' when given. */
  readonly cellSize: readonly [number, number];
  readonly cellSizeSource: 'options' | 'file';
  /** Axis names used for x and y of the grid ('x', 'y' or 'z'). */
  readonly axes: readonly [string, string];
}

const AXES = ['x', 'y', 'z'];

/** Sample counts along x, y, z for points of dimensions `dims`, for point or cell data. */
export function sampleDims(dims: readonly number[], placement: 'cells' | 'nodes'): number[] {
  return placement === 'nodes' ? [...dims] : dims.map((d) => Math.max(d - 1, 1));
}

/**
 * Chooses the grid plane and cell size. `samples` are the sample counts along x, y, z; `spacing` the file's.
 * @throws RhoformError(`code`) when no axis has a single sample, or the spacing of a grid axis is not > 0.
 */
export function imageGeometry(
  samples: readonly number[],
  spacing: readonly number[],
  origin: readonly number[],
  options: { cellSize: readonly [number, number]; cellSizeGiven?: boolean },
  code: ErrorCode,
  where: Where,
  warnings: string[],
): ImageGeometry {
  const unit = [2, 1, 0].find((a) => samples[a] === 1);
  if (unit === undefined) {
    throw new RhoformError(code, `expected 2-D image data (one axis with a single sample), found ${samples.join('×')} samples`, where);
  }
  const [a, b] = [0, 1, 2].filter((k) => k !== unit);
  if (unit !== 2) warnings.push(`the image data lie in the ${AXES[a]}${AXES[b]} plane: ${AXES[a]} was read as x and ${AXES[b]} as y`);
  const given = options.cellSizeGiven === true;
  if (!given) {
    for (const k of [a, b]) {
      if (!(spacing[k] > 0 && spacing[k] < Infinity)) {
        throw new RhoformError(code, `expected a spacing > 0 along ${AXES[k]}, found ${spacing[k]}; or give --cell-size`, where);
      }
    }
  }
  if (origin.some((o) => o !== 0)) warnings.push(`the file's origin (${origin.join(', ')}) was not applied: the grid starts at 0, 0`);
  return {
    cols: samples[a],
    rows: samples[b],
    cellSize: given ? options.cellSize : [spacing[a], spacing[b]],
    cellSizeSource: given ? 'options' : 'file',
    axes: [AXES[a], AXES[b]],
  };
}

/** Warnings for options that a VTK file's own frame and placement override (values that differ from the defaults). */
export function overriddenOptions(options: { rowOrder: string; values: string }, placement: 'cells' | 'nodes'): string[] {
  const out: string[] = [];
  if (options.rowOrder === 'bottom-up') out.push("--row-order does not apply to VTK image data: the file's own frame (y up) was used");
  // 'cells' is also the default, so only an explicit --values nodes can be told apart
  if (options.values === 'nodes' && placement === 'cells') {
    out.push('--values nodes does not apply to VTK image data: the file holds cell data (cell values)');
  }
  return out;
}
