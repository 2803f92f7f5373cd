/**
 * Validity of a set of rings: no crossing or touching, at least three vertices, the orientation of its role
 * (outer CCW, hole CW), outers in no material, holes inside their own outer only. A uniform segment grid makes
 * it about O(n); nesting casts one winding-number ray per ring. mm, y up.
 */

import { type FlatRings, SegmentGrid } from '../geom/segments.js';
import { flatRingArea } from '../geom/area.js';
import { ringSegments } from './deviation.js';
import { bucketPairs, rayWinding, totalLength } from './validate-cells.js';
import type { SmoothScratch } from './scratch.js';

/** What each ring is: hole[r] ≠ 0 for holes; owner[r] = index of the outer ring of hole r (−1 for outers). */
export interface RingRoles {
  readonly hole: Uint8Array;
  readonly owner: Int32Array;
}

/** Per-segment and per-ring problem flags. Segment indices are global vertex indices (segment i starts at i). */
export interface Validation {
  /** segmentHit[i] = 1 when segment i touches or crosses another segment (adjacent ones excepted). */
  readonly segmentHit: Uint8Array;
  /** ringHit[r] = 1 when ring r is degenerate, has the wrong orientation or the wrong nesting. */
  readonly ringHit: Uint8Array;
  /** blamed[r] = 1 when ring r may cause another's nesting failure (its misplaced hole, or crossing its ray). */
  readonly blamed: Uint8Array;
  /** Number of flagged segments plus flagged rings; 0 means valid. */
  readonly problems: number;
}

/**
 * Adjacent segments may share their vertex but not fold back; every other pair of closed segments is disjoint.
 * `scratch`: where the segment arrays live (the result never refers to them).
 */
export function validateRings(rings: FlatRings, roles: RingRoles, scratch?: SmoothScratch): Validation {
  const { xy, start } = rings;
  const nRings = start.length - 1;
  const n = start[nRings];
  const seg = ringSegments(rings, scratch);
  const segmentHit = new Uint8Array(n);
  const ringHit = new Uint8Array(nRings);
  const blamed = new Uint8Array(nRings);
  let problems = 0;
  for (let r = 0; r < nRings; r++) {
    const a = start[r], b = start[r + 1];
    const area = flatRingArea(xy, a, b);
    if (b - a < 3 || !(roles.hole[r] ? area < 0 : area > 0)) {
      ringHit[r] = 1;
      problems++;
    }
  }
  if (n === 0) return { segmentHit, ringHit, blamed, problems };
  const len = totalLength(seg.x0, seg.y0, seg.x1, seg.y1, n);
  const grid = new SegmentGrid(seg.x0, seg.y0, seg.x1, seg.y1, Math.max(2 * (len / n), 1e-9));
  const { x0, y0, x1, y1, ring } = seg;
  const cells = grid.cols * grid.rows;
  for (let cell = 0; cell < cells; cell++) {
    const p0 = grid.cellStart[cell], p1 = grid.cellStart[cell + 1];
    if (p1 - p0 > 1) problems += bucketPairs(x0, y0, x1, y1, ring, start, grid.items, p0, p1, segmentHit);
  }
  // nesting: winding number of all other rings at the first vertex of each ring
  const winding = new Int32Array(2);
  for (let r = 0; r < nRings; r++) {
    if (start[r + 1] - start[r] < 1) continue;
    const px = xy[2 * start[r]], py = xy[2 * start[r] + 1];
    const own = roles.hole[r] ? roles.owner[r] : -1;
    rayWinding(grid, x0, y0, x1, y1, ring, r, own, px, py, winding);
    const total = winding[0], fromOwner = winding[1];
    const ok = roles.hole[r] ? total === 1 && fromOwner === 1 : total === 0;
    if (!ok) {
      if (!ringHit[r]) {
        ringHit[r] = 1;
        problems++;
      }
      if (own >= 0) blamed[own] = 1;
      blameRay(grid, seg, r, px, py, blamed);
    }
  }
  return { segmentHit, ringHit, blamed, problems };
}

/** Marks every ring (other than r) with a segment crossing the ray from (px, py) towards +x. */
function blameRay(
  grid: SegmentGrid,
  seg: { x0: Float64Array; y0: Float64Array; x1: Float64Array; y1: Float64Array; ring: Int32Array },
  r: number, px: number, py: number, blamed: Uint8Array,
): void {
  const row = grid.row(py);
  for (let c = grid.col(px); c < grid.cols; c++) {
    const cell = row * grid.cols + c;
    for (let p = grid.cellStart[cell]; p < grid.cellStart[cell + 1]; p++) {
      const s = grid.items[p];
      if (seg.ring[s] === r) continue;
      const { x0, y0, x1, y1 } = seg;
      if (!((y0[s] <= py && py < y1[s]) || (y1[s] <= py && py < y0[s]))) continue;
      const xc = x0[s] + ((py - y0[s]) * (x1[s] - x0[s])) / (y1[s] - y0[s]);
      if (xc > px) blamed[seg.ring[s]] = 1;
    }
  }
}
