import { describe, expect, it } from 'vitest';
import { contourFlat, type FlatPolygonSet } from '../../src/contour/index.js';
import { outlineStage, outlineWorkspace, type OutlineRecord } from '../../src/smooth/stage.js';
import { smoothFlat } from '../../src/smooth/smooth.js';
import { SmoothScratch } from '../../src/smooth/scratch.js';
import type { DensityGrid } from '../../src/types.js';
import { smoothField } from '../contour/grids.js';
import { holePlateGrid } from '../support/hole-plate.js';

const settings = { smooth: 2, smoothLambda: 0.33, smoothMu: -0.34, saddle: 'decider' as const };

function input(g: DensityGrid, tolerance: number) {
  const domain = [g.origin[0], g.origin[1], g.origin[0] + g.nx * g.cellSize[0], g.origin[1] + g.ny * g.cellSize[1]] as const;
  return { grid: g, planes: [], domain, tolerance };
}

/** Everything a caller can read of a record, lazy members included. */
function readAll(r: OutlineRecord) {
  const sm = r.smoothed;
  return {
    raw: r.raw,
    polygons: sm.polygons,
    maxDeviation: sm.maxDeviation,
    deviationResolution: sm.deviationResolution,
    areas: [sm.areaBefore, sm.areaAfter],
    vertices: [sm.verticesBefore, sm.verticesAfter, sm.ringsDropped],
  };
}

describe('outline builds sharing one workspace (the level search)', () => {
  const cases: { name: string; g: DensityGrid }[] = [
    { name: 'hole plate', g: holePlateGrid() },
    { name: 'random field, many rings', g: smoothField(80, 60, 12, 1) },
  ];
  for (const { name, g } of cases) {
    it(`gives every build the result of a build on fresh arrays, read after later builds (${name})`, () => {
      const field = input(g, 0.25);
      const ws = outlineWorkspace();
      // levels whose outlines grow and shrink, as the search's builds and a later search would
      const levels = [0.5, 0.47, 0.2, 0.8, 0.5, 0.35];
      const shared = levels.map((L, k) => outlineStage(field, L, settings, ws, k % 2 === 0 ? undefined : 3));
      // lazy members are read only now, after every later build has written over the workspace
      for (let k = 0; k < levels.length; k++) {
        expect(readAll(shared[k])).toEqual(readAll(outlineStage(field, levels[k], settings)));
      }
    });
  }

  it('the empty part (no level) through a used workspace', () => {
    const field = input(holePlateGrid(), 0.25);
    const ws = outlineWorkspace();
    outlineStage(field, 0.5, settings, ws);
    expect(readAll(outlineStage(field, null, settings, ws))).toEqual(readAll(outlineStage(field, null, settings)));
  });
});

describe('smoothing rings that need no cleaning without copying them', () => {
  it('gives the result of the copying path (the same rings in a larger buffer take it)', () => {
    const raw = contourFlat(smoothField(70, 50, 4, 2), 0.5, 'decider');
    const n = raw.start[raw.start.length - 1];
    const roomy = new Float64Array(2 * n + 6);
    roomy.set(raw.xy);
    const copied: FlatPolygonSet = { ...raw, xy: roomy };
    const opts = { iterations: 2, lambda: 0.33, mu: -0.34, tolerance: 0.25, domain: [0, 0, 70, 50] as const };
    const scratch = new SmoothScratch();
    const a = smoothFlat(raw, opts, scratch);
    const b = smoothFlat(copied, opts);
    expect([a.areaBefore, a.areaAfter, a.verticesBefore, a.verticesAfter, a.ringsDropped]).toEqual([b.areaBefore, b.areaAfter, b.verticesBefore, b.verticesAfter, b.ringsDropped]);
    expect(a.polygons).toEqual(b.polygons);
    expect(a.maxDeviation).toBe(b.maxDeviation);
    // the input is never written: it is still the contour
    expect(Array.from(raw.xy)).toEqual(Array.from(contourFlat(smoothField(70, 50, 4, 2), 0.5, 'decider').xy));
  });

  it('still cleans rings with repeated points, and drops a degenerate ring with its holes', () => {
    // a unit-square outer with its first point repeated, a hole inside it, and a zero-area outer with a hole
    const xy = Float64Array.from([0, 0, 0, 0, 4, 0, 4, 4, 0, 4, 1, 1, 1, 3, 3, 3, 3, 1, 5, 5, 6, 6, 7, 7, 5.5, 5.4, 5.6, 5.6, 5.7, 5.4]);
    const set: FlatPolygonSet = {
      xy,
      start: Int32Array.from([0, 5, 9, 12, 15]),
      hole: Uint8Array.from([0, 1, 0, 1]),
      owner: Int32Array.from([-1, 0, -1, 2]),
    };
    const r = smoothFlat(set, { iterations: 0, lambda: 0.33, mu: -0.34, tolerance: 0, domain: [-1, -1, 10, 10] });
    // analytic: 4 × 4 square minus a 2 × 2 hole; the collinear outer (zero area) and its hole are dropped
    expect(r.areaBefore).toBe(16 - 4);
    expect(r.ringsDropped).toBe(2);
    expect(r.polygons.polygons).toEqual([{ outer: [[0, 0], [4, 0], [4, 4], [0, 4]], holes: [[[1, 1], [1, 3], [3, 3], [3, 1]]] }]);
  });
});
