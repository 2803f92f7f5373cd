/**
 * The threshold stage and the outline stage it drives (docs/threshold.md). `outlineStage` contours a prepared
 * grid at one level and smooths the result; `thresholdStage` chooses the level (constant field, `--level`, or the
 * volume-preserving search on the smoothed area) by calling it. Both can be called alone.
 *
 * Frame: mm, y up, origin at the lower-left corner of the input grid (docs/conventions.md).
 */
import { contourGrid } from '../contour/index.js';
import { symmetricArea, type MirrorPlane } from '../geom/symmetry.js';
import type { Settings } from '../settings.js';
import { smoothPolygons, type SmoothResult } from '../smooth/smooth.js';
import type { DensityGrid, Domain, PolygonSet, ThresholdSummary } from '../types.js';
import { chooseThreshold } from './choose.js';

/** What the outline stage needs of the prepared field (src/field/stage.ts PreparedField). */
export interface OutlineInput {
  readonly grid: DensityGrid;
  readonly planes: readonly MirrorPlane[];
  readonly domain: Domain;
  /** mm: the outline's deviation budget. */
  readonly tolerance: number;
}

/** One outline: the raw iso-contour and what smoothing made of it, with the time each took (ms). */
export interface OutlineRecord {
  readonly raw: PolygonSet;
  readonly smoothed: SmoothResult;
  readonly contourMs: number;
  readonly smoothMs: number;
}

/** What the threshold stage hands on. */
export interface ThresholdRecord {
  /** The report's `threshold` block. */
  readonly summary: ThresholdSummary;
  readonly raw: PolygonSet;
  readonly smoothed: SmoothResult;
  /** Full contour + smooth passes the choice needed (1 for --level). */
  readonly builds: number;
  /** ms spent contouring and smoothing inside the choice. */
  readonly contourMs: number;
  readonly smoothMs: number;
  readonly warnings: readonly string[];
}

type SmoothSettings = Pick<Settings, 'smooth' | 'smoothLambda' | 'smoothMu' | 'saddle'>;

const EMPTY: PolygonSet = { polygons: [] };

/**
 * The same smoothing result judged by another area (mm²): a view that keeps its lazy members (copying it would
 * run the deviation measure).
 */
function withArea(sm: SmoothResult, areaAfter: number): SmoothResult {
  return Object.create(sm, { areaAfter: { value: areaAfter, enumerable: true } }) as SmoothResult;
}

/**
 * Contour `field.grid` at `level` (null: the empty part) and smooth it. With `--mirror` the outline written is
 * the symmetrized one, so its area is judged as such (exact, no booleans): the volume search then meets the
 * target with the geometry that is written (docs/symmetry.md).
 */
export function outlineStage(field: OutlineInput, level: number | null, s: SmoothSettings): OutlineRecord {
  const a = performance.now();
  const raw = level === null ? EMPTY : contourGrid(field.grid, level, s.saddle);
  const b = performance.now();
  const opts = { iterations: s.smooth, lambda: s.smoothLambda, mu: s.smoothMu, tolerance: field.tolerance, domain: field.domain };
  const smoothedHere = smoothPolygons(raw, opts);
  const smoothed = field.planes.length > 0 ? withArea(smoothedHere, symmetricArea(smoothedHere.polygons, field.planes)) : smoothedHere;
  return { raw, smoothed, contourMs: b - a, smoothMs: performance.now() - b };
}

/** Share of samples at or above `level`; without a level, 1 for a solid constant field and 0 otherwise. */
function pixelFraction(grid: DensityGrid, level: number | null, solidConstant: boolean): number {
  if (level === null) return solidConstant ? 1 : 0;
  let pixels = 0;
  const v = grid.values;
  for (let k = 0; k < v.length; k++) if (v[k] >= level) pixels++;
  return pixels / v.length;
}

/** What the threshold stage needs of the prepared field. */
export interface ThresholdInput extends OutlineInput {
  readonly min: number;
  readonly max: number;
  readonly mean: number;
  readonly domainArea: number;
}

/** Choose the level for a prepared field and build the outline there. */
export function thresholdStage(field: ThresholdInput, s: SmoothSettings & Pick<Settings, 'volumeFraction' | 'level' | 'volumeTolerance'>): ThresholdRecord {
  const target = s.volumeFraction ?? Math.min(1, Math.max(0, field.mean));
  let builds = 0;
  let contourMs = 0;
  let smoothMs = 0;
  const { grid, domainArea } = field;
  const choice = chooseThreshold(
    grid,
    { target, level: s.level, saddle: s.saddle, volumeTolerance: s.volumeTolerance, min: field.min, max: field.max, domainArea },
    (L) => {
      const r = outlineStage(field, L, s);
      if (L !== null) builds++;
      contourMs += r.contourMs;
      smoothMs += r.smoothMs;
      return { raw: r.raw, smoothed: r.smoothed };
    },
  );
  const { mode, level } = choice;
  const { raw, smoothed } = choice.chosen;
  return {
    summary: {
      mode,
      level,
      targetFraction: target,
      achievedFraction: domainArea > 0 ? smoothed.areaAfter / domainArea : 0,
      pixelFraction: pixelFraction(grid, level, mode === 'constant' && field.min >= 0.5),
    },
    raw,
    smoothed,
    builds,
    contourMs,
    smoothMs,
    warnings: choice.warnings,
  };
}
