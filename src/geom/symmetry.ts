/** Exact mirror symmetry about the `--mirror` planes (docs/symmetry.md; method and exactness: docs/notes/geom.md). */
import { RhoformError } from '../errors.js';
import type { Domain, Point, PolygonSet, Ring } from '../types.js';
import { booleanOp, quantumFor, ringsOf, unionRings } from './clipper.js';

/** The line `axis` = `at` (mm, input grid frame); `keep`: the side the input lies on. */
export interface MirrorPlane {
  readonly axis: 'x' | 'y';
  readonly at: number;
  readonly keep: 'below' | 'above';
}


/**
 * The outline of an unfolded grid made exactly symmetric: the input's side kept, its mirror images replace the
 * rest, by exact booleans (src/geom/clipper.ts). `domain`: of the UNFOLDED grid. Input unchanged.
 */
export function symmetrize(
  set: PolygonSet,
  planes: readonly MirrorPlane[],
  domain: Domain,
): PolygonSet {
  if (planes.length === 0) return set;
  const { px, py } = planesByAxis(planes);
  if (!domain.every(Number.isFinite) || !(domain[2] >= domain[0] && domain[3] >= domain[1])) {
    throw new RhoformError('E_INTERNAL', `symmetrize: expected a domain [minX, minY, maxX, maxY], found [${domain.join(', ')}]`);
  }
  const sx = px?.at ?? 0;
  const sy = py?.at ?? 0;
  const shifted: Ring[] = ringsOf(set).map((r) => r.map((p): Point => [p[0] - sx, p[1] - sy]));
  if (shifted.length === 0) return { polygons: [] };

  // 1. one quantum for every step
  const d: Domain = [domain[0] - sx, domain[1] - sy, domain[2] - sx, domain[3] - sy];
  let extent = Math.max(...d.map(Math.abs));
  for (const r of shifted) for (const p of r) extent = Math.max(extent, Math.abs(p[0]), Math.abs(p[1]));
  const q = quantumFor(2 * extent);
  const B = Math.ceil((2 * extent) / q) * q;
  const opts = { quantum: q };

  // 2. the input's side of every plane, in one cut
  const range = (p: MirrorPlane | null): [number, number] => (p === null ? [-B, B] : p.keep === 'above' ? [0, B] : [-B, 0]);
  const [x0, x1] = range(px);
  const [y0, y1] = range(py);
  const side: Ring = [[x0, y0], [x1, y0], [x1, y1], [x0, y1]];
  let cur = booleanOp('intersection', shifted, [side], opts);

  // 3. reflect and unite, plane by plane
  for (const p of [px, py]) {
    if (p === null || cur.polygons.length === 0) continue;
    const rings = ringsOf(cur);
    const image = rings.map((r) => {
      const out: Point[] = new Array(r.length);
      for (let k = 0, n = r.length; k < n; k++) {
        const v = r[n - 1 - k];
        out[k] = p.axis === 'x' ? [-v[0], v[1]] : [v[0], -v[1]];
      }
      return out;
    });
    cur = unionRings([...rings, ...image], opts);
  }

  // 4. back, with domain-edge coordinates exact
  const snapX = edgeSnap(d[0], d[2], px, q, domain[0], domain[2], sx);
  const snapY = edgeSnap(d[1], d[3], py, q, domain[1], domain[3], sy);
  const back = (r: Ring): Point[] => r.map((v): Point => [snapX(v[0]), snapY(v[1])]);
  return { polygons: cur.polygons.map((poly) => ({ outer: back(poly.outer), holes: poly.holes.map(back) })) };
}

/**
 * `symmetrize`'s area (mm²) without the booleans, by Sutherland–Hodgman clipping (I. E. Sutherland, G. W.
 * Hodgman, "Reentrant polygon clipping", CACM 17(1):32–42, 1974, doi:10.1145/360767.360802), for the volume search.
 */
export function symmetricArea(set: PolygonSet, planes: readonly MirrorPlane[]): number {
  const { px, py } = planesByAxis(planes);
  const sx = px?.at ?? 0;
  const sy = py?.at ?? 0;
  let total = 0;
  let bufA = new Float64Array(0);
  let bufB = new Float64Array(0);
  for (const ring of ringsOf(set)) {
    const n = ring.length;
    if (n < 3) continue;
    if (bufA.length < 8 * n) {
      bufA = new Float64Array(8 * n);
      bufB = new Float64Array(8 * n);
    }
    for (let k = 0; k < n; k++) {
      bufA[2 * k] = ring[k][0] - sx;
      bufA[2 * k + 1] = ring[k][1] - sy;
    }
    let m = n;
    for (const p of planes) {
      const c = p.axis === 'x' ? 0 : 1;
      const sign = p.keep === 'above' ? 1 : -1;
      let out = 0;
      for (let k = 0; k < m; k++) {
        const a = 2 * k;
        const b = 2 * ((k + 1) % m);
        const va = sign * bufA[a + c];
        const vb = sign * bufA[b + c];
        if (va >= 0) {
          bufB[2 * out] = bufA[a];
          bufB[2 * out + 1] = bufA[a + 1];
          out++;
        }
        if (va >= 0 !== vb >= 0) {
          const t = va / (va - vb);
          bufB[2 * out] = c === 0 ? 0 : bufA[a] + t * (bufA[b] - bufA[a]);
          bufB[2 * out + 1] = c === 1 ? 0 : bufA[a + 1] + t * (bufA[b + 1] - bufA[a + 1]);
          out++;
        }
      }
      [bufA, bufB] = [bufB, bufA];
      m = out;
    }
    let s = 0;
    for (let k = 0; k < m; k++) {
      const a = 2 * k;
      const b = 2 * ((k + 1) % m);
      s += bufA[a] * bufA[b + 1] - bufA[b] * bufA[a + 1];
    }
    total += s / 2;
  }
  return total * 2 ** planes.length;
}

function planesByAxis(planes: readonly MirrorPlane[]): { px: MirrorPlane | null; py: MirrorPlane | null } {
  let px: MirrorPlane | null = null;
  let py: MirrorPlane | null = null;
  for (const p of planes) {
    if (!Number.isFinite(p.at)) throw new RhoformError('E_INTERNAL', `symmetrize: expected a finite plane position, found ${p.at}`);
    if (p.axis === 'x' ? px !== null : py !== null) {
      throw new RhoformError('E_INTERNAL', `symmetrize: expected at most one plane per axis, found two on ${p.axis}`);
    }
    if (p.axis === 'x') px = p;
    else py = p;
  }
  return { px, py };
}

/** Shifted u = X·q back to the set's frame, the domain edges' integers to the exact domain values. */
function edgeSnap(
  lo: number,
  hi: number,
  plane: MirrorPlane | null,
  q: number,
  exactLo: number,
  exactHi: number,
  shift: number,
): (u: number) => number {
  let kLo = Math.round(lo / q);
  let kHi = Math.round(hi / q);
  if (plane !== null) {
    if (plane.keep === 'above') kLo = -kHi;
    else kHi = -kLo;
  }
  return (u) => {
    const k = Math.round(u / q);
    return k === kLo ? exactLo : k === kHi ? exactHi : u + shift;
  };
}
