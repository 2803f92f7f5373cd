/** The design's fixed parts: symmetry, then the passive regions by exact booleans; run after smoothing and again after repair. mm, y up. */
import { symmetrize, type MirrorPlane } from '../geom/symmetry.js';
import type { Domain, PolygonSet } from '../types.js';
import { applyPassiveExact, type PassiveExactResult } from './exact.js';
import type { PassiveRegions } from './types.js';

export interface FixedPartsResult {
  readonly polygons: PolygonSet;
  readonly passive: PassiveExactResult | null;
}

/** `domain`: the unfolded grid's; `tolerance`: mm. No planes and no regions: `set` itself. */
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
