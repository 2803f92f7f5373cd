/**
 * `thicken` (→ `min-member-size`, docs/repair.md): members thinner than the member limit L are thickened to L
 * along their medial axis.
 *
 * Frame: millimetres, y up, origin at the lower-left corner of the grid.
 *
 * Method: the counted medial samples of the solid (θ-simplified medial axis, θ ≥ 120°, exactly those the check
 * counts — Foskey, Lin & Manocha, "Efficient computation of a simplified medial axis", Proc. 8th ACM Symposium on
 * Solid Modeling and Applications, 2003, DOI 10.1145/781606.781623) whose local width is below L, thinned to one
 * per half-pixel square, each carry a disc of radius ρ = L/2 + δ (δ: common.ts marginOf). The union of the discs
 * is added to the solid. A disc whose centre lies closer than ρ to the domain edge is moved inward until it fits
 * (it still contains the sample's own inscribed disc, whose radius is at most the distance to the edge), so a
 * wall along the domain edge thickens inward rather than being clipped. A 90° corner of a thick part has θ = 90°
 * and is not counted, so it is left alone. Only adds material: no member is ever deleted.
 */
import { bufferPolylines, ringsOf } from '../geom/clipper.js';
import type { Morphology } from '../morph/types.js';
import type { Point, PolygonSet } from '../types.js';
import { addMaterial, arcToleranceOf, marginOf, quantumOf } from './common.js';
import type { RepairInput, StepResult } from './types.js';

/** Thickens the thin members of `set`; `morph` is the morphology of `set` (buildMorphology with input.pixel). */
export function thicken(set: PolygonSet, input: RepairInput, morph: Morphology): StepResult {
  const L = input.limits.minMember;
  if (L === null) return { polygons: set, area: 0, locations: [], changed: { polygons: [] }, skipped: 'no member limit (--min-member or --process)' };
  const pts = morph.medial('solid', L);
  if (pts.count === 0) return { polygons: set, area: 0, locations: [], changed: { polygons: [] }, skipped: null };
  const rho = L / 2 + marginOf(input);
  const [x0, y0, x1, y1] = input.domain;
  const fit = (v: number, lo: number, hi: number): number => (hi - lo >= 2 * rho ? Math.min(hi - rho, Math.max(lo + rho, v)) : 0.5 * (lo + hi));
  const centres = thinOut(pts.x, pts.y, pts.count, input.pixel / 2, x0, y0).map((k) => [[fit(pts.x[k], x0, x1), fit(pts.y[k], y0, y1)] as Point]);
  const quantum = quantumOf(input.domain, rho);
  const discs = bufferPolylines(centres, rho, { arcTolerance: arcToleranceOf(input), quantum });
  const added = addMaterial(set, ringsOf(discs), input, quantum);
  const locations = morph.width('solid', L).places.map((p) => ({ x: p.x, y: p.y, measured: p.width }));
  return { polygons: added.polygons, area: added.area, locations, changed: added.changed, skipped: null };
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
    const key = i * 4_194_304 + j; // exact in a double for |i|, |j| < 2^22
    if (seen.has(key)) continue;
    seen.add(key);
    keep.push(k);
  }
  return keep;
}
