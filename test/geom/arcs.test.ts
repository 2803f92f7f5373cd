/**
 * `--arcs`: circular arcs and lines through the outline's vertices within the outline tolerance of the raw
 * contour (src/geom/arcs.ts, src/write/arcs-outline.ts). Checked against analytic shapes: a disc (πr²), a
 * rectangle (four lines), and on the demo the distance of the written arcs, as dxf-parser reads them back, from
 * the raw iso-contour.
 */
import { readFileSync } from 'node:fs';
import type { ILwpolylineEntity } from 'dxf-parser';
import { describe, expect, it } from 'vitest';
import { bulgeCentre, bulgeRadius, bulgeSegmentArea } from '../../src/geom/bulge.js';
import { fitOutlineArcs } from '../../src/write/arcs-outline.js';
import { circumscribedRadius, circumscribedSegments } from '../../src/geom/circle.js';
import { passiveCircleTolerance } from '../../src/passive/exact.js';
import { flattenSet } from '../../src/geom/flat.js';
import { locatedDeviation } from '../../src/geom/hausdorff.js';
import { build } from '../../src/pipeline.js';
import { resolveSettings } from '../../src/settings.js';
import type { Point, PolygonSet } from '../../src/types.js';
import { parseDxf } from '../support/dxf-parser.js';

const circle = (cx: number, cy: number, r: number, n: number): Point[] =>
  Array.from({ length: n }, (_, k): Point => [cx + r * Math.cos((2 * Math.PI * k) / n), cy + r * Math.sin((2 * Math.PI * k) / n)]);

/** Signed area of a ring with bulges: shoelace plus each arc's circular segment (analytic, src/geom/bulge.ts). */
function bulgedArea(pts: readonly Point[], bulges: readonly number[]): number {
  let a = 0;
  for (let i = 0; i < pts.length; i++) {
    const [ax, ay] = pts[i];
    const [bx, by] = pts[(i + 1) % pts.length];
    a += (ax * by - bx * ay) / 2 + bulgeSegmentArea(Math.hypot(bx - ax, by - ay), bulges[i]);
  }
  return a;
}

describe('bulge geometry (analytic)', () => {
  it('a half circle has bulge 1: radius c/2, segment area πr²/2, centre at the chord midpoint', () => {
    expect(bulgeRadius(2, 1)).toBeCloseTo(1, 15);
    expect(bulgeSegmentArea(2, 1)).toBeCloseTo(Math.PI / 2, 14);
    expect(bulgeSegmentArea(2, -1)).toBeCloseTo(-Math.PI / 2, 14);
    expect(bulgeCentre(-1, 0, 1, 0, 1)).toEqual([0, 0]);
  });

  it('a quarter circle of radius r: bulge tan(π/8), segment area r²(π/2 − 1)/2, centre to the left for b > 0', () => {
    const b = Math.tan(Math.PI / 8);
    // from (r, 0) to (0, r) counter-clockwise about the origin
    const r = 3;
    expect(bulgeRadius(r * Math.SQRT2, b)).toBeCloseTo(r, 13);
    expect(bulgeSegmentArea(r * Math.SQRT2, b)).toBeCloseTo((r * r * (Math.PI / 2 - 1)) / 2, 13);
    const [cx, cy] = bulgeCentre(r, 0, 0, r, b);
    expect(cx).toBeCloseTo(0, 13);
    expect(cy).toBeCloseTo(0, 13);
  });
});

describe('fitOutlineArcs', () => {
  const domain = [0, 0, 100, 100] as const;
  const fit = (set: PolygonSet, tolerance: number) =>
    fitOutlineArcs({ polygons: set, ringCircles: [], passive: null, domain, tolerance, raw: set });

  it('a 720-gon disc of radius 30 becomes a handful of arcs with the area within 0.1 % of πr² (analytic)', () => {
    const r = 30;
    const set: PolygonSet = { polygons: [{ outer: circle(50, 50, r, 720), holes: [] }] };
    const res = fit(set, 0.05);
    const ring = res.polygons.polygons[0].outer;
    const bulges = res.bulges[0][0] ?? [];
    expect(res.summary.segmentsBefore).toBe(720);
    expect(res.summary.arcs).toBeGreaterThanOrEqual(2); // each arc sweeps at most 180°
    expect(res.summary.arcs).toBeLessThanOrEqual(6);
    expect(bulges.filter((b) => b !== 0)).toHaveLength(res.summary.arcs);
    expect(Math.abs(bulgedArea(ring, bulges) - Math.PI * r * r) / (Math.PI * r * r)).toBeLessThan(0.001);
    expect(res.summary.maxDeviation).toBeLessThanOrEqual(0.05);
  });

  it('a hole (clockwise) gets clockwise arcs: the area stays negative, −πr² within 0.1 %', () => {
    const r = 20;
    const hole = circle(50, 50, r, 360).reverse();
    const set: PolygonSet = { polygons: [{ outer: [[0, 0], [100, 0], [100, 100], [0, 100]], holes: [hole] }] };
    const res = fit(set, 0.05);
    const ring = res.polygons.polygons[0].holes[0];
    const bulges = res.bulges[0][1] ?? [];
    expect(bulges.every((b) => b <= 0)).toBe(true);
    expect(Math.abs(bulgedArea(ring, bulges) + Math.PI * r * r) / (Math.PI * r * r)).toBeLessThan(0.001);
    // the square touching the domain edge keeps its four corners and straight sides
    expect(res.polygons.polygons[0].outer).toEqual([[0, 0], [100, 0], [100, 100], [0, 100]]);
  });

  it('a rectangle with many collinear vertices stays four lines', () => {
    const outer: Point[] = [];
    for (let x = 10; x < 90; x += 5) outer.push([x, 20]);
    for (let y = 20; y < 70; y += 5) outer.push([90, y]);
    for (let x = 90; x > 10; x -= 5) outer.push([x, 70]);
    for (let y = 70; y > 20; y -= 5) outer.push([10, y]);
    const res = fit({ polygons: [{ outer, holes: [] }] }, 0.25);
    expect(res.polygons.polygons[0].outer).toEqual([[10, 20], [90, 20], [90, 70], [10, 70]]);
    expect(res.bulges[0][0]).toEqual([0, 0, 0, 0]);
    expect(res.summary.arcs).toBe(0);
  });

  it('a passive void circle stays void: the arcs of its circumscribed polygon never enter the disc', () => {
    const r = 10;
    const tolerance = 0.5;
    // the hole as src/passive/exact.ts cuts it: the circumscribed polygon within tolerance / 16, clockwise
    const n = circumscribedSegments(r, passiveCircleTolerance(tolerance));
    const hole = circle(50, 50, circumscribedRadius(r, n), n).reverse();
    const set: PolygonSet = { polygons: [{ outer: [[0, 0], [100, 0], [100, 100], [0, 100]], holes: [hole] }] };
    const passive = { regions: [{ role: 'void' as const, shape: { kind: 'circle' as const, cx: 50, cy: 50, r }, name: null, path: 'regions[0]' }] };
    const res = fitOutlineArcs({ polygons: set, ringCircles: [], passive, domain, tolerance, raw: set });
    const ring = res.polygons.polygons[0].holes[0];
    const bulges = res.bulges[0][1] ?? [];
    expect(bulges.some((b) => b !== 0)).toBe(true);
    ring.forEach(([ax, ay], i) => {
      const [bx, by] = ring[(i + 1) % ring.length];
      // every arc's points are at its radius from its centre; the nearest of them to the disc centre is at
      // least |centre offset − radius| away (analytic)
      if (bulges[i] === 0) return;
      const [cx, cy] = bulgeCentre(ax, ay, bx, by, bulges[i]);
      const rr = bulgeRadius(Math.hypot(bx - ax, by - ay), bulges[i]);
      expect(rr - Math.hypot(cx - 50, cy - 50)).toBeGreaterThanOrEqual(r - 1e-9);
    });
  });
});

describe('--arcs on the demo (dxf-parser reads the bulges back)', () => {
  it('the written outline stays within --tolerance of the raw iso-contour, with fewer segments', () => {
    const bytes = readFileSync(new URL('../../fixtures/grids/demo-bracket.npy', import.meta.url));
    const res = build({ name: 'demo-bracket.npy', bytes }, resolveSettings({ cellSize: [2, 2], arcs: true }));
    const fitReport = res.report.geometry.arcFit;
    expect(fitReport).toBeDefined();
    expect(fitReport!.arcs).toBeGreaterThan(0);
    expect(fitReport!.segmentsAfter).toBeLessThan(fitReport!.segmentsBefore);
    const tolerance = res.report.smoothing.tolerance;
    // the file's rings, each arc sampled every 0.01 mm (analytic points on the circle of its bulge)
    const dxf = parseDxf(res.dxf());
    const rings: Point[][] = [];
    let bulgeCount = 0;
    for (const e of dxf.entities) {
      if (e.type !== 'LWPOLYLINE') continue;
      const v = (e as ILwpolylineEntity).vertices as { x: number; y: number; bulge?: number }[];
      const pts: Point[] = [];
      v.forEach((p, i) => {
        const q = v[(i + 1) % v.length];
        pts.push([p.x, p.y]);
        if (!p.bulge) return;
        bulgeCount++;
        const [cx, cy] = bulgeCentre(p.x, p.y, q.x, q.y, p.bulge);
        const r = Math.hypot(p.x - cx, p.y - cy);
        const a0 = Math.atan2(p.y - cy, p.x - cx);
        const sweep = 4 * Math.atan(p.bulge);
        const steps = Math.ceil((r * Math.abs(sweep)) / 0.01);
        for (let k = 1; k < steps; k++) pts.push([cx + r * Math.cos(a0 + (sweep * k) / steps), cy + r * Math.sin(a0 + (sweep * k) / steps)]);
      });
      rings.push(pts);
    }
    expect(bulgeCount).toBe(fitReport!.arcs);
    const written: PolygonSet = { polygons: rings.map((outer) => ({ outer, holes: [] })) };
    const dev = locatedDeviation(flattenSet(written), flattenSet(res.raw), 0.01, Infinity);
    // DESIGN §6: --tolerance bounds the distance of the final outline from the raw contour (+ the file's rounding)
    expect(dev.upper).toBeLessThanOrEqual(tolerance + 1e-6);
    expect(fitReport!.maxDeviation).toBeLessThanOrEqual(tolerance);
  }, 120_000);
});
