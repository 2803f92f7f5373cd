/**
 * Fuzz of the MAT, VTK, VTI and PNG readers (fast-check): fixture files with bytes flipped, cut, repeated or
 * inserted, and random bytes behind each format's magic. Every outcome must be a grid of the declared size or a
 * RhoformError with a stable E_* code and a one-line message — never another exception, a hang or a crash.
 */
import { readFileSync } from 'node:fs';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { RhoformError } from '../../src/errors.js';
import { readGrid } from '../../src/read/detect.js';
import { DEFAULT_READ_OPTIONS } from '../../src/read/types.js';

const fixture = (dir: string, file: string): Uint8Array => new Uint8Array(readFileSync(new URL(`../../fixtures/${dir}/${file}`, import.meta.url)));

const SEEDS: Record<string, Uint8Array[]> = {
  mat: ['double.mat', 'double-z.mat', 'int16-z.mat', 'big-endian.mat', 'with-scalars.mat', 'struct.mat'].map((f) => fixture('mat', f)),
  vtk: ['cells-ascii.vtk', 'cells-binary.vtk', 'several-binary.vtk', 'points-ascii.vtk'].map((f) => fixture('vtk', f)),
  vti: ['ascii.vti', 'base64-uint32-zlib.vti', 'appended-raw-uint64.vti', 'appended-base64-uint32-zlib.vti', 'pieces.vti'].map((f) => fixture('vtk', f)),
  png: ['grey8.png', 'grey16.png', 'rgb.png', 'palette4.png', 'grey1.png'].map((f) => fixture('png', f)),
};

type Edit = { kind: 'flip' | 'cut' | 'insert' | 'dup'; at: number; byte: number; len: number };
const edit = fc.record({
  kind: fc.constantFrom('flip', 'cut', 'insert', 'dup') as fc.Arbitrary<Edit['kind']>,
  at: fc.double({ min: 0, max: 1, noNaN: true }).map((x) => x),
  byte: fc.integer({ min: 0, max: 255 }),
  len: fc.integer({ min: 1, max: 64 }),
}) as unknown as fc.Arbitrary<Edit>;

function apply(b: Uint8Array, edits: Edit[]): Uint8Array {
  let out = b;
  for (const e of edits) {
    const at = Math.floor((e.at as unknown as number) * out.length);
    if (e.kind === 'flip') {
      out = out.slice();
      out[Math.min(at, out.length - 1)] ^= e.byte || 1;
    } else if (e.kind === 'cut') out = out.slice(0, at);
    else if (e.kind === 'insert') out = new Uint8Array([...out.subarray(0, at), ...new Uint8Array(e.len).fill(e.byte), ...out.subarray(at)]);
    else out = new Uint8Array([...out.subarray(0, at), ...out.subarray(at, at + e.len), ...out.subarray(at)]);
  }
  return out;
}

function outcome(bytes: Uint8Array, name: string): void {
  try {
    const r = readGrid(bytes, name, { ...DEFAULT_READ_OPTIONS, maxCells: 1_000_000, field: null });
    expect(r.grid.values.length).toBe(r.grid.nx * r.grid.ny);
    expect(r.grid.nx >= 1 && r.grid.ny >= 1).toBe(true);
    expect(r.grid.cellSize.every((h) => h > 0 && h < Infinity)).toBe(true);
  } catch (e) {
    if (!(e instanceof RhoformError)) throw new Error(`${name}: not a RhoformError: ${(e as Error)?.stack ?? String(e)}`);
    expect(e.code).toMatch(/^E_[A-Z0-9_]+$/);
    expect(e.message).not.toMatch(/[\n\r]/);
    expect(e.message.length).toBeLessThan(2000);
  }
}

describe('new readers under damaged input', () => {
  for (const [format, seeds] of Object.entries(SEEDS)) {
    it(`${format}: damaged fixtures give a grid or a RhoformError`, () => {
      fc.assert(
        fc.property(fc.integer({ min: 0, max: seeds.length - 1 }), fc.array(edit, { minLength: 1, maxLength: 4 }), (k, edits) => {
          outcome(apply(seeds[k], edits), `fuzz.${format}`);
        }),
        { numRuns: 150, seed: 13 },
      );
    });
  }
  it('random bytes behind each magic give a RhoformError', () => {
    const magics = [
      new TextEncoder().encode('MATLAB 5.0 MAT-file'),
      new TextEncoder().encode('# vtk DataFile Version 3.0\n'),
      new TextEncoder().encode('<?xml version="1.0"?><VTKFile type="ImageData">'),
      new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    ];
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 3 }), fc.uint8Array({ maxLength: 400 }), (m, tail) => {
        outcome(new Uint8Array([...magics[m], ...tail]), 'random');
      }),
      { numRuns: 300, seed: 7 },
    );
  });
});
