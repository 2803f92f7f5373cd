/** `thicken` (→ `min-member-size`): discs of radius L/2 + δ along the thin medial axis (docs/notes/repair.md). mm, y up. */
import { bufferPolylines, ringsOf } from '../geom/clipper.js';
import type { Morphology } from '../morph/types.js';
import type { Point, PolygonSet } from '../types.js';
import { boxesOf, clearOfVoids } from './away.js';
import { addMaterial, arcToleranceOf, marginOf, quantumOf } from './common.js';
import type { RepairInput, StepResult } from './types.js';
import { cellKey } from './cell-key.js';

/** `morph` is the morphology of `set`. */
export function thicken(set: PolygonSet, input: RepairInput, morph: Morphology): StepResult {
  const L = input.limits.minMember;
  if (L === null) return { polygons: set, area: 0, locations: [], changed: { polygons: [] }, skipped: 'no member limit (--min-member or --process)' };
  // the check's "too close to call" band is thickened too
  const below = L + 0.5 * morph.pixel;
  const pts = morph.medial('solid', below);
  if (pts.count === 0) return { polygons: set, area: 0, locations: [], changed: { polygons: [] }, skipped: null };
  const rho = L / 2 + marginOf(input, L / 2);
  const [x0, y0, x1, y1] = input.domain;
  const fit = (v: number, lo: number, hi: number): number => (hi - lo >= 2 * rho ? Math.min(hi - rho, Math.max(lo + rho, v)) : 0.5 * (lo + hi));
  // capsules between neighbours keep the band smooth at any spacing; fewer centres keep the union fast
  const cell = Math.max(input.pixel / 2, rho / 4);
  const keep = thinOut(pts.x, pts.y, pts.count, cell, x0, y0);
  const boxes = boxesOf(input.passiveVoid);
  const centres = keep.map((k): Point => {
    const c = clearOfVoids([pts.x[k], pts.y[k]], rho, input.passiveVoid, boxes);
    return [fit(c[0], x0, x1), fit(c[1], y0, y1)];
  });
  const runs = chain(centres, cell, x0, y0);
  // near the domain edge or a passive void: a capsule from the sample to its moved centre
  keep.forEach((k, m) => {
    if (centres[m][0] !== pts.x[k] || centres[m][1] !== pts.y[k]) runs.push([[pts.x[k], pts.y[k]], centres[m]]);
  });
  const quantum = quantumOf(input.domain, rho);
  const discs = bufferPolylines(runs, rho, { arcTolerance: arcToleranceOf(input, L / 2), quantum });
  const added = addMaterial(set, ringsOf(discs), input, quantum);
  const locations = morph.width('solid', below).places.map((p) => ({ x: p.x, y: p.y, measured: p.width }));
  return { polygons: added.polygons, area: added.area, locations, changed: added.changed, skipped: null };
}

/** Runs joining each centre to those in the 8 neighbouring squares of side `cell` mm (anchored at (ox, oy)): capsules without scallops. */
function chain(centres: readonly Point[], cell: number, ox: number, oy: number): Point[][] {
  const at = new Map<number, number>();
  const key = cellKey;
  const ij = centres.map((c) => [Math.floor((c[0] - ox) / cell), Math.floor((c[1] - oy) / cell)] as const);
  ij.forEach(([i, j], k) => at.set(key(i, j), k));
  const runs: Point[][] = [];
  const lonely = new Uint8Array(centres.length).fill(1);
  ij.forEach(([i, j], k) => {
    for (const [di, dj] of [[1, 0], [0, 1], [1, 1], [-1, 1]] as const) {
      const n = at.get(key(i + di, j + dj));
      if (n === undefined) continue;
      runs.push([centres[k], centres[n]]);
      lonely[k] = 0;
      lonely[n] = 0;
    }
  });
  for (let k = 0; k < centres.length; k++) if (lonely[k]) runs.push([centres[k]]);
  return runs;
}

/** Indices kept at one per square of side `cell` mm (anchored at (ox, oy)), the first in input order. O(n). */
export function thinOut(x: Float64Array, y: Float64Array, n: number, cell: number, ox: number, oy: number): number[] {
  const seen = new Set<number>();
  const keep: number[] = [];
  for (let k = 0; k < n; k++) {
    const i = Math.floor((x[k] - ox) / cell), j = Math.floor((y[k] - oy) / cell);
    const key = cellKey(i, j);
    if (seen.has(key)) continue;
    seen.add(key);
    keep.push(k);
  }
  return keep;
}
