/**
 * `--units in`: the DXF says inches in its header and holds every coordinate and length in inches; the SVG
 * page and viewBox are in inches. Read back with dxf-parser 1.1.2 (independent reader) and by attribute.
 */
import { describe, expect, it } from 'vitest';
import type { ICircleEntity, IDxf, ILwpolylineEntity, IPoint, IPointEntity, ITextEntity } from 'dxf-parser';
import { writeDxf } from '../../src/write/dxf.js';
import { writeSvg } from '../../src/write/svg.js';
import type { WriterInput } from '../../src/write/types.js';
import { regularPolygon } from './fixtures.js';
import { parseDxf } from '../support/dxf-parser.js';


const MM_PER_IN = 25.4; // exact by definition (NIST SP 811, Appendix B)
const HALF_ULP6 = 0.5e-6 + 1e-12; // 6 decimals written in the DXF

/** A 254 × 127 mm plate (10 × 5 in) with a passive 10 mm bolt hole, a finding marker and a passive circle. */
function plate(units: 'mm' | 'in'): WriterInput {
  return {
    polygons: {
      polygons: [
        {
          outer: [[0, 0], [254, 0], [254, 127], [0, 127]],
          holes: [regularPolygon(63.5, 63.5, 5, 48, true), [[150, 40], [150, 80], [200, 80], [200, 40]]],
        },
      ],
    },
    domain: [-12.7, -25.4, 266.7, 152.4],
    units,
    ringCircles: [{ polygon: 0, ring: 1, x: 63.5, y: 63.5, r: 5 }],
    extras: [
      { layer: 'passive', circles: [{ x: 220, y: 100, r: 12.7 }] },
      { layer: 'finding', markers: [{ x: 175, y: 60, label: '1' }] },
    ],
  };
}

describe('DXF in inches', () => {
  const inch = parseDxf(writeDxf(plate('in')));
  const mm = parseDxf(writeDxf(plate('mm')));

  it('declares inches: $INSUNITS 1 and $MEASUREMENT 0 (mm: 4 and 1)', () => {
    // Autodesk AutoCAD help, INSUNITS system variable: 1 = inches, 4 = millimetres.
    expect(inch.header.$INSUNITS).toBe(1);
    expect(mm.header.$INSUNITS).toBe(4);
    // Autodesk AutoCAD help, MEASUREMENT system variable ($MEASUREMENT in the DXF header): 0 = imperial
    // (English), 1 = metric.
    expect(inch.header.$MEASUREMENT).toBe(0);
    expect(mm.header.$MEASUREMENT).toBe(1);
  });

  it('writes extents and limits in inches', () => {
    // limits: the domain [-12.7, -25.4, 266.7, 152.4] mm is [-0.5, -1, 10.5, 6] in (exact decimals)
    for (const [name, x, y] of [
      ['$LIMMIN', -0.5, -1],
      ['$LIMMAX', 10.5, 6],
    ] as const) {
      const p = inch.header[name] as IPoint;
      expect([name, p.x, p.y]).toEqual([name, x, y]);
    }
    // extents: what is drawn — the plate from (0, 0); the passive circle reaches (232.7 + 12.7) / 25.4 = 9.66 in
    // right and (100 + 12.7) / 25.4 = 4.437 in up, inside the plate's 10 × 5 in
    const lo = inch.header.$EXTMIN as IPoint;
    const hi = inch.header.$EXTMAX as IPoint;
    expect([lo.x, lo.y]).toEqual([0, 0]);
    expect(hi.x).toBeGreaterThanOrEqual(10);
    expect(hi.y).toBeGreaterThanOrEqual(5);
    const vport = (inch.tables as unknown as { viewPort: { viewPorts: { center: IPoint; viewHeight: number }[] } })
      .viewPort.viewPorts[0];
    // the active viewport is centred on the extents
    expect(vport.center.x).toBeCloseTo(hi.x / 2, 6);
    expect(vport.center.y).toBeCloseTo(hi.y / 2, 6);
  });

  it('writes the part, the bolt-hole CIRCLE and the extras in inches', () => {
    const pl = inch.entities.filter((e): e is ILwpolylineEntity => e.type === 'LWPOLYLINE');
    expect(pl.map((p) => p.layer)).toEqual(['outline', 'hole']);
    expect(pl[0].vertices.map((v) => [v.x, v.y])).toEqual([[0, 0], [10, 0], [10, 5], [0, 5]]); // 254 × 127 mm
    const circles = inch.entities.filter((e): e is ICircleEntity => e.type === 'CIRCLE');
    expect(circles.map((c) => c.layer)).toEqual(['hole', 'passive']);
    // bolt hole: centre (63.5, 63.5) mm = (2.5, 2.5) in, r = 5 mm = 5/25.4 in
    expect(circles[0].center.x).toBe(2.5);
    expect(circles[0].center.y).toBe(2.5);
    expect(Math.abs(circles[0].radius - 5 / MM_PER_IN)).toBeLessThanOrEqual(HALF_ULP6);
    expect(circles[1].radius).toBe(0.5); // 12.7 mm
    const point = inch.entities.find((e): e is IPointEntity => e.type === 'POINT');
    expect(Math.abs((point?.position.x ?? NaN) - 175 / MM_PER_IN)).toBeLessThanOrEqual(HALF_ULP6);
  });

  it('holds the same drawing as the mm file, scaled by 1/25.4', () => {
    expect(inch.entities.map((e) => `${e.type}:${e.layer}`)).toEqual(mm.entities.map((e) => `${e.type}:${e.layer}`));
    const numbers = (e: IDxf['entities'][number]): number[] => {
      if (e.type === 'LWPOLYLINE') return (e as ILwpolylineEntity).vertices.flatMap((v) => [v.x, v.y]);
      if (e.type === 'CIRCLE') {
        const c = e as ICircleEntity;
        return [c.center.x, c.center.y, c.radius];
      }
      if (e.type === 'POINT') return [(e as IPointEntity).position.x, (e as IPointEntity).position.y];
      const t = e as ITextEntity;
      return [t.startPoint.x, t.startPoint.y, t.textHeight];
    };
    inch.entities.forEach((e, k) => {
      const a = numbers(e);
      const b = numbers(mm.entities[k]);
      expect(a).toHaveLength(b.length);
      a.forEach((v, i) => expect(Math.abs(v * MM_PER_IN - b[i])).toBeLessThanOrEqual(HALF_ULP6 * (MM_PER_IN + 1)));
    });
  });
});

/** Attributes of the first `<name …>` element whose attribute text contains `where`. */
function element(svg: string, name: string, where = ''): Record<string, string> {
  for (const m of svg.matchAll(new RegExp(`<${name}\\b([^>]*)>`, 'g'))) {
    if (!m[1].includes(where)) continue;
    return Object.fromEntries([...m[1].matchAll(/([\w:-]+)="([^"]*)"/g)].map((a) => [a[1], a[2]]));
  }
  throw new Error(`no <${name}> with ${where}`);
}

describe('SVG in inches', () => {
  const inch = writeSvg(plate('in'));
  const mm = writeSvg(plate('mm'));

  it('has its page size in inches and a viewBox in inches', () => {
    // SVG 1.1 §7.10 units: "in" is an absolute unit; viewBox user units then equal one inch on paper.
    const svg = element(inch, 'svg');
    expect(svg.width).toBe('11in'); // 279.4 mm
    expect(svg.height).toBe('7in'); // 177.8 mm
    expect(svg.viewBox).toBe('-0.5 0 11 7');
    const svgMm = element(mm, 'svg');
    expect([svgMm.width, svgMm.height, svgMm.viewBox]).toEqual(['279.4mm', '177.8mm', '-12.7 0 279.4 177.8']);
  });

  it('writes path data and stroke widths in inches, y flipped once', () => {
    const d = element(inch, 'path', 'id="part"').d;
    // outer ring (0, 0) (254, 0) (254, 127) (0, 127) mm with y' = 152.4 − y → (0, 6) (10, 6) (10, 1) (0, 1) in
    expect(d.startsWith('M0 6L10 6 10 1 0 1 Z')).toBe(true);
    // bolt hole: centre (2.5, 152.4 − 63.5 = 88.9 mm = 3.5 in), r = 5 mm = 0.19685 in → 0.1969 at 4 decimals
    expect(d).toContain('M2.6969 3.5 A 0.1969 0.1969 0 1 1 2.3031 3.5 A 0.1969 0.1969 0 1 1 2.6969 3.5 Z');
    // 0.1 mm part outline = 0.0039 in (4 decimals)
    expect(element(inch, 'path', 'id="part"')['stroke-width']).toBe('0.0039');
    const passive = element(inch, 'circle', 'cx="8.6614"');
    expect(passive.r).toBe('0.5'); // 12.7 mm
  });
});
