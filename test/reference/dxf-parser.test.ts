/**
 * Re-reads our DXF with dxf-parser 1.1.2 (an independent DXF reader, MIT, github.com/gdsestimating/dxf-parser)
 * and compares what it sees with what we wrote.
 */
import { describe, expect, it } from 'vitest';
import type { ICircleEntity, IDxf, ILwpolylineEntity, IPointEntity, ITextEntity } from 'dxf-parser';
import { writeDxf } from '../../src/write/dxf.js';
import type { WriterInput } from '../../src/write/types.js';
import { partRings, sampleInput } from '../write/fixtures.js';
import { parseDxf } from '../support/dxf-parser.js';


const parse = parseDxf;

/** Written precision: 6 decimals, so a read-back coordinate is within half a unit of the 6th decimal. */
const HALF_ULP6 = 0.5e-6 + 1e-12;

describe('DXF re-read by dxf-parser', () => {
  for (const units of ['mm', 'in'] as const) {
    it(`keeps every ring, vertex, closed flag and layer (${units})`, () => {
      const input: WriterInput = sampleInput(units);
      const dxf = parse(writeDxf(input));
      const div = units === 'in' ? 25.4 : 1; // 1 in = 25.4 mm exactly (NIST SP 811)
      const polylines = dxf.entities.filter((e): e is ILwpolylineEntity => e.type === 'LWPOLYLINE');
      const expected = partRings(input);
      const extraRings = (input.extras ?? []).flatMap((e) => (e.rings ?? []).map((ring) => ({ ring, layer: e.layer })));
      expect(polylines).toHaveLength(expected.length + extraRings.length);

      const all = [
        ...expected.map(({ ring, hole }) => ({ ring, layer: hole ? 'hole' : 'outline' })),
        ...extraRings,
      ];
      all.forEach(({ ring, layer }, k) => {
        const pl = polylines[k];
        expect(pl.layer).toBe(layer);
        // DXF Reference, LWPOLYLINE: group 70 bit 1 = closed; dxf-parser exposes it as `shape`.
        expect(pl.shape).toBe(true);
        // Closed ring without a repeated end vertex (docs/references.md §7.3).
        expect(pl.vertices).toHaveLength(ring.length);
        ring.forEach(([x, y], i) => {
          expect(Math.abs(pl.vertices[i].x - x / div)).toBeLessThanOrEqual(HALF_ULP6);
          expect(Math.abs(pl.vertices[i].y - y / div)).toBeLessThanOrEqual(HALF_ULP6);
        });
      });
    });

    it(`writes $ACADVER AC1015, $INSUNITS and $MEASUREMENT for ${units}`, () => {
      const dxf = parse(writeDxf(sampleInput(units)));
      // docs/references.md §7.1: $ACADVER AC1015 = AutoCAD 2000.
      expect(dxf.header['$ACADVER']).toBe('AC1015');
      // docs/references.md §7.2: $INSUNITS 4 = millimetres, 1 = inches; $MEASUREMENT 1 = metric, 0 = English.
      expect(dxf.header['$INSUNITS']).toBe(units === 'mm' ? 4 : 1);
      expect(dxf.header['$MEASUREMENT']).toBe(units === 'mm' ? 1 : 0);
      const div = units === 'in' ? 25.4 : 1;
      // $LIMMIN/$LIMMAX: the domain [-10, -5, 180, 70] mm of sampleInput ($EXTMIN/$EXTMAX, the bounds of the
      // entities, are tested in test/write/cad-files.test.ts)
      const extmin = dxf.header['$LIMMIN'] as { x: number; y: number };
      const extmax = dxf.header['$LIMMAX'] as { x: number; y: number };
      expect(extmin.x).toBeCloseTo(-10 / div, 6);
      expect(extmin.y).toBeCloseTo(-5 / div, 6);
      expect(extmax.x).toBeCloseTo(180 / div, 6);
      expect(extmax.y).toBeCloseTo(70 / div, 6);
    });

    it(`reads circles, points and labels back (${units})`, () => {
      const input = sampleInput(units);
      const dxf = parse(writeDxf(input));
      const div = units === 'in' ? 25.4 : 1;
      const circles = dxf.entities.filter((e): e is ICircleEntity => e.type === 'CIRCLE');
      expect(circles).toHaveLength(1);
      expect(circles[0].layer).toBe('passive');
      expect(Math.abs(circles[0].radius - 5 / div)).toBeLessThanOrEqual(HALF_ULP6);
      expect(Math.abs(circles[0].center.x - 85 / div)).toBeLessThanOrEqual(HALF_ULP6);
      expect(Math.abs(circles[0].center.y - 30 / div)).toBeLessThanOrEqual(HALF_ULP6);

      const points = dxf.entities.filter((e): e is IPointEntity => e.type === 'POINT');
      const texts = dxf.entities.filter((e): e is ITextEntity => e.type === 'TEXT');
      const markers = (input.extras ?? []).flatMap((e) => (e.markers ?? []).map((m) => ({ ...m, layer: e.layer })));
      expect(points).toHaveLength(markers.length);
      expect(texts).toHaveLength(markers.length);
      markers.forEach((m, i) => {
        expect(points[i].layer).toBe(m.layer);
        expect(Math.abs(points[i].position.x - m.x / div)).toBeLessThanOrEqual(HALF_ULP6);
        expect(Math.abs(points[i].position.y - m.y / div)).toBeLessThanOrEqual(HALF_ULP6);
        expect(texts[i].layer).toBe(m.layer);
        expect(texts[i].text).toBe(m.label); // ASCII labels are written literally
      });
    });
  }

  it('declares our layers in the LAYER table', () => {
    const dxf = parse(writeDxf(sampleInput()));
    const layers = (dxf.tables as unknown as { layer: { layers: Record<string, unknown> } }).layer.layers;
    // docs/output-formats.md layer names; layer 0 is required in every drawing (docs/references.md §7.1).
    expect(Object.keys(layers).sort()).toEqual(['0', 'finding', 'hole', 'outline', 'passive', 'repair']);
  });

  it('reads an empty part as a valid drawing with no entities', () => {
    const dxf = parse(writeDxf({ polygons: { polygons: [] }, domain: [0, 0, 10, 10], units: 'mm' }));
    expect(dxf.entities).toHaveLength(0);
    expect(dxf.header['$ACADVER']).toBe('AC1015');
  });
});
