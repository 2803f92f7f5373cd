/** Exact area fraction of material in each cell, by Green's theorem per column (docs/notes/fe.md). mm, y up. */
import type { PolygonSet, Ring } from '../types.js';

export interface CoverageGrid {
  readonly nx: number;
  readonly ny: number;
  /** Cell size, mm. */
  readonly hx: number;
  readonly hy: number;
  /** Lower-left corner of cell (0, 0), mm (default 0, 0). */
  readonly x0?: number;
  readonly y0?: number;
}

/** Fractions in [0, 1], values[j·nx + i]. */
export function coverage(set: PolygonSet, grid: CoverageGrid): Float64Array {
  const { nx, ny, hx, hy } = grid;
  if (!(nx >= 1 && ny >= 1 && Number.isInteger(nx) && Number.isInteger(ny))) throw new RangeError(`grid size must be positive integers, found ${nx} × ${ny}`);
  if (!(hx > 0 && hy > 0)) throw new RangeError(`cell size must be > 0 mm, found ${hx} × ${hy}`);
  const X0 = grid.x0 ?? 0;
  const Y0 = grid.y0 ?? 0;
  const part = new Float64Array(nx * ny); // partial trapezoids, index j·nx + i
  const full = new Float64Array(nx * ny); // "add to every row ≤ j of column i"

  // one straight piece inside column i (x in cell units, y in mm)
  const addPiece = (i: number, xa: number, ya: number, xb: number, yb: number): void => {
    const dx = (xb - xa) * hx;
    if (dx === 0) return;
    const ra = ya / hy;
    const rb = yb / hy;
    const lo = Math.min(ra, rb);
    const hi = Math.max(ra, rb);
    const cuts: number[] = [0];
    for (let k = Math.max(0, Math.floor(lo) + 1); k <= Math.min(ny, Math.ceil(hi) - 1); k++) cuts.push((k - ra) / (rb - ra));
    cuts.push(1);
    if (ra > rb) cuts.sort((p, q) => p - q);
    for (let c = 0; c + 1 < cuts.length; c++) {
      const t0 = cuts[c];
      const t1 = cuts[c + 1];
      if (!(t1 > t0)) continue;
      const w = -dx * (t1 - t0);
      const ym = (ra + (rb - ra) * (t0 + t1) * 0.5) * hy; // mean height of the sub-piece, mm above Y0
      if (ym <= 0) continue;
      if (ym >= ny * hy) {
        full[(ny - 1) * nx + i] += w * hy;
        continue;
      }
      const j = Math.min(ny - 1, Math.floor(ym / hy));
      part[j * nx + i] += w * (ym - j * hy);
      if (j > 0) full[(j - 1) * nx + i] += w * hy;
    }
  };

  const addEdge = (px: number, py: number, qx: number, qy: number): void => {
    const ax = (px - X0) / hx;
    const bx = (qx - X0) / hx;
    if (ax === bx) return;
    const ay = py - Y0;
    const by = qy - Y0;
    const lo = Math.max(0, Math.min(ax, bx));
    const hi = Math.min(nx, Math.max(ax, bx));
    if (!(hi > lo)) return;
    const yAt = (x: number): number => ay + ((by - ay) * (x - ax)) / (bx - ax);
    const forward = bx > ax;
    for (let i = Math.floor(lo); i < Math.ceil(hi) && i < nx; i++) {
      const s0 = Math.max(lo, i);
      const s1 = Math.min(hi, i + 1);
      if (!(s1 > s0)) continue;
      if (forward) addPiece(i, s0, yAt(s0), s1, yAt(s1));
      else addPiece(i, s1, yAt(s1), s0, yAt(s0));
    }
  };

  const addRing = (ring: Ring): void => {
    const n = ring.length;
    for (let k = 0; k < n; k++) {
      const p = ring[k];
      const q = ring[(k + 1) % n];
      addEdge(p[0], p[1], q[0], q[1]);
    }
  };

  for (const poly of set.polygons) {
    addRing(poly.outer);
    for (const h of poly.holes) addRing(h);
  }

  const out = new Float64Array(nx * ny);
  const cellArea = hx * hy;
  for (let i = 0; i < nx; i++) {
    let run = 0;
    for (let j = ny - 1; j >= 0; j--) {
      run += full[j * nx + i];
      const a = (part[j * nx + i] + run) / cellArea;
      out[j * nx + i] = a < 0 ? 0 : a > 1 ? 1 : a;
    }
  }
  return out;
}
