import { describe, expect, it } from 'vitest';
import { runRepairs } from '../../src/repair/index.js';
import type { RepairInput } from '../../src/repair/types.js';
import { islands } from '../../src/check/islands.js';
import { type Box, circle, poly, rect, sizeChecks, realContext } from './support.js';

const domain: Box = [0, 0, 100, 60];
const pixel = 0.5;
const tolerance = 0.25;
const limits = { minMember: null, minHole: null, toolRadius: null, minIslandArea: 0, minHoleArea: null };
const body = poly(rect(0, 0, 60, 40));
const speck = poly(rect(70, 10, 75, 15)); // analytic area 25 mm²
const part = { polygons: [speck, body] };
const input: RepairInput = { polygons: part, domain, tolerance, limits, passiveSolid: [], passiveVoid: [], pixel };

describe('drop-islands', () => {
  it('removes a piece not joined to the main body', () => {
    expect(sizeChecks(part, domain, tolerance, pixel, limits, ['islands'])[0].status).toBe('warn');
    const { polygons, actions } = runRepairs(['drop-islands'], input);
    expect(polygons.polygons).toEqual([body]);
    expect(actions[0].area).toBe(-25); // analytic: 5 × 5 square removed
    expect(actions[0].locations).toEqual([{ x: 72.5, y: 12.5, measured: 25 }]); // analytic: centre of the square
    expect(actions[0].changed.polygons).toEqual([speck]);
    expect(sizeChecks(polygons, domain, tolerance, pixel, limits, ['islands'])[0].status).toBe('pass');
  });

  it('keeps an island up to --min-island-area', () => {
    const r = runRepairs(['drop-islands'], { ...input, limits: { ...limits, minIslandArea: 25 } });
    expect(r.polygons).toBe(part);
  });

  it('keeps a piece touching (an edge in common) or overlapping a passive-solid region: it is joined', () => {
    for (const passive of [rect(75, 10, 80, 15), circle(74, 14, 2, 64)]) {
      const r = runRepairs(['drop-islands'], { ...input, passiveSolid: [passive] });
      expect(r.polygons).toBe(part);
      expect(r.actions[0].area).toBe(0);
      // the check agrees: no island
      expect(islands.measure(realContext(part, domain, tolerance, pixel, [passive]), 0).measured).toBeNull();
    }
    // a passive region apart from it does not join it
    const apart = runRepairs(['drop-islands'], { ...input, passiveSolid: [rect(80, 10, 85, 15)] });
    expect(apart.polygons.polygons).toEqual([body]);
  });
});
