/** The read stage: read and validate a grid file, and describe it (the report's `input`, `rhoform inspect`). Pure. */
import { createHash } from 'node:crypto';
import { RhoformError } from './errors.js';
import { fieldStats, histogram, type FieldStats, type Histogram } from './field/stats.js';
import { readGrid } from './read/detect.js';
import type { ReadOptions, ReadResult } from './read/types.js';
import type { Settings } from './settings.js';
import type { Report } from './types.js';
import { VERSION } from './version.js';

export interface InputFile {
  /** As the user gave it (messages, the report). */
  readonly name: string;
  readonly bytes: Uint8Array;
  /**
   * True when the caller hands `bytes` over and will not read them again (the CLI, which read the file into a
   * buffer of its own): the build may then rearrange them in place instead of copying them (an NPY file's rows
   * flipped into grid order). The report's `input.sha256` is still of the bytes as given, taken first.
   * Absent or false (the default): `bytes` are never written.
   */
  readonly consumable?: boolean;
  /**
   * With `consumable`: bytes of `bytes.buffer` right after `bytes` that the caller hands over too (default 0), so
   * that an NPY file's f4 data can be widened to f8 where they are (src/read/npy.ts npyInPlaceBytes).
   */
  readonly room?: number;
}

function readOptions(s: Settings, consumeBytes: boolean, room: number): ReadOptions {
  return {
    consumeBytes,
    room,
    cellSize: s.cellSize,
    rowOrder: s.rowOrder,
    values: s.values,
    layout: s.layout,
    decimalComma: s.decimalComma,
    maxCells: s.maxCells,
    field: s.field,
    cellSizeGiven: !s.cellSizeDefaulted,
    imageSolid: s.imageSolid,
    imageChannel: s.imageChannel,
  };
}

/**
 * Reads and validates the grid file; errors carry its name. The file's SHA-256 is taken first (`sha256` of the
 * result), since a consumable input's bytes may be changed by the reader.
 */
export function loadGrid(input: InputFile, s: Settings): ReadResult {
  const hash = sha256(input.bytes);
  const read = readGrid(input.bytes, input.name, readOptions(s, input.consumable === true, input.consumable === true ? (input.room ?? 0) : 0));
  const g = read.grid;
  if (g.placement === 'nodes' && (g.nx < 2 || g.ny < 2)) {
    throw new RhoformError('E_GRID_SIZE', `expected at least 2×2 nodal values (--values nodes), found ${g.ny}×${g.nx}`, {
      file: input.name,
    });
  }
  return { ...read, sha256: hash };
}

export interface InspectResult {
  readonly schemaVersion: 1;
  readonly tool: Report['tool'];
  readonly input: Report['input'];
  readonly histogram: Histogram;
  /** Share of samples with 0.1 < ρ < 0.9, after range mapping. */
  readonly greyShare: number;
  readonly layout: 'grid' | 'long';
  readonly cellSizeSource: 'options' | 'file';
  readonly warnings: string[];
}

function sha256(bytes: Uint8Array): string {
  return createHash('sha256').update(bytes).digest('hex');
}

/** `known`: statistics gathered while preparing; otherwise computed here. */
export function describeInput(
  input: InputFile,
  read: ReadResult,
  s: Settings,
  known?: FieldStats,
): { input: Report['input']; greyShare: number } {
  const g = read.grid;
  const raw = known ?? fieldStats(g);
  const st = known ?? (isIdentity(s) ? raw : fieldStats(g, s.valueRange));
  return {
    input: {
      file: input.name,
      sha256: read.sha256 ?? sha256(input.bytes),
      format: read.format,
      nx: g.nx,
      ny: g.ny,
      cellSize: [g.cellSize[0], g.cellSize[1]],
      min: raw.min,
      max: raw.max,
      mean: st.mean,
      greyLevel: st.greyLevel,
      nonFinite: raw.nonFinite,
    },
    greyShare: st.greyShare,
  };
}

function isIdentity(s: Settings): boolean {
  return s.valueRange[0] === 0 && s.valueRange[1] === 1;
}

/** Never fails on non-finite values. */
export function inspect(input: InputFile, s: Settings): InspectResult {
  const read = loadGrid(input, s);
  const d = describeInput(input, read, s);
  return {
    schemaVersion: 1,
    tool: { name: 'rhoform', version: VERSION },
    input: d.input,
    histogram: histogram(read.grid, 10, 0, 1, isIdentity(s) ? undefined : s.valueRange),
    greyShare: d.greyShare,
    layout: read.layout,
    cellSizeSource: read.cellSizeSource ?? 'options',
    warnings: [...read.warnings],
  };
}

