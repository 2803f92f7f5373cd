/**
 * Shared checks of the format tests: a file read by its reader gives the same DensityGrid as a reference field
 * written by numpy.save (read by the NPY reader), and the same built geometry (the DXF text of `build`).
 */
import { readFileSync } from 'node:fs';
import { expect } from 'vitest';
import { readGrid } from '../../src/read/detect.js';
import { DEFAULT_READ_OPTIONS, type ReadOptions, type ReadResult } from '../../src/read/types.js';
import { build } from '../../src/pipeline.js';
import { resolveSettings, type Settings } from '../../src/settings.js';

export function loadFixture(dir: URL, file: string): Uint8Array {
  return new Uint8Array(readFileSync(new URL(file, dir)));
}

export function read(bytes: Uint8Array, name: string, options: Partial<ReadOptions> = {}): ReadResult {
  return readGrid(bytes, name, { ...DEFAULT_READ_OPTIONS, ...options });
}

/** Bit-exact equality of two grids' values (NaN equal to NaN), sizes, cell size and placement. */
export function expectSameGrid(a: ReadResult, b: ReadResult): void {
  expect([a.grid.nx, a.grid.ny, a.grid.placement]).toEqual([b.grid.nx, b.grid.ny, b.grid.placement]);
  expect(a.grid.cellSize).toEqual(b.grid.cellSize);
  const x = new Uint8Array(a.grid.values.buffer, a.grid.values.byteOffset, a.grid.values.byteLength);
  const y = new Uint8Array(b.grid.values.buffer, b.grid.values.byteOffset, b.grid.values.byteLength);
  // compare as bytes: bit-exact, and fast on a mismatch report
  let first = -1;
  for (let k = 0; k < x.length; k++) if (x[k] !== y[k]) { first = k >> 3; break; }
  expect(first, first >= 0 ? `value ${first}: ${a.grid.values[first]} vs ${b.grid.values[first]}` : '').toBe(-1);
}

/** The DXF text of a build of each file, under the same name so that only the content differs. */
export function expectSameDxf(a: Uint8Array, b: Uint8Array, settings: Partial<Settings>): void {
  const s = resolveSettings(settings);
  const da = build({ name: 'grid', bytes: a }, s).dxf();
  const db = build({ name: 'grid', bytes: b }, s).dxf();
  expect(da.length).toBeGreaterThan(1000);
  expect(da === db).toBe(true);
}
