/** One location per region a repair changed, over all its rounds, keeping the worst value. mm, y up. */
import { ringBounds } from '../geom/contains.js';
import type { PolygonSet } from '../types.js';

type Loc = { x: number; y: number; measured: number };

/** Merges `locs` (worst first; `larger`: largest first) by the piece of `changed` whose box grown by `reach` mm holds them. */
export function clusterLocations(locs: readonly Loc[], changed: PolygonSet, reach: number, larger = false): Loc[] {
  if (locs.length <= 1) return [...locs];
  const worse = (a: Loc, b: Loc): boolean => (larger ? a.measured > b.measured : a.measured < b.measured);
  const boxes = changed.polygons.map((p) => ringBounds(p.outer));
  const best = new Map<string, Loc>();
  for (const l of locs) {
    let key = `p${l.x},${l.y}`;
    for (let k = 0; k < boxes.length; k++) {
      const b = boxes[k];
      if (l.x >= b[0] - reach && l.x <= b[2] + reach && l.y >= b[1] - reach && l.y <= b[3] + reach) {
        key = `c${k}`;
        break;
      }
    }
    const had = best.get(key);
    if (!had || worse(l, had)) best.set(key, l);
  }
  return [...best.values()].sort((a, b) => (larger ? b.measured - a.measured : a.measured - b.measured));
}
