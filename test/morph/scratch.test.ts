/**
 * The engine's raster-sized scratch buffer (src/morph/scratch.ts) is lent to one step after another, so each
 * step must give the same result whatever the buffer held before: the checks in another order, a dirty table,
 * a sample area too small for its band. The foot vector, no longer stored, is checked against its definition.
 */
import { describe, expect, it } from 'vitest';
import { clusterPixels } from '../../src/morph/cluster.js';
import { makeFrame } from '../../src/morph/frame.js';
import { buildMorphology } from '../../src/morph/index.js';
import { medialRows } from '../../src/morph/medial.js';
import { footTo, nearestField } from '../../src/morph/nearest.js';
import { phaseMask } from '../../src/morph/raster.js';
import { RasterScratch } from '../../src/morph/scratch.js';
import { segmentsOf } from '../../src/morph/segments.js';
import { circle, poly, rect, set, stadium } from './shapes.js';

const bytes = (a: ArrayBufferView): Buffer => Buffer.from(a.buffer, a.byteOffset, a.byteLength);

// a plate with round holes, a slot and a thin strut: places for both width checks and for the tool corners
const shape = set(
  poly(rect(0, 0, 60, 40), circle(15, 15, 6), circle(40, 25, 4), rect(30, 5, 50, 6.5)),
  poly(stadium([65, 5], [110, 35], 0.8)),
);
const domain = [0, 0, 115, 40] as const;

describe('the scratch buffer lent from step to step', () => {
  it('gives the same results whatever step ran before (checks in two orders)', () => {
    const run = (cornersFirst: boolean): string[] => {
      const m = buildMorphology(shape, { domain, pixel: 0.25 });
      const out: Record<string, unknown> = {};
      if (cornersFirst) out.c = m.corners(1.5, 0.05);
      out.s = m.width('solid', 2);
      out.v = m.width('void', 3);
      if (!cornersFirst) out.c = m.corners(1.5, 0.05);
      const t = m.thicknessMap(300);
      return [JSON.stringify([out.s, out.v, out.c]), bytes(t.values).toString('hex')];
    };
    const a = run(false), b = run(true);
    // every survey must have a place to report, or the comparison would prove little
    for (const survey of JSON.parse(a[0]) as { places: unknown[] }[]) expect(survey.places.length).toBeGreaterThan(0);
    expect(b).toEqual(a);
  });

  it('refuses a second lease while one is open', () => {
    const s = new RasterScratch(16, false);
    expect(() => s.use(() => s.use(() => 0))).toThrow(/already in use/);
    expect(s.use((f64, i32) => [f64.length, i32.length, i32.buffer === f64.buffer])).toEqual([16, 16, true]);
  });

  it('clusterPixels on a dirty table equals clusterPixels on a new one', () => {
    const nx = 50, ny = 40;
    let seed = 11;
    const rnd = (): number => (seed = (seed * 16807) % 2147483647) / 2147483647;
    const n = 300;
    const ii = Int32Array.from({ length: n }, () => Math.floor(rnd() * nx));
    const jj = Int32Array.from({ length: n }, () => Math.floor(rnd() * ny));
    const dirty = Int32Array.from({ length: nx * ny + 7 }, () => Math.floor(rnd() * 1000) - 500);
    for (const gap of [0, 2]) {
      const fresh = clusterPixels(ii, jj, nx, ny, gap);
      expect(fresh.count).toBeGreaterThan(1);
      expect(clusterPixels(ii, jj, nx, ny, gap, dirty)).toEqual(fresh);
    }
  });

  it('the feature transform on a dirty scratch equals the transform on a new one', () => {
    const frame = makeFrame(domain, 0.5, 6);
    const segs = segmentsOf(shape, frame);
    const fresh = nearestField(frame, segs);
    const dirty = new Float64Array(frame.nx * frame.ny).fill(-3);
    const again = nearestField(frame, segs, dirty);
    expect(bytes(again.seg).equals(bytes(fresh.seg))).toBe(true);
    expect(bytes(again.dist).equals(bytes(fresh.dist))).toBe(true);
  });

  it('a band whose samples outgrow their area continues in new arrays: the same samples', () => {
    const frame = makeFrame(domain, 0.25, 6);
    const segs = segmentsOf(shape, frame);
    const field = nearestField(frame, segs);
    const phase = phaseMask(frame, segs);
    const free = medialRows(frame, segs, field, phase, 0, frame.ny);
    expect(free.n).toBeGreaterThan(100);
    for (const fit of [0, 5, free.n, free.n + 3]) {
      const area = { buffer: new ArrayBuffer(8 * Math.ceil((29 * fit) / 8) + 8), offset: 8, bytes: 29 * fit };
      const got = medialRows(frame, segs, field, phase, 0, frame.ny, area);
      expect(got.n).toBe(free.n);
      for (const k of ['x', 'y', 'r', 'cos', 'solid'] as const) expect(bytes(got[k]).equals(bytes(free[k]))).toBe(true);
    }
  });
});

describe('footTo', () => {
  it('is the vector to the nearest point of the segment (definition: projection clamped to the segment), in single precision, and its length is the stored distance', () => {
    const frame = makeFrame(domain, 0.5, 6);
    const segs = segmentsOf(shape, frame);
    const field = nearestField(frame, segs);
    const out = new Float32Array(2);
    let checked = 0;
    for (let p = 0; p < frame.nx * frame.ny; p += 97) {
      const s = field.seg[p];
      if (s < 0) continue;
      const i = p % frame.nx, j = (p - i) / frame.nx;
      const [ax, ay, dx, dy] = segs.geo.subarray(5 * s, 5 * s + 4);
      // nearest point of a + t·d, t in [0, 1], to (i, j): t = (c − a)·d / |d|², clamped
      const t = Math.min(1, Math.max(0, ((i - ax) * dx + (j - ay) * dy) / (dx * dx + dy * dy)));
      footTo(segs.geo, s, i, j, out, 0);
      expect(Math.abs(out[0] - (ax + t * dx - i))).toBeLessThan(1e-5);
      expect(Math.abs(out[1] - (ay + t * dy - j))).toBeLessThan(1e-5);
      expect(Math.abs(Math.hypot(out[0], out[1]) - field.dist[p])).toBeLessThan(1e-5 * (1 + field.dist[p]));
      checked++;
    }
    expect(checked).toBeGreaterThan(100);
  });
});
