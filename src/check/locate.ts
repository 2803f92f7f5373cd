/**
 * From a point in the report frame (mm, y up) to the grid sample under it, and from there to the 1-based row
 * and column of the input file (through the reader's own `locate`, so row order, nodal grids and long-form CSV
 * are handled in one place).
 */
import type { DensityGrid } from '../types.js';
import type { LocateInFile } from './run.js';

/** Cell grids: the cell containing the point; nodal grids: the nearest node. Points outside are clamped. */
export function sampleAt(grid: Pick<DensityGrid, 'nx' | 'ny' | 'cellSize' | 'origin' | 'placement'>, x: number, y: number): { i: number; j: number } {
  const [hx, hy] = grid.cellSize;
  const u = (x - grid.origin[0]) / hx;
  const v = (y - grid.origin[1]) / hy;
  const pick = grid.placement === 'nodes' ? Math.round : Math.floor;
  const clamp = (k: number, n: number) => (Number.isFinite(k) ? Math.min(n - 1, Math.max(0, k)) : 0);
  return { i: clamp(pick(u), grid.nx), j: clamp(pick(v), grid.ny) };
}

export function locator(
  grid: Pick<DensityGrid, 'nx' | 'ny' | 'cellSize' | 'origin' | 'placement'>,
  fileLocate: (i: number, j: number) => { fileRow: number; fileCol: number },
): LocateInFile {
  return (x, y) => {
    const { i, j } = sampleAt(grid, x, y);
    const p = fileLocate(i, j);
    return { fileRow: p.fileRow, fileCol: p.fileCol };
  };
}
