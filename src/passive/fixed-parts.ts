/**
 * The design's fixed parts applied exactly to an outline: mirror symmetry about the `--mirror` planes
 * (src/geom/symmetry.ts), then the passive regions by exact booleans (src/passive/exact.ts) — their second act,
 * which makes a bolt hole a true circle. The passive stage runs it on the smoothed outline and the repair stage
 * again on the repaired one, so the fixed parts always win.
 *
 * Frame: mm, y up, origin at the lower-left corner of the input grid (docs/conventions.md).
 */
import { symmetrize, type MirrorPlane } from '../geom/symmetry.js';
import type { Domain, PolygonSet } from '../types.js';
import { applyPassiveExact, type PassiveExactResult } from './exact.js';
import type { PassiveRegions } from './types.js';

/** The outline after symmetry and passive regions, with what the passive step produced. */
export interface FixedPartsResult {
  readonly polygons: PolygonSet;
  readonly passive: PassiveExactResult | null;
}

/**
 * `domain` is the (unfolded) grid's; `tolerance` the outline budget (mm). No planes and no regions: `set` itself.
 */
export function applyFixedParts(
  set: PolygonSet,
  planes: readonly MirrorPlane[],
  passive: PassiveRegions | null,
  domain: Domain,
  tolerance: number,
): FixedPartsResult {
  const symmetric = planes.length > 0 ? symmetrize(set, planes, domain) : set;
  if (!passive) return { polygons: symmetric, passive: null };
  const exact = applyPassiveExact(symmetric, passive, domain, tolerance);
  return { polygons: exact.polygons, passive: exact };
}
