/** The outline stage: the raw iso-contour at one level and what smoothing makes of it. mm, y up. */
import { ContourScratch, contourFlat, nestedSet, NO_RINGS } from '../contour/index.js';
import { symmetricArea, type MirrorPlane } from '../geom/symmetry.js';
import type { Settings } from '../settings.js';
import type { DensityGrid, Domain, PolygonSet } from '../types.js';
import { SmoothScratch } from './scratch.js';
import { smoothFlat, type SmoothResult } from './smooth.js';

/** What the outline stage needs of the prepared field (src/field/stage.ts PreparedField). */
export interface OutlineInput {
  readonly grid: DensityGrid;
  readonly planes: readonly MirrorPlane[];
  readonly domain: Domain;
  /** mm: the outline's deviation budget. */
  readonly tolerance: number;
}

/** One outline, with the ms each part took. */
export interface OutlineRecord {
  /** null: the empty part. */
  readonly level: number | null;
  /** Nested on first read. */
  readonly raw: PolygonSet;
  readonly smoothed: SmoothResult;
  readonly contourMs: number;
  readonly smoothMs: number;
}

export type OutlineSettings = Pick<Settings, 'smooth' | 'smoothLambda' | 'smoothMu' | 'saddle'>;

/**
 * Working arrays the outline builds of one threshold search share (src/pipeline.ts thresholdStage), one build
 * at a time: the crossing store, the stitcher's and the smoothing's buffers. No record refers to them, so an
 * earlier build's outline stays valid while a later one reuses them.
 */
export interface OutlineWorkspace {
  readonly contour: ContourScratch;
  readonly smooth: SmoothScratch;
}

export function outlineWorkspace(): OutlineWorkspace {
  return { contour: new ContourScratch(), smooth: new SmoothScratch() };
}

/** The same result judged by another area (mm²), keeping its lazy members. */
function withArea(sm: SmoothResult, areaAfter: number): SmoothResult {
  return Object.create(sm, { areaAfter: { value: areaAfter, enumerable: true } }) as SmoothResult;
}

/**
 * Contour and smooth at `level`. With `--mirror` the area is that of the symmetrized outline, the one written
 * (docs/symmetry.md). `workspace`: arrays to reuse from the build before (same record without);
 * `straddling`: at most how many lattice cells straddle the level, when known (src/contour/march.ts).
 */
export function outlineStage(
  field: OutlineInput,
  level: number | null,
  s: OutlineSettings,
  workspace?: OutlineWorkspace,
  straddling?: number,
): OutlineRecord {
  const a = performance.now();
  const flat = level === null ? NO_RINGS : contourFlat(field.grid, level, s.saddle, workspace?.contour, straddling);
  const b = performance.now();
  const opts = { iterations: s.smooth, lambda: s.smoothLambda, mu: s.smoothMu, tolerance: field.tolerance, domain: field.domain };
  const here = smoothFlat(flat, opts, workspace?.smooth);
  const smoothed = field.planes.length > 0 ? withArea(here, symmetricArea(here.polygons, field.planes)) : here;
  const smoothMs = performance.now() - b;
  let raw: PolygonSet | undefined;
  return {
    level,
    get raw(): PolygonSet {
      return (raw ??= nestedSet(flat));
    },
    smoothed,
    contourMs: b - a,
    smoothMs,
  };
}
