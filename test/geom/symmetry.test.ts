import { missingImage } from '../support/mirror-image.js';
import { describe, expect, it } from 'vitest';
import type { MirrorPlane } from '../../src/field/mirror.js';
import { symmetricArea, symmetrize } from '../../src/geom/symmetry.js';
import type { Point, PolygonSet, Ring } from '../../src/types.js';

// Sources: analytic reflections and areas, and an independent half-plane clip written here
// (Sutherland & Hodgman, "Reentrant polygon clipping", CACM 17(1):32–42, 1974, doi:10.1145/360767.360802)
// with the shoelace formula, so the kept half's area never comes from the boolean engine under test.

type Domain = readonly [number, number, number, number];

/** Sutherland–Hodgman clip of a ring to the half-plane {axis ≥ at} ('above') or {axis ≤ at} ('below'). */
function clipHalf(ring: Ring, p: MirrorPlane): Point[] {
  const k = p.axis === 'x' ? 0 : 1;
  const inside = (v: Point) => (p.keep === 'above' ? v[k] >= p.at : v[k] <= p.at);
  const out: Point[] = [];
  for (let i = 0; i < ring.length; i++) {
    const a = ring[i];
    const b = ring[(i + 1) % ring.length];
    if (inside(a)) out.push(a);
    if (inside(a) !== inside(b)) {
      const t = (p.at - a[k]) / (b[k] - a[k]);
      out.push([a[0] + t * (b[0] - a[0]), a[1] + t * (b[1] - a[1])]);
    }
  }
  return out;
}

/** Shoelace area (independent of src/geom/area.ts). */
function shoelace(r: readonly Point[]): number {
  let s = 0;
  for (let i = 0; i < r.length; i++) {
    const [x0, y0] = r[i];
    const [x1, y1] = r[(i + 1) % r.length];
    s += x0 * y1 - x1 * y0;
  }
  return s / 2;
}

/** A lopsided star-shaped ring (counter-clockwise) with no symmetry: r(θ) = R(1 + 0.3 sin(3θ + 0.7) + 0.1 cos 5θ). */
function blob(cx: number, cy: number, R: number, n = 97): Point[] {
  const out: Point[] = [];
  for (let k = 0; k < n; k++) {
    const t = (2 * Math.PI * k) / n;
    const r = R * (1 + 0.3 * Math.sin(3 * t + 0.7) + 0.1 * Math.cos(5 * t));
    out.push([cx + r * Math.cos(t), cy + r * Math.sin(t)]);
  }
  return out;
}

/** Area of a polygon set: shoelace over every ring (holes are clockwise, so they subtract). */
const setArea = (s: PolygonSet): number => s.polygons.reduce((a, p) => a + shoelace(p.outer) + p.holes.reduce((b, h) => b + shoelace(h), 0), 0);
const ringArea = (r: Ring): number => shoelace(r);

/** Perimeter of a polygon set (every ring). */
const perimeter = (s: PolygonSet): number =>
  s.polygons.flatMap((p) => [p.outer, ...p.holes]).reduce((a, r) => a + r.reduce((b, v, i) => b + Math.hypot(r[(i + 1) % r.length][0] - v[0], r[(i + 1) % r.length][1] - v[1]), 0), 0);

/**
 * The booleans round every vertex to a multiple of q = 2^⌈log2(2·extent / 2^29)⌉ mm (src/geom/clipper.ts; the
 * extent here is under 32 mm, so q ≤ 2^-23): the area can change by at most perimeter × q.
 */
const areaBound = (s: PolygonSet): number => perimeter(s) * 2 ** -23;

const vertices = (s: PolygonSet): Point[] => s.polygons.flatMap((p) => [p.outer, ...p.holes].flat());

/** Every vertex has its image under `map` among the vertices, within `tol` mm. */
function expectInvariant(s: PolygonSet, map: (v: Point) => Point, tol = 1e-9): void {
  expect(vertices(s).length).toBeGreaterThan(0);
  const miss = missingImage(s, map, tol);
  if (miss) throw new Error(`vertex (${miss.v[0]}, ${miss.v[1]}) has no mirror image near (${miss.w[0]}, ${miss.w[1]})`);
}

function expectOriented(s: PolygonSet): void {
  for (const p of s.polygons) {
    expect(ringArea(p.outer)).toBeGreaterThan(0); // DESIGN §3: outer rings counter-clockwise
    for (const h of p.holes) expect(ringArea(h)).toBeLessThan(0); // holes clockwise
  }
}

describe('symmetrize', () => {
  it('one plane through a lopsided shape: mirror-invariant vertices, one polygon, area = 2 × the kept half', () => {
    // plane x = 2.1 (not a binary fraction: the plane is not on Clipper's integer lattice in the original frame)
    const at = 0.3 * 7;
    const plane: MirrorPlane = { axis: 'x', at, keep: 'above' };
    const domain: Domain = [at - 10, 0, at + 10, 12];
    const ring = blob(at + 1.3, 6, 4);
    const set: PolygonSet = { polygons: [{ outer: ring, holes: [] }] };
    const copy = JSON.stringify(set);
    const out = symmetrize(set, [plane], domain);
    expect(JSON.stringify(set)).toBe(copy); // input not modified
    expect(out.polygons.length).toBe(1); // seamless: the shape crosses the plane, the halves merge
    expect(out.polygons[0].holes.length).toBe(0);
    expectOriented(out);
    expectInvariant(out, ([x, y]) => [2 * at - x, y]); // analytic: reflection in x = at
    // analytic: the result is the kept half and its mirror image, which have equal areas
    const half = shoelace(clipHalf(ring, plane));
    expect(Math.abs(setArea(out) - 2 * half)).toBeLessThan(areaBound(out));
    expect(Math.abs(symmetricArea(set, [plane]) - 2 * half)).toBeLessThan(1e-9 * half); // same area without booleans
    // no seam: at most the two points where the outline crosses the plane lie on it
    const onPlane = vertices(out).filter(([x]) => Math.abs(x - at) < 1e-9);
    expect(onPlane.length).toBeLessThanOrEqual(2);
  });

  it('each side of each axis keeps the input side (right, bottom, top), area = 2 × the kept half', () => {
    const ring = blob(0.4, -0.7, 3);
    const domain: Domain = [-8, -8, 8, 8];
    for (const plane of [
      { axis: 'x', at: 0, keep: 'below' },
      { axis: 'y', at: 0, keep: 'above' },
      { axis: 'y', at: 0, keep: 'below' },
    ] as MirrorPlane[]) {
      const out = symmetrize({ polygons: [{ outer: ring, holes: [] }] }, [plane], domain);
      expect(out.polygons.length).toBe(1);
      expectOriented(out);
      expectInvariant(out, ([x, y]) => (plane.axis === 'x' ? [-x, y] : [x, -y]));
      const half = shoelace(clipHalf(ring, plane));
      expect(Math.abs(setArea(out) - 2 * half)).toBeLessThan(areaBound(out));
      // the kept side is the input's: its vertices are the input's within the quantum (q ≤ 2^-24 mm here)
      const k = plane.axis === 'x' ? 0 : 1;
      const kept = ring.filter((v) => (plane.keep === 'above' ? v[k] > 1e-6 : v[k] < -1e-6));
      const vs = vertices(out);
      for (const v of kept) expect(vs.some((w) => Math.hypot(w[0] - v[0], w[1] - v[1]) < 1e-6)).toBe(true);
    }
  });

  it('a rectangle across the plane becomes the symmetric rectangle: 4 vertices, no seam (analytic)', () => {
    const out = symmetrize(
      { polygons: [{ outer: [[-3, 1], [5, 1], [5, 4], [-3, 4]], holes: [] }] },
      [{ axis: 'x', at: 0, keep: 'above' }],
      [-6, 0, 6, 5],
    );
    expect(out.polygons.length).toBe(1);
    // analytic: [0, 5] × [1, 4] and its image = [−5, 5] × [1, 4], area 30
    expect(setArea(out)).toBe(30);
    expect([...out.polygons[0].outer].map((p) => p.join(',')).sort()).toEqual(['-5,1', '-5,4', '5,1', '5,4']);
  });

  it('a hole across the plane stays one hole; pieces off the plane are doubled or dropped (analytic areas)', () => {
    // outer 2..8 × 0..6 around the plane x = 4 (keep below), hole 3..5 × 2..4 across it; a square 0.5..1.5 × 1..2
    // on the kept side (doubled) and one at 6.5..7.5 × 7..8 on the discarded side (dropped)
    const sq = (x0: number, y0: number, x1: number, y1: number): Point[] => [[x0, y0], [x1, y0], [x1, y1], [x0, y1]];
    const set: PolygonSet = {
      polygons: [
        { outer: sq(2, 0, 7, 6), holes: [sq(3, 2, 5.5, 4).reverse()] },
        { outer: sq(0.5, 1, 1.5, 2), holes: [] },
        { outer: sq(6.5, 7, 7.5, 8), holes: [] },
      ],
    };
    const out = symmetrize(set, [{ axis: 'x', at: 4, keep: 'below' }], [0, 0, 8, 9]);
    expectOriented(out);
    expectInvariant(out, ([x, y]) => [8 - x, y]);
    const withHole = out.polygons.filter((p) => p.holes.length > 0);
    expect(withHole.length).toBe(1);
    expect(withHole[0].holes.length).toBe(1);
    expect(out.polygons.length).toBe(3);
    // analytic: kept part of the frame = (4 − 2)·6 − (4 − 3)·2 = 10, doubled = 20; the small square doubled = 2
    expect(setArea(out)).toBeCloseTo(22, 9);
    expect(symmetricArea(set, [{ axis: 'x', at: 4, keep: 'below' }])).toBeCloseTo(22, 12);
  });

  it('a quarter model (two planes) is 4-fold symmetric; area = 4 × the kept quadrant; domain edges exact', () => {
    // input quadrant [0, W] × [0, H] of a left+bottom unfolding; W, H not binary fractions
    const W = 0.3 * 37;
    const H = 0.7 * 13;
    const domain: Domain = [-W, -H, W, H];
    const planes: MirrorPlane[] = [
      { axis: 'x', at: 0, keep: 'above' },
      { axis: 'y', at: 0, keep: 'above' },
    ];
    // a blob across both planes, a strip reaching the far domain edge x = W, and a piece across the x plane only
    const strip: Point[] = [[W - 2, 3], [W, 3], [W, 4.5], [W - 2, 4.5]];
    const set: PolygonSet = {
      polygons: [
        { outer: blob(0.6, -0.4, 2.5), holes: [] },
        { outer: strip, holes: [] },
        { outer: blob(-0.3, 6.5, 1.2, 61), holes: [] },
      ],
    };
    const out = symmetrize(set, planes, domain);
    expectOriented(out);
    expectInvariant(out, ([x, y]) => [-x, y]);
    expectInvariant(out, ([x, y]) => [x, -y]);
    expectInvariant(out, ([x, y]) => [-x, -y]);
    // pieces: the centre blob (1), the strip in each quadrant (4), the upper/lower blob across x = 0 (2)
    expect(out.polygons.length).toBe(7);
    let quadrant = 0;
    for (const p of set.polygons) quadrant += shoelace(clipHalf(clipHalf(p.outer, planes[0]), planes[1]));
    expect(Math.abs(setArea(out) - 4 * quadrant)).toBeLessThan(areaBound(out));
    expect(Math.abs(symmetricArea(set, planes) - 4 * quadrant)).toBeLessThan(1e-9 * quadrant); // same area without booleans
    // the strip reaches both far edges exactly (hard domain edge, DESIGN §3)
    const xs = vertices(out).map((v) => v[0]);
    expect(xs).toContain(W);
    expect(xs).toContain(-W);
    expect(Math.max(...xs)).toBe(W);
    expect(Math.min(...xs)).toBe(-W);
  });

  it('no planes: the set itself; an empty set stays empty; a set wholly on the far side vanishes', () => {
    const set: PolygonSet = { polygons: [{ outer: blob(3, 3, 1), holes: [] }] };
    expect(symmetrize(set, [], [0, 0, 6, 6])).toBe(set);
    expect(symmetrize({ polygons: [] }, [{ axis: 'x', at: 0, keep: 'above' }], [-6, 0, 6, 6]).polygons).toEqual([]);
    expect(symmetrize(set, [{ axis: 'x', at: 0, keep: 'below' }], [-6, 0, 6, 6]).polygons).toEqual([]);
  });

  it('refuses two planes on one axis', () => {
    const set: PolygonSet = { polygons: [{ outer: blob(0, 0, 1), holes: [] }] };
    const p: MirrorPlane = { axis: 'x', at: 0, keep: 'above' };
    expect(() => symmetrize(set, [p, { ...p, at: 1 }], [-2, -2, 2, 2])).toThrow(/one plane per axis/);
  });
});
