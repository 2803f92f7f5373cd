/** A point strictly inside a polygon with holes, for placing a finding. mm, y up; even–odd rule. */
import type { Point, Ring } from '../types.js';
import { ringArea } from './area.js';
import { ringContains } from './contains.js';

/** The centroid when strictly inside, else the middle of the widest inside interval on a few scanlines; O(n). */
export function interiorPoint(outer: Ring, holes: readonly Ring[] = []): Point {
  const n = outer.length;
  if (n === 0) return [NaN, NaN];
  const c = centroid(outer, holes);
  if (c !== null && strictlyInside(outer, holes, c)) return c;
  let minY = Infinity, maxY = -Infinity;
  for (const p of outer) {
    if (p[1] < minY) minY = p[1];
    if (p[1] > maxY) maxY = p[1];
  }
  const h = maxY - minY;
  const ys = [minY + 0.5 * h, minY + 0.25 * h, minY + 0.75 * h];
  if (c !== null) ys.unshift(c[1]);
  let best: Point = outer[0];
  let bestWidth = 0;
  const xs: number[] = [];
  for (const y of ys) {
    xs.length = 0;
    crossings(outer, y, xs);
    for (const r of holes) crossings(r, y, xs);
    xs.sort((a, b) => a - b);
    for (let k = 0; k + 1 < xs.length; k += 2) {
      const w = xs[k + 1] - xs[k];
      if (w > bestWidth) {
        bestWidth = w;
        best = [(xs[k] + xs[k + 1]) / 2, y];
      }
    }
  }
  return best;
}

/** Area centroid (mm) of outer minus holes; null when the area is 0 or not finite. */
function centroid(outer: Ring, holes: readonly Ring[]): Point | null {
  const [x0, y0] = outer[0];
  let a = 0, sx = 0, sy = 0;
  const add = (ring: Ring, sign: number): void => {
    const n = ring.length;
    const s = Math.sign(ringArea(ring)) * sign;
    if (s === 0) return;
    for (let i = 0; i < n; i++) {
      const px = ring[i][0] - x0, py = ring[i][1] - y0;
      const q = ring[(i + 1) % n];
      const qx = q[0] - x0, qy = q[1] - y0;
      const cr = (px * qy - qx * py) * s;
      a += cr;
      sx += (px + qx) * cr;
      sy += (py + qy) * cr;
    }
  };
  add(outer, 1);
  for (const r of holes) add(r, -1);
  if (!(a > 0) || !Number.isFinite(sx + sy)) return null;
  return [x0 + sx / (3 * a), y0 + sy / (3 * a)];
}

function strictlyInside(outer: Ring, holes: readonly Ring[], p: Point): boolean {
  if (ringContains(outer, p) !== 1) return false;
  for (const r of holes) if (ringContains(r, p) !== -1) return false;
  return true;
}

/** Half-open on y, as ringContains. */
function crossings(ring: Ring, y: number, out: number[]): void {
  const n = ring.length;
  for (let i = 0, j = n - 1; i < n; j = i++) {
    const [xi, yi] = ring[i];
    const [xj, yj] = ring[j];
    if (yi > y !== yj > y) out.push(xi + ((xj - xi) * (y - yi)) / (yj - yi));
  }
}
