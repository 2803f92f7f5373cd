/** The repair rounds: asked repairs in REPAIR_IDS order until nothing changes (docs/notes/repair.md). mm, y up; inputs unchanged. */
import { booleanOp, ringsOf } from '../geom/clipper.js';
import { buildMorphology } from '../morph/index.js';
import type { Morphology } from '../morph/types.js';
import { REPAIR_IDS, type RepairName } from '../settings.js';
import type { PolygonSet } from '../types.js';
import { quantumOf } from './common.js';
import { dropIslands } from './drop-islands.js';
import { fillHoles } from './fill-holes.js';
import { openCorners } from './open-corners.js';
import { thicken } from './thicken.js';
import { clusterLocations } from './places.js';
import { unresolvedOf } from './unresolved.js';
import { REPAIR_CHECKS, type RepairAction, type RepairInput, type StepResult } from './types.js';

/** Rounds at most: converging parts settle within four (test/repair/property.test.ts, the demo); six leave room for two more. */
export const MAX_ROUNDS = 6;

function step(id: RepairName, set: PolygonSet, input: RepairInput, morph: () => Morphology): StepResult {
  switch (id) {
    case 'thicken':
      return thicken(set, input, morph());
    case 'fill-holes':
      return fillHoles(set, input, morph());
    case 'open-corners':
      return openCorners(set, input, morph());
    case 'drop-islands':
      return dropIslands(set, input);
  }
}

/** Repaired outline (mm, outer CCW, holes CW) and one action per asked repair, all rounds gathered. */
export function runRepairs(ids: readonly RepairName[], input: RepairInput): { polygons: PolygonSet; actions: RepairAction[] } {
  if (!(input.pixel > 0) || !Number.isFinite(input.pixel)) throw new RangeError(`runRepairs: expected pixel > 0 mm, found ${input.pixel}`);
  if (!(input.tolerance >= 0)) throw new RangeError(`runRepairs: expected tolerance ≥ 0 mm, found ${input.tolerance}`);
  const asked = REPAIR_IDS.filter((r) => ids.includes(r));
  const acc = new Map<RepairName, { area: number; locations: RepairAction['locations']; changed: PolygonSet[]; skipped: string | null }>();
  for (const id of asked) acc.set(id, { area: 0, locations: [], changed: [], skipped: null });
  let current = input.polygons;
  let morph: { of: PolygonSet; m: Morphology } | undefined;
  const morphology = (): Morphology => {
    if (!morph || morph.of !== current) morph = { of: current, m: buildMorphology(current, { domain: input.domain, pixel: input.pixel }) };
    return morph.m;
  };
  let rounds = 0;
  let settled = false;
  for (let round = 0; round < MAX_ROUNDS; round++) {
    rounds = round + 1;
    let changedAny = false;
    for (const id of asked) {
      const r = step(id, current, input, morphology);
      const a = acc.get(id)!;
      a.skipped = r.skipped;
      if (r.polygons === current) continue;
      a.area += r.area;
      a.locations.push(...r.locations);
      if (r.changed.polygons.length > 0) a.changed.push(r.changed);
      current = r.polygons;
      changedAny = true;
    }
    if (!changedAny) {
      settled = true;
      break;
    }
  }
  const actions = asked.map((id): RepairAction => {
    const a = acc.get(id)!;
    const changed = merge(a.changed, id, input);
    const unresolved = a.skipped === null ? unresolvedOf(id, current, input, morphology(), rounds, settled) : null;
    return { id, checks: [...REPAIR_CHECKS[id]], area: a.area, locations: id === 'drop-islands' ? a.locations : clusterLocations(a.locations, changed, reachOf(id, input)), changed, skipped: a.skipped, unresolved };
  });
  return { polygons: current, actions };
}

/** How far (mm) from the added material the place a repair measured can lie: its disc radius and a pixel. */
function reachOf(id: RepairName, input: RepairInput): number {
  const L = input.limits;
  const r = id === 'thicken' ? (L.minMember ?? 0) / 2 : id === 'fill-holes' ? (L.minHole ?? 0) / 2 : id === 'open-corners' ? (L.toolRadius ?? 0) : 0;
  return r + input.pixel;
}

function merge(sets: readonly PolygonSet[], id: RepairName, input: RepairInput): PolygonSet {
  if (sets.length === 0) return { polygons: [] };
  if (sets.length === 1) return sets[0];
  if (id === 'drop-islands') return { polygons: sets.flatMap((s) => s.polygons) };
  return booleanOp('union', sets.flatMap((s) => ringsOf(s)), [], { quantum: quantumOf(input.domain, 0) });
}
