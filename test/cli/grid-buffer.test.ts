/**
 * The CLI's grid buffer (cli/files.ts readGridFile): the file's bytes as read, in a buffer of the process's own
 * with room after them for NPY f4 data to be widened to f8 in place by the build.
 */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { readGridFile } from '../../cli/files.js';

const grid = (name: string): string => fileURLToPath(new URL(`../../fixtures/grids/${name}`, import.meta.url));

describe('readGridFile', () => {
  it('leaves room for 8 bytes a sample after the header of an f4 file, and none for f8', () => {
    // clean-cantilever-240x80.npy: numpy 2.4 float32 (80, 240), data at byte 128 (fixtures/make)
    const f4 = readGridFile(grid('clean-cantilever-240x80.npy'), 'c.npy', 50_000_000);
    expect(Uint8Array.from(f4.bytes)).toEqual(new Uint8Array(readFileSync(grid('clean-cantilever-240x80.npy'))));
    expect(f4.bytes.length).toBe(128 + 4 * 80 * 240);
    expect(f4.room).toBe(4 * 80 * 240);
    expect(f4.bytes.buffer.byteLength).toBeGreaterThanOrEqual(f4.bytes.length + f4.room);
    expect(f4.bytes.byteOffset).toBe(0);
    // demo-bracket.npy: numpy float64 (60, 120): flipped in its own bytes, no room needed
    const f8 = readGridFile(grid('demo-bracket.npy'), 'd.npy', 50_000_000);
    expect(f8.room).toBe(0);
    expect(Uint8Array.from(f8.bytes)).toEqual(new Uint8Array(readFileSync(grid('demo-bracket.npy'))));
  });
});
