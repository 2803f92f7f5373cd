/**
 * The files a CAD program reads, built from the demo bracket with its passive regions and every repair
 * (fixtures/grids/demo-bracket.md): re-read by dxf-parser 1.1.2 (an independent reader) and measured with the
 * boolean engine. The rules are DESIGN §8: the part alone on `outline` and `hole`, every hole on `hole` (true
 * circles as CIRCLE), annotations only in `<name>.notes.dxf` on layers that do not plot, no zero-length or
 * sub-micrometre segment in mm or inches, $EXTMIN/$EXTMAX the bounds of what is drawn, passive voids void.
 */
import { readFileSync } from 'node:fs';
import type { ICircleEntity, IDxf, ILwpolylineEntity, IPoint } from 'dxf-parser';
import { beforeAll, describe, expect, it } from 'vitest';
import { polygonSetArea } from '../../src/geom/area.js';
import { booleanOp } from '../../src/geom/clipper.js';
import { parsePassive } from '../../src/passive/parse.js';
import { build, type BuildResult } from '../../src/pipeline.js';
import { REPAIR_IDS, resolveSettings } from '../../src/settings.js';
import type { Point, Ring } from '../../src/types.js';
import { parseDxf } from '../support/dxf-parser.js';
import { dxfPairs } from './fixtures.js';
import '../support/build-parts.js';

const root = new URL('../../', import.meta.url);
const bytes = readFileSync(new URL('fixtures/grids/demo-bracket.npy', root));
const passive = parsePassive(readFileSync(new URL('fixtures/passive/demo-bracket.passive.json', root), 'utf8'), 'demo-bracket.passive.json');
/** The demo's settings (cli/run.ts DEMO): 2 mm cells, waterjet preset for 8 mm sheet, every repair. Built once per option set. */
const builds = new Map<string, BuildResult>();
const demo = (more: Record<string, unknown> = {}): BuildResult => {
  const key = JSON.stringify(more);
  let b = builds.get(key);
  if (!b) {
    const s = resolveSettings({ cellSize: [2, 2], process: 'waterjet-cut', thickness: 8, passive: 'p.json', repair: [...REPAIR_IDS], ...more });
    builds.set(key, (b = build({ name: 'demo-bracket.npy', bytes }, s, { passive })));
  }
  return b;
};
/** 1 µm, the shortest segment written (src/geom/clean-ring.ts); in inches 1/25 400 in. */
const MIN_SEGMENT_MM = 0.001;
/** The cable pass-through of the demo's passive file: a void disc of radius 8 at (90, 62), mm. */
const PASS = { x: 90, y: 62, r: 8 };

/** Every segment length of the closed polylines of a DXF (in its units). */
function segmentLengths(dxf: IDxf): number[] {
  const out: number[] = [];
  for (const e of dxf.entities) {
    if (e.type !== 'LWPOLYLINE') continue;
    const v = (e as ILwpolylineEntity).vertices;
    for (let i = 0; i < v.length; i++) out.push(Math.hypot(v[(i + 1) % v.length].x - v[i].x, v[(i + 1) % v.length].y - v[i].y));
  }
  return out;
}

/** A circle as the regular polygon inscribed in it, counter-clockwise (n vertices). */
const inscribed = (x: number, y: number, r: number, n = 720): Ring => Array.from({ length: n }, (_, k): Point => [x + r * Math.cos((2 * Math.PI * k) / n), y + r * Math.sin((2 * Math.PI * k) / n)]);
/** A circle as the regular polygon circumscribed about it (contains the disc), clockwise when `hole`. */
const circumscribed = (x: number, y: number, r: number, hole: boolean, n = 720): Ring => {
  const R = r / Math.cos(Math.PI / n);
  const ring = Array.from({ length: n }, (_, k): Point => [x + R * Math.cos((2 * Math.PI * k) / n), y + R * Math.sin((2 * Math.PI * k) / n)]);
  return hole ? ring.reverse() : ring;
};

describe('the demo part DXF, as a CAD program reads it (dxf-parser)', () => {
  let built: BuildResult;
  let dxf: IDxf;
  beforeAll(() => {
    built = demo();
    dxf = parseDxf(built.dxf());
  }, 120_000);

  it('holds the part only: the layers 0, outline and hole, closed LWPOLYLINEs and CIRCLEs, nothing else', () => {
    expect(Object.keys((dxf.tables as unknown as { layer: { layers: Record<string, unknown> } }).layer.layers)).toEqual(['0', 'outline', 'hole']);
    const kinds = new Set(dxf.entities.map((e) => `${e.type}:${e.layer}`));
    expect([...kinds].sort()).toEqual(['CIRCLE:hole', 'LWPOLYLINE:hole', 'LWPOLYLINE:outline']);
    for (const e of dxf.entities) if (e.type === 'LWPOLYLINE') expect((e as ILwpolylineEntity).shape).toBe(true);
    // one outer ring, ten holes (the report's count), two of them the M10 bolt holes as true circles Ø11
    expect(dxf.entities.filter((e) => e.layer === 'outline')).toHaveLength(built.report.geometry.polygons);
    expect(dxf.entities.filter((e) => e.layer === 'hole')).toHaveLength(built.report.geometry.holes);
    const circles = dxf.entities.filter((e): e is ICircleEntity => e.type === 'CIRCLE');
    expect(circles.map((c) => [c.center.x, c.center.y, c.radius]).sort((a, b) => a[0] - b[0])).toEqual([
      [194, 30, 5.5],
      [224, 30, 5.5],
    ]);
  });

  it('has no zero-length and no sub-micrometre segment (mm and inches)', () => {
    const mm = segmentLengths(dxf);
    expect(mm.length).toBeGreaterThan(100);
    expect(Math.min(...mm)).toBeGreaterThanOrEqual(MIN_SEGMENT_MM);
    const inch = segmentLengths(parseDxf(demo({ units: 'in' }).dxf()));
    expect(inch.length).toBe(mm.length);
    expect(Math.min(...inch)).toBeGreaterThanOrEqual(MIN_SEGMENT_MM / 25.4); // 1 in = 25.4 mm exactly
  }, 120_000);

  it('gives $EXTMIN/$EXTMAX as the bounds of its entities', () => {
    let [x0, y0, x1, y1] = [Infinity, Infinity, -Infinity, -Infinity];
    for (const e of dxf.entities) {
      const pts: { x: number; y: number }[] =
        e.type === 'CIRCLE'
          ? [(e as ICircleEntity).center].flatMap((c) => [{ x: c.x - (e as ICircleEntity).radius, y: c.y - (e as ICircleEntity).radius }, { x: c.x + (e as ICircleEntity).radius, y: c.y + (e as ICircleEntity).radius }])
          : (e as ILwpolylineEntity).vertices;
      for (const p of pts) [x0, y0, x1, y1] = [Math.min(x0, p.x), Math.min(y0, p.y), Math.max(x1, p.x), Math.max(y1, p.y)];
    }
    const lo = dxf.header.$EXTMIN as IPoint;
    const hi = dxf.header.$EXTMAX as IPoint;
    expect([lo.x, lo.y, hi.x, hi.y]).toEqual([x0, y0, x1, y1]);
    // and the report's bbox is the same box (mm)
    expect(built.report.geometry.bbox).toEqual([x0, y0, x1, y1]);
  });

  it('the report area is the area the file holds: polylines by the shoelace formula, circles as πr²', () => {
    let area = 0;
    for (const e of dxf.entities) {
      if (e.type === 'CIRCLE') area += (e.layer === 'hole' ? -1 : 1) * Math.PI * (e as ICircleEntity).radius ** 2;
      else {
        const v = (e as ILwpolylineEntity).vertices;
        area += v.reduce((a, p, i) => a + p.x * v[(i + 1) % v.length].y - v[(i + 1) % v.length].x * p.y, 0) / 2;
      }
    }
    expect(built.report.geometry.area).toBeCloseTo(area, 6);
  });

  it('keeps the cable pass-through exactly void after every repair, on the hole layer', () => {
    // the part as the file holds it: outline minus holes (circles as polygons containing their disc, so no
    // material of the file is missed), intersected with the pass-through disc (a polygon inside the disc)
    const outer: Ring[] = [];
    const holes: Ring[] = [];
    for (const e of dxf.entities) {
      if (e.type === 'CIRCLE') {
        const c = e as ICircleEntity;
        holes.push(circumscribed(c.center.x, c.center.y, c.radius, true));
      } else (e.layer === 'outline' ? outer : holes).push((e as ILwpolylineEntity).vertices.map((v): Point => [v.x, v.y]));
    }
    const part = booleanOp('difference', outer, holes.map((h) => [...h].reverse()));
    const inside = booleanOp('intersection', part.polygons.flatMap((p) => [p.outer, ...p.holes]), [inscribed(PASS.x, PASS.y, PASS.r)]);
    // analytic: 0 — to the rounding of the file's 6 decimals (perimeter 2π·8 × 1e-6 mm ≈ 5e-5 mm²)
    expect(polygonSetArea(inside)).toBeLessThan(5e-5);
    // the hole that holds the pass-through is on layer hole
    const around = dxf.entities.filter((e) => e.type === 'LWPOLYLINE' && (e as ILwpolylineEntity).vertices.some((v) => Math.abs(Math.hypot(v.x - PASS.x, v.y - PASS.y) - PASS.r) < 0.2));
    expect(around.map((e) => e.layer)).toEqual(['hole']);
    // and every one of its vertices is on or outside the disc (never inside)
    for (const v of (around[0] as ILwpolylineEntity).vertices) expect(Math.hypot(v.x - PASS.x, v.y - PASS.y)).toBeGreaterThanOrEqual(PASS.r - 1e-6);
  });
});

describe('the annotations file (--annotations)', () => {
  let built: BuildResult;
  let notes: string;
  beforeAll(() => {
    built = demo({ annotations: true });
    notes = built.notesDxf();
  }, 120_000);

  it('holds passive references, findings and repair regions, on layers that do not plot (290 = 0), and no part', () => {
    const dxf = parseDxf(notes);
    const layers = new Set(dxf.entities.map((e) => e.layer));
    // findings only when a check of the repaired part warned or failed with a place
    const located = built.report.checks.filter((c) => c.status !== 'pass').reduce((n, c) => n + c.locations.length, 0);
    expect([...layers].sort()).toEqual(located > 0 ? ['finding', 'passive', 'repair'] : ['passive', 'repair']);
    expect(dxf.entities.filter((e) => e.layer === 'finding' && e.type === 'POINT')).toHaveLength(located);
    // DXF Reference, LAYER: group 290 plotting flag, 0 = do not plot
    const pairs = dxfPairs(notes);
    const plot = new Map<string, string>();
    let name = '';
    let inLayer = false;
    for (const [code, value] of pairs) {
      if (code === 0) inLayer = value === 'LAYER';
      else if (inLayer && code === 2) name = value;
      else if (inLayer && code === 290) plot.set(name, value);
    }
    expect(Object.fromEntries(plot)).toEqual({ passive: '0', finding: '0', repair: '0' });
    // the passive file's six regions: five circles and one rectangle (the motor pad)
    expect(dxf.entities.filter((e) => e.layer === 'passive').map((e) => e.type).sort()).toEqual(['CIRCLE', 'CIRCLE', 'CIRCLE', 'CIRCLE', 'CIRCLE', 'LWPOLYLINE']);
    // one labelled point per place a repair acted, as the report lists them
    const places = built.report.repairs.reduce((n, r) => n + r.locations.length, 0);
    expect(places).toBeGreaterThan(0);
    expect(dxf.entities.filter((e) => e.layer === 'repair' && e.type === 'POINT')).toHaveLength(places);
  });

  it('draws every repair region as simple rings: no ring crosses itself', () => {
    const dxf = parseDxf(notes);
    const rings = dxf.entities.filter((e): e is ILwpolylineEntity => e.type === 'LWPOLYLINE' && e.layer === 'repair');
    expect(rings.length).toBeGreaterThan(0);
    // brute force: two non-adjacent edges of one ring must not cross (orientation test, common practice)
    const orient = (a: IPoint, b: IPoint, c: IPoint) => Math.sign((b.x - a.x) * (c.y - a.y) - (b.y - a.y) * (c.x - a.x));
    for (const r of rings) {
      const v = r.vertices as IPoint[];
      const n = v.length;
      for (let i = 0; i < n; i++) {
        for (let j = i + 2; j < n; j++) {
          if (i === 0 && j === n - 1) continue;
          const [a, b, c, d] = [v[i], v[(i + 1) % n], v[j], v[(j + 1) % n]];
          const crosses = orient(a, b, c) * orient(a, b, d) < 0 && orient(c, d, a) * orient(c, d, b) < 0;
          expect(crosses).toBe(false);
        }
      }
    }
  });

  it('the part DXF is the same with or without --annotations', () => {
    expect(built.dxf()).toBe(demo().dxf());
  }, 120_000);
});

describe('the demo SVG', () => {
  it('has no annotation group by default; with --annotations they are groups beside the one part path', () => {
    const plain = demo().svg();
    expect(plain).not.toContain('class="annotation"');
    expect(plain.match(/<path /g)).toHaveLength(1);
    const noted = demo({ annotations: true }).svg();
    expect(noted.match(/<path id="part"/g)).toHaveLength(1);
    expect(noted.match(/<g id="(passive|repair|finding)" class="annotation"/g)?.length).toBeGreaterThanOrEqual(2);
  }, 120_000);

  it('keeps every label on the page: a label near the right edge is anchored at its end, left of its marker', () => {
    const svg = demo({ annotations: true }).svg();
    const width = Number(/width="([\d.]+)mm"/.exec(svg)?.[1]);
    const labels = [...svg.matchAll(/<text x="([\d.]+)" y="([\d.]+)" dx="(-?[\d.]+)" dy="(-?[\d.]+)"( text-anchor="end")? [^>]*font-size="([\d.]+)"[^>]*>([^<]*)<\/text>/g)];
    expect(labels.length).toBeGreaterThan(0);
    for (const m of labels) {
      const x = Number(m[1]) + Number(m[3]);
      const y = Number(m[2]) + Number(m[4]);
      const size = Number(m[6]);
      // digits and capitals are at most 0.722 em wide in Helvetica/Arial (Adobe's font metrics, from memory)
      const w = 0.75 * size * m[7].length;
      const [left, right] = m[5] ? [x - w, x] : [x, x + w];
      expect(left).toBeGreaterThanOrEqual(0);
      expect(right).toBeLessThanOrEqual(width + 1e-9);
      expect(y - size).toBeGreaterThanOrEqual(0);
    }
  });
});
