/**
 * Finding markers carry a short label (the finding number) and an optional note (the check id): DXF writes
 * both in its TEXT (read back with dxf-parser, an independent parser), SVG draws the number and puts both in
 * the tooltip `<title>`.
 */
import DxfParser from 'dxf-parser';
import { describe, expect, it } from 'vitest';
import { writeDxf } from '../../src/write/dxf.js';
import { writeSvg } from '../../src/write/svg.js';
import type { WriterInput } from '../../src/write/types.js';

const input: WriterInput = {
  polygons: { polygons: [{ outer: [[0, 0], [10, 0], [10, 10], [0, 10]], holes: [] }] },
  domain: [0, 0, 20, 20],
  units: 'mm',
  extras: [{ layer: 'finding', markers: [{ x: 5, y: 5, label: '3', note: 'min-member-size' }, { x: 15, y: 15, label: '4' }] }],
};

describe('finding markers with notes', () => {
  it('DXF: TEXT "<n> <note>" on the finding layer, at the marker (dxf-parser)', () => {
    const Parser = DxfParser as unknown as new () => { parseSync(s: string): { entities: { type: string; layer: string; text?: string; position?: { x: number; y: number } }[] } };
    const texts = new Parser().parseSync(writeDxf(input)).entities.filter((e) => e.type === 'TEXT' && e.layer === 'finding');
    expect(texts.map((t) => t.text)).toEqual(['3 min-member-size', '4']);
    const points = new Parser().parseSync(writeDxf(input)).entities.filter((e) => e.type === 'POINT');
    expect(points.map((p) => [p.position?.x, p.position?.y])).toEqual([[5, 5], [15, 15]]);
  });
  it('SVG: the number is drawn, number and note are the tooltip', () => {
    const svg = writeSvg(input);
    expect(svg).toContain('<title>3 min-member-size</title>');
    expect(svg).toMatch(/>3<\/text>/);
    expect(svg).toContain('<title>4</title>');
  });
});
