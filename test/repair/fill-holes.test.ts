import { describe, expect, it } from 'vitest';
import { arcToleranceOf, marginOf } from '../../src/repair/common.js';
import { runRepairs } from '../../src/repair/index.js';
import type { RepairInput } from '../../src/repair/types.js';
import { type Box, circle, hole, ngonArea, poly, rect, setArea, shoelace, sizeChecks } from './support.js';

const d = 8; // hole limit, mm
const domain: Box = [0, 0, 100, 60];
const pixel = 0.25;
const tolerance = 0.25;
const n = 256;
const limits = { minMember: null, minHole: d, toolRadius: null, minIslandArea: 0, minHoleArea: null };
// a plate with a round hole of diameter 0.5·d and one of diameter 2·d
const small = circle(30, 30, 0.25 * d, n);
const big = circle(70, 30, d, n);
const plate = { polygons: [poly(rect(0, 0, 100, 60), hole(small), hole(big))] };
const input: RepairInput = { polygons: plate, domain, tolerance, limits, passiveSolid: [], passiveVoid: [], pixel };

describe('fill-holes', () => {
  it('fills a hole narrower than the limit whole and leaves a wide one untouched', () => {
    const before = sizeChecks(plate, domain, tolerance, pixel, limits, ['min-hole-size'])[0];
    expect(before.status).toBe('fail');
    const { polygons, actions } = runRepairs(['fill-holes'], input);
    expect(polygons.polygons).toHaveLength(1);
    const holes = polygons.polygons[0].holes;
    expect(holes).toHaveLength(1);
    // the 2d hole is the same ring (analytic n-gon area)
    expect(Math.abs(shoelace(holes[0]))).toBeCloseTo(ngonArea(d, n), 6);
    // area added = the small hole's area (analytic n-gon area), which is π(0.25d)² within the polygonisation bound
    const added = setArea(polygons) - setArea(plate);
    expect(added).toBeCloseTo(ngonArea(0.25 * d, n), 5);
    expect(Math.abs(added - Math.PI * (0.25 * d) ** 2)).toBeLessThanOrEqual(Math.PI * (0.25 * d) ** 2 - ngonArea(0.25 * d, n) + 1e-6);
    expect(actions[0].area).toBeCloseTo(added, 6);
    expect(actions[0].checks).toEqual(['min-hole-size', 'small-holes']);
    // the finding was at the small hole's centre, measured its diameter (analytic 0.5·d)
    expect(actions[0].locations).toHaveLength(1);
    expect(Math.hypot(actions[0].locations[0].x - 30, actions[0].locations[0].y - 30)).toBeLessThan(pixel);
    expect(actions[0].locations[0].measured).toBeCloseTo(0.5 * d, 1);
    const after = sizeChecks(polygons, domain, tolerance, pixel, limits, ['min-hole-size'])[0];
    expect(after.status).toBe('pass');
    expect(after.measured!).toBeCloseTo(2 * d, 1); // analytic: the remaining hole's diameter
  });

  it('fills a narrow slot along its length, with round ends where it opens into wide void', () => {
    // a slot of width 0.5·d cut 20 mm deep from the top edge of a plate that fills the domain's lower part
    const slotW = 0.5 * d;
    const outer = [[0, 0], [100, 0], [100, 40], [52, 40], [52, 20], [48, 20], [48, 40], [0, 40]] as const;
    const part = { polygons: [poly(outer.map((p) => [p[0], p[1]] as const))] };
    const r = runRepairs(['fill-holes'], { ...input, polygons: part });
    // analytic: the slot (20 × slotW) is filled except the cap a disc of radius ρ = d/2 + δ resting on the slot's
    // two top corners dips into it: cap = ρ²·acos(h/ρ) − h·slotW/2 with h = √(ρ² − (slotW/2)²)
    const rho = d / 2 + marginOf(input, d / 2, true);
    const half = slotW / 2;
    const h = Math.sqrt(rho * rho - half * half);
    const cap = rho * rho * Math.acos(h / rho) - h * half;
    const added = setArea(r.polygons) - setArea(part);
    // the polygonised arc lies within the arc tolerances of the circle along its length 2ρ·asin(half/ρ): its own
    // (fillet) and that of the dilated corners it hangs from (common.ts closing)
    const arcs = arcToleranceOf(input, d / 2, true) + arcToleranceOf(input, d / 2);
    expect(Math.abs(added - (20 * slotW - cap))).toBeLessThanOrEqual(arcs * 2 * rho * Math.asin(half / rho));
    expect(sizeChecks(r.polygons, domain, tolerance, pixel, limits, ['min-hole-size'])[0].status).toBe('pass');
  });

  it('never fills a passive-void region and does not count it', () => {
    const r = runRepairs(['fill-holes'], { ...input, passiveVoid: [small] });
    expect(r.actions[0].area).toBeCloseTo(0, 9);
    expect(r.polygons.polygons[0].holes).toHaveLength(2);
  });

  it('fills holes smaller than --min-hole-area whole (analytic hole area πr²)', () => {
    const lim = { ...limits, minHole: null };
    const area2d = ngonArea(d, n); // ≈ π·64 ≈ 201 mm²
    const filled = runRepairs(['fill-holes'], { ...input, limits: { ...lim, minHoleArea: 250 } });
    expect(filled.polygons.polygons[0].holes).toHaveLength(0);
    expect(filled.actions[0].area).toBeCloseTo(area2d + ngonArea(0.25 * d, n), 5);
    expect(filled.actions[0].locations.map((l) => Math.round(l.measured))).toEqual([Math.round(ngonArea(0.25 * d, n)), Math.round(area2d)]);
    const kept = runRepairs(['fill-holes'], { ...input, limits: { ...lim, minHoleArea: 150 } });
    expect(kept.polygons.polygons[0].holes).toHaveLength(1);
    expect(Math.abs(shoelace(kept.polygons.polygons[0].holes[0]))).toBeCloseTo(area2d, 6);
    expect(sizeChecks(kept.polygons, domain, tolerance, pixel, { ...lim, minHoleArea: 150 }, ['small-holes'])[0].status).toBe('pass');
  });
});
