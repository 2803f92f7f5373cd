import { describe, expect, it } from 'vitest';
import { unionRings } from '../../src/geom/clipper.js';
import { runRepairs } from '../../src/repair/index.js';
import { cleanSet } from '../../src/repair/common.js';
import type { RepairInput } from '../../src/repair/types.js';
import type { Point, PolygonSet } from '../../src/types.js';
import { type Box, circle, crossingsAt, hole, poly, rect, setArea, sizeChecks } from './support.js';

const d = 8; // member limit, mm
const domain: Box = [0, 0, 100, 60];
const pixel = 0.25;
const tolerance = 0.25;
const limits = { minMember: d, minHole: null, toolRadius: null, minIslandArea: 0, minHoleArea: null };

describe('thicken beside a passive void', () => {
  // a wall 5 mm wide between a bolt hole (passive void, radius 6 at (50, 30)) and a slot above it: the wall's
  // lower edge is the hole, so it can only grow upward
  const bolt = circle(50, 30, 6, 256);
  const w = 5;
  const part = unionRings([rect(0, 0, 100, 20), rect(0, 20, 100, 36 + w), rect(0, 50, 100, 60)]);
  const withHole: PolygonSet = { polygons: part.polygons.map((p) => poly(p.outer, ...p.holes, hole(bolt))) };
  const input: RepairInput = { polygons: withHole, domain, tolerance, limits, passiveSolid: [], passiveVoid: [bolt], pixel };

  it('the wall over the hole reaches the member limit in the first round (its discs are moved off the void)', () => {
    const before = sizeChecks(withHole, domain, tolerance, pixel, limits, ['min-member-size'])[0];
    expect(before.status).toBe('fail');
    const r = runRepairs(['thicken'], input);
    // above the hole's centre, the line x = 50 crosses the hole's top (y = 36) and then the wall's top edge
    const ys = crossingsAt(r.polygons, 50).filter((y) => y > 30);
    expect(ys[0]).toBeCloseTo(36, 6); // analytic: the hole's top point, untouched (a passive void is never filled)
    expect(ys[1] - ys[0]).toBeGreaterThanOrEqual(d); // analytic: the discs of radius d/2 + δ sit d/2 + δ above the hole
    expect(r.actions[0].unresolved).toBeNull();
    expect(sizeChecks(r.polygons, domain, tolerance, pixel, limits, ['min-member-size'])[0].status).toBe('pass');
  });
});

describe('cleanSet removes needles (zero-area spikes), not corners', () => {
  it('a spike running out and back along one line goes; the square stays with its four corners', () => {
    const sq: Point[] = [[0, 0], [10, 0], [10, 10], [5, 10], [5, 14], [5, 10], [0, 10]];
    const out = cleanSet({ polygons: [poly(sq)] }, 1e-6);
    expect(out.polygons[0].outer).toEqual([[0, 0], [10, 0], [10, 10], [5, 10], [0, 10]]);
    // analytic: the area is the square's, 100 mm², with or without the needle
    expect(setArea(out)).toBeCloseTo(100, 12);
    const thin: Point[] = [[0, 0], [10, 0], [10, 10], [5, 10], [5.01, 14], [5.02, 10], [0, 10]]; // a real (if thin) spike
    expect(cleanSet({ polygons: [poly(thin)] }, 1e-6).polygons[0].outer).toHaveLength(7);
  });
});
