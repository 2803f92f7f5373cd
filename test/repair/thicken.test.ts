import { describe, expect, it } from 'vitest';
import { unionRings } from '../../src/geom/clipper.js';
import { marginOf } from '../../src/repair/common.js';
import { runRepairs } from '../../src/repair/index.js';
import type { RepairInput } from '../../src/repair/types.js';
import { type Box, crossingsAt, rect, setArea, sizeChecks } from './support.js';

const d = 8; // member limit, mm
const domain: Box = [0, 0, 100, 60];
const pixel = 0.25;
const tolerance = 0.25;
const limits = { minMember: d, minHole: null, toolRadius: null, minIslandArea: 0, minHoleArea: null };
// two thick blocks joined by a strut of width 0.6·d along y = 30
const w = 0.6 * d;
const part = unionRings([rect(0, 0, 30, 60), rect(30, 30 - w / 2, 70, 30 + w / 2), rect(70, 0, 100, 60)]);
const input: RepairInput = { polygons: part, domain, tolerance, limits, passiveSolid: [], passiveVoid: [], pixel };

describe('thicken', () => {
  const { polygons, actions } = runRepairs(['thicken'], input);
  const delta = marginOf(input, d / 2);

  it('the strut fails the member check before and passes it after (real planner and runner)', () => {
    const before = sizeChecks(part, domain, tolerance, pixel, limits, ['min-member-size'])[0];
    expect(before.status).toBe('fail');
    expect(before.measured!).toBeCloseTo(w, 1); // analytic: the strut is 0.6·d wide
    const after = sizeChecks(polygons, domain, tolerance, pixel, limits, ['min-member-size'])[0];
    expect(after.measured!).toBeGreaterThanOrEqual(d - after.resolution);
    expect(after.status).toBe('pass');
  });

  it('the strut measured at its middle is d wide, plus at most 2δ (analytic: discs of radius d/2 + δ on the axis)', () => {
    const ys = crossingsAt(polygons, 50);
    expect(ys).toHaveLength(2); // x = 50 crosses only the strut's two edges
    const width = ys[1] - ys[0];
    expect(width).toBeGreaterThanOrEqual(d); // analytic: the polygonised discs stay within the arc tolerance < δ of radius d/2 + δ
    expect(width).toBeLessThanOrEqual(d + 2 * delta + 1e-9);
    expect((ys[0] + ys[1]) / 2).toBeCloseTo(30, 6); // centred on the old axis (analytic: symmetric strut)
  });

  it('leaves the blocks unchanged away from the strut and keeps one piece', () => {
    expect(polygons.polygons).toHaveLength(1);
    const a = actions[0];
    expect(a.id).toBe('thicken');
    expect(a.checks).toEqual(['min-member-size']);
    expect(a.skipped).toBeNull();
    // analytic: the material added is the change of the net area
    expect(a.area).toBeCloseTo(setArea(polygons) - setArea(part), 6);
    expect(a.locations.length).toBeGreaterThan(0);
    expect(a.locations[0].measured).toBeCloseTo(w, 1);
    // every vertex of the added region lies within d/2 + δ of the strut's axis extended d/2 into the blocks
    for (const p of a.changed.polygons) {
      for (const [x, y] of p.outer) {
        const dx = Math.max(30 - d / 2 - x, 0, x - (70 + d / 2));
        expect(Math.hypot(dx, y - 30)).toBeLessThanOrEqual(d / 2 + delta + 1e-6);
      }
    }
    // the far corners of the blocks are still vertices (analytic: nothing was added there)
    const outer = polygons.polygons[0].outer.map((p) => `${p[0]},${p[1]}`);
    for (const c of ['0,0', '100,0', '100,60', '0,60', '30,0', '70,0', '30,60', '70,60']) expect(outer).toContain(c);
  });

  it('with no member limit it does nothing and says why', () => {
    const r = runRepairs(['thicken'], { ...input, limits: { ...limits, minMember: null } });
    expect(r.polygons).toBe(part);
    expect(r.actions[0].skipped).toMatch(/no member limit/);
    expect(r.actions[0].area).toBe(0);
  });
});
