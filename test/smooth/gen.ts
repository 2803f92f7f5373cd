/**
 * Test geometry of our own invention: circles as marching squares would trace them (one vertex per
 * lattice-edge crossing), plates with many round holes, random star-shaped blobs. mm, y up.
 */
import type { Point, PolygonSet, Ring } from '../../src/types.js';
import { rng } from '../support/random.js';

export { rng };

/**
 * Crossings of the circle (cx, cy, r) with the lattice lines x = k·h and y = k·h, in angular order
 * (counter-clockwise), optionally pushed radially by ±jitter·h (uniform) to imitate interpolation noise.
 */
export function latticeCircle(cx: number, cy: number, r: number, h: number, jitter = 0, seed = 1): Point[] {
  const pts: [number, number, number][] = [];
  for (let k = Math.ceil((cx - r) / h); k * h <= cx + r; k++) {
    const x = k * h, d = r * r - (x - cx) ** 2;
    if (d <= 0) continue;
    const s = Math.sqrt(d);
    pts.push([x, cy + s, 0], [x, cy - s, 0]);
  }
  for (let k = Math.ceil((cy - r) / h); k * h <= cy + r; k++) {
    const y = k * h, d = r * r - (y - cy) ** 2;
    if (d <= 0) continue;
    const s = Math.sqrt(d);
    pts.push([cx + s, y, 0], [cx - s, y, 0]);
  }
  for (const p of pts) p[2] = Math.atan2(p[1] - cy, p[0] - cx);
  pts.sort((a, b) => a[2] - b[2]);
  const rand = rng(seed);
  const out: Point[] = [];
  for (const [x, y, t] of pts) {
    const last = out[out.length - 1];
    if (last && Math.hypot(last[0] - x, last[1] - y) < 1e-9 * h) continue;
    const dr = jitter ? (rand() * 2 - 1) * jitter * h : 0;
    out.push([x + dr * Math.cos(t), y + dr * Math.sin(t)]);
  }
  if (out.length > 1 && Math.hypot(out[0][0] - out[out.length - 1][0], out[0][1] - out[out.length - 1][1]) < 1e-9 * h) out.pop();
  return out;
}

/** The domain rectangle as a CCW ring with one vertex every h along each edge (material filling the domain). */
export function denseRect(x0: number, y0: number, x1: number, y1: number, h: number): Point[] {
  const out: Point[] = [];
  const nx = Math.round((x1 - x0) / h), ny = Math.round((y1 - y0) / h);
  for (let i = 0; i < nx; i++) out.push([x0 + ((x1 - x0) * i) / nx, y0]);
  for (let j = 0; j < ny; j++) out.push([x1, y0 + ((y1 - y0) * j) / ny]);
  for (let i = nx; i > 0; i--) out.push([x0 + ((x1 - x0) * i) / nx, y1]);
  for (let j = ny; j > 0; j--) out.push([x0, y0 + ((y1 - y0) * j) / ny]);
  return out;
}

/** A W×H plate filling the domain with a cols×rows array of round holes of radius r (CW), cell size h. */
export function plateWithHoles(
  W: number, H: number, cols: number, rows: number, r: number, h: number, jitter = 0.05,
): PolygonSet {
  const holes: Ring[] = [];
  let seed = 7;
  for (let j = 0; j < rows; j++) {
    for (let i = 0; i < cols; i++) {
      const cx = (W * (i + 0.5)) / cols + 0.123 * h, cy = (H * (j + 0.5)) / rows + 0.071 * h;
      holes.push(latticeCircle(cx, cy, r, h, jitter, seed++).reverse());
    }
  }
  return { polygons: [{ outer: denseRect(0, 0, W, H, h), holes }] };
}

/** A random star-shaped blob around (cx, cy): radius R·(1 + Σ a_k cos(kθ + φ_k)), one vertex per ~h of arc. */
export function blob(cx: number, cy: number, R: number, h: number, seed: number): Point[] {
  const rand = rng(seed);
  const terms = [2, 3, 5, 7].map((k) => ({ k, a: (rand() * 0.15) / Math.sqrt(k), p: rand() * 2 * Math.PI }));
  const n = Math.max(8, Math.round((2 * Math.PI * R) / h));
  const out: Point[] = [];
  for (let i = 0; i < n; i++) {
    const t = (2 * Math.PI * i) / n;
    let rr = 1;
    for (const { k, a, p } of terms) rr += a * Math.cos(k * t + p);
    rr *= R * (1 + (rand() * 2 - 1) * 0.02);
    out.push([cx + rr * Math.cos(t), cy + rr * Math.sin(t)]);
  }
  return out;
}
