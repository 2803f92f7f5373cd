/**
 * Rings written as true circles (WriterInput.ringCircles): the DXF re-read by dxf-parser 1.1.2 (an
 * independent reader, github.com/gdsestimating/dxf-parser), the SVG path data read back with the SVG 1.1 path
 * grammar (§8.3) and the arc endpoint → centre conversion of SVG 1.1 Appendix F.6.5.
 */
import { describe, expect, it } from 'vitest';
import type { ICircleEntity, IDxf, ILwpolylineEntity } from 'dxf-parser';
import { RhoformError } from '../../src/errors.js';
import { writeDxf } from '../../src/write/dxf.js';
import { writeSvg } from '../../src/write/svg.js';
import type { RingCircle, WriterInput } from '../../src/write/types.js';
import { dxfPairs, regularPolygon } from './fixtures.js';
import { parseDxf } from '../support/dxf-parser.js';



/** 6 decimals written: a read-back value is within half a unit of the 6th decimal. */
const HALF_ULP6 = 0.5e-6 + 1e-12;

/**
 * A 100 × 60 plate with a square hole and a 48-gon bolt hole (r = 5 at (30, 30), drawn as a CIRCLE on `hole`),
 * and a 64-gon disc (r = 8 at (140, 30), its outer ring drawn as a circle on its own layer) with a 32-gon
 * hole (r = 3, a circle on its own layer, `hole`).
 */
function circleInput(units: 'mm' | 'in' = 'mm'): WriterInput {
  const ringCircles: RingCircle[] = [
    { polygon: 0, ring: 2, x: 30, y: 30, r: 5 },
    { polygon: 1, ring: 0, x: 140, y: 30, r: 8 },
    { polygon: 1, ring: 1, x: 140, y: 30, r: 3 },
  ];
  return {
    polygons: {
      polygons: [
        {
          outer: [[0, 0], [100, 0], [100, 60], [0, 60]],
          holes: [[[60, 20], [60, 40], [80, 40], [80, 20]], regularPolygon(30, 30, 5, 48, true)],
        },
        { outer: regularPolygon(140, 30, 8, 64), holes: [regularPolygon(140, 30, 3, 32, true)] },
      ],
    },
    domain: [-10, -5, 160, 70],
    units,
    ringCircles,
  };
}

describe('DXF: rings as CIRCLE entities, re-read by dxf-parser', () => {
  for (const units of ['mm', 'in'] as const) {
    const div = units === 'in' ? 25.4 : 1; // 1 in = 25.4 mm exactly (NIST SP 811)

    it(`writes a bolt hole as a CIRCLE on layer hole and no LWPOLYLINE for it (${units})`, () => {
      const input = circleInput(units);
      const dxf = parseDxf(writeDxf(input));
      const circles = dxf.entities.filter((e): e is ICircleEntity => e.type === 'CIRCLE');
      const polylines = dxf.entities.filter((e): e is ILwpolylineEntity => e.type === 'LWPOLYLINE');
      // DXF Reference, CIRCLE group codes: 10/20/30 centre, 40 radius; 8 layer (common entity codes).
      // DESIGN §8: every hole of the part on `hole`, true circles included
      expect(circles.map((c) => c.layer)).toEqual(['hole', 'outline', 'hole']);
      const expected = input.ringCircles ?? [];
      circles.forEach((c, k) => {
        expect(Math.abs(c.radius - expected[k].r / div)).toBeLessThanOrEqual(HALF_ULP6);
        expect(Math.abs(c.center.x - expected[k].x / div)).toBeLessThanOrEqual(HALF_ULP6);
        expect(Math.abs(c.center.y - expected[k].y / div)).toBeLessThanOrEqual(HALF_ULP6);
      });
      expect(Math.abs(circles[0].radius - 5 / div)).toBeLessThanOrEqual(HALF_ULP6);
      // Only the plate's outer ring and its square hole remain polylines: none with 48, 64 or 32 vertices.
      expect(polylines.map((p) => [p.layer, p.vertices.length, p.shape])).toEqual([
        ['outline', 4, true],
        ['hole', 4, true],
      ]);
      expect(Math.abs(polylines[0].vertices[2].x - 100 / div)).toBeLessThanOrEqual(HALF_ULP6);
    });
  }

  it('keeps the rings in writing order: each circle in its ring’s place', () => {
    const dxf = parseDxf(writeDxf(circleInput()));
    expect(dxf.entities.map((e) => `${e.type}:${e.layer}`)).toEqual([
      'LWPOLYLINE:outline',
      'LWPOLYLINE:hole',
      'CIRCLE:hole',
      'CIRCLE:outline',
      'CIRCLE:hole',
    ]);
  });

  it('counts the circles in $HANDSEED: unique entity handles, all below it', () => {
    const pairs = dxfPairs(writeDxf(circleInput()));
    const start = pairs.findIndex(([c, v]) => c === 2 && v === 'ENTITIES');
    const end = pairs.findIndex(([c, v], i) => i > start && c === 0 && v === 'ENDSEC');
    const handles: number[] = [];
    for (let i = start; i < end; i++) if (pairs[i][0] === 5) handles.push(parseInt(pairs[i][1], 16));
    expect(handles).toHaveLength(5);
    expect(new Set(handles).size).toBe(5);
    const seedAt = pairs.findIndex(([c, v]) => c === 9 && v === '$HANDSEED');
    // DXF Reference, header variables: $HANDSEED is the next available handle.
    expect(parseInt(pairs[seedAt + 1][1], 16)).toBe(Math.max(...handles) + 1);
  });

  it('is deterministic and does not mutate its input', () => {
    const input = circleInput();
    const before = JSON.stringify(input);
    expect(writeDxf(input)).toBe(writeDxf(circleInput()));
    expect(JSON.stringify(input)).toBe(before);
  });
});

/** Tokens of absolute M/L/A/Z path data (SVG 1.1 §8.3; flags are separate numbers in our output). */
interface MoveLine {
  cmd: 'M' | 'L';
  x: number;
  y: number;
}
interface Arc {
  cmd: 'A';
  rx: number;
  ry: number;
  rot: number;
  large: number;
  sweep: number;
  x: number;
  y: number;
}
type Seg = MoveLine | Arc | { cmd: 'Z' };

/** Parses absolute M/L/A/Z path data into sub-paths (implicit repeats of L and A, SVG 1.1 §8.3.2). */
function parsePath(d: string): Seg[][] {
  const tokens = d.match(/[MLAZ]|-?\d*\.?\d+/g) ?? [];
  const out: Seg[][] = [];
  let cmd = '';
  for (let i = 0; i < tokens.length; ) {
    const t = tokens[i];
    if (/^[MLAZ]$/.test(t)) {
      cmd = t;
      i++;
      if (t === 'Z') out[out.length - 1].push({ cmd: 'Z' });
      continue;
    }
    const n = (k: number): number => Number(tokens[i + k]);
    if (cmd === 'M') {
      out.push([{ cmd: 'M', x: n(0), y: n(1) }]);
      cmd = 'L';
      i += 2;
    } else if (cmd === 'L') {
      out[out.length - 1].push({ cmd: 'L', x: n(0), y: n(1) });
      i += 2;
    } else if (cmd === 'A') {
      out[out.length - 1].push({ cmd: 'A', rx: n(0), ry: n(1), rot: n(2), large: n(3), sweep: n(4), x: n(5), y: n(6) });
      i += 7;
    } else throw new Error(`number outside a command at token ${i}`);
  }
  return out;
}

/**
 * Centre and swept angle of a circular arc (rx = ry, no rotation) from its endpoint form, SVG 1.1 Appendix
 * F.6.5 (with F.6.6: radii too small for the endpoints are scaled up, so the radicand is clamped at 0).
 */
function arcCentre(x1: number, y1: number, a: Arc): { cx: number; cy: number; dTheta: number } {
  const r = a.rx;
  const xp = (x1 - a.x) / 2;
  const yp = (y1 - a.y) / 2;
  const num = r * r * r * r - r * r * (yp * yp + xp * xp);
  const coef = (a.large === a.sweep ? -1 : 1) * Math.sqrt(Math.max(0, num / (r * r * (yp * yp + xp * xp))));
  const cxp = coef * ((r * yp) / r);
  const cyp = coef * (-(r * xp) / r);
  const cx = cxp + (x1 + a.x) / 2;
  const cy = cyp + (y1 + a.y) / 2;
  const angle = (ux: number, uy: number, vx: number, vy: number): number =>
    Math.sign(ux * vy - uy * vx || 1) * Math.acos(Math.max(-1, Math.min(1, (ux * vx + uy * vy) / (Math.hypot(ux, uy) * Math.hypot(vx, vy)))));
  let dTheta = angle((xp - cxp) / r, (yp - cyp) / r, (-xp - cxp) / r, (-yp - cyp) / r);
  if (a.sweep === 0 && dTheta > 0) dTheta -= 2 * Math.PI;
  else if (a.sweep === 1 && dTheta < 0) dTheta += 2 * Math.PI;
  return { cx, cy, dTheta };
}

/** Signed area of a polygon sub-path in the SVG frame (shoelace; negative = counter-clockwise on screen). */
const shoelace = (pts: { x: number; y: number }[]): number =>
  pts.reduce((s, p, i) => {
    const q = pts[(i + 1) % pts.length];
    return s + (p.x * q.y - q.x * p.y) / 2;
  }, 0);

describe('SVG: rings as arc sub-paths inside the part’s even-odd path', () => {
  for (const units of ['mm', 'in'] as const) {
    const div = units === 'in' ? 25.4 : 1;
    const tol = 0.5 * 10 ** -(units === 'in' ? 4 : 3) + 1e-12; // 3 decimals in mm, 4 in inches

    it(`writes each circle as two half-circle arcs, flipped once (${units})`, () => {
      const input = circleInput(units);
      const maxY = input.domain[3];
      const text = writeSvg(input);
      expect(text.match(/<path id="part"/g)).toHaveLength(1);
      const part = text.match(/<path id="part"([^>]*)>/)?.[1] ?? '';
      // docs/references.md §7.4: evenodd makes nested sub-paths holes whatever their winding.
      expect(part).toContain('fill-rule="evenodd"');
      const d = part.match(/ d="([^"]*)"/)?.[1] ?? '';
      const subs = parsePath(d);
      expect(subs).toHaveLength(5); // plate, square hole, bolt hole, disc, disc hole
      const arcs = subs.filter((s) => s.some((g) => g.cmd === 'A'));
      expect(arcs).toHaveLength(3);
      (input.ringCircles ?? []).forEach((c, k) => {
        const sub = arcs[k];
        expect(sub.map((g) => g.cmd)).toEqual(['M', 'A', 'A', 'Z']);
        const [m, a1, a2] = sub as [MoveLine, Arc, Arc];
        const yFlip = (maxY - c.y) / div; // y' = maxY − y
        // starts at (x + r, y'), the first arc ends at (x − r, y'), the second back at the start; x ± r is the
        // rounded centre ± the rounded radius, so within two roundings of the exact value
        expect(Math.abs(m.x - (c.x + c.r) / div)).toBeLessThanOrEqual(2 * tol);
        expect(Math.abs(m.y - yFlip)).toBeLessThanOrEqual(tol);
        expect(Math.abs(a1.x - (c.x - c.r) / div)).toBeLessThanOrEqual(2 * tol);
        expect(Math.abs(a1.y - yFlip)).toBeLessThanOrEqual(tol);
        expect([a2.x, a2.y]).toEqual([m.x, m.y]);
        for (const a of [a1, a2]) {
          expect(Math.abs(a.rx - c.r / div)).toBeLessThanOrEqual(tol);
          expect(a.ry).toBe(a.rx);
          expect(a.rot).toBe(0);
          // the written radius is half the written chord (else F.6.5 moves each arc's centre off the diameter)
          expect(Math.abs((m.x - a1.x) / 2 - a.rx)).toBeLessThan(1e-9);
        }
        // SVG 1.1 F.6.5: both arcs turn about the circle's centre, half a turn each, the same way.
        const h1 = arcCentre(m.x, m.y, a1);
        const h2 = arcCentre(a1.x, a1.y, a2);
        for (const h of [h1, h2]) {
          expect(Math.abs(h.cx - c.x / div)).toBeLessThanOrEqual(2 * tol);
          expect(Math.abs(h.cy - yFlip)).toBeLessThanOrEqual(2 * tol);
          expect(Math.abs(Math.abs(h.dTheta) - Math.PI)).toBeLessThan(1e-3);
        }
        expect(Math.sign(h1.dTheta)).toBe(Math.sign(h2.dTheta));
      });
    });
  }

  it('keeps the model orientation: circles turn like the polygon rings they replace', () => {
    const text = writeSvg(circleInput());
    const subs = parsePath(text.match(/<path id="part"[^>]* d="([^"]*)"/)?.[1] ?? '');
    // Plate outer (model counter-clockwise) and square hole (clockwise) as polygons in the y-down frame:
    // the flip reverses the shoelace sign (analytic), so outer < 0 and hole > 0.
    const pts = (s: Seg[]): MoveLine[] => s.filter((g): g is MoveLine => g.cmd === 'M' || g.cmd === 'L');
    expect(shoelace(pts(subs[0]))).toBeLessThan(0);
    expect(shoelace(pts(subs[1]))).toBeGreaterThan(0);
    const turnOf = (s: Seg[]): number => {
      const m = s[0] as MoveLine;
      const a1 = s[1] as Arc;
      return arcCentre(m.x, m.y, a1).dTheta;
    };
    // The swept angle has the same sign as the shoelace area (SVG F.6.5 angles in the y-down frame).
    expect(turnOf(subs[2])).toBeGreaterThan(0); // bolt hole (a hole)
    expect(turnOf(subs[3])).toBeLessThan(0); // disc outer
    expect(turnOf(subs[4])).toBeGreaterThan(0); // disc hole
  });
});

describe('RingCircle validation', () => {
  const bad: [string, Partial<RingCircle>, RegExp][] = [
    ['a polygon that does not exist', { polygon: 2 }, /polygon index/],
    ['a negative polygon index', { polygon: -1 }, /polygon index/],
    ['a hole that does not exist', { ring: 3 }, /ring index/],
    ['a fractional ring index', { ring: 0.5 }, /ring index/],
    ['a zero radius', { r: 0 }, /radius/],
    ['a negative radius', { r: -1 }, /radius/],
    ['a NaN radius', { r: Number.NaN }, /radius/],
    ['an infinite radius', { r: Number.POSITIVE_INFINITY }, /radius/],
    ['a non-finite centre', { x: Number.NaN }, /centre/],
  ];
  for (const [what, change, message] of bad) {
    it(`throws for ${what} in both writers`, () => {
      const input = circleInput();
      const ringCircles = [{ ...(input.ringCircles ?? [])[0], ...change }];
      for (const write of [writeDxf, writeSvg]) {
        expect(() => write({ ...input, ringCircles })).toThrow(RhoformError);
        expect(() => write({ ...input, ringCircles })).toThrow(message);
      }
    });
  }

  it('throws for two circles on one ring', () => {
    const input = circleInput();
    const c = (input.ringCircles ?? [])[0];
    expect(() => writeDxf({ ...input, ringCircles: [c, { ...c, r: 6 }] })).toThrow(/at most one circle per ring/);
  });
});
