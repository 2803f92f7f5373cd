import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { polygonSetArea, ringArea } from '../../src/geom/area.js';
import { booleanOp, ringsOf } from '../../src/geom/clipper.js';
import { applyPassiveExact } from '../../src/passive/exact.js';
import { parsePassive } from '../../src/passive/parse.js';
import { passiveRings } from '../../src/passive/rings.js';
import type { PassiveRegion, PassiveRegions, PassiveShape } from '../../src/passive/types.js';
import { build } from '../../src/pipeline.js';
import { resolveSettings } from '../../src/settings.js';
import type { PolygonSet, Ring } from '../../src/types.js';

const region = (role: 'solid' | 'void', shape: PassiveShape, k = 0): PassiveRegion => ({ role, shape, name: null, path: `regions[${k}]` });
const regionsOf = (...r: PassiveRegion[]): PassiveRegions => ({ regions: r });
const rectRing = (x0: number, y0: number, x1: number, y1: number): Ring => [
  [x0, y0],
  [x1, y0],
  [x1, y1],
  [x0, y1],
];
const rectSet = (x0: number, y0: number, x1: number, y1: number): PolygonSet => ({ polygons: [{ outer: rectRing(x0, y0, x1, y1), holes: [] }] });

/** analytic: area of the regular n-gon inscribed in a circle of radius r, (n/2) r² sin(2π/n). */
const inscribed = (n: number, r: number): number => (n / 2) * r * r * Math.sin((2 * Math.PI) / n);
/** analytic: sagitta of a chord spanning 2π/n on a circle of radius r, r (1 − cos(π/n)). */
const sagitta = (n: number, r: number): number => r * (1 - Math.cos(Math.PI / n));
/** analytic: area of the circular segment cut off by a chord at distance d from the centre, r² acos(d/r) − d √(r² − d²). */
const segment = (r: number, d: number): number => r * r * Math.acos(d / r) - d * Math.sqrt(r * r - d * d);

const TOL = 0.5; // outline tolerance, mm: circles within TOL / 4 (inscribed), passive circles within TOL / 16 (circumscribed)
/** How far outside its circle a passive circle's circumscribed polygon reaches at most (passiveCircleTolerance). */
const OUT = TOL / 16;
const AREA_EPS = 1e-5; // mm²: vertices are rounded to a quantum of ~2.4e-7 mm; perimeter × quantum ≈ 1e-5
/** analytic: the fewest vertices of an inscribed regular polygon with sagitta ≤ s (the polygonisation rule; the tool
 * uses at least 8, and every circle here needs more). */
const fewest = (r: number, s: number): number => {
  let n = 3;
  while (sagitta(n, r) > s) n++;
  return n;
};
/** analytic: area of the regular n-gon circumscribed about a circle of radius r, n r² tan(π/n). */
const circumscribed = (n: number, r: number): number => n * r * r * Math.tan(Math.PI / n);
/** analytic: how far the vertices of the circumscribed n-gon lie outside the circle, r (1/cos(π/n) − 1). */
const overshoot = (n: number, r: number): number => r * (1 / Math.cos(Math.PI / n) - 1);
/** analytic: the fewest vertices of a circumscribed regular polygon whose vertices lie within s of the circle (at least 8). */
const fewestOutside = (r: number, s: number): number => {
  let n = 8;
  while (overshoot(n, r) > s) n++;
  return n;
};

describe('applyPassiveExact', () => {
  it('a 100 × 60 plate minus a void circle Ø10 at (30, 30): area 6000 − circumscribed polygon, one RingCircle r 5 at (30, 30)', () => {
    const set = rectSet(0, 0, 100, 60);
    const snapshot = JSON.stringify(set);
    const res = applyPassiveExact(set, regionsOf(region('void', { kind: 'circle', cx: 30, cy: 30, r: 5 })), [0, 0, 100, 60], TOL);
    expect(res.polygons.polygons).toHaveLength(1);
    const hole = res.polygons.polygons[0].holes[0];
    expect(res.polygons.polygons[0].holes).toHaveLength(1);
    expect(ringArea(hole)).toBeLessThan(0); // holes clockwise (DESIGN §3)
    const n = hole.length;
    expect(n).toBe(fewestOutside(5, OUT)); // polygonised within tolerance/16 outside the circle, with no more vertices than needed
    const area = polygonSetArea(res.polygons);
    expect(Math.abs(area - (6000 - circumscribed(n, 5)))).toBeLessThan(AREA_EPS);
    // the polygon contains the disc: never more material than the true answer 6000 − π·25 (analytic), and
    // within the polygonisation bound of it
    expect(area - (6000 - Math.PI * 25)).toBeLessThan(0);
    expect(6000 - Math.PI * 25 - area).toBeLessThanOrEqual(2 * Math.PI * (5 + OUT) * OUT);
    expect(res.ringCircles).toEqual([{ polygon: 0, ring: 1, x: 30, y: 30, r: 5 }]);
    expect(res.solidRings).toEqual([]);
    expect(JSON.stringify(set)).toBe(snapshot); // input unchanged
  });

  it('a void circle cut by the outline stays polygonal (no RingCircle); removed area = disc minus the segment outside the material', () => {
    // material 80 × 60 in a 100 × 60 domain; circle r 5 at (77, 30) crosses the material edge x = 80 at d = 3
    const r = 5;
    const d = 3;
    const res = applyPassiveExact(rectSet(0, 0, 80, 60), regionsOf(region('void', { kind: 'circle', cx: 80 - d, cy: 30, r })), [0, 0, 100, 60], TOL);
    expect(res.ringCircles).toEqual([]);
    expect(res.polygons.polygons).toHaveLength(1);
    expect(res.polygons.polygons[0].holes).toHaveLength(0); // the bite is part of the outer ring
    const exact = 4800 - (Math.PI * r * r - segment(r, d)); // analytic: disc area inside the material
    // the circumscribed polygon contains the disc, so at least the disc's part is removed, and at most the
    // polygon's whole excess over the disc more (analytic)
    const excess = circumscribed(fewestOutside(r, OUT), r) - Math.PI * r * r;
    const area = polygonSetArea(res.polygons);
    expect(area).toBeLessThanOrEqual(exact + AREA_EPS);
    expect(exact - area).toBeLessThanOrEqual(excess + AREA_EPS);
  });

  it('a void circle crossing the domain edge: clipped there, no RingCircle, area by the segment formula', () => {
    const r = 5;
    const d = 2;
    const res = applyPassiveExact(rectSet(0, 0, 100, 60), regionsOf(region('void', { kind: 'circle', cx: 30, cy: 60 - d, r })), [0, 0, 100, 60], TOL);
    expect(res.ringCircles).toEqual([]);
    const exact = 6000 - (Math.PI * r * r - segment(r, d)); // analytic
    const area = polygonSetArea(res.polygons);
    expect(area).toBeLessThanOrEqual(exact + AREA_EPS);
    expect(exact - area).toBeLessThanOrEqual(circumscribed(fewestOutside(r, OUT), r) - Math.PI * r * r + AREA_EPS);
  });

  it('a solid pad adds only its uncovered part: 50 × 60 plate ∪ pad 40…70 × 20…30 = 3000 + 20 × 10', () => {
    const res = applyPassiveExact(rectSet(0, 0, 50, 60), regionsOf(region('solid', { kind: 'rect', x0: 40, y0: 20, x1: 70, y1: 30 })), [0, 0, 100, 60], TOL);
    expect(res.polygons.polygons).toHaveLength(1);
    expect(polygonSetArea(res.polygons)).toBeCloseTo(3200, 9); // analytic: inclusion–exclusion of rectangles
    expect(res.solidRings).toEqual([rectRing(40, 20, 70, 30)]);
    expect(ringArea(res.solidRings[0])).toBeGreaterThan(0); // counter-clockwise
  });

  it('void wins over solid, in either order: a bolt hole inside a pad stays a hole (and is a true circle)', () => {
    const pad = region('solid', { kind: 'rect', x0: 70, y0: 20, x1: 90, y1: 40 });
    const hole = region('void', { kind: 'circle', cx: 80, cy: 30, r: 5 }, 1);
    for (const rs of [regionsOf(pad, hole), regionsOf(hole, pad)]) {
      const res = applyPassiveExact(rectSet(0, 0, 70, 60), rs, [0, 0, 100, 60], TOL);
      expect(res.polygons.polygons).toHaveLength(1); // the pad touches the plate along x = 70: one piece
      const h = res.polygons.polygons[0].holes;
      expect(h).toHaveLength(1);
      // analytic: 70·60 + 20·20 minus the circumscribed polygon of the hole
      expect(Math.abs(polygonSetArea(res.polygons) - (4200 + 400 - circumscribed(h[0].length, 5)))).toBeLessThan(AREA_EPS);
      expect(res.ringCircles).toEqual([{ polygon: 0, ring: 1, x: 80, y: 30, r: 5 }]);
    }
  });

  it('a free-standing boss with its bolt hole: two true circles, the outer one a solid circle', () => {
    const res = applyPassiveExact(
      { polygons: [] },
      regionsOf(region('solid', { kind: 'circle', cx: 50, cy: 30, r: 12 }), region('void', { kind: 'circle', cx: 50, cy: 30, r: 5.5 }, 1)),
      [0, 0, 100, 60],
      TOL,
    );
    expect(res.polygons.polygons).toHaveLength(1);
    const p = res.polygons.polygons[0];
    // analytic: annulus between the two circumscribed polygons
    expect(Math.abs(polygonSetArea(res.polygons) - (circumscribed(p.outer.length, 12) - circumscribed(p.holes[0].length, 5.5)))).toBeLessThan(AREA_EPS);
    expect(p.outer.length).toBe(fewestOutside(12, OUT));
    expect(res.ringCircles).toEqual([
      { polygon: 0, ring: 0, x: 50, y: 30, r: 12 },
      { polygon: 0, ring: 1, x: 50, y: 30, r: 5.5 },
    ]);
    expect(res.solidRings).toHaveLength(1);
  });

  it('primitives outside the domain are clipped to it', () => {
    const res = applyPassiveExact(
      rectSet(0, 0, 50, 60),
      regionsOf(
        region('solid', { kind: 'rect', x0: 40, y0: 10, x1: 130, y1: 20 }), // reaches past x = 100
        region('solid', { kind: 'circle', cx: 150, cy: 30, r: 10 }, 1), // wholly outside
        region('solid', { kind: 'polygon', points: [[60, 50], [80, 50], [70, 75]] }, 2), // tip above y = 60
      ),
      [0, 0, 100, 60],
      TOL,
    );
    // analytic: 3000 + (100 − 50)·10 + triangle part below y = 60: 20·25/2 − (20·15/25)·15/2 (similar triangles)
    const triangle = (20 * 25) / 2 - ((20 * 15) / 25) * 15 / 2;
    expect(Math.abs(polygonSetArea(res.polygons) - (3000 + 500 + triangle))).toBeLessThan(AREA_EPS);
    let maxX = -Infinity;
    let maxY = -Infinity;
    for (const p of res.polygons.polygons) for (const [x, y] of p.outer) {
      maxX = Math.max(maxX, x);
      maxY = Math.max(maxY, y);
    }
    expect(maxX).toBe(100);
    expect(maxY).toBe(60);
    expect(res.solidRings).toHaveLength(3); // the primitives themselves, unclipped
  });

  it('no regions: the set comes back as it is', () => {
    const set = rectSet(0, 0, 10, 10);
    const res = applyPassiveExact(set, { regions: [] }, [0, 0, 10, 10], TOL);
    expect(res.polygons).toBe(set);
    expect(res.ringCircles).toEqual([]);
  });

  it('passiveRings: counter-clockwise rings; a clockwise polygon is reversed; circles within the sagitta tolerance', () => {
    const cw = passiveRings(region('solid', { kind: 'polygon', points: [[0, 0], [0, 4], [3, 0]] }), 0.1);
    expect(ringArea(cw)).toBeCloseTo(6, 12); // analytic: right triangle 3·4/2, now CCW
    const c = passiveRings(region('void', { kind: 'circle', cx: 1, cy: 2, r: 3 }), 0.01);
    expect(ringArea(c)).toBeGreaterThan(0);
    expect(sagitta(c.length, 3)).toBeLessThanOrEqual(0.01); // analytic sagitta bound
    for (const [x, y] of c) expect(Math.hypot(x - 1, y - 2)).toBeCloseTo(3, 12);
    expect(ringArea(passiveRings(region('solid', { kind: 'rect', x0: 1, y0: 2, x1: 4, y1: 7 }), 1))).toBe(15);
  });

  it('the demo bracket with its scenario file: both bolt holes come out as true circles inside solid bosses', () => {
    const bytes = readFileSync(new URL('../../fixtures/grids/demo-bracket.npy', import.meta.url));
    const built = build({ name: 'demo-bracket.npy', bytes }, resolveSettings({ cellSize: [2, 2] }));
    const regions = parsePassive(readFileSync(new URL('../../fixtures/passive/demo-bracket.passive.json', import.meta.url), 'utf8'), 'demo');
    const res = applyPassiveExact(built.smoothed.polygons, regions, [0, 0, 240, 120], built.report.smoothing.tolerance);
    // fixtures/grids/demo-bracket.md: M10 clearance holes Ø11 at (194, 30) and (224, 30), inside the passive-solid pad
    const bolts = res.ringCircles.filter((c) => c.r === 5.5).map((c) => [c.x, c.y]);
    expect(bolts.sort((a, b) => a[0] - b[0])).toEqual([
      [194, 30],
      [224, 30],
    ]);
    for (const c of res.ringCircles) {
      const p = res.polygons.polygons[c.polygon];
      const ring = c.ring === 0 ? p.outer : p.holes[c.ring - 1];
      // every vertex on the circumscribed polygon's circle, r / cos(π/n) (analytic)
      const R = c.r / Math.cos(Math.PI / ring.length);
      for (const [x, y] of ring) expect(Math.abs(Math.hypot(x - c.x, y - c.y) - R)).toBeLessThan(1e-6);
    }
    // the pad between the holes (x 200…218 clears both Ø11 holes, y 18…42) is all material: 18 × 24 mm² (analytic)
    const padCore = booleanOp('intersection', ringsOf(res.polygons), [rectRing(200, 18, 218, 42)]);
    expect(Math.abs(polygonSetArea(padCore) - 18 * 24)).toBeLessThan(AREA_EPS);
  });
});
