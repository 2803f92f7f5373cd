/**
 * What readers take and return. Readers are pure: bytes or text in, a DensityGrid out.
 * They do not map value ranges, clip or apply the non-finite policy (src/field/prepare.ts does);
 * non-finite cells are kept as NaN so that prepare can locate and count them.
 */
import type { DensityGrid, InputFormat } from '../types.js';
import type { Where } from '../errors.js';

export interface ReadOptions {
  /** Cell size [hx, hy] in mm. Long-form CSV infers it from the coordinates and ignores this. */
  readonly cellSize: readonly [number, number];
  /** 'top-down' (default): file row 1 is the top of the part (largest y). */
  readonly rowOrder: 'top-down' | 'bottom-up';
  /** 'cells': values at cell centres; 'nodes': values on cell corners. */
  readonly values: 'cells' | 'nodes';
  /** CSV only: 'auto' picks 'long' when the header names x, y and value/rho/density. */
  readonly layout: 'grid' | 'long' | 'auto';
  /** CSV only: ',' is the decimal separator (then ',' is never a field separator). */
  readonly decimalComma: boolean;
  /** Refuse a declared or counted size above this many samples, before allocating. */
  readonly maxCells: number;
  /** MAT, VTK, VTI: the variable or array to read (`--field`); absent or null = the only candidate. */
  readonly field?: string | null;
  /** False when the cell size is the default (no `--cell-size`): then a VTK file's own spacing is used. */
  readonly cellSizeGiven?: boolean;
  /** PNG: which end of the grey scale is solid (`--image-solid`, default 'dark': black = 1). */
  readonly imageSolid?: 'dark' | 'light';
  /** PNG: the channel of a colour image to read (`--image-channel`); colour images are refused without it. */
  readonly imageChannel?: 'luminance' | 'r' | 'g' | 'b' | null;
  /**
   * The caller hands the file's bytes over (it will not read them again): a reader may rearrange them in place
   * and return a view of them as the grid's values instead of a copy (NPY: aligned little-endian f8 in C order).
   * Absent or false: the bytes are never written.
   */
  readonly consumeBytes?: boolean;
  /**
   * With `consumeBytes`: this many bytes of the same ArrayBuffer right after the file's bytes are the caller's
   * too and may be used (NPY f4 data widened to f8 in place; npyInPlaceBytes says how many). Default 0.
   */
  readonly room?: number;
}

export const DEFAULT_READ_OPTIONS: ReadOptions = {
  cellSize: [1, 1],
  rowOrder: 'top-down',
  values: 'cells',
  layout: 'auto',
  decimalComma: false,
  maxCells: 50_000_000,
};

/** Position of a grid sample in the input file, for messages and report locations. */
export interface SamplePosition {
  /** 1-based data row and column as in the input file (row 1 = first row written). */
  readonly fileRow: number;
  readonly fileCol: number;
  /** Where to point an error message: text line/column for CSV, byte offset for NPY. */
  readonly where: Where;
}

export interface ReadResult {
  readonly grid: DensityGrid;
  readonly format: InputFormat;
  /** Layout actually used (CSV 'auto' resolved; NPY is always 'grid'). */
  readonly layout: 'grid' | 'long';
  /** Maps a sample (i from the left, j from the bottom, in grid order) to its place in the file. */
  readonly locate: (i: number, j: number) => SamplePosition;
  /** Non-fatal remarks (e.g. a 3-D array with a unit axis was squeezed). */
  readonly warnings: readonly string[];
  /** Where the grid's cell size came from: the options (default), or the file itself (VTK spacing). */
  readonly cellSizeSource?: 'options' | 'file';
  /**
   * True when `grid.values` belong to this result alone: a reader's fresh array, or a view of bytes the caller
   * handed over (`consumeBytes`). Whoever holds the result may then overwrite them (prepare in place, the
   * `consume` option of prepareStage). Absent or false: they may share memory with the caller's bytes (a
   * zero-copy view of an NPY file) and must never be written.
   */
  readonly ownsValues?: boolean;
  /**
   * SHA-256 (hex) of the file's bytes as read, taken by loadGrid before any reader could change them (the
   * report's `input.sha256`); absent from a bare reader's result, when describeInput hashes the bytes itself.
   */
  readonly sha256?: string;
}
