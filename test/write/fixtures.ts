/**
 * Writer inputs used by the writer tests: shapes of our own invention with coordinates chosen to exercise
 * rounding (irrational values from cos/sin, negative values, a domain that does not start at 0).
 */
import type { Point, Ring } from '../../src/types.js';
import type { WriterInput } from '../../src/write/types.js';

/** Regular n-gon, counter-clockwise (positive area) unless `clockwise`. */
export function regularPolygon(cx: number, cy: number, r: number, n: number, clockwise = false): Point[] {
  const pts: Point[] = [];
  for (let i = 0; i < n; i++) {
    const a = ((clockwise ? -i : i) * 2 * Math.PI) / n;
    pts.push([cx + r * Math.cos(a), cy + r * Math.sin(a)]);
  }
  return pts;
}

/** A 100 × 60 plate with a rectangular hole, a 48-gon plate with a 24-gon hole, extras on every layer. */
export function sampleInput(units: 'mm' | 'in' = 'mm'): WriterInput {
  const plateHole: Ring = [[30, 20], [30, 40], [70, 40], [70, 20]];
  return {
    polygons: {
      polygons: [
        { outer: [[0, 0], [100, 0], [100, 60], [0, 60]], holes: [plateHole] },
        { outer: regularPolygon(140.123456789, 30.5, 25, 48), holes: [regularPolygon(140.123456789, 30.5, 7.25, 24, true)] },
      ],
    },
    domain: [-10, -5, 180, 70],
    units,
    extras: [
      { layer: 'passive', circles: [{ x: 85, y: 30, r: 5 }], rings: [[[5, 5], [15, 5], [15, 15], [5, 15]]] },
      { layer: 'finding', markers: [{ x: 50, y: 50, label: '1' }, { x: 120.5, y: -2.25, label: '2 <thin> & "sharp"' }] },
      { layer: 'repair', rings: [[[60, 45], [64, 45], [64, 49]]], markers: [{ x: 62, y: 46, label: 'R1' }] },
    ],
  };
}

/** All rings of the part in writing order (outer, then its holes), with their role. */
export function partRings(input: WriterInput): { ring: Ring; hole: boolean }[] {
  const out: { ring: Ring; hole: boolean }[] = [];
  for (const p of input.polygons.polygons) {
    out.push({ ring: p.outer, hole: false });
    for (const h of p.holes) out.push({ ring: h, hole: true });
  }
  return out;
}

/** Reads a DXF text as [code, value] pairs (group code line, value line), trimming the code line. */
export function dxfPairs(text: string): [number, string][] {
  const lines = text.split(/\r\n|\n/);
  if (lines[lines.length - 1] === '') lines.pop();
  const pairs: [number, string][] = [];
  for (let i = 0; i + 1 < lines.length; i += 2) pairs.push([Number(lines[i].trim()), lines[i + 1]]);
  return pairs;
}
