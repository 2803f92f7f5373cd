import { describe, expect, it } from 'vitest';
import { buildMorphology, choosePixel } from '../../src/morph/index.js';
import { makeFrame } from '../../src/morph/frame.js';
import { nearestField } from '../../src/morph/nearest.js';
import { segmentsOf } from '../../src/morph/segments.js';
import type { Point, PolygonSet } from '../../src/types.js';
import { type Box, circle, mapSet, poly, rect, segDist, set, stadium } from './shapes.js';

/**
 * Independent brute-force binary opening (docs/references.md §1.2: O_r(Ω) = (Ω ⊖ B_r) ⊕ B_r; a shape with no member thinner
 * than d equals its opening by a disc of radius d/2). Pixels of size h at centres ((i + ½)h, (j + ½)h); the disc
 * footprint is {(a, b): a² + b² ≤ (r/h)²}; outside the image counts as `outside` (0 = void). Shares no code with
 * src/morph.
 */
function opening(mask: Uint8Array, nx: number, ny: number, rPx: number, outside = 0): Uint8Array {
  const offs: number[] = [];
  const R = Math.floor(rPx);
  for (let b = -R; b <= R; b++) for (let a = -R; a <= R; a++) if (a * a + b * b <= rPx * rPx) offs.push(a, b);
  const at = (i: number, j: number): number => (i < 0 || j < 0 || i >= nx || j >= ny ? outside : mask[j * nx + i]);
  const eroded = new Uint8Array(nx * ny);
  for (let j = 0; j < ny; j++) {
    for (let i = 0; i < nx; i++) {
      if (!mask[j * nx + i]) continue;
      let ok = 1;
      for (let k = 0; k < offs.length && ok; k += 2) if (!at(i + offs[k], j + offs[k + 1])) ok = 0;
      eroded[j * nx + i] = ok;
    }
  }
  const out = new Uint8Array(nx * ny);
  for (let j = 0; j < ny; j++) {
    for (let i = 0; i < nx; i++) {
      if (!eroded[j * nx + i]) continue;
      for (let k = 0; k < offs.length; k += 2) {
        const a = i + offs[k], b = j + offs[k + 1];
        if (a >= 0 && b >= 0 && a < nx && b < ny) out[b * nx + a] = 1;
      }
    }
  }
  return out;
}

interface Shape { name: string; set: PolygonSet; sd: (x: number, y: number) => number; domain: Box; h: number }

/** Pixels the opening removes deeper than 1.5 pixels inside the shape (boundary pixels allowed). */
function removedInterior(s: Shape, r: number): Point[] {
  const nx = Math.round(s.domain[2] / s.h), ny = Math.round(s.domain[3] / s.h);
  const mask = new Uint8Array(nx * ny);
  for (let j = 0; j < ny; j++) for (let i = 0; i < nx; i++) mask[j * nx + i] = s.sd((i + 0.5) * s.h, (j + 0.5) * s.h) > 0 ? 1 : 0;
  const open = opening(mask, nx, ny, r / s.h);
  const out: Point[] = [];
  for (let j = 0; j < ny; j++) {
    for (let i = 0; i < nx; i++) {
      const x = (i + 0.5) * s.h, y = (j + 0.5) * s.h;
      if (mask[j * nx + i] && !open[j * nx + i] && s.sd(x, y) > 1.5 * s.h) out.push([x, y]);
    }
  }
  return out;
}

const smooth: Shape[] = [
  { name: 'disc Ø50', set: set(poly(circle(40, 40, 25))), sd: (x, y) => 25 - Math.hypot(x - 40, y - 40), domain: [0, 0, 80, 80], h: 1 },
  {
    name: 'ring Ø120/Ø50', set: set(poly(circle(70, 70, 60), circle(70, 70, 25))), domain: [0, 0, 140, 140], h: 1,
    sd: (x, y) => Math.min(60 - Math.hypot(x - 70, y - 70), Math.hypot(x - 70, y - 70) - 25),
  },
  {
    name: 'strut w 6 at 30° with rounded ends', set: set(poly(stadium([17, 15], [43, 30], 6))), domain: [0, 0, 60, 45], h: 0.25,
    sd: (x, y) => 3 - segDist([x, y], [17, 15], [43, 30]),
  },
];

describe('local width against an independent raster opening (docs/references.md §1.2)', () => {
  for (const s of smooth) {
    it(`analytic: ${s.name} — min width ≥ d ⇔ the opening by d/2 removes (almost) nothing; places lie where it removes`, () => {
      const m = buildMorphology(s.set, { domain: s.domain, pixel: choosePixel([1, 1], s.domain, 500_000) });
      const w = m.width('solid', 0).min!;
      for (const d of [0.85 * w, 1.15 * w]) {
        const removed = removedInterior(s, d / 2);
        expect(removed.length === 0).toBe(w >= d);
        if (removed.length > 0) {
          const places = m.width('solid', d).places;
          expect(places.length).toBeGreaterThan(0);
          for (const p of places) expect(Math.min(...removed.map((q) => Math.hypot(q[0] - p.x, q[1] - p.y)))).toBeLessThan(2 * s.h + 0.5);
        }
      }
    });
  }

  it('documented difference: the opening trims sharp convex corners of a rectangle, the width finds no thin place', () => {
    const r: Shape = {
      name: 'rectangle 40 × 20', set: set(poly(rect(10, 10, 50, 30))), domain: [0, 0, 60, 40], h: 0.25,
      sd: (x, y) => Math.min(x - 10, 50 - x, y - 10, 30 - y),
    };
    const removed = removedInterior(r, 6); // opening by r = 6: the corners beyond the quarter circles go
    expect(removed.length).toBeGreaterThan(0);
    for (const p of removed) expect(Math.min(Math.hypot(p[0] - 10, p[1] - 10), Math.hypot(p[0] - 50, p[1] - 10), Math.hypot(p[0] - 10, p[1] - 30), Math.hypot(p[0] - 50, p[1] - 30))).toBeLessThan(6);
    const m = buildMorphology(r.set, { domain: r.domain, pixel: 0.25 });
    expect(m.width('solid', 12).places).toEqual([]); // docs/checks/README.md: corners are never thin
  });
});

describe('properties', () => {
  // a disc with two holes, free in the domain
  const base = set(poly(circle(40, 40, 25), circle(32, 40, 6), circle(50.5, 44, 5)));
  const dom: Box = [0, 0, 80, 80];
  const rot = (deg: number) => (p: Point): Point => {
    const a = (deg * Math.PI) / 180, x = p[0] - 40, y = p[1] - 40;
    return [40 + x * Math.cos(a) - y * Math.sin(a), 40 + x * Math.sin(a) + y * Math.cos(a)];
  };
  it('analytic: rotating or mirroring a shape changes its min widths by no more than the resolution', () => {
    const ref = buildMorphology(base, { domain: dom, pixel: 0.25 });
    const s0 = ref.width('solid', 0), v0 = ref.width('void', 0);
    for (const f of [rot(90), rot(30), rot(-67), (p: Point): Point => [80 - p[0], p[1]], (p: Point): Point => [p[1], p[0]]]) {
      const m = buildMorphology(mapSet(base, f), { domain: dom, pixel: 0.25 });
      const s = m.width('solid', 0), v = m.width('void', 0);
      expect(Math.abs(s.min! - s0.min!)).toBeLessThanOrEqual(s.resolution + s0.resolution);
      expect(Math.abs(v.min! - v0.min!)).toBeLessThanOrEqual(v.resolution + v0.resolution);
    }
    // analytic: the thinnest solid is the wall between the holes, |c1 − c2| − 6 − 5
    expect(Math.abs(s0.min! - (Math.hypot(18.5, 4) - 11))).toBeLessThanOrEqual(s0.resolution);
  });

  it('analytic: the feature transform matches the exact point–segment distance (brute force over all segments)', () => {
    const s = mapSet(base, rot(17));
    const frame = makeFrame(dom, 0.5, 3);
    const segs = segmentsOf(s, frame);
    const f = nearestField(frame, segs);
    let worst = 0, wrong = 0;
    for (let j = 0; j < frame.ny; j += 1) {
      for (let i = 0; i < frame.nx; i += 1) {
        let best = Infinity;
        for (let k = 0; k < segs.n; k++) {
          const o = 5 * k;
          best = Math.min(best, segDist([i, j], [segs.geo[o], segs.geo[o + 1]], [segs.geo[o] + segs.geo[o + 2], segs.geo[o + 1] + segs.geo[o + 3]]));
        }
        const e = f.dist[j * frame.nx + i] - best;
        worst = Math.max(worst, e);
        if (e > 1e-4) wrong++;
      }
    }
    expect(worst).toBeLessThan(0.01); // pixel units
    expect(wrong / (frame.nx * frame.ny)).toBeLessThan(0.005);
  });

  it('analytic: local thickness picture — Hildebrand & Rüegsegger τ of a ring is its band width, NaN on void', () => {
    const m = buildMorphology(set(poly(circle(70, 70, 60), circle(70, 70, 25))), { domain: [0, 0, 140, 140], pixel: 0.5 });
    const t = m.thicknessMap(100);
    expect(t.nx).toBe(100);
    expect(t.ny).toBe(100);
    let solid = 0, good = 0;
    for (let j = 0; j < t.ny; j++) {
      for (let i = 0; i < t.nx; i++) {
        const v = t.values[j * t.nx + i];
        const d = Math.hypot((i + 0.5) * 1.4 - 70, (j + 0.5) * 1.4 - 70);
        if (d > 60.5 || d < 24.5) expect(Number.isNaN(v)).toBe(true);
        if (d < 59.8 && d > 25.2) {
          solid++;
          if (Math.abs(v - 35) <= 0.5) good++; // analytic: every point of the band lies in a disc of diameter 35
        }
      }
    }
    expect(good / solid).toBeGreaterThan(0.98);
  });
});
