/**
 * The boundary as a flat list of directed segments in raster units (frame.ts): every ring segment of every
 * polygon, domain-edge segments included. Outer rings CCW and holes CW put the solid on the LEFT of every segment.
 */
import type { PolygonSet, Ring } from '../types.js';
import type { Frame } from './frame.js';
import { float64, int32 } from '../parallel/lanes.js';
import { rasterLanes } from './split.js';

/** Directed boundary segments; the solid lies on their left. */
export interface SegmentSet {
  readonly n: number;
  /** Stride 5: ax, ay, dx, dy, 1/|d|² (pixel units); the segment runs from a to a + d. */
  readonly geo: Float64Array;
  /** Stride 2: unit normal pointing into the solid (left of the direction). */
  readonly normal: Float64Array;
  /** Previous / next segment of the same ring (cyclic). */
  readonly prev: Int32Array;
  readonly next: Int32Array;
}

/** Flattens the polygon rings into raster-unit segments, dropping zero-length edges. Inputs are not modified. */
export function segmentsOf(polygons: PolygonSet, frame: Frame): SegmentSet {
  const rings: Ring[] = [];
  let total = 0;
  for (const poly of polygons.polygons) {
    for (const ring of [poly.outer, ...poly.holes]) {
      if (ring.length >= 2) {
        rings.push(ring);
        total += ring.length;
      }
    }
  }
  // shared memory when the raster passes will be split, so that the other lanes read these without a copy
  const shared = rasterLanes(frame.nx * frame.ny) > 1;
  const geo = float64(5 * total, shared);
  const normal = float64(2 * total, shared);
  const prev = int32(total, shared);
  const next = int32(total, shared);
  const sx = 1 / frame.pixel;
  let n = 0;
  for (const ring of rings) {
    const first = n;
    const m = ring.length;
    for (let k = 0; k < m; k++) {
      const p = ring[k];
      const q = ring[(k + 1) % m];
      const ax = (p[0] - frame.x0) * sx - 0.5;
      const ay = (p[1] - frame.y0) * sx - 0.5;
      const dx = (q[0] - frame.x0) * sx - 0.5 - ax;
      const dy = (q[1] - frame.y0) * sx - 0.5 - ay;
      const l2 = dx * dx + dy * dy;
      if (!(l2 > 1e-24)) continue;
      const l = Math.sqrt(l2);
      geo[5 * n] = ax;
      geo[5 * n + 1] = ay;
      geo[5 * n + 2] = dx;
      geo[5 * n + 3] = dy;
      geo[5 * n + 4] = 1 / l2;
      normal[2 * n] = -dy / l;
      normal[2 * n + 1] = dx / l;
      n++;
    }
    const count = n - first;
    for (let k = 0; k < count; k++) {
      prev[first + k] = first + ((k + count - 1) % count);
      next[first + k] = first + ((k + 1) % count);
    }
  }
  return { n, geo, normal, prev, next };
}

/** Squared distance (pixel units²) from (px, py) to segment s. */
export function segDist2(geo: Float64Array, s: number, px: number, py: number): number {
  const o = 5 * s;
  const ax = geo[o], ay = geo[o + 1], dx = geo[o + 2], dy = geo[o + 3];
  let t = ((px - ax) * dx + (py - ay) * dy) * geo[o + 4];
  t = t < 0 ? 0 : t > 1 ? 1 : t;
  const ex = px - ax - t * dx;
  const ey = py - ay - t * dy;
  return ex * ex + ey * ey;
}

/**
 * Which side of the boundary (px, py) is on, judged by segment s assumed nearest: > 0 solid, < 0 void.
 * A foot inside the segment uses its normal; a foot at an end vertex uses the vertex pseudo-normal (the sum of
 * the two adjacent unit normals; J.A. Bærentzen & H. Aanæs, "Signed distance computation using the angle
 * weighted pseudonormal", IEEE TVCG 11(3):243–253, 2005, DOI 10.1109/TVCG.2005.49 — DOI from memory).
 */
export function sideOf(set: SegmentSet, s: number, px: number, py: number): number {
  const { geo, normal } = set;
  const o = 5 * s;
  const t = ((px - geo[o]) * geo[o + 2] + (py - geo[o + 1]) * geo[o + 3]) * geo[o + 4];
  if (t <= 0) {
    const r = set.prev[s];
    return (px - geo[o]) * (normal[2 * s] + normal[2 * r]) + (py - geo[o + 1]) * (normal[2 * s + 1] + normal[2 * r + 1]);
  }
  if (t >= 1) {
    const r = set.next[s];
    return (px - geo[o] - geo[o + 2]) * (normal[2 * s] + normal[2 * r]) +
      (py - geo[o + 1] - geo[o + 3]) * (normal[2 * s + 1] + normal[2 * r + 1]);
  }
  return (px - geo[o]) * normal[2 * s] + (py - geo[o + 1]) * normal[2 * s + 1];
}
