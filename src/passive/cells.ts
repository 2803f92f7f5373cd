/** Passive regions on the grid, their first step: samples inside a solid primitive set to 1, inside a void to 0; void wins (docs/notes/passive.md). */
import { offsetRings } from '../geom/clipper.js';
import type { DensityGrid } from '../types.js';
import type { PassiveRegions, PassiveShape } from './types.js';

const SOLID = 1;
const VOID = 2;

interface SampleLattice {
  readonly nx: number;
  readonly ny: number;
  readonly ox: number;
  readonly oy: number;
  readonly hx: number;
  readonly hy: number;
  /** ½ for cell centres, 0 for corners. */
  readonly s: number;
}

/** Sample index range [lo, hi] inside [a, b], clamped, one wider than the float estimate. */
function span(a: number, b: number, o: number, h: number, s: number, n: number): [number, number] {
  const lo = Math.max(0, Math.ceil((a - o) / h - s) - 1);
  const hi = Math.min(n - 1, Math.floor((b - o) / h - s) + 1);
  return [lo, hi];
}

/** mark(k) for every sample inside `shape` (closed), over its bounding box only. */
function forEachInside(shape: PassiveShape, f: SampleLattice, mark: (k: number) => void): void {
  const { nx, ny, ox, oy, hx, hy, s } = f;
  const X = (i: number): number => ox + (i + s) * hx;
  const Y = (j: number): number => oy + (j + s) * hy;
  if (shape.kind === 'circle') {
    const { cx, cy, r } = shape;
    const r2 = r * r;
    const [j0, j1] = span(cy - r, cy + r, oy, hy, s, ny);
    const [i0, i1] = span(cx - r, cx + r, ox, hx, s, nx);
    for (let j = j0; j <= j1; j++) {
      const dy = Y(j) - cy;
      const dy2 = dy * dy;
      if (dy2 > r2) continue;
      for (let i = i0; i <= i1; i++) {
        const dx = X(i) - cx;
        if (dx * dx + dy2 <= r2) mark(j * nx + i);
      }
    }
    return;
  }
  if (shape.kind === 'rect') {
    const [j0, j1] = span(shape.y0, shape.y1, oy, hy, s, ny);
    const [i0, i1] = span(shape.x0, shape.x1, ox, hx, s, nx);
    for (let j = j0; j <= j1; j++) {
      const y = Y(j);
      if (y < shape.y0 || y > shape.y1) continue;
      for (let i = i0; i <= i1; i++) {
        const x = X(i);
        if (x >= shape.x0 && x <= shape.x1) mark(j * nx + i);
      }
    }
    return;
  }
  // polygon: even–odd scanline, both half-open rules on vertex rows so the set is closed (docs/notes/passive.md)
  const pts = shape.points;
  const n = pts.length;
  const xs = new Float64Array(n);
  const ys = new Float64Array(n);
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
  const vertexYs = new Set<number>();
  for (let k = 0; k < n; k++) {
    xs[k] = pts[k][0];
    ys[k] = pts[k][1];
    if (xs[k] < minX) minX = xs[k];
    if (xs[k] > maxX) maxX = xs[k];
    if (ys[k] < minY) minY = ys[k];
    if (ys[k] > maxY) maxY = ys[k];
    vertexYs.add(ys[k]);
  }
  const [j0, j1] = span(minY, maxY, oy, hy, s, ny);
  const [i0, i1] = span(minX, maxX, ox, hx, s, nx);
  const cross = new Float64Array(n);
  const fill = (y: number, upper: boolean, row: number): void => {
    let m = 0;
    for (let a = 0, b = n - 1; a < n; b = a++) {
      const ya = ys[a];
      const yb = ys[b];
      const hit = upper ? ya >= y !== yb >= y : ya > y !== yb > y;
      if (hit) cross[m++] = xs[a] + ((y - ya) * (xs[b] - xs[a])) / (yb - ya);
    }
    const c = cross.subarray(0, m).sort();
    for (let p = 0; p + 1 < m; p += 2) {
      const a = c[p];
      const b = c[p + 1];
      const lo = Math.max(i0, Math.ceil((a - ox) / hx - s) - 1);
      const hi = Math.min(i1, Math.floor((b - ox) / hx - s) + 1);
      for (let i = lo; i <= hi; i++) {
        const x = X(i);
        if (x >= a && x <= b) mark(row + i);
      }
    }
  };
  for (let j = j0; j <= j1; j++) {
    const y = Y(j);
    if (y < minY || y > maxY) continue;
    fill(y, false, j * nx);
    if (vertexYs.has(y)) fill(y, true, j * nx);
  }
}

/** The primitive shrunk by `inset` mm (a polygon's inward offset may have several pieces); empty when nothing is left. */
export function insetShape(shape: PassiveShape, inset: number): PassiveShape[] {
  if (!(inset > 0)) return [shape];
  if (shape.kind === 'circle') return shape.r > inset ? [{ ...shape, r: shape.r - inset }] : [];
  if (shape.kind === 'rect') {
    const s = { kind: 'rect' as const, x0: shape.x0 + inset, y0: shape.y0 + inset, x1: shape.x1 - inset, y1: shape.y1 - inset };
    return s.x0 < s.x1 && s.y0 < s.y1 ? [s] : [];
  }
  const inner = offsetRings([shape.points], -inset, { join: 'miter', arcTolerance: inset / 8 });
  return inner.polygons.map((p) => ({ kind: 'polygon' as const, points: p.outer }));
}

/**
 * A new grid with the passive regions applied, and the counts of samples set solid and lying in a void. Only
 * samples at least `inset` mm inside are set (the pipeline's choice: docs/notes/passive.md).
 */
export function applyPassiveToGrid(
  grid: DensityGrid,
  regions: PassiveRegions,
  opts: { inset?: number } = {},
): { grid: DensityGrid; solidSamples: number; voidSamples: number } {
  const inset = opts.inset ?? 0;
  const values = new Float64Array(grid.values);
  if (regions.regions.length === 0) return { grid: { ...grid, values }, solidSamples: 0, voidSamples: 0 };
  const [hx, hy] = grid.cellSize;
  const f: SampleLattice = { nx: grid.nx, ny: grid.ny, ox: grid.origin[0], oy: grid.origin[1], hx, hy, s: grid.placement === 'nodes' ? 0 : 0.5 };
  const role = new Uint8Array(values.length);
  for (const r of regions.regions) if (r.role === 'solid') for (const sh of insetShape(r.shape, inset)) forEachInside(sh, f, (k) => (role[k] = SOLID));
  // void wins: a sample anywhere in a void primitive is never set solid
  const BLOCKED = 3;
  if (inset > 0) for (const r of regions.regions) if (r.role === 'void') forEachInside(r.shape, f, (k) => (role[k] = role[k] === SOLID ? BLOCKED : role[k]));
  for (const r of regions.regions) if (r.role === 'void') for (const sh of insetShape(r.shape, inset)) forEachInside(sh, f, (k) => (role[k] = VOID));
  let solidSamples = 0;
  let voidSamples = 0;
  for (let k = 0; k < role.length; k++) {
    if (role[k] === SOLID) {
      values[k] = 1;
      solidSamples++;
    } else if (role[k] === VOID) {
      values[k] = 0;
      voidSamples++;
    }
  }
  return { grid: { ...grid, values }, solidSamples, voidSamples };
}
