/** The repair stage: the repairs, then the fixed parts again so they win (docs/repair.md). mm, y up. */
import type { CheckId } from '../check/ids.js';
import { MAX_LOCATIONS, type PlannedCheck } from '../check/run.js';
import type { MirrorPlane } from '../geom/symmetry.js';
import type { PassiveExactResult } from '../passive/exact.js';
import { applyFixedParts } from '../passive/fixed-parts.js';
import { arcSagitta } from '../geom/circle.js';
import { shapeRing } from '../passive/rings.js';
import type { PassiveRegions } from '../passive/types.js';
import type { RepairName, Settings } from '../settings.js';
import type { Domain, Location, PolygonSet, RepairRecord, Ring } from '../types.js';
import { runRepairs } from './run.js';
import { quantumOf } from './common.js';
import { simplifySet } from '../smooth/simplify-set.js';
import { REPAIR_CHECKS, type RepairAction } from './types.js';

/** Why a repair cannot run (its check is off or has no limit); null when it can. */
function offReason(id: RepairName, planned: ReadonlySet<CheckId>): string | null {
  const checks = REPAIR_CHECKS[id];
  if (checks.some((c) => planned.has(c))) return null;
  return `its check${checks.length === 1 ? '' : 's'} ${checks.join(', ')} ${checks.length === 1 ? 'is' : 'are'} off (no limit, or --severity …=off)`;
}

export interface RepairStageInput {
  readonly polygons: PolygonSet;
  readonly settings: Pick<Settings, 'repair' | 'minIslandArea' | 'minHoleArea'>;
  readonly limits: { readonly minMember: number | null; readonly minHole: number | null; readonly toolRadius: number | null; readonly minHoleArea?: number | null };
  readonly planned: readonly PlannedCheck[];
  readonly planes: readonly MirrorPlane[];
  readonly passive: PassiveRegions | null;
  readonly passiveSolid: readonly Ring[];
  readonly domain: Domain;
  readonly tolerance: number;
  /** mm: the outline budget the smoothing left; the repaired outline is simplified within it. 0 = none. */
  readonly simplify?: number;
  /** Morphology raster pixel, mm. */
  readonly pixel: number;
  readonly locate: (x: number, y: number) => Pick<Location, 'fileRow' | 'fileCol'>;
}

export interface RepairStageRecord {
  /** Symmetric again, passive regions applied again. */
  readonly polygons: PolygonSet;
  readonly passive: PassiveExactResult | null;
  /** In REPAIR_IDS order (report `repairs`). */
  readonly records: readonly RepairRecord[];
  readonly before: PolygonSet;
  readonly changed: PolygonSet;
}

/** The repaired outline (mm, y up) with its fixed parts applied again, and one record per requested repair. */
export function repairStage(input: RepairStageInput): RepairStageRecord {
  const plannedIds = new Set(input.planned.map((p) => p.def.id));
  const ids = input.settings.repair.filter((id) => offReason(id, plannedIds) === null);
  const passiveVoid = input.passive
    ? input.passive.regions.filter((r) => r.role === 'void').map((r) => shapeRing(r.shape, arcSagitta(input.tolerance)))
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
      minHoleArea: has('small-holes') ? (input.limits.minHoleArea !== undefined ? input.limits.minHoleArea : input.settings.minHoleArea) : null,
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
      locations: a.locations.slice(0, MAX_LOCATIONS).map((l) => ({ x: l.x, y: l.y, measured: l.measured, ...input.locate(l.x, l.y) })),
      checks: [...a.checks],
      skipped: a.skipped,
      locationsTotal: a.locations.length,
      unresolved: a.unresolved,
    };
  });
  const repaired = input.simplify ? simplifySet(run.polygons, input.simplify, { quantum: quantumOf(input.domain, 0) }) : run.polygons;
  const fixed = applyFixedParts(repaired, input.planes, input.passive, input.domain, input.tolerance);
  const changed: PolygonSet = { polygons: run.actions.flatMap((a) => a.changed.polygons) };
  return { polygons: fixed.polygons, passive: fixed.passive, records, before: input.polygons, changed };
}
