/**
 * The part as a closed triangle mesh extruded along z from 0 to the thickness (mm), for STL/3MF (DESIGN §14);
 * faces by earcut 3.2.4 (ISC) with its Lawson flips. Mesh rules: docs/notes/geom.md. mm, y up, z up.
 */
import earcut, { refine } from 'earcut';
import { bulgeCentre, bulgeAngle, bulgeRadius } from './bulge.js';
import { circleRing, circumscribedRing } from './circle.js';
import { cleanRing, MIN_SEGMENT_MM } from './clean-ring.js';
import type { PolygonSet, Point, Ring } from '../types.js';
import type { RingBulges } from './bulge.js';
import type { RingCircle } from './circle.js';
import { RhoformError } from '../errors.js';
import { hypot } from './portable-math.js';

export interface SolidInput {
  readonly polygons: PolygonSet;
  readonly ringCircles?: readonly RingCircle[];
  readonly arcs?: RingBulges;
  /** mm, > 0. */
  readonly thickness: number;
  /** mm; circles and arcs are polygonised within a quarter of it. */
  readonly tolerance: number;
}

/** Vertices (x, y, z, mm) and triangles (three vertex indices each). */
export interface Mesh {
  readonly vertices: Float64Array;
  readonly triangles: Uint32Array;
}

/** Points of an arc (ends excluded), inscribed within `tol` mm. */
function arcPoints(ax: number, ay: number, bx: number, by: number, b: number, tol: number, out: Point[]): void {
  const c = hypot(bx - ax, by - ay);
  const r = bulgeRadius(c, b);
  const theta = bulgeAngle(b);
  const steps = Math.max(1, Math.ceil(theta / (2 * Math.acos(Math.max(-1, 1 - tol / r)))));
  if (steps <= 1) return;
  const [cx, cy] = bulgeCentre(ax, ay, bx, by, b);
  const a0 = Math.atan2(ay - cy, ax - cx);
  const dir = b > 0 ? 1 : -1;
  for (let k = 1; k < steps; k++) {
    const a = a0 + (dir * theta * k) / steps;
    out.push([cx + r * Math.cos(a), cy + r * Math.sin(a)]);
  }
}

function dropCollinear(xy: Float64Array): Float64Array {
  let cur = xy;
  for (let pass = 0; pass < 4; pass++) {
    const n = cur.length >> 1;
    if (n <= 3) break;
    const out = new Float64Array(cur.length);
    let m = 0;
    for (let i = 0; i < n; i++) {
      const ax = m > 0 ? out[2 * m - 2] : cur[2 * ((i + n - 1) % n)];
      const ay = m > 0 ? out[2 * m - 1] : cur[2 * ((i + n - 1) % n) + 1];
      const x = cur[2 * i], y = cur[2 * i + 1];
      const j = (i + 1) % n;
      const qx = cur[2 * j], qy = cur[2 * j + 1];
      const cross = (x - ax) * (qy - ay) - (y - ay) * (qx - ax);
      const len2 = Math.max((qx - ax) ** 2 + (qy - ay) ** 2, 1e-300);
      if (Math.abs(cross) > 1e-9 * len2) {
        out[2 * m] = x;
        out[2 * m + 1] = y;
        m++;
      }
    }
    if (m === n || m < 3) break;
    cur = out.slice(0, 2 * m);
  }
  return cur;
}

function solidRing(ring: Ring, k: number, circle: RingCircle | undefined, bulges: readonly number[] | null | undefined, tol: number, minSeg: number): Float64Array | null {
  let pts: Ring = ring;
  if (circle) {
    const c = { cx: circle.x, cy: circle.y, r: circle.r };
    const poly = k === 0 ? circleRing(c, tol) : circumscribedRing(c, tol);
    pts = k === 0 ? poly : [...poly].reverse();
  } else if (bulges) {
    const out: Point[] = [];
    for (let i = 0; i < ring.length; i++) {
      const a = ring[i];
      const b = ring[(i + 1) % ring.length];
      out.push(a);
      if (bulges[i]) arcPoints(a[0], a[1], b[0], b[1], bulges[i], tol, out);
    }
    pts = out;
  }
  const c = cleanRing(pts, 1, 6, minSeg);
  if (!c) return null;
  const xy = dropCollinear(c.xy);
  return xy.length >= 6 ? xy : null;
}

/** Throws RhoformError E_INTERNAL for a thickness that is not > 0. */
export function extrude(input: SolidInput): Mesh {
  const t = input.thickness;
  if (!(t > 0 && Number.isFinite(t))) throw new RhoformError('E_INTERNAL', `expected a thickness > 0 mm, found ${String(t)}`);
  const tol = input.tolerance > 0 ? input.tolerance / 4 : 0.01;
  let maxAbs = 1;
  for (const p of input.polygons.polygons) for (const [x, y] of p.outer) maxAbs = Math.max(maxAbs, Math.abs(x), Math.abs(y));
  // float32 keeps 24 bits: an edge must span several of its steps to stay an edge
  const minSeg = Math.max(MIN_SEGMENT_MM, 16 * 2 ** (Math.floor(Math.log2(maxAbs)) - 23));
  const circles = new Map((input.ringCircles ?? []).map((c) => [`${c.polygon}:${c.ring}`, c]));
  const verts: number[] = [];
  const tris: number[] = [];
  input.polygons.polygons.forEach((p, i) => {
    const rings: Float64Array[] = [];
    [p.outer, ...p.holes].forEach((ring, k) => {
      const r = solidRing(ring, k, circles.get(`${i}:${k}`), input.arcs?.[i]?.[k], tol, minSeg);
      if (r) rings.push(r);
      else if (k === 0) rings.length = 0;
    });
    if (rings.length === 0 || ringSign(rings[0]) <= 0) return;
    const flat: number[] = [];
    const holes: number[] = [];
    for (const [k, r] of rings.entries()) {
      if (k > 0) holes.push(flat.length / 2);
      for (const v of r) flat.push(v);
    }
    const faces = earcut(flat, holes);
    refine(faces, flat);
    const n = flat.length / 2;
    const base = verts.length / 3;
    for (let v = 0; v < n; v++) verts.push(flat[2 * v], flat[2 * v + 1], 0);
    for (let v = 0; v < n; v++) verts.push(flat[2 * v], flat[2 * v + 1], t);
    for (let f = 0; f < faces.length; f += 3) {
      let [a, b, c] = [faces[f], faces[f + 1], faces[f + 2]];
      const cross = (flat[2 * b] - flat[2 * a]) * (flat[2 * c + 1] - flat[2 * a + 1]) - (flat[2 * b + 1] - flat[2 * a + 1]) * (flat[2 * c] - flat[2 * a]);
      if (cross === 0) continue;
      if (cross < 0) [b, c] = [c, b];
      tris.push(base + n + a, base + n + b, base + n + c); // top, counter-clockwise from +z
      tris.push(base + a, base + c, base + b); // bottom, reversed
    }
    let start = 0;
    for (const r of rings) {
      const m = r.length / 2;
      for (let v = 0; v < m; v++) {
        const a = base + start + v;
        const b = base + start + ((v + 1) % m);
        tris.push(a, b, b + n, a, b + n, a + n);
      }
      start += m;
    }
  });
  return { vertices: Float64Array.from(verts), triangles: Uint32Array.from(tris) };
}

function ringSign(xy: Float64Array): number {
  let s = 0;
  const n = xy.length >> 1;
  for (let i = 0; i < n; i++) {
    const j = (i + 1) % n;
    s += xy[2 * i] * xy[2 * j + 1] - xy[2 * j] * xy[2 * i + 1];
  }
  return s;
}
