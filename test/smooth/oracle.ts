/**
 * Independent brute-force checks for the smoothing tests (O(n²), small inputs only): validity of a polygon set
 * and the sampled directed distance from one set of rings to another. Nothing here uses the library.
 */
import type { PolygonSet, Ring } from '../../src/types.js';

const segs = (ring: Ring): number[][] => ring.map((p, i) => [p[0], p[1], ring[(i + 1) % ring.length][0], ring[(i + 1) % ring.length][1]]);

function pointSegDist(px: number, py: number, s: number[]): number {
  const vx = s[2] - s[0], vy = s[3] - s[1];
  const L2 = vx * vx + vy * vy;
  const t = L2 === 0 ? 0 : Math.max(0, Math.min(1, ((px - s[0]) * vx + (py - s[1]) * vy) / L2));
  return Math.hypot(px - s[0] - t * vx, py - s[1] - t * vy);
}

function cross(p: number[], q: number[]): boolean {
  const o = (ax: number, ay: number, bx: number, by: number, cx: number, cy: number) => Math.sign((bx - ax) * (cy - ay) - (by - ay) * (cx - ax));
  const on = (ax: number, ay: number, bx: number, by: number, cx: number, cy: number) =>
    Math.min(ax, bx) <= cx && cx <= Math.max(ax, bx) && Math.min(ay, by) <= cy && cy <= Math.max(ay, by);
  const d1 = o(q[0], q[1], q[2], q[3], p[0], p[1]), d2 = o(q[0], q[1], q[2], q[3], p[2], p[3]);
  const d3 = o(p[0], p[1], p[2], p[3], q[0], q[1]), d4 = o(p[0], p[1], p[2], p[3], q[2], q[3]);
  if (d1 * d2 < 0 && d3 * d4 < 0) return true;
  return (d1 === 0 && on(q[0], q[1], q[2], q[3], p[0], p[1])) || (d2 === 0 && on(q[0], q[1], q[2], q[3], p[2], p[3])) ||
    (d3 === 0 && on(p[0], p[1], p[2], p[3], q[0], q[1])) || (d4 === 0 && on(p[0], p[1], p[2], p[3], q[2], q[3]));
}

function area(ring: Ring): number {
  let a = 0;
  for (let i = 0; i < ring.length; i++) {
    const p = ring[i], q = ring[(i + 1) % ring.length];
    a += p[0] * q[1] - q[0] * p[1];
  }
  return a / 2;
}

/** Even-odd point in ring (ray casting). */
function inside(x: number, y: number, ring: Ring): boolean {
  let c = false;
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
    const [xi, yi] = ring[i], [xj, yj] = ring[j];
    if (yi > y !== yj > y && x < ((xj - xi) * (y - yi)) / (yj - yi) + xi) c = !c;
  }
  return c;
}

/** Problems found by brute force: touching/crossing segments, bad orientation, holes outside their outer. */
export function bruteProblems(set: PolygonSet): string[] {
  const out: string[] = [];
  const all: { ring: number; i: number; n: number; s: number[] }[] = [];
  let ringId = 0;
  for (const [p, poly] of set.polygons.entries()) {
    if (poly.outer.length < 3 || !(area(poly.outer) > 0)) out.push(`polygon ${p}: outer not CCW`);
    for (const [h, hole] of poly.holes.entries()) {
      if (hole.length < 3 || !(area(hole) < 0)) out.push(`polygon ${p} hole ${h}: not CW`);
      if (!hole.every(([x, y]) => inside(x, y, poly.outer))) out.push(`polygon ${p} hole ${h}: outside its outer`);
    }
    for (const ring of [poly.outer, ...poly.holes]) {
      segs(ring).forEach((s, i) => all.push({ ring: ringId, i, n: ring.length, s }));
      ringId++;
    }
  }
  for (let a = 0; a < all.length; a++) {
    for (let b = a + 1; b < all.length; b++) {
      const A = all[a], B = all[b];
      if (A.ring === B.ring && ((A.i + 1) % A.n === B.i || (B.i + 1) % B.n === A.i)) continue;
      if (cross(A.s, B.s)) out.push(`segments ${A.ring}:${A.i} and ${B.ring}:${B.i} touch`);
    }
  }
  return out;
}

/** Largest distance from points of `from` (sampled every `step` mm along each segment) to any ring of `to`. */
export function bruteDeviation(from: PolygonSet, to: PolygonSet, step: number): number {
  const target = to.polygons.flatMap((p) => [p.outer, ...p.holes]).flatMap(segs);
  let worst = 0;
  for (const ring of from.polygons.flatMap((p) => [p.outer, ...p.holes])) {
    for (const s of segs(ring)) {
      const m = Math.max(1, Math.ceil(Math.hypot(s[2] - s[0], s[3] - s[1]) / step));
      for (let k = 0; k <= m; k++) {
        const x = s[0] + ((s[2] - s[0]) * k) / m, y = s[1] + ((s[3] - s[1]) * k) / m;
        let best = Infinity;
        for (const t of target) best = Math.min(best, pointSegDist(x, y, t));
        worst = Math.max(worst, best);
      }
    }
  }
  return worst;
}

/** Material area (outer minus holes), shoelace. */
export function setArea(set: PolygonSet): number {
  return set.polygons.reduce((a, p) => a + area(p.outer) + p.holes.reduce((b, h) => b + area(h), 0), 0);
}
