/** Supports and loads the geometry no longer reaches, and pieces no support holds (docs/checks/load-path.md; docs/notes/fe.md). */
import { ringContains } from '../geom/contains.js';
import { interiorPoint } from '../geom/interior.js';
import { polygonArea } from '../geom/area.js';
import { entryLabel, type ResolvedEntry } from '../loads/resolve.js';
import type { PolygonSet, Ring } from '../types.js';
import type { FeAnalysis } from './analyse.js';

export interface ReachFinding {
  readonly kind: 'support' | 'load' | 'piece';
  /** mm. */
  readonly x: number;
  readonly y: number;
  /** `supports[1] ("stop") sits in void`, `a piece of 120 mm² held by no support`. */
  readonly text: string;
}

function reachedNodes(a: FeAnalysis, solid: number): Uint8Array {
  const [ex, ey] = a.elements;
  const nxn = ex + 1;
  const out = new Uint8Array(nxn * (ey + 1));
  for (let j = 0; j < ey; j++) {
    for (let i = 0; i < ex; i++) {
      if (!(a.fraction[j * ex + i] >= solid)) continue;
      const n = j * nxn + i;
      out[n] = out[n + 1] = out[n + nxn] = out[n + nxn + 1] = 1;
    }
  }
  return out;
}

function segmentDistance2(px: number, py: number, ax: number, ay: number, bx: number, by: number): number {
  const dx = bx - ax;
  const dy = by - ay;
  const L = dx * dx + dy * dy;
  const t = L > 0 ? Math.min(1, Math.max(0, ((px - ax) * dx + (py - ay) * dy) / L)) : 0;
  const qx = ax + t * dx - px;
  const qy = ay + t * dy - py;
  return qx * qx + qy * qy;
}

function nearRing(ring: Ring, x: number, y: number, d2: number): boolean {
  for (let k = 0, m = ring.length; k < m; k++) {
    const a = ring[k];
    const b = ring[(k + 1) % m];
    if (segmentDistance2(x, y, a[0], a[1], b[0], b[1]) <= d2) return true;
  }
  return false;
}

/** `x0`, `y0`: the grid's lower-left corner, mm; `polygons` null for a density design. */
export function reachFindings(a: FeAnalysis, polygons: PolygonSet | null, x0: number, y0: number, solid = 0.5): ReachFinding[] {
  const [ex] = a.elements;
  const [hx, hy] = a.elementSize;
  const nxn = ex + 1;
  const reached = reachedNodes(a, solid);
  const at = (n: number): [number, number] => [x0 + (n % nxn) * hx, y0 + Math.floor(n / nxn) * hy];
  const out: ReachFinding[] = [];
  const entries: [ResolvedEntry, 'support' | 'load'][] = [
    ...a.loadCase.supports.map((e) => [e, 'support'] as [ResolvedEntry, 'support']),
    ...a.loadCase.loads.map((e) => [e, 'load'] as [ResolvedEntry, 'load']),
  ];
  for (const [e, kind] of entries) {
    if (e.nodeIds.some((n) => reached[n] === 1)) continue;
    let sx = 0;
    let sy = 0;
    for (const n of e.nodeIds) {
      const [x, y] = at(n);
      sx += x;
      sy += y;
    }
    const k = Math.max(1, e.nodeIds.length);
    out.push({ kind, x: sx / k, y: sy / k, text: `${entryLabel(e)} sits in void: none of its ${e.nodeIds.length} node${e.nodeIds.length === 1 ? '' : 's'} touches material` });
  }
  if (polygons === null) return out;
  const held: [number, number][] = [];
  for (const e of a.loadCase.supports) for (const n of e.nodeIds) if (reached[n]) held.push(at(n));
  const d2 = hx * hx + hy * hy;
  for (const p of polygons.polygons) {
    let minX = Infinity;
    let minY = Infinity;
    let maxX = -Infinity;
    let maxY = -Infinity;
    for (const q of p.outer) {
      minX = Math.min(minX, q[0]);
      minY = Math.min(minY, q[1]);
      maxX = Math.max(maxX, q[0]);
      maxY = Math.max(maxY, q[1]);
    }
    const r = Math.sqrt(d2);
    const holds = held.some(([x, y]) => {
      if (x < minX - r || x > maxX + r || y < minY - r || y > maxY + r) return false;
      const inOuter = ringContains(p.outer, [x, y]) >= 0;
      if (inOuter && !p.holes.some((h) => ringContains(h, [x, y]) > 0)) return true;
      return nearRing(p.outer, x, y, d2) || p.holes.some((h) => nearRing(h, x, y, d2));
    });
    if (holds) continue;
    const c = interiorPoint(p.outer, p.holes);
    out.push({ kind: 'piece', x: c[0], y: c[1], text: `a piece of ${Math.round(polygonArea(p))} mm² held by no support` });
  }
  return out;
}
