/**
 * The solids (`--formats stl,3mf`): the part extruded by the thickness. Read back with readers written here
 * from the format documents — binary STL (3D Systems' StereoLithography Interface Specification, 1988: 80-byte
 * header, uint32 count, 50 bytes per facet, little-endian) and the 3MF package (PKWARE APPNOTE.TXT zip records,
 * CRC-32 checked with Node's own zlib.crc32, an independent implementation; 3MF Core Specification 1.3: the
 * model part named by _rels/.rels, unit millimeter, one object) — and checked as solids: every edge shared by
 * exactly two triangles running it in opposite directions (closed and consistently oriented), positive signed
 * volume (outward normals), no degenerate triangle, volume = area × thickness (analytic).
 * By hand, once: python3's zipfile opened the demo's .3mf (testzip: no bad entry).
 */
import { readFileSync } from 'node:fs';
import { crc32 } from 'node:zlib';
import { describe, expect, it } from 'vitest';
import { circumscribedRadius, circumscribedSegments } from '../../src/geom/circle.js';
import { build } from '../../src/pipeline.js';
import { REPAIR_IDS, resolveSettings } from '../../src/settings.js';
import { parsePassive } from '../../src/passive/parse.js';
import { writeSolid } from '../../src/write/solid.js';
import type { RingBulges, RingCircle } from '../../src/write/types.js';
import type { PolygonSet } from '../../src/types.js';
import { regularPolygon } from './fixtures.js';
import '../support/build-parts.js';

type Tri = [number, number, number][];

/** Binary STL → triangles (float32 vertices as read). */
function readStl(bytes: Uint8Array): Tri[] {
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const n = view.getUint32(80, true);
  expect(bytes.length).toBe(84 + 50 * n);
  const tris: Tri[] = [];
  for (let f = 0; f < n; f++) {
    const o = 84 + 50 * f + 12; // skip the normal
    const t: Tri = [];
    for (let k = 0; k < 3; k++) t.push([view.getFloat32(o + 12 * k, true), view.getFloat32(o + 12 * k + 4, true), view.getFloat32(o + 12 * k + 8, true)]);
    tris.push(t);
  }
  return tris;
}

/** Stored zip → entries by name, from the central directory (APPNOTE §4.3.12, §4.3.16), CRC-checked. */
function readZip(bytes: Uint8Array): Map<string, Uint8Array> {
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const eocd = bytes.length - 22;
  expect(view.getUint32(eocd, true)).toBe(0x06054b50);
  const count = view.getUint16(eocd + 10, true);
  let o = view.getUint32(eocd + 16, true);
  const out = new Map<string, Uint8Array>();
  for (let i = 0; i < count; i++) {
    expect(view.getUint32(o, true)).toBe(0x02014b50);
    const method = view.getUint16(o + 10, true);
    const crc = view.getUint32(o + 16, true);
    const size = view.getUint32(o + 20, true);
    const nameLen = view.getUint16(o + 28, true);
    const extraLen = view.getUint16(o + 30, true);
    const commentLen = view.getUint16(o + 32, true);
    const local = view.getUint32(o + 42, true);
    const name = new TextDecoder().decode(bytes.subarray(o + 46, o + 46 + nameLen));
    expect(method).toBe(0); // stored
    expect(view.getUint32(local, true)).toBe(0x04034b50);
    const start = local + 30 + view.getUint16(local + 26, true) + view.getUint16(local + 28, true);
    const data = bytes.subarray(start, start + size);
    expect(crc32(data)).toBe(crc);
    out.set(name, data);
    o += 46 + nameLen + extraLen + commentLen;
  }
  return out;
}

/** 3MF model XML → triangles, with the unit and the object count. */
function readModel(xml: string): { unit: string; objects: number; tris: Tri[] } {
  const unit = /<model[^>]*unit="([^"]+)"/.exec(xml)?.[1] ?? '';
  const objects = (xml.match(/<object /g) ?? []).length;
  const verts = [...xml.matchAll(/<vertex x="([^"]+)" y="([^"]+)" z="([^"]+)"\/>/g)].map((m) => [Number(m[1]), Number(m[2]), Number(m[3])] as [number, number, number]);
  const tris = [...xml.matchAll(/<triangle v1="(\d+)" v2="(\d+)" v3="(\d+)"\/>/g)].map((m) => [verts[Number(m[1])], verts[Number(m[2])], verts[Number(m[3])]] as Tri);
  return { unit, objects, tris };
}

/** Closed, consistently oriented, outward, non-degenerate; returns the volume (divergence theorem). */
function checkSolid(tris: Tri[]): number {
  const key = (p: [number, number, number]) => p.join(',');
  const directed = new Map<string, number>();
  let volume = 0;
  for (const t of tris) {
    const [a, b, c] = t;
    const ux = b[0] - a[0], uy = b[1] - a[1], uz = b[2] - a[2];
    const vx = c[0] - a[0], vy = c[1] - a[1], vz = c[2] - a[2];
    const area2 = Math.hypot(uy * vz - uz * vy, uz * vx - ux * vz, ux * vy - uy * vx);
    expect(area2).toBeGreaterThan(0); // no degenerate triangle
    for (let k = 0; k < 3; k++) {
      const e = `${key(t[k])}>${key(t[(k + 1) % 3])}`;
      directed.set(e, (directed.get(e) ?? 0) + 1);
    }
    // signed volume of the tetrahedron (origin, a, b, c)
    volume += (a[0] * (b[1] * c[2] - b[2] * c[1]) - a[1] * (b[0] * c[2] - b[2] * c[0]) + a[2] * (b[0] * c[1] - b[1] * c[0])) / 6;
  }
  // edge-manifold: every directed edge once, and its reverse once
  for (const [e, n] of directed) {
    expect(n).toBe(1);
    const [p, q] = e.split('>');
    expect(directed.get(`${q}>${p}`)).toBe(1);
  }
  expect(volume).toBeGreaterThan(0); // outward normals
  return volume;
}

/** A 100 × 60 plate with a 40 × 20 hole and a bolt hole r 5 (a true circle), and a detached 20 × 20 square with two half-circle bulges. */
const plate: PolygonSet = {
  polygons: [
    { outer: [[0, 0], [100, 0], [100, 60], [0, 60]], holes: [[[10, 10], [10, 30], [50, 30], [50, 10]], regularPolygon(75, 30, 5, 48, true)] },
    { outer: [[120, 0], [140, 0], [140, 20], [120, 20]], holes: [] },
  ],
};
const ringCircles: RingCircle[] = [{ polygon: 0, ring: 2, x: 75, y: 30, r: 5 }];
const arcs: RingBulges = [[null, null, null], [[0, 1, 0, 0]]];
const T = 6;
const TOL = 0.2;
/** analytic: 6000 − 800 − the circumscribed n-gon of the bolt hole + a half disc of radius 10 on the square. */
const n = circumscribedSegments(5, TOL / 4);
const holeArea = n * 5 * 5 * Math.tan(Math.PI / n);
const exactArea = 6000 - 800 - holeArea + 400;

describe('solids: STL and 3MF of the extruded part', () => {
  it('STL: closed, outward, no degenerate triangle; volume = area × thickness (half disc inscribed within the tolerance)', () => {
    const tris = readStl(writeSolid('stl', { polygons: plate, ringCircles, arcs, thickness: T, tolerance: TOL }));
    const volume = checkSolid(tris);
    // the half disc of radius 10 is polygonised inside it within TOL / 4: its area lies between the inscribed
    // polygon's and πr²/2 (analytic); float32 coordinates add a relative 1e-7
    expect(volume).toBeLessThanOrEqual((exactArea + (Math.PI * 100) / 2) * T * (1 + 1e-6));
    expect(volume).toBeGreaterThanOrEqual((exactArea + (Math.PI * 100) / 2 - 10 * Math.PI * (TOL / 4)) * T * (1 - 1e-6));
    expect(circumscribedRadius(5, n)).toBeLessThanOrEqual(5 + TOL / 4);
  });

  it('3MF: a stored zip with the content types, the relationship and one millimetre object; the same solid', () => {
    const zip = readZip(writeSolid('3mf', { polygons: plate, ringCircles, arcs, thickness: T, tolerance: TOL }));
    expect([...zip.keys()]).toEqual(['[Content_Types].xml', '_rels/.rels', '3D/3dmodel.model']);
    const rels = new TextDecoder().decode(zip.get('_rels/.rels'));
    expect(rels).toContain('Target="/3D/3dmodel.model"');
    expect(rels).toContain('Type="http://schemas.microsoft.com/3dmanufacturing/2013/01/3dmodel"');
    expect(new TextDecoder().decode(zip.get('[Content_Types].xml'))).toContain('application/vnd.ms-package.3dmanufacturing-3dmodel+xml');
    const model = readModel(new TextDecoder().decode(zip.get('3D/3dmodel.model')));
    expect(model.unit).toBe('millimeter');
    expect(model.objects).toBe(1);
    const volume = checkSolid(model.tris);
    const stl = checkSolid(readStl(writeSolid('stl', { polygons: plate, ringCircles, arcs, thickness: T, tolerance: TOL })));
    expect(Math.abs(volume - stl) / stl).toBeLessThan(1e-6);
  });

  it('a rectangle with a rectangular hole: volume exactly area × thickness (analytic 5200 × 6)', () => {
    const set: PolygonSet = { polygons: [{ outer: [[0, 0], [100, 0], [100, 60], [0, 60]], holes: [[[10, 10], [10, 30], [50, 30], [50, 10]]] }] };
    const model = readModel(new TextDecoder().decode(readZip(writeSolid('3mf', { polygons: set, thickness: T, tolerance: TOL })).get('3D/3dmodel.model')));
    expect(checkSolid(model.tris)).toBeCloseTo(5200 * T, 6);
  });

  it('refuses a solid without a thickness, naming --thickness', () => {
    expect(() => writeSolid('stl', { polygons: plate, thickness: null, tolerance: TOL })).toThrow(/--thickness/);
  });

  it('the repaired demo bracket: closed and outward, volume = the written area × 8 mm within the circles’ polygonisation', () => {
    const root = new URL('../../', import.meta.url);
    const passive = parsePassive(readFileSync(new URL('fixtures/passive/demo-bracket.passive.json', root), 'utf8'), 'p.json');
    const s = resolveSettings({ cellSize: [2, 2], process: 'waterjet-cut', thickness: 8, passive: 'p.json', repair: [...REPAIR_IDS], formats: ['stl'] });
    const res = build({ name: 'demo-bracket.npy', bytes: readFileSync(new URL('fixtures/grids/demo-bracket.npy', root)) }, s, { passive });
    const volume = checkSolid(readStl(res.solid('stl')));
    // the two bolt holes (r 5.5) are cut as polygons containing the circle: at most 2π·r·(tolerance/4) more
    // void each than the report's true circles (analytic); float32 adds a relative 1e-6
    const t = res.report.smoothing.tolerance;
    const area = res.report.geometry.area;
    expect(volume / 8).toBeLessThanOrEqual(area * (1 + 1e-6));
    expect(volume / 8).toBeGreaterThanOrEqual(area - 2 * 2 * Math.PI * 5.5 * (t / 4) - area * 1e-6);
  }, 120_000);
});
