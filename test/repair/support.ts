/**
 * Helpers for the repair tests: a check context with the real morphology engine, the size checks run through
 * the real planner and runner, and plain-geometry measures (independent of the repair code).
 */
import { planChecks } from '../../src/check/registry.js';
import { runChecks } from '../../src/check/run.js';
import type { CheckContext } from '../../src/check/types.js';
import type { CheckId } from '../../src/check/ids.js';
import { buildMorphology } from '../../src/morph/index.js';
import type { Morphology } from '../../src/morph/types.js';
import type { RepairLimits } from '../../src/repair/types.js';
import { resolveSettings } from '../../src/settings.js';
import type { CheckResult, Point, Polygon, PolygonSet, Ring } from '../../src/types.js';
import { booleanOp, ringsOf } from '../../src/geom/clipper.js';
import { makeContext } from '../check/context.js';
import { rng } from '../support/random.js';

export type Box = readonly [number, number, number, number];

/** A check context over `polygons` whose morphology is the real engine at `pixel` mm. */
export function realContext(polygons: PolygonSet, domain: Box, tolerance: number, pixel: number, passiveSolid?: readonly Ring[]): CheckContext {
  const base = makeContext({ polygons, domain, tolerance });
  let m: Morphology | undefined;
  return { ...base, passiveSolid, morphology: () => (m ??= buildMorphology(polygons, { domain, pixel })) };
}

/** The size checks (member, hole, inner radius, islands, small holes) with the given limits, through planChecks/runChecks. */
export function sizeChecks(polygons: PolygonSet, domain: Box, tolerance: number, pixel: number, limits: RepairLimits, only?: readonly CheckId[]): CheckResult[] {
  const settings = resolveSettings({ minIslandArea: limits.minIslandArea, minHoleArea: limits.minHoleArea });
  const size: CheckId[] = ['min-member-size', 'min-hole-size', 'min-inner-radius', 'islands', 'small-holes'];
  const planned = planChecks(settings, { tolerance, mode: 'volume', limits: { minMember: limits.minMember, minHole: limits.minHole, toolRadius: limits.toolRadius } })
    .filter((p) => size.includes(p.def.id) && (!only || only.includes(p.def.id)));
  return runChecks(planned, realContext(polygons, domain, tolerance, pixel), () => ({ fileRow: 1, fileCol: 1 }));
}

/** Shoelace area of a ring (mm², signed), written independently of src/geom. */
export function shoelace(ring: Ring): number {
  let a = 0;
  for (let k = 0; k < ring.length; k++) {
    const p = ring[k], q = ring[(k + 1) % ring.length];
    a += p[0] * q[1] - q[0] * p[1];
  }
  return a / 2;
}

/** Net area of a polygon set (mm²): outer rings positive, holes negative. */
export function setArea(s: PolygonSet): number {
  let a = 0;
  for (const p of s.polygons) {
    a += Math.abs(shoelace(p.outer));
    for (const h of p.holes) a -= Math.abs(shoelace(h));
  }
  return a;
}

/** The y values where the rings of `s` cross the vertical line x = x0, sorted. */
export function crossingsAt(s: PolygonSet, x0: number): number[] {
  const ys: number[] = [];
  for (const p of s.polygons) {
    for (const r of [p.outer, ...p.holes]) {
      for (let k = 0; k < r.length; k++) {
        const a = r[k], b = r[(k + 1) % r.length];
        if ((a[0] > x0) !== (b[0] > x0)) ys.push(a[1] + ((x0 - a[0]) * (b[1] - a[1])) / (b[0] - a[0]));
      }
    }
  }
  return ys.sort((u, v) => u - v);
}

/** Axis-aligned rectangle, counter-clockwise. */
export const rect = (x0: number, y0: number, x1: number, y1: number): Point[] => [[x0, y0], [x1, y0], [x1, y1], [x0, y1]];

/** A circle of radius r as an n-gon with vertices on the circle, counter-clockwise. */
export function circle(cx: number, cy: number, r: number, n = 256): Point[] {
  return Array.from({ length: n }, (_, k) => [cx + r * Math.cos((2 * Math.PI * k) / n), cy + r * Math.sin((2 * Math.PI * k) / n)] as Point);
}

/** Area of a regular n-gon of circumradius r (analytic): (n/2)·r²·sin(2π/n). */
export const ngonArea = (r: number, n: number): number => (n / 2) * r * r * Math.sin((2 * Math.PI) / n);

export const hole = (ring: Ring): Point[] => [...ring].reverse();

export const poly = (outer: Ring, ...holes: Ring[]): Polygon => ({ outer, holes });

/** A rectangle of length l and width w centred at (cx, cy), turned by angle a (radians), counter-clockwise. */
function bar(cx: number, cy: number, l: number, w: number, a: number): Point[] {
  const c = Math.cos(a), s = Math.sin(a);
  return ([[-l / 2, -w / 2], [l / 2, -w / 2], [l / 2, w / 2], [-l / 2, w / 2]] as const).map(([u, v]) => [cx + u * c - v * s, cy + u * s + v * c] as Point);
}

/** A random part in [0, 100] × [0, 60] mm: a union of discs, blocks and thin bars, minus a few small discs, clipped to the domain. */
export function randomPart(seed: number): PolygonSet {
  const r = rng(seed);
  const U = (a: number, b: number) => a + (b - a) * r();
  const solid: Point[][] = [];
  const n = 3 + Math.floor(r() * 6);
  for (let k = 0; k < n; k++) {
    const kind = r();
    if (kind < 0.35) solid.push(circle(U(0, 100), U(0, 60), U(2, 14), 96));
    else if (kind < 0.7) solid.push(bar(U(0, 100), U(0, 60), U(5, 40), U(5, 25), U(0, Math.PI)));
    else solid.push(bar(U(10, 90), U(10, 50), U(10, 60), U(0.8, 3.5), U(0, Math.PI))); // a thin strut
  }
  const voids: Point[][] = [];
  const m = Math.floor(r() * 4);
  for (let k = 0; k < m; k++) voids.push(circle(U(0, 100), U(0, 60), U(0.5, 4), 64));
  const body = booleanOp('intersection', solid, [rect(0, 0, 100, 60)]);
  return voids.length ? booleanOp('difference', ringsOf(body), voids) : body;
}

