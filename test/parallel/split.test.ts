/**
 * The split passes give the same bytes as the serial ones. In-process, with a stand-in host that runs each
 * band's task at its join (after the calling thread's own band, so in another order than the serial loop), the
 * morphology engine's outputs with 2 and 3 lanes are compared byte for byte with the single-lane run; the
 * transform itself is compared with its definition. Worker threads themselves: threads-e2e.test.ts.
 */
import { afterEach, describe, expect, it } from 'vitest';
import { columnPass, rowPass, sampledTransform, transformInput } from '../../src/morph/edt.js';
import { buildMorphology } from '../../src/morph/index.js';
import { medialRows } from '../../src/morph/medial.js';
import { polishRows, seedRows } from '../../src/morph/nearest.js';
import { bands, installLanes, type LaneHost, type LaneTask, runSplit } from '../../src/parallel/lanes.js';
import { encodePng } from '../../src/report/png.js';
import { circle, poly, rect, set, stadium } from '../morph/shapes.js';

const KERNELS: Record<string, (...a: never[]) => unknown> = { columnPass, rowPass, seedRows, polishRows, medialRows, encodePng };

/** A host whose lanes run the named kernel when the task is joined; `fail` makes every join throw instead. */
function standIn(count: number, fail = false): LaneHost & { tasks: LaneTask[] } {
  const tasks: LaneTask[] = [];
  return {
    count,
    tasks,
    submit(task) {
      tasks.push(task);
      return {
        join: () => {
          if (fail) throw new Error('lane lost');
          return (KERNELS[task.name] as (...a: unknown[]) => unknown)(...task.args);
        },
      };
    },
  };
}

afterEach(() => installLanes(null));

const bytes = (a: ArrayBufferView): Buffer => Buffer.from(a.buffer, a.byteOffset, a.byteLength);

describe('bands', () => {
  it('cover 0 … n − 1 once, in order, in near-equal parts', () => {
    for (const [n, k] of [[10, 3], [7, 7], [3, 5], [1_000_001, 2]]) {
      const b = bands(n, k);
      expect(b[0][0]).toBe(0);
      expect(b[b.length - 1][1]).toBe(n);
      for (let i = 1; i < b.length; i++) expect(b[i][0]).toBe(b[i - 1][1]);
      const sizes = b.map(([s, e]) => e - s);
      expect(Math.max(...sizes) - Math.min(...sizes)).toBeLessThanOrEqual(1);
    }
  });
});

describe('runSplit', () => {
  it('answers a lost lane by running its band on the calling thread', () => {
    installLanes(standIn(2, true));
    const got = runSplit('unused', 'sq', (x: number) => x * x, [[2], [3], [4]]);
    expect(got).toEqual([4, 9, 16]);
  });
});

describe('distance transform of a sampled function, split by columns and rows', () => {
  it('equals the definition min_q |p − q|² + f(q) (Felzenszwalb & Huttenlocher 2012), on one lane and on three', () => {
    // integer samples keep every sum exact, so the brute-force minimum must match to the bit
    const nx = 1500, ny = 1400;
    let seed = 5;
    const rnd = (): number => (seed = (seed * 16807) % 2147483647) / 2147483647;
    const pts: [number, number, number][] = [];
    for (let k = 0; k < 40; k++) pts.push([Math.floor(rnd() * nx), Math.floor(rnd() * ny), -Math.floor(rnd() * 400)]);
    const fill = (f: Float64Array): Float64Array => {
      f.fill(Infinity);
      for (const [i, j, v] of pts) f[j * nx + i] = v;
      return f;
    };
    const one = sampledTransform(fill(transformInput(nx * ny)), nx, ny);
    const host = standIn(3);
    installLanes(host);
    const three = sampledTransform(fill(transformInput(nx * ny)), nx, ny);
    expect(host.tasks.map((t) => t.name)).toEqual(['columnPass', 'columnPass', 'rowPass', 'rowPass']);
    expect(bytes(three.value).equals(bytes(one.value))).toBe(true);
    expect(bytes(three.arg).equals(bytes(one.arg))).toBe(true);
    for (let p = 0; p < nx * ny; p += 9973) {
      const i = p % nx, j = (p - i) / nx;
      let best = Infinity;
      for (const [qi, qj, v] of pts) best = Math.min(best, (i - qi) ** 2 + (j - qj) ** 2 + v);
      expect(one.value[p]).toBe(best);
    }
  });
});

describe('morphology engine on 1, 2 and 3 lanes', () => {
  // a plate with round holes, a thin strut and a slot, on a raster of 2.4 M pixels (over the split size)
  const shape = set(
    poly(rect(0, 0, 120, 100), circle(30, 30, 12), circle(80, 60, 9), rect(60, 10, 100, 12.5)),
    poly(stadium([130, 10], [230, 90], 1.6)),
  );
  const run = (): Buffer[] => {
    const m = buildMorphology(shape, { domain: [0, 0, 240, 100], pixel: 0.1 });
    const w = m.width('solid', 3), v = m.width('void', 4);
    const md = m.medial('solid', 3);
    const c = m.corners(1, 0.05);
    const t = m.thicknessMap(600);
    const text = Buffer.from(JSON.stringify([w, v, c]));
    return [text, bytes(md.x), bytes(md.y), bytes(md.radius), bytes(t.values)];
  };
  it('gives the same bytes', () => {
    const serial = run();
    expect(serial[0].length).toBeGreaterThan(100);
    for (const lanes of [2, 3]) {
      const host = standIn(lanes);
      installLanes(host);
      const split = run();
      expect(new Set(host.tasks.map((t) => t.name))).toEqual(new Set(['seedRows', 'polishRows', 'medialRows', 'columnPass', 'rowPass']));
      split.forEach((b, k) => expect(b.equals(serial[k])).toBe(true));
      installLanes(null);
    }
  });
});
