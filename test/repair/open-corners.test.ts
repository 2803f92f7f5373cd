import { describe, expect, it } from 'vitest';
import { buildMorphology } from '../../src/morph/index.js';
import { arcToleranceOf, marginOf } from '../../src/repair/common.js';
import { runRepairs } from '../../src/repair/index.js';
import type { RepairInput } from '../../src/repair/types.js';
import type { Point, PolygonSet } from '../../src/types.js';
import { type Box, poly, setArea, sizeChecks } from './support.js';

const R = 2; // tool radius, mm
const domain: Box = [0, 0, 60, 40];
const pixel = 0.25;
const tolerance = 0.25;
const limits = { minMember: null, minHole: null, toolRadius: R, minIslandArea: 0, minHoleArea: null };
// a block [0, 60] × [0, 30] with a square notch x ∈ [26, 34], y ∈ [20, 30] (width 8 ≥ 2R + margin) cut from its
// top edge: the notch's two bottom corners are sharp 90° concave corners of the solid
const notch: Point[] = [[0, 0], [60, 0], [60, 30], [34, 30], [34, 20], [26, 20], [26, 30], [0, 30]];
const part = { polygons: [poly(notch)] };

/** The same notch with its two bottom corners filleted with radius ρ (64 chords per quarter, vertices on the arc). */
function filleted(rho: number): Point[] {
  const pts: Point[] = [[0, 0], [60, 0], [60, 30], [34, 30]];
  const arc = (cx: number, cy: number, a0: number): void => {
    for (let k = 0; k <= 64; k++) {
      const t = a0 - ((Math.PI / 2) * k) / 64;
      pts.push([cx + rho * Math.cos(t), cy + rho * Math.sin(t)]);
    }
  };
  arc(34 - rho, 20 + rho, 0);
  arc(26 + rho, 20 + rho, -Math.PI / 2);
  pts.push([26, 30], [0, 30]);
  return pts;
}
const input: RepairInput = { polygons: part, domain, tolerance, limits, passiveSolid: [], passiveVoid: [], pixel };

describe('open-corners', () => {
  const { polygons, actions } = runRepairs(['open-corners'], input);
  const rho = R + marginOf(input, R, true);

  it('the inner-radius check fails before and passes after (real planner and runner)', () => {
    expect(sizeChecks(part, domain, tolerance, pixel, limits, ['min-inner-radius'])[0].status).toBe('fail');
    expect(sizeChecks(polygons, domain, tolerance, pixel, limits, ['min-inner-radius'])[0].status).toBe('pass');
    expect(polygons.polygons).toHaveLength(1);
    expect(actions[0].locations).toHaveLength(2);
    for (const l of actions[0].locations) expect(l.measured).toBeLessThanOrEqual(pixel / 2); // analytic: sharp corners, radius 0
  });

  it("the check's own method measures radius R (within δ and its resolution) at both notch corners", () => {
    // a wider probe tool (1.5 R) finds the new fillets and measures their radius (docs/checks/min-inner-radius.md)
    const probe = (s: PolygonSet) => buildMorphology(s, { domain, pixel }).corners(1.5 * R, 0.01);
    const survey = probe(polygons);
    expect(survey.places).toHaveLength(2);
    // the same method on an analytic notch whose corners are filleted with radius ρ (64 chords per quarter)
    const ideal = probe({ polygons: [poly(filleted(rho))] });
    expect(ideal.places).toHaveLength(2);
    for (const corner of [[26, 20], [34, 20]]) {
      const p = survey.places.find((q) => Math.hypot(q.x - corner[0], q.y - corner[1]) < 2 * R);
      expect(p).toBeDefined();
      // analytic: a disc of radius ρ = R + δ leaves a fillet of radius ρ in a 90° corner
      expect(Math.abs(p!.radius - R)).toBeLessThanOrEqual(rho - R + survey.resolution);
      expect(Math.abs(p!.radius - ideal.places[0].radius)).toBeLessThanOrEqual(survey.resolution);
    }
  });

  it('adds (1 − π/4)ρ² per corner (analytic), within the polygonisation of the arcs', () => {
    const added = setArea(polygons) - setArea(part);
    const expected = 2 * (1 - Math.PI / 4) * rho * rho;
    // each quarter arc of length πρ/2 lies within the arc tolerance of the true circle
    expect(Math.abs(added - expected)).toBeLessThanOrEqual(2 * arcToleranceOf(input, R, true) * (Math.PI * rho) / 2);
    expect(actions[0].area).toBeCloseTo(added, 6);
    // the added region lies within ρ of the two corners
    for (const p of actions[0].changed.polygons) {
      for (const [x, y] of p.outer) expect(Math.min(Math.hypot(x - 26, y - 20), Math.hypot(x - 34, y - 20))).toBeLessThanOrEqual(rho * Math.SQRT2 + 1e-6);
    }
  });

  it('fills a slot narrower than 2R (a tool of radius R cannot enter it)', () => {
    const slot: Point[] = [[0, 0], [60, 0], [60, 30], [31.5, 30], [31.5, 20], [28.5, 20], [28.5, 30], [0, 30]];
    const r = runRepairs(['open-corners'], { ...input, polygons: { polygons: [poly(slot)] } });
    // analytic: the slot is 3 × 10 = 30 mm², less the cap a disc of radius ρ resting on its top corners dips into
    const half = 1.5, h = Math.sqrt(rho * rho - half * half);
    const cap = rho * rho * Math.acos(h / rho) - h * half;
    const added = setArea(r.polygons) - 60 * 30 + 30;
    // within the fillet's arc tolerance and that of the dilated corners the arc hangs from (common.ts closing)
    const arcs = arcToleranceOf(input, R, true) + arcToleranceOf(input, R);
    expect(Math.abs(added - (30 - cap))).toBeLessThanOrEqual(arcs * 2 * rho * Math.asin(half / rho));
    expect(sizeChecks(r.polygons, domain, tolerance, pixel, limits, ['min-inner-radius'])[0].status).toBe('pass');
  });

  it('leaves an outline that passes exactly as it is', () => {
    const plain = { polygons: [poly([[0, 0], [60, 0], [60, 30], [0, 30]])] };
    const r = runRepairs(['open-corners'], { ...input, polygons: plain });
    expect(r.polygons).toBe(plain);
    expect(r.actions[0].area).toBe(0);
  });
});
