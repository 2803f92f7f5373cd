/** The passive stage: fixed parts on the smoothed outline, and the area they changed. mm, y up. */
import type { MirrorPlane } from '../geom/symmetry.js';
import { polygonSetArea } from '../geom/area.js';
import type { Domain, PolygonSet } from '../types.js';
import type { PassiveExactResult } from './exact.js';
import { applyFixedParts } from './fixed-parts.js';
import type { PassiveRegions } from './types.js';

export interface PassiveRecord {
  readonly polygons: PolygonSet;
  /** Null without passive regions. */
  readonly exact: PassiveExactResult | null;
  /** mm², signed. */
  readonly area: number;
}

export interface PassiveStageInput {
  readonly planes: readonly MirrorPlane[];
  readonly passive: PassiveRegions | null;
  readonly domain: Domain;
  readonly tolerance: number;
}

/** `smoothed.areaAfter`: mm², as the volume search judged it. */
export function passiveStage(smoothed: { readonly polygons: PolygonSet; readonly areaAfter: number }, field: PassiveStageInput): PassiveRecord {
  const fixed = applyFixedParts(smoothed.polygons, field.planes, field.passive, field.domain, field.tolerance);
  return { polygons: fixed.polygons, exact: fixed.passive, area: fixed.passive ? polygonSetArea(fixed.polygons) - smoothed.areaAfter : 0 };
}
