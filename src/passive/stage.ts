/**
 * The passive stage: the smoothed outline made exactly symmetric and given its passive regions by exact booleans
 * (fixed-parts.ts). Reports the area the regions changed. mm, y up.
 */
import type { MirrorPlane } from '../geom/symmetry.js';
import { polygonSetArea } from '../geom/area.js';
import type { Domain, PolygonSet } from '../types.js';
import type { PassiveExactResult } from './exact.js';
import { applyFixedParts } from './fixed-parts.js';
import type { PassiveRegions } from './types.js';

export interface PassiveRecord {
  /** The outline after symmetry and passive regions (the smoothed polygons themselves when neither applies). */
  readonly polygons: PolygonSet;
  /** What the exact passive step drew (true circles, solid rings); null without passive regions. */
  readonly exact: PassiveExactResult | null;
  /** mm², signed: what the passive regions changed (0 without). */
  readonly area: number;
}

/** What the passive stage needs of the prepared field (src/field/stage.ts PreparedField). */
export interface PassiveStageInput {
  readonly planes: readonly MirrorPlane[];
  readonly passive: PassiveRegions | null;
  readonly domain: Domain;
  readonly tolerance: number;
}

/** `smoothed`: the threshold stage's outline and its area (mm², as the volume search judged it). */
export function passiveStage(smoothed: { readonly polygons: PolygonSet; readonly areaAfter: number }, field: PassiveStageInput): PassiveRecord {
  const fixed = applyFixedParts(smoothed.polygons, field.planes, field.passive, field.domain, field.tolerance);
  return { polygons: fixed.polygons, exact: fixed.passive, area: fixed.passive ? polygonSetArea(fixed.polygons) - smoothed.areaAfter : 0 };
}
