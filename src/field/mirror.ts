/**
 * Symmetry unfolding (`--mirror left|right|bottom|top`, docs/symmetry.md): a named grid edge is a symmetry
 * plane and the mirror image of the grid is added beyond it, so that a half (one edge) or quarter model (one
 * vertical and one horizontal edge) becomes the whole part before thresholding and contouring.
 *
 * Frame: mm, y up. The input grid keeps its frame; the image lies beyond the edge. `left` adds the image at
 * x < origin.x (an input with origin 0 then spans −W…W, symmetric about x = 0), `right` beyond x = origin.x + W,
 * `bottom` at y < origin.y, `top` beyond origin.y + H. The unfolded grid's origin may therefore be negative.
 *
 * Sample placement:
 * - 'cells' (values at cell centres, nx×ny samples, domain nx·hx wide): the image reflects whole cells, so
 *   the unfolded grid has 2·nx columns (2·ny rows); the plane is a cell boundary.
 * - 'nodes' (values on cell corners, nx×ny samples spanning (nx − 1)×(ny − 1) cells; nx counts samples, as
 *   everywhere in this code base): the plane is a column (row) of samples, shared and not duplicated, so the
 *   unfolded grid has 2·nx − 1 samples across.
 * Either way the unfolded field is exactly symmetric sample by sample, and its mean (cell grids: the plain
 * mean; nodal grids: the bilinear field's mean) equals the input's.
 */
import { UsageError } from '../errors.js';
import type { SamplePosition } from '../read/types.js';
import type { MirrorEdge } from '../settings.js';
import type { MirrorPlane } from '../geom/symmetry.js';
import type { DensityGrid } from '../types.js';

export type { MirrorPlane } from '../geom/symmetry.js';

type Sides = { x: 'left' | 'right' | null; y: 'bottom' | 'top' | null };

/** The edges per axis; refuses a repeated edge or both edges of one axis (they would not describe a plane). */
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

/**
 * Along one axis: the unfolded sample count and the source index of an unfolded index k.
 * `low` = the image is added before index 0 (left/bottom), otherwise after the last index (right/top).
 * `shared` = nodal placement, the plane's samples are shared.
 */
function axisMap(n: number, side: 'low' | 'high' | null, shared: boolean): { n: number; src: (k: number) => number } {
  if (side === null) return { n, src: (k) => k };
  const s = shared ? 1 : 0;
  const m = 2 * n - s;
  if (side === 'low') {
    // unfolded 0 … n − 1 − s is the image (k ↦ n − 1 − k, reaching index s at the last image sample),
    // unfolded n − s … 2n − 1 − s is the input (k ↦ k − (n − s)).
    return { n: m, src: (k) => (k < n - s ? n - 1 - k : k - (n - s)) };
  }
  // unfolded 0 … n − 1 is the input, n … 2n − 1 − s the image (k ↦ 2n − 1 − s − k).
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
 * The grid unfolded across the named edges: a new grid (the input is not modified) whose every sample is a
 * copy of one input sample, exactly symmetric about each plane (see the module comment for frame and sample
 * placement). Edges apply in the order given; since at most one edge per axis is allowed, the order does not
 * change the result (a quarter model unfolds to the same grid from left+bottom as from bottom+left).
 * The origin moves by −W (left) or −H (bottom), W and H the input domain's width and height in mm; the cell
 * size is unchanged. No edges: a copy of the input. Cost O(output samples), one pass.
 * Throws UsageError for a repeated edge or both edges of one axis.
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
 * Maps a sample of the unfolded grid (i from the left, j from the bottom, 0-based, in unfoldGrid's order) to
 * the file position of the input sample it is a copy of, through the reader's own `locate` (which knows row
 * order, nodal grids and long-form CSV). A finding in the mirrored half thus points at the file cell that
 * produced it. `grid` is the INPUT grid (before unfolding); `edges` as given to unfoldGrid.
 */
export function unfoldLocate(
  locate: (i: number, j: number) => SamplePosition,
  grid: Pick<DensityGrid, 'nx' | 'ny' | 'placement'>,
  edges: readonly MirrorEdge[],
): (i: number, j: number) => SamplePosition {
  const { mx, my } = maps(grid, edges);
  return (i, j) => locate(mx.src(i), my.src(j));
}

/**
 * The symmetry planes of an unfolding, in the input grid's frame (mm, y up): `left` → x = origin.x,
 * `right` → x = origin.x + W, `bottom` → y = origin.y, `top` → y = origin.y + H, where W = nx·hx (cells) or
 * (nx − 1)·hx (nodes) and likewise H; `keep` names the input's side. In the order of `edges`.
 */
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
