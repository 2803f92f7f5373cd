/** What the repairs could not settle: each repair's survey once more on the result, said in words. mm, y up. */
import { joinedPieces } from '../check/islands.js';
import { cornerDepth } from '../check/min-inner-radius.js';
import { polygonArea, ringArea } from '../geom/area.js';
import { ringContains } from '../geom/contains.js';
import { nearestOnRing } from '../geom/near.js';
import type { Morphology } from '../morph/types.js';
import type { RepairName } from '../settings.js';
import type { PolygonSet, Ring } from '../types.js';
import type { RepairInput } from './types.js';

const fmt = (v: number): string => (Math.abs(v) >= 100 ? v.toFixed(0) : Math.abs(v) >= 1 ? v.toFixed(2) : v.toPrecision(2));

function nearVoid(x: number, y: number, voids: readonly Ring[]): number {
  let best = Infinity;
  for (const r of voids) {
    if (ringContains(r, [x, y]) > 0) return 0;
    best = Math.min(best, nearestOnRing(r, x, y).d);
  }
  return best;
}

/** The likely reason a place stayed; `settled`: the last round changed nothing. */
function why(x: number, y: number, limit: number, input: RepairInput, rounds: number, settled: boolean): string {
  if (nearVoid(x, y, input.passiveVoid) < limit) return 'beside a passive-void region, which the repairs never fill';
  if (settled) return 'the repair finds nothing to add there (its discs there changed nothing, or met a passive region or the domain edge)';
  return `the repairs of neighbouring places still undid each other after ${rounds} rounds`;
}

/** What repair `id` left on `set` in words, or null; `settled`: the last round changed nothing. */
export function unresolvedOf(id: RepairName, set: PolygonSet, input: RepairInput, morph: Morphology, rounds: number, settled: boolean): string | null {
  const L = input.limits;
  if (id === 'thicken' && L.minMember !== null) {
    const s = morph.width('solid', L.minMember);
    if (s.places.length === 0) return null;
    const p = s.places[0];
    return `${s.places.length} thin place${s.places.length === 1 ? '' : 's'} still below ${fmt(L.minMember)} mm (thinnest ${fmt(p.width)} mm at x ${fmt(p.x)}, y ${fmt(p.y)}): ${why(p.x, p.y, L.minMember, input, rounds, settled)}`;
  }
  if (id === 'fill-holes') {
    const parts: string[] = [];
    if (L.minHole !== null) {
      const s = morph.width('void', L.minHole);
      if (s.places.length > 0) {
        const p = s.places[0];
        parts.push(`${s.places.length} narrow place${s.places.length === 1 ? '' : 's'} still below ${fmt(L.minHole)} mm (narrowest ${fmt(p.width)} mm at x ${fmt(p.x)}, y ${fmt(p.y)}): ${why(p.x, p.y, L.minHole, input, rounds, settled)}`);
      }
    }
    if (L.minHoleArea !== null) {
      let n = 0;
      for (const p of set.polygons) for (const h of p.holes) if (Math.abs(ringArea(h)) < L.minHoleArea) n++;
      if (n > 0) parts.push(`${n} hole${n === 1 ? '' : 's'} still below ${fmt(L.minHoleArea)} mm²: passive-void regions, which the repairs never fill`);
    }
    return parts.length ? parts.join('; ') : null;
  }
  if (id === 'open-corners' && L.toolRadius !== null) {
    const s = morph.corners(L.toolRadius, cornerDepth(input.tolerance, L.toolRadius));
    if (s.places.length === 0) return null;
    const p = s.places[0];
    return `${s.places.length} corner${s.places.length === 1 ? '' : 's'} still tighter than ${fmt(L.toolRadius)} mm (tightest ${fmt(p.radius)} mm at x ${fmt(p.x)}, y ${fmt(p.y)}): ${why(p.x, p.y, 2 * L.toolRadius, input, rounds, settled)}`;
  }
  if (id === 'drop-islands') {
    const areas = new Float64Array(set.polygons.length);
    set.polygons.forEach((p, k) => (areas[k] = polygonArea(p)));
    const joined = joinedPieces(set, areas, input.passiveSolid);
    let n = 0;
    for (let k = 0; k < areas.length; k++) if (!joined[k] && areas[k] > L.minIslandArea) n++;
    return n > 0 ? `${n} island${n === 1 ? '' : 's'} left` : null;
  }
  return null;
}
