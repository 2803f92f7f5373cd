/**
 * The finishing stages after smoothing (DESIGN §3–5): exact symmetry, passive regions by exact booleans, the
 * repairs with their re-check, true circles, and the report of what finishing changed. Each is a pure
 * function of its inputs; src/pipeline.ts decides the order.
 *
 * Frame: mm, y up, origin at the lower-left corner of the input grid (docs/conventions.md).
 */
import type { CheckId } from './check/ids.js';
import type { PlannedCheck } from './check/run.js';
import { samplingStep } from './check/outline-fidelity.js';
import { polygonSetArea, polygonSetPerimeter } from './geom/area.js';
import { findCircleRings } from './geom/fit-circle.js';
import { flattenSet } from './geom/flat.js';
import { locatedDeviation } from './geom/hausdorff.js';
import { symmetrize, type MirrorPlane } from './geom/symmetry.js';
import { applyPassiveExact, type PassiveExactResult } from './passive/exact.js';
import { shapeRing } from './passive/rings.js';
import type { PassiveRegions } from './passive/types.js';
import { REPAIR_CHECKS, runRepairs, type RepairAction } from './repair/index.js';
import type { RepairName, Settings } from './settings.js';
import type { Location, PolygonSet, RepairRecord, Report, Ring } from './types.js';
import type { RingCircle } from './write/types.js';

/** Repair locations kept per repair in the report (like MAX_LOCATIONS of the checks). */
export const MAX_REPAIR_LOCATIONS = 100;

/** The outline after symmetry and passive regions, with what the passive step produced. */
export interface FinishedOutline {
  readonly polygons: PolygonSet;
  readonly passive: PassiveExactResult | null;
}

/**
 * Exact symmetry about the mirror planes (src/geom/symmetry.ts), then the passive regions by exact booleans
 * (src/passive/exact.ts): the second act of the passive regions, which makes a bolt hole a true circle.
 * `domain` is the (unfolded) grid's; `tolerance` the outline budget (mm). No planes and no regions: `set` itself.
 */
export function finishOutline(
  set: PolygonSet,
  planes: readonly MirrorPlane[],
  passive: PassiveRegions | null,
  domain: readonly [number, number, number, number],
  tolerance: number,
): FinishedOutline {
  const symmetric = planes.length > 0 ? symmetrize(set, planes, domain) : set;
  if (!passive) return { polygons: symmetric, passive: null };
  const exact = applyPassiveExact(symmetric, passive, domain, tolerance);
  return { polygons: exact.polygons, passive: exact };
}

/**
 * The rings written as true circles: the passive circles that survived whole, and with `--circles` every other
 * ring that is a circle within the outline tolerance (src/geom/fit-circle.ts).
 */
export function circleRings(set: PolygonSet, passive: readonly RingCircle[], recognise: boolean, tolerance: number): RingCircle[] {
  if (!recognise) return [...passive];
  const taken = new Set(passive.map((c) => `${c.polygon}:${c.ring}`));
  return [...passive, ...findCircleRings(set, tolerance).filter((c) => !taken.has(`${c.polygon}:${c.ring}`))];
}

/**
 * What finishing changed after smoothing: the area and fraction change, and the directed Hausdorff distance (mm)
 * from the final outline to the raw iso-contour, sampled as outline-fidelity samples — reported, never failed
 * (DESIGN §4). maxDeviation is null when there is no raw contour to measure against.
 */
export function finishingOf(final: PolygonSet, smoothedArea: number, raw: PolygonSet, domainArea: number, tolerance: number): NonNullable<Report['finishing']> {
  const area = polygonSetArea(final);
  const step = samplingStep(polygonSetPerimeter(final), tolerance);
  const dev = locatedDeviation(flattenSet(final), flattenSet(raw), step, Infinity);
  return {
    areaChange: area - smoothedArea,
    fractionChange: domainArea > 0 ? (area - smoothedArea) / domainArea : 0,
    maxDeviation: Number.isFinite(dev.max) ? dev.max : null,
  };
}

/** Why a repair does nothing because the check it answers is off or has no limit; null when it can run. */
function offReason(id: RepairName, planned: ReadonlySet<CheckId>): string | null {
  const checks = REPAIR_CHECKS[id];
  if (checks.some((c) => planned.has(c))) return null;
  return `its check${checks.length === 1 ? '' : 's'} ${checks.join(', ')} ${checks.length === 1 ? 'is' : 'are'} off (no limit, or --severity …=off)`;
}

export interface RepairStageInput {
  readonly polygons: PolygonSet;
  readonly settings: Pick<Settings, 'repair' | 'minIslandArea' | 'minHoleArea'>;
  readonly limits: { readonly minMember: number | null; readonly minHole: number | null; readonly toolRadius: number | null };
  readonly planned: readonly PlannedCheck[];
  readonly planes: readonly MirrorPlane[];
  readonly passive: PassiveRegions | null;
  /** The passive-solid primitives as rings, as the exact passive step drew them (PassiveExactResult.solidRings). */
  readonly passiveSolid: readonly Ring[];
  readonly domain: readonly [number, number, number, number];
  readonly tolerance: number;
  /** Morphology raster pixel, mm (choosePixel). */
  readonly pixel: number;
  /** Maps a point (mm) to its 1-based file row and column (the check locator). */
  readonly locate: (x: number, y: number) => Pick<Location, 'fileRow' | 'fileCol'>;
}

export interface RepairStageResult {
  /** The repaired outline, symmetric again and with the passive regions applied again. */
  readonly polygons: PolygonSet;
  readonly passive: PassiveExactResult | null;
  readonly records: RepairRecord[];
  /** The material added or removed, for the `repair` layer and the HTML figure. */
  readonly changed: PolygonSet;
}

/**
 * Run the requested repairs (src/repair/, docs/repair.md) on the finished outline, then make it symmetric again
 * and re-apply the passive regions exactly: they are the design's fixed parts and win over any repair (a
 * thickened member never closes a bolt hole). A repair whose checks are off is recorded as skipped. The
 * pipeline re-runs the checks on the result.
 */
export function repairStage(input: RepairStageInput): RepairStageResult {
  const plannedIds = new Set(input.planned.map((p) => p.def.id));
  const ids = input.settings.repair.filter((id) => offReason(id, plannedIds) === null);
  const passiveVoid = input.passive
    ? input.passive.regions.filter((r) => r.role === 'void').map((r) => shapeRing(r.shape, input.tolerance / 4))
    : [];
  const has = (c: CheckId) => plannedIds.has(c);
  const run = runRepairs(ids, {
    polygons: input.polygons,
    domain: input.domain,
    tolerance: input.tolerance,
    limits: {
      minMember: has('min-member-size') ? input.limits.minMember : null,
      minHole: has('min-hole-size') ? input.limits.minHole : null,
      toolRadius: has('min-inner-radius') ? input.limits.toolRadius : null,
      minIslandArea: input.settings.minIslandArea,
      minHoleArea: has('small-holes') ? input.settings.minHoleArea : null,
    },
    passiveSolid: input.passiveSolid,
    passiveVoid,
    pixel: input.pixel,
  });
  const byId = new Map<RepairName, RepairAction>(run.actions.map((a) => [a.id, a]));
  const records: RepairRecord[] = input.settings.repair.map((id) => {
    const a = byId.get(id);
    if (!a) return { id, area: 0, locations: [], checks: [...REPAIR_CHECKS[id]], skipped: offReason(id, plannedIds) ?? 'not run', locationsTotal: 0, unresolved: null };
    return {
      id,
      area: a.area,
      locations: a.locations.slice(0, MAX_REPAIR_LOCATIONS).map((l) => ({ x: l.x, y: l.y, measured: l.measured, ...input.locate(l.x, l.y) })),
      checks: [...a.checks],
      skipped: a.skipped,
      locationsTotal: a.locations.length,
      unresolved: a.unresolved,
    };
  });
  const finished = finishOutline(run.polygons, input.planes, input.passive, input.domain, input.tolerance);
  const changed: PolygonSet = { polygons: run.actions.flatMap((a) => a.changed.polygons) };
  return { polygons: finished.polygons, passive: finished.passive, records, changed };
}
