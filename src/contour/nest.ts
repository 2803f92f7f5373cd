/**
 * Holes → owners from the lattice rows instead of point-in-polygon tests, O(crossings) (why it is right:
 * docs/notes/outline.md §4). Rings whose signed area disagrees with their class (zero-area rings from values
 * exactly at the level) are dropped.
 */
import type { Point, Ring } from '../types.js';
import { ringContains } from '../geom/contains.js';
import type { FlatPolygonSet } from './flat.js';
import type { Crossings } from './march.js';
import type { StitchedRings } from './stitch.js';

export function nest(cr: Crossings, sr: StitchedRings): FlatPolygonSet {
  const n = sr.count;
  const bestI = new Int32Array(n).fill(0x7fffffff);
  const isHole = new Uint8Array(n);
  const link = new Int32Array(n).fill(-1);
  const { hKey, hStart, hEnd } = cr;
  const { ringOf } = sr;
  for (let j = 0; j < hStart.length; j++) {
    let prev = -1;
    for (let c = hStart[j]; c < hEnd[j]; c++) {
      const r = ringOf[c];
      const i = hKey[c] >> 1;
      if (i < bestI[r]) {
        bestI[r] = i;
        isHole[r] = hKey[c] & 1;
        link[r] = prev;
      }
      prev = r;
    }
  }
  // links strictly decrease the smallest column: no cycles
  const owner = new Int32Array(n).fill(-1);
  const path: number[] = [];
  for (let r = 0; r < n; r++) {
    if (!isHole[r] || owner[r] !== -1) continue;
    let q = r;
    while (q >= 0 && isHole[q] && owner[q] === -1) {
      path.push(q);
      q = link[q];
    }
    const o = q < 0 ? -1 : isHole[q] ? owner[q] : q;
    for (const p of path) owner[p] = o;
    path.length = 0;
  }
  const keep = (r: number) => (isHole[r] ? sr.area[r] < 0 : sr.area[r] > 0);
  const slot = new Int32Array(n).fill(-1);
  const outers: number[] = [];
  const holes: number[][] = [];
  for (let r = 0; r < n; r++) {
    if (isHole[r] || !keep(r)) continue;
    slot[r] = outers.length;
    outers.push(r);
    holes.push([]);
  }
  const points: (Ring | undefined)[] = [];
  const ring = (r: number): Ring => (points[r] ??= ringPoints(sr, r));
  for (let r = 0; r < n; r++) {
    if (!isHole[r] || !keep(r)) continue;
    const o = owner[r];
    if (o >= 0 && slot[o] >= 0) holes[slot[o]].push(r);
    else adopt(r, ring, outers, holes);
  }
  return gather(sr, outers, holes);
}

function gather(sr: StitchedRings, outers: readonly number[], holes: readonly number[][]): FlatPolygonSet {
  let rings = outers.length;
  let vertices = 0;
  for (let k = 0; k < outers.length; k++) {
    vertices += sr.start[outers[k] + 1] - sr.start[outers[k]];
    rings += holes[k].length;
    for (const h of holes[k]) vertices += sr.start[h + 1] - sr.start[h];
  }
  const xy = new Float64Array(2 * vertices);
  const start = new Int32Array(rings + 1);
  const hole = new Uint8Array(rings);
  const owner = new Int32Array(rings);
  let q = 0;
  let o = 0;
  const put = (r: number) => {
    start[q++] = o;
    const a = sr.start[r];
    const b = sr.start[r + 1];
    xy.set(sr.xy.subarray(2 * a, 2 * b), 2 * o);
    o += b - a;
  };
  for (let k = 0; k < outers.length; k++) {
    const outer = q;
    owner[q] = -1;
    put(outers[k]);
    for (const h of holes[k]) {
      hole[q] = 1;
      owner[q] = outer;
      put(h);
    }
  }
  start[q] = o;
  return { xy, start, hole, owner };
}

function ringPoints(sr: StitchedRings, r: number): Ring {
  const pts: Point[] = [];
  for (let i = sr.start[r]; i < sr.start[r + 1]; i++) pts.push([sr.xy[2 * i], sr.xy[2 * i + 1]]);
  return pts;
}

/**
 * Fallback for a hole whose owner was dropped as degenerate (only possible with values exactly at the level):
 * the smallest outer ring that contains one of its vertices, by direct test.
 */
function adopt(h: number, ring: (r: number) => Ring, outers: readonly number[], holes: number[][]): void {
  const hole = ring(h);
  let best = -1;
  let bestArea = Infinity;
  for (let k = 0; k < outers.length; k++) {
    const outer = ring(outers[k]);
    for (const p of hole) {
      const inside = ringContains(outer, p);
      if (inside === 0) continue;
      if (inside === 1) {
        const a = areaOf(outer);
        if (a < bestArea) {
          bestArea = a;
          best = k;
        }
      }
      break;
    }
  }
  if (best >= 0) holes[best].push(h);
}

function areaOf(ring: Ring): number {
  let s = 0;
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) s += ring[j][0] * ring[i][1] - ring[i][0] * ring[j][1];
  return 0.5 * s;
}
