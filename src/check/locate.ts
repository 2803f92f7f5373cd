/** From a point (mm, y up) to the grid sample under it and to the input file's 1-based row and column. */
import type { DensityGrid } from '../types.js';
import type { LocateInFile } from './run.js';

/** Cell grids: the cell containing the point; nodal grids: the nearest node. Clamped. */
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
