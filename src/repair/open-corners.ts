/**
 * `open-corners` (→ `min-inner-radius`, docs/repair.md): concave corners tighter than the tool radius R are
 * opened to R — the geometry becomes what a tool of radius R actually cuts.
 *
 * Frame: millimetres, y up, origin at the lower-left corner of the grid.
 *
 * Method: the void is opened by the disc of radius ρ = R + δ, i.e. the solid is closed by it (offset +ρ then −ρ
 * with round joins, common.ts `closing`; Serra 1982, textbook definition) in the plane — outside the domain is
 * open space the tool may come from — and the result is clipped to the domain rectangle. This adds the uncut
 * material in each tight corner (a fillet of radius ρ; in a 90° corner its area is (1 − π/4)ρ², analytic) and
 * fills slots narrower than 2ρ. δ (common.ts marginOf) makes the re-check's own radius come out at least R
 * despite the polygonised arcs. Runs only when the check's survey finds a corner (the same depth allowance
 * max(tolerance, 0.05 R) as the check), so an outline that passes is left exactly as it is.
 */
import type { Morphology } from '../morph/types.js';
import type { PolygonSet } from '../types.js';
import { ringsOf } from '../geom/clipper.js';
import { addMaterial, arcToleranceOf, closing, marginOf, quantumOf } from './common.js';
import type { RepairInput, StepResult } from './types.js';

/** Opens the tight corners of `set`; `morph` is the morphology of `set`. */
export function openCorners(set: PolygonSet, input: RepairInput, morph: Morphology): StepResult {
  const R = input.limits.toolRadius;
  if (R === null) return { polygons: set, area: 0, locations: [], changed: { polygons: [] }, skipped: 'no tool radius (--tool-radius or --process)' };
  const survey = morph.corners(R, Math.max(input.tolerance, 0.05 * R));
  if (survey.places.length === 0) return { polygons: set, area: 0, locations: [], changed: { polygons: [] }, skipped: null };
  const rho = R + marginOf(input, R, true);
  const quantum = quantumOf(input.domain, rho);
  const closed = closing(set, rho, arcToleranceOf(input, R), arcToleranceOf(input, R, true), quantum);
  const added = addMaterial(set, ringsOf(closed), input, quantum);
  const locations = survey.places.map((p) => ({ x: p.x, y: p.y, measured: p.radius }));
  return { polygons: added.polygons, area: added.area, locations, changed: added.changed, skipped: null };
}
