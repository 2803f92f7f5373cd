/**
 * The whole job on the bundled demo grid, its DXF re-read by dxf-parser 1.1.2 (an independent DXF reader):
 * the same rings, vertices, closed flags, layers and units as the polygons the pipeline produced.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import type { IDxf, ILwpolylineEntity } from 'dxf-parser';
import { build } from '../../src/pipeline.js';
import { resolveSettings } from '../../src/settings.js';
import { DxfParser } from '../support/dxf-parser.js';


describe('demo grid → DXF → dxf-parser', () => {
  const bytes = readFileSync(new URL('../../fixtures/grids/demo-bracket.npy', import.meta.url));
  const res = build({ name: 'demo-bracket.npy', bytes }, resolveSettings({ cellSize: [2, 2] }));

  it('reads back every ring as a closed LWPOLYLINE on its layer, vertices to the written precision', () => {
    const text = res.dxf();
    const dxf = new DxfParser().parseSync(text) as IDxf;
    expect(dxf.header.$ACADVER).toBe('AC1015'); // docs/references.md §7.1: R2000 = AC1015
    expect(dxf.header.$INSUNITS).toBe(4); // docs/references.md §7.2: 4 = millimetres
    const lw = dxf.entities.filter((e): e is ILwpolylineEntity => e.type === 'LWPOLYLINE');
    const polys = res.smoothed.polygons.polygons;
    const rings = polys.flatMap((p) => [{ ring: p.outer, layer: 'outline' }, ...p.holes.map((h) => ({ ring: h, layer: 'hole' }))]);
    expect(lw).toHaveLength(rings.length);
    expect(lw.filter((e) => e.layer === 'outline')).toHaveLength(polys.length);
    expect(lw.filter((e) => e.layer === 'hole')).toHaveLength(res.report.geometry.holes);
    // Match by layer and order of writing.
    for (let k = 0; k < rings.length; k++) {
      const e = lw[k];
      expect(e.shape).toBe(true); // group 70 bit 1 = closed
      expect(e.layer).toBe(rings[k].layer);
      expect(e.vertices).toHaveLength(rings[k].ring.length);
      for (let v = 0; v < e.vertices.length; v++) {
        expect(Math.abs(e.vertices[v].x - rings[k].ring[v][0])).toBeLessThanOrEqual(0.5e-6 + 1e-9);
        expect(Math.abs(e.vertices[v].y - rings[k].ring[v][1])).toBeLessThanOrEqual(0.5e-6 + 1e-9);
      }
    }
  });

  it('writes the same bytes for the same input', () => {
    const again = build({ name: 'demo-bracket.npy', bytes }, resolveSettings({ cellSize: [2, 2] }));
    expect(again.dxf()).toBe(res.dxf());
    expect(again.svg()).toBe(res.svg());
  });

  it('keeps the optimizer volume within 0.1 % of the target (docs/threshold.md)', () => {
    const t = res.report.threshold;
    expect(t.mode).toBe('volume');
    expect(Math.abs(t.achievedFraction - t.targetFraction) / t.targetFraction).toBeLessThanOrEqual(0.001);
  });
});
