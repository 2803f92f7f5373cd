/**
 * `thicken` (→ `min-member-size`, docs/repair.md): members thinner than the member limit L are thickened to L
 * along their medial axis.
 *
 * Frame: millimetres, y up, origin at the lower-left corner of the grid.
 *
 * Method: the counted medial samples of the solid (θ-simplified medial axis, θ ≥ 120°, exactly those the check
 * counts — Foskey, Lin & Manocha, "Efficient computation of a simplified medial axis", Proc. 8th ACM Symposium on
 * Solid Modeling and Applications, 2003, DOI 10.1145/781606.781623) whose local width is below L + pixel/2 (the check's "too close to call" band included), thinned to one
 * per square of side max(pixel/2, ρ/4), each carry a disc of radius ρ = L/2 + δ (δ: common.ts marginOf); the discs of neighbouring
 * samples are joined by capsules (a smooth band, no scallops). The union is added to the solid. A disc whose
 * centre lies closer than ρ to the domain edge is moved inward until it fits (it still contains the sample's own
 * inscribed disc, whose radius is at most the distance to the edge), and the capsule from the sample to the moved
 * centre is added too: clipped to the domain it is 2ρ wide right up to the edge, so a wall along the domain edge
 * thickens inward rather than being clipped to half, and a wedge tip on the edge is covered. A disc that would
 * reach into a passive-void region is moved away from it the same way (away.ts), so a member beside a bolt hole
 * grows on its other side. A 90° corner of a thick part has θ = 90°
 * and is not counted, so it is left alone. Only adds material: no member is ever deleted.
 */
import { bufferPolylines, ringsOf } from '../geom/clipper.js';
import type { Morphology } from '../morph/types.js';
import type { Point, PolygonSet } from '../types.js';
import { boxesOf, clearOfVoids } from './away.js';
import { addMaterial, arcToleranceOf, marginOf, quantumOf } from './common.js';
import type { RepairInput, StepResult } from './types.js';
import { cellKey } from './cell-key.js';

/** Thickens the thin members of `set`; `morph` is the morphology of `set` (buildMorphology with input.pixel). */
export function thicken(set: PolygonSet, input: RepairInput, morph: Morphology): StepResult {
  const L = input.limits.minMember;
  if (L === null) return { polygons: set, area: 0, locations: [], changed: { polygons: [] }, skipped: 'no member limit (--min-member or --process)' };
  // the check warns within its resolution (pixel/2) of the limit: members in that band are thickened too
  const below = L + 0.5 * morph.pixel;
  const pts = morph.medial('solid', below);
  if (pts.count === 0) return { polygons: set, area: 0, locations: [], changed: { polygons: [] }, skipped: null };
  const rho = L / 2 + marginOf(input, L / 2);
  const [x0, y0, x1, y1] = input.domain;
  const fit = (v: number, lo: number, hi: number): number => (hi - lo >= 2 * rho ? Math.min(hi - rho, Math.max(lo + rho, v)) : 0.5 * (lo + hi));
  // one centre per square of side s = max(pixel/2, ρ/4): the capsules between neighbours make the band smooth
  // whatever the spacing, and fewer, less overlapping capsules keep the union fast
  const cell = Math.max(input.pixel / 2, rho / 4);
  const keep = thinOut(pts.x, pts.y, pts.count, cell, x0, y0);
  const boxes = boxesOf(input.passiveVoid);
  const centres = keep.map((k): Point => {
    const c = clearOfVoids([pts.x[k], pts.y[k]], rho, input.passiveVoid, boxes);
    return [fit(c[0], x0, x1), fit(c[1], y0, y1)];
  });
  const runs = chain(centres, cell, x0, y0);
  // near the domain edge: the capsule from the sample to its moved centre covers the sample's own disc (a wedge
  // tip on the edge) and, clipped to the domain, is 2ρ wide up to the edge; near a passive void likewise (the
  // part of the capsule in the void is not added)
  keep.forEach((k, m) => {
    if (centres[m][0] !== pts.x[k] || centres[m][1] !== pts.y[k]) runs.push([[pts.x[k], pts.y[k]], centres[m]]);
  });
  const quantum = quantumOf(input.domain, rho);
  const discs = bufferPolylines(runs, rho, { arcTolerance: arcToleranceOf(input, L / 2), quantum });
  const added = addMaterial(set, ringsOf(discs), input, quantum);
  const locations = morph.width('solid', below).places.map((p) => ({ x: p.x, y: p.y, measured: p.width }));
  return { polygons: added.polygons, area: added.area, locations, changed: added.changed, skipped: null };
}

/**
 * Short runs between neighbouring centres: each centre joined to the centres in the 8 neighbouring squares of
 * side `cell` (mm, squares anchored at (ox, oy), at most one centre per square); a centre with no neighbour is a
 * run of one point. Buffered by ρ these capsules make the union of the discs along a medial axis without the
 * scallops a row of separate discs would leave between them (each capsule lies within cell·√2 of its two
 * discs, both centred on thin medial samples).
 */
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

/**
 * Indices of the points kept when at most one is kept per square of side `cell` (mm; squares anchored at
 * (ox, oy)): the first in input order. O(n) with a hash of square keys.
 */
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
