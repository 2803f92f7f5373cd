/**
 * `--dxf-version r12`: the AutoCAD R12 (AC1009) form, re-read by dxf-parser 1.1.2 and compared with the R2000
 * form of the same part (DXF Reference: POLYLINE 66 = 1 vertices follow, 70 bit 1 closed; VERTEX 10/20 and 42
 * bulge; SEQEND; CIRCLE 10/20/40). Audited once by hand with ezdxf 0.18.1 (readfile + audit: 0 errors, 0 fixes;
 * docs/output-formats.md).
 */
import type { ICircleEntity, ILwpolylineEntity, IPolylineEntity } from 'dxf-parser';
import { describe, expect, it } from 'vitest';
import { writeDxf } from '../../src/write/dxf.js';
import type { WriterInput } from '../../src/write/types.js';
import { parseDxf } from '../support/dxf-parser.js';
import { regularPolygon } from './fixtures.js';

/** A plate with a square hole, a 24-gon hole drawn as a true circle and an outer ring with two arcs. */
function input(version: 'r12' | 'r2000', units: 'mm' | 'in' = 'mm'): WriterInput {
  return {
    polygons: {
      polygons: [
        { outer: [[0, 0], [100, 0], [100, 60], [0, 60]], holes: [[[10, 10], [10, 30], [30, 30], [30, 10]], regularPolygon(70, 30, 8, 24, true)] },
        { outer: [[120, 0], [160, 0], [160, 40], [120, 40]], holes: [] },
      ],
    },
    domain: [0, 0, 170, 70],
    units,
    ringCircles: [{ polygon: 0, ring: 2, x: 70, y: 30, r: 8 }],
    // the second plate's right and left sides bulge outward as half circles (bulge 1)
    arcs: [[null, null, null], [[0, 1, 0, 1]]],
    dxfVersion: version,
  };
}

describe('DXF R12 (AC1009), read back by dxf-parser', () => {
  for (const units of ['mm', 'in'] as const) {
    it(`closed POLYLINE/VERTEX/SEQEND with the same vertices and bulges as the R2000 LWPOLYLINEs, CIRCLE on hole (${units})`, () => {
      const r12 = parseDxf(writeDxf(input('r12', units)));
      const r2000 = parseDxf(writeDxf(input('r2000', units)));
      expect(r12.header.$ACADVER).toBe('AC1009');
      expect(r12.header.$INSUNITS).toBe(units === 'mm' ? 4 : 1);
      const polys = r12.entities.filter((e): e is IPolylineEntity => e.type === 'POLYLINE');
      const lws = r2000.entities.filter((e): e is ILwpolylineEntity => e.type === 'LWPOLYLINE');
      expect(polys.map((p) => [p.layer, p.shape])).toEqual([['outline', true], ['hole', true], ['outline', true]]);
      expect(polys.map((p) => p.vertices.map((v) => [v.x, v.y, v.bulge ?? 0]))).toEqual(
        lws.map((p) => (p.vertices as { x: number; y: number; bulge?: number }[]).map((v) => [v.x, v.y, v.bulge ?? 0])),
      );
      // the bulges of the second plate: 1 on its edges 1 and 3 (half circles)
      expect(polys[2].vertices.map((v) => v.bulge ?? 0)).toEqual([0, 1, 0, 1]);
      const circles = r12.entities.filter((e): e is ICircleEntity => e.type === 'CIRCLE');
      const div = units === 'in' ? 25.4 : 1;
      expect(circles.map((c) => [c.layer, c.center.x, c.center.y])).toEqual([['hole', Number((70 / div).toFixed(6)), Number((30 / div).toFixed(6))]]);
      expect(circles[0].radius).toBeCloseTo(8 / div, 6);
      // same layers as R2000, in a LAYER table of its own
      expect(Object.keys((r12.tables as unknown as { layer: { layers: Record<string, unknown> } }).layer.layers)).toEqual(['0', 'outline', 'hole']);
    });
  }

  it('$EXTMIN/$EXTMAX include the half-circle bulges: the second plate reaches x = 160 + 20 and 120 − 20', () => {
    const dxf = parseDxf(writeDxf(input('r12')));
    const lo = dxf.header.$EXTMIN as { x: number; y: number };
    const hi = dxf.header.$EXTMAX as { x: number; y: number };
    // analytic: a half circle over a 40 mm chord reaches 20 mm beyond it
    expect([lo.x, lo.y, hi.x, hi.y]).toEqual([0, 0, 180, 60]);
  });

  it('refuses annotation layers, which R12 cannot keep from plotting', () => {
    const withNotes: WriterInput = { ...input('r12'), extras: [{ layer: 'finding', markers: [{ x: 1, y: 1, label: '1' }] }] };
    expect(() => writeDxf(withNotes)).toThrow(/R12/);
  });
});
