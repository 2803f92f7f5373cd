/**
 * Mean density over the domain: the optimizer's own volume fraction.
 * Cell grids: the plain mean of the samples. Nodal grids: the mean of the bilinear field over the domain,
 * i.e. trapezoidal weights (1/4 at corners, 1/2 on edges, 1 inside). Non-finite samples count as 0.
 */
import type { DensityGrid, Domain } from '../types.js';

export function fieldMean(grid: DensityGrid): number {
  const { nx, ny, values } = grid;
  if (grid.placement === 'cells' || nx < 2 || ny < 2) {
    let s = 0;
    for (let k = 0; k < values.length; k++) {
      const v = values[k];
      if (Number.isFinite(v)) s += v;
    }
    return s / values.length;
  }
  let s = 0;
  for (let j = 0; j < ny; j++) {
    const wy = j === 0 || j === ny - 1 ? 0.5 : 1;
    for (let i = 0; i < nx; i++) {
      const v = values[j * nx + i];
      if (!Number.isFinite(v)) continue;
      const wx = i === 0 || i === nx - 1 ? 0.5 : 1;
      s += wx * wy * v;
    }
  }
  return s / ((nx - 1) * (ny - 1));
}

/** Domain rectangle [minX, minY, maxX, maxY] in mm for the grid's sample placement. */
export function gridDomain(grid: DensityGrid): Domain {
  const [hx, hy] = grid.cellSize;
  const [ox, oy] = grid.origin;
  const cx = grid.placement === 'nodes' ? grid.nx - 1 : grid.nx;
  const cy = grid.placement === 'nodes' ? grid.ny - 1 : grid.ny;
  return [ox, oy, ox + cx * hx, oy + cy * hy];
}
