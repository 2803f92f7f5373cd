/**
 * `--mirror` end to end on an analytic shape: a half disc (radius R, centred on the left grid edge, only the
 * right half in the grid) unfolded with `--mirror left` must give the full disc of diameter 2R centred at x = 0.
 *
 * Two drivers run the same assertions:
 * - `runStages`: the stages by hand in the order proposed for the pipeline (read → prepare → unfoldGrid →
 *   volume search on contour + smooth, judged by symmetricArea → symmetrize);
 * - `build()` itself, through the DXF it writes (re-read by dxf-parser, an independent reader).
 * Both judge the volume on the symmetric outline's area (symmetricArea): on coarse grids the two smoothed halves
 * differ enough that judging the plain smoothed area would miss the target (R = 5.3 cells below: 0.2 % off with
 * --volume-tolerance 0.1 %), which is why that case is here.
 *
 * Sources: analytic disc (area πR², perimeter 2πR, symmetric about its centre line); the smoothing budget
 * `--tolerance` (docs/smoothing.md: every final point within tolerance of the raw contour).
 */
import { describe, expect, it } from 'vitest';
import type { IDxf, ILwpolylineEntity } from 'dxf-parser';
import { contourGrid } from '../../src/contour/index.js';
import { fieldMean, gridDomain } from '../../src/field/mean.js';
import { mirrorPlanes, unfoldGrid } from '../../src/field/mirror.js';
import { prepareGrid } from '../../src/field/prepare.js';
import { symmetricArea, symmetrize } from '../../src/geom/symmetry.js';
import { loadGrid } from '../../src/input.js';
import { build } from '../../src/pipeline.js';
import { resolveSettings, type Settings } from '../../src/settings.js';
import { smoothPolygons } from '../../src/smooth/smooth.js';
import { chooseThreshold } from '../../src/threshold/choose.js';
import type { Point, PolygonSet } from '../../src/types.js';
import { npyFloat64 } from '../bench/npy-write.js';
import { DxfParser } from '../support/dxf-parser.js';


/** The half disc as an NPY file (rows top-down): density 0.5 + 0.5·tanh(signed distance / h), a ramp about one cell wide. */
function halfDisc(R: number, h: number, yc: number): { bytes: Uint8Array; cols: number; rows: number } {
  const cols = Math.ceil((R + 4) / h);
  const rows = Math.ceil((2 * yc) / h);
  const v = new Float64Array(cols * rows);
  for (let r = 0; r < rows; r++) {
    const y = (rows - 1 - r + 0.5) * h;
    for (let c = 0; c < cols; c++) v[r * cols + c] = 0.5 + 0.5 * Math.tanh((R - Math.hypot((c + 0.5) * h, y - yc)) / h);
  }
  return { bytes: npyFloat64(v, rows, cols), cols, rows };
}

interface Outcome {
  polygons: PolygonSet;
  /** The unfolded domain [minX, minY, maxX, maxY], mm. */
  domain: readonly [number, number, number, number];
  target: number;
  /** Mean of the grid as read (the half), for the volume target. */
  halfMean: number;
  level: number | null;
  tolerance: number;
}

/** The stages in the order the pipeline is to call them (the wiring the report of this change proposes). */
function runStages(bytes: Uint8Array, s: Settings): Outcome {
  const read = loadGrid({ name: 'half.npy', bytes }, s);
  const prep = prepareGrid(read.grid, read.locate, { valueRange: s.valueRange, clip: s.clip, nonFinite: s.nonFinite });
  const grid = unfoldGrid(prep.grid, s.mirror);
  const planes = mirrorPlanes(prep.grid, s.mirror);
  const domain = gridDomain(grid);
  const domainArea = (domain[2] - domain[0]) * (domain[3] - domain[1]);
  const tolerance = s.tolerance ?? 0.25 * Math.min(...grid.cellSize);
  const smoothOpts = { iterations: s.smooth, lambda: s.smoothLambda, mu: s.smoothMu, tolerance, domain } as const;
  const target = s.volumeFraction ?? fieldMean(grid);
  const choice = chooseThreshold(
    grid,
    { target, level: s.level, saddle: s.saddle, volumeTolerance: s.volumeTolerance, min: prep.min, max: prep.max, domainArea },
    (L) => {
      const raw = L === null ? { polygons: [] } : contourGrid(grid, L, s.saddle);
      const sm = smoothPolygons(raw, smoothOpts);
      // the volume search judges the area the symmetric outline will have
      return { raw, smoothed: { polygons: sm.polygons, areaBefore: sm.areaBefore, areaAfter: symmetricArea(sm.polygons, planes) } };
    },
  );
  return {
    polygons: symmetrize(choice.chosen.smoothed.polygons, planes, domain),
    domain,
    target,
    halfMean: fieldMean(prep.grid),
    level: choice.level,
    tolerance,
  };
}

/** Through build(): the outline as the DXF holds it (6 decimals), re-read by dxf-parser. */
function runBuild(bytes: Uint8Array, s: Settings): Outcome {
  const res = build({ name: 'half.npy', bytes }, s);
  const dxf = new DxfParser().parseSync(res.dxf());
  if (!dxf) throw new Error('dxf-parser returned nothing');
  const lines = dxf.entities.filter((e): e is ILwpolylineEntity => e.type === 'LWPOLYLINE');
  const outers = lines.filter((l) => l.layer === 'outline').map((l) => l.vertices.map((v): Point => [v.x, v.y]));
  const holes = lines.filter((l) => l.layer === 'hole').map((l) => l.vertices.map((v): Point => [v.x, v.y]));
  // DXF header: $LIMMIN / $LIMMAX are the domain corners (src/write/dxf.ts; $EXTMIN/$EXTMAX bound the entities)
  const lo = dxf.header.$LIMMIN as { x: number; y: number };
  const hi = dxf.header.$LIMMAX as { x: number; y: number };
  expect(res.report.geometry.polygons).toBe(outers.length);
  return {
    // holes are attached to the first outer ring: the disc has none, and the count is checked separately
    polygons: { polygons: outers.map((outer, k) => ({ outer, holes: k === 0 ? holes : [] })) },
    domain: [lo.x, lo.y, hi.x, hi.y],
    target: res.report.threshold.targetFraction,
    halfMean: res.report.input.mean,
    level: res.report.threshold.level,
    tolerance: res.report.smoothing.tolerance,
  };
}

const shoelace = (r: readonly Point[]) => r.reduce((a, [x, y], i) => a + x * r[(i + 1) % r.length][1] - r[(i + 1) % r.length][0] * y, 0) / 2;
const setArea = (s: PolygonSet) => s.polygons.reduce((a, p) => a + shoelace(p.outer) + p.holes.reduce((b, q) => b + shoelace(q), 0), 0);

/** Every vertex (x, y) has a vertex (−x, y) within `tol` (analytic: the disc's mirror line x = 0). */
function expectMirrorX(s: PolygonSet, tol: number): void {
  const vs = s.polygons.flatMap((p) => [p.outer, ...p.holes].flat());
  const sorted = [...vs].sort((a, b) => a[0] - b[0]);
  for (const [x, y] of vs) {
    let lo = 0;
    let hi = sorted.length;
    while (lo < hi) {
      const m = (lo + hi) >> 1;
      if (sorted[m][0] < -x - tol) lo = m + 1;
      else hi = m;
    }
    let ok = false;
    for (let k = lo; k < sorted.length && sorted[k][0] <= -x + tol; k++) if (Math.abs(sorted[k][1] - y) <= tol) ok = true;
    if (!ok) throw new Error(`vertex (${x}, ${y}) has no mirror image (${-x}, ${y})`);
  }
}

/** Allowance for marching squares' linear interpolation of a one-cell ramp (measured ≤ 0.03 h on these grids). */
const INTERPOLATION = 0.1;

const CASES = [
  { R: 20, h: 0.5, name: 'fine (R = 40 cells)', halvesDiffer: false },
  { R: 7.3, h: 1, name: 'coarse (R = 7.3 cells)', halvesDiffer: false },
  { R: 5.3, h: 1, name: 'coarse (R = 5.3 cells)', halvesDiffer: true },
];

/** The checks on every case (`halvesDiffer`: the smoothed halves differ, so judging the symmetric area matters). */
function mirroredDiscChecks(run: (bytes: Uint8Array, s: Settings) => Outcome, symmetryTol: number): void {
  for (const { R, h, name } of CASES) {
    const yc = R + 3.37;
    const { bytes, cols } = halfDisc(R, h, yc);
    const base: Partial<Settings> = { cellSize: [h, h], mirror: ['left'] };

    it(`${name}, level 0.5: one full disc centred at x = 0, exactly symmetric, area πR² within the contouring band`, () => {
      const o = run(bytes, resolveSettings({ ...base, level: 0.5 }));
      // the frame: the image lies beyond the left edge, the unfolded domain is [−W, W] × [0, H]
      expect(o.domain[0]).toBeCloseTo(-cols * h, 9);
      expect(o.domain[2]).toBeCloseTo(cols * h, 9);
      expect(o.polygons.polygons.length).toBe(1); // seamless: the halves merge into one piece
      expect(o.polygons.polygons[0].holes.length).toBe(0);
      expectMirrorX(o.polygons, symmetryTol);
      // every vertex lies within δ of the circle: the smoothing budget plus the raw contour's interpolation error
      const delta = o.tolerance + INTERPOLATION * h;
      let xmin = Infinity;
      let xmax = -Infinity;
      for (const [x, y] of o.polygons.polygons[0].outer) {
        expect(Math.abs(Math.hypot(x, y - yc) - R)).toBeLessThanOrEqual(delta);
        xmin = Math.min(xmin, x);
        xmax = Math.max(xmax, x);
      }
      expect(xmin).toBeCloseTo(-xmax, 6); // analytic: centred at x = 0
      expect(Math.abs(xmax - R)).toBeLessThanOrEqual(delta);
      // analytic: an outline within the band R ± δ encloses πR² ± (2πRδ + πδ²)
      const A = setArea(o.polygons);
      expect(Math.abs(A - Math.PI * R * R)).toBeLessThanOrEqual(2 * Math.PI * R * delta + Math.PI * delta * delta);
    });

    it(`${name}, volume search: the target is the half's mean and the symmetric outline meets it`, () => {
      const s = resolveSettings(base);
      const o = run(bytes, s);
      // analytic: every cell is copied once, so the unfolded mean is the half's mean
      expect(Math.abs(o.target - o.halfMean)).toBeLessThan(1e-12);
      expect(o.polygons.polygons.length).toBe(1);
      expectMirrorX(o.polygons, symmetryTol);
      const domainArea = (o.domain[2] - o.domain[0]) * (o.domain[3] - o.domain[1]);
      // docs/threshold.md: the final area equals target × domain area within --volume-tolerance (relative);
      // the DXF's 6 decimals change the area by at most perimeter × 1e-6
      const A = setArea(o.polygons);
      const slack = 2 * Math.PI * R * 1e-6;
      expect(Math.abs(A - o.target * domainArea)).toBeLessThanOrEqual(s.volumeTolerance * o.target * domainArea + slack);
    });
  }
}

describe('--mirror left on a half disc, stage by stage', () => {
  mirroredDiscChecks(runStages, 1e-9);
});

describe('--mirror left on a half disc, through build() and its DXF', () => {
  // the DXF rounds half away from zero to 6 decimals, which is symmetric under x ↦ −x
  mirroredDiscChecks(runBuild, 1e-9);
});
