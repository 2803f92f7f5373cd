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

describe('fill-holes: a neck beside a sharp convex corner', () => {
  // A V-notch cut from below into a block, with a step on its left wall: the convex corner B of the step faces
  // the right wall DE across a neck narrower than the limit (4 mm), while a disc of the limit's size passes below
  // B — the closing by that disc leaves the neck (the shape of a random part, test/repair/property.test.ts).
  const A: [number, number] = [47.432, 32.173], B: [number, number] = [54.199, 51.091], C: [number, number] = [53.484, 51.346];
  const D: [number, number] = [55.968, 55.035], E: [number, number] = [66.475, 37.208];
  const block = { polygons: [poly([A, B, C, D, E, [80, 37.208], [80, 60], [30, 60], [30, 32.173]])] };
  const lim = { minMember: null, minHole: 4, toolRadius: null, minIslandArea: 0, minHoleArea: null };
  const px = 0.5;
  const inp: RepairInput = { polygons: block, domain: [20, 20, 90, 60], tolerance, limits: lim, passiveSolid: [], passiveVoid: [], pixel: px };
  // analytic: the neck is the distance from the corner B to the line DE
  const ex = E[0] - D[0], ey = E[1] - D[1];
  const neck = Math.abs((B[0] - D[0]) * ey - (B[1] - D[1]) * ex) / Math.hypot(ex, ey);

  it('the check finds the neck (width = distance from B to the line DE, analytic), and fill-holes bridges it', () => {
    expect(neck).toBeLessThan(4);
    const before = sizeChecks(block, [20, 20, 90, 60], tolerance, px, lim, ['min-hole-size'])[0];
    expect(before.status).toBe('fail');
    expect(Math.abs(before.measured! - neck)).toBeLessThanOrEqual(px); // the check's resolution is pixel/2 per side
    const { polygons, actions } = runRepairs(['fill-holes'], inp);
    // the check runner is the judge (src/check/run.ts)
    expect(sizeChecks(polygons, [20, 20, 90, 60], tolerance, px, lim, ['min-hole-size'])[0].status).toBe('pass');
    expect(actions[0].unresolved).toBeNull();
    // only material is added, and only near the notch: everything added lies in the notch's bounding box
    expect(actions[0].area).toBeGreaterThan(0);
    const added = actions[0].changed.polygons.flatMap((p) => p.outer);
    for (const q of added) {
      expect(q[0]).toBeGreaterThanOrEqual(A[0] - 1e-6);
      expect(q[0]).toBeLessThanOrEqual(E[0] + 1e-6);
      expect(q[1]).toBeGreaterThanOrEqual(A[1] - 1e-6);
      expect(q[1]).toBeLessThanOrEqual(D[1] + 1e-6);
    }
  });
});
