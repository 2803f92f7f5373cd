/** Checks of the reader options shared by the MAT, VTK, VTI and PNG readers. */
import { UsageError } from '../errors.js';
import type { ReadOptions } from './types.js';

export interface CheckedOptions {
  readonly hx: number;
  readonly hy: number;
  readonly topDown: boolean;
}

/** @throws UsageError (E_USAGE) for a bad cell size, row order, placement or cell limit. */
export function checkReadOptions(options: ReadOptions): CheckedOptions {
  const [hx, hy] = options.cellSize;
  if (!(hx > 0 && hy > 0 && hx < Infinity && hy < Infinity)) {
    throw new UsageError(`cell size: expected two positive finite lengths in mm, found ${hx}, ${hy}`);
  }
  if (options.rowOrder !== 'top-down' && options.rowOrder !== 'bottom-up') {
    throw new UsageError(`row order: expected 'top-down' or 'bottom-up', found ${String(options.rowOrder)}`);
  }
  if (options.values !== 'cells' && options.values !== 'nodes') {
    throw new UsageError(`values: expected 'cells' or 'nodes', found ${String(options.values)}`);
  }
  if (!(options.maxCells > 0)) throw new UsageError(`max cells: expected a positive number, found ${options.maxCells}`);
  return { hx, hy, topDown: options.rowOrder === 'top-down' };
}

/** Warning for the CSV-only layout option given to a binary reader (as the NPY reader words it). */
export function layoutWarning(options: ReadOptions, what: string): string[] {
  return options.layout === 'long' ? [`layout 'long' applies to CSV files only; the ${what} was read as a grid`] : [];
}
