/**
 * Symmetry unfolding (`--mirror left|right|bottom|top`, docs/symmetry.md): the mirror image of the grid is
 * added beyond the named edge, so a half or quarter model becomes the whole part. Frame: mm, y up; the input
 * keeps its frame and the image lies beyond the edge (`left`/`bottom` make the origin negative). Cell grids
 * reflect whole cells (2·nx columns); nodal grids share the plane's samples (2·nx − 1). Details:
 * docs/notes/outline.md §5.
 */
import { UsageError } from '../errors.js';
import type { SamplePosition } from '../read/types.js';
import type { MirrorEdge } from '../settings.js';
import type { MirrorPlane } from '../geom/symmetry.js';
import type { DensityGrid } from '../types.js';

export type { MirrorPlane } from '../geom/symmetry.js';

type Sides = { x: 'left' | 'right' | null; y: 'bottom' | 'top' | null };

/** The edges per axis; refuses a repeated edge or both edges of one axis. */
function sidesOf(edges: readonly MirrorEdge[]): Sides {
  const s: Sides = { x: null, y: null };
  for (const e of edges) {
    if (e === 'left' || e === 'right') {
      if (s.x !== null) throw new UsageError(`--mirror: expected at most one of left/right, found ${s.x} and ${e}`);
      s.x = e;
    } else if (e === 'bottom' || e === 'top') {
      if (s.y !== null) throw new UsageError(`--mirror: expected at most one of bottom/top, found ${s.y} and ${e}`);
      s.y = e;
    } else {
      throw new UsageError(`--mirror: expected left, right, bottom or top, found ${String(e)}`);
    }
  }
  return s;
}

/** Number of cells (not samples) across `n` samples for the placement. */
const cellsAcross = (n: number, placement: DensityGrid['placement']): number => (placement === 'nodes' ? n - 1 : n);

/** Along one axis: the unfolded sample count and the source index of unfolded index k. */
function axisMap(n: number, side: 'low' | 'high' | null, shared: boolean): { n: number; src: (k: number) => number } {
  if (side === null) return { n, src: (k) => k };
  const s = shared ? 1 : 0;
  const m = 2 * n - s;
  if (side === 'low') {
    // image first (k ↦ n − 1 − k), then the input
    return { n: m, src: (k) => (k < n - s ? n - 1 - k : k - (n - s)) };
  }
  // input first, then the image (k ↦ 2n − 1 − s − k)
  return { n: m, src: (k) => (k < n ? k : 2 * n - 1 - s - k) };
}

function maps(grid: Pick<DensityGrid, 'nx' | 'ny' | 'placement'>, edges: readonly MirrorEdge[]) {
  const s = sidesOf(edges);
  const shared = grid.placement === 'nodes';
  const mx = axisMap(grid.nx, s.x === null ? null : s.x === 'left' ? 'low' : 'high', shared);
  const my = axisMap(grid.ny, s.y === null ? null : s.y === 'bottom' ? 'low' : 'high', shared);
  return { s, mx, my };
}

/**
 * The grid unfolded across the named edges: a new grid, exactly symmetric about each plane; the origin moves by
 * −W (left) or −H (bottom), mm. At most one edge per axis, so their order does not matter. O(output samples).
 */
export function unfoldGrid(grid: DensityGrid, edges: readonly MirrorEdge[]): DensityGrid {
  const { s, mx, my } = maps(grid, edges);
  const { nx, values } = grid;
  const [hx, hy] = grid.cellSize;
  const nx2 = mx.n;
  const ny2 = my.n;
  const out = new Float64Array(nx2 * ny2);
  const colSrc = new Int32Array(nx2);
  for (let i = 0; i < nx2; i++) colSrc[i] = mx.src(i);
  for (let j = 0; j < ny2; j++) {
    const from = my.src(j) * nx;
    const to = j * nx2;
    for (let i = 0; i < nx2; i++) out[to + i] = values[from + colSrc[i]];
  }
  const ox = s.x === 'left' ? grid.origin[0] - cellsAcross(grid.nx, grid.placement) * hx : grid.origin[0];
  const oy = s.y === 'bottom' ? grid.origin[1] - cellsAcross(grid.ny, grid.placement) * hy : grid.origin[1];
  return { nx: nx2, ny: ny2, cellSize: [hx, hy], origin: [ox, oy], values: out, placement: grid.placement };
}

/**
 * Maps a sample of the unfolded grid (0-based i, j from the lower left) to the file position of the input
 * sample it copies, through the reader's `locate`. `grid` is the input grid, before unfolding.
 */
export function unfoldLocate(
  locate: (i: number, j: number) => SamplePosition,
  grid: Pick<DensityGrid, 'nx' | 'ny' | 'placement'>,
  edges: readonly MirrorEdge[],
): (i: number, j: number) => SamplePosition {
  const { mx, my } = maps(grid, edges);
  return (i, j) => locate(mx.src(i), my.src(j));
}

/** The symmetry planes of an unfolding in the input's frame (mm, y up), in the order of `edges`. */
export function mirrorPlanes(grid: Pick<DensityGrid, 'nx' | 'ny' | 'placement' | 'cellSize' | 'origin'>, edges: readonly MirrorEdge[]): MirrorPlane[] {
  sidesOf(edges);
  const [hx, hy] = grid.cellSize;
  const [ox, oy] = grid.origin;
  const w = cellsAcross(grid.nx, grid.placement) * hx;
  const h = cellsAcross(grid.ny, grid.placement) * hy;
  return edges.map((e): MirrorPlane => {
    switch (e) {
      case 'left':
        return { axis: 'x', at: ox, keep: 'above' };
      case 'right':
        return { axis: 'x', at: ox + w, keep: 'below' };
      case 'bottom':
        return { axis: 'y', at: oy, keep: 'above' };
      default:
        return { axis: 'y', at: oy + h, keep: 'below' };
    }
  });
}
