/**
 * The threshold stage (docs/threshold.md): chooses the level. It names levels and judges the outlines built
 * there (src/smooth/stage.ts), but builds none; src/pipeline.ts thresholdStage runs the loop.
 */
import type { Settings } from '../settings.js';
import type { SmoothResult } from '../smooth/smooth.js';
import type { DensityGrid, PolygonSet, ThresholdSummary } from '../types.js';
import { ThresholdSearch, type LevelRequest } from './choose.js';

/** What the threshold stage needs of the prepared field (src/field/stage.ts PreparedField). */
export interface ThresholdInput {
  readonly grid: DensityGrid;
  readonly min: number;
  readonly max: number;
  readonly mean: number;
  /** mm². */
  readonly domainArea: number;
}

/** What the threshold stage reads of one outline (src/smooth/stage.ts OutlineRecord). */
export interface OutlineBuild {
  readonly raw: PolygonSet;
  readonly smoothed: SmoothResult;
  readonly contourMs: number;
  readonly smoothMs: number;
}

export interface ThresholdRecord {
  /** The report's `threshold` block. */
  readonly summary: ThresholdSummary;
  readonly raw: PolygonSet;
  readonly smoothed: SmoothResult;
  /** Full contour + smooth passes the choice needed (1 for --level). */
  readonly builds: number;
  /** ms, over all builds. */
  readonly contourMs: number;
  readonly smoothMs: number;
  readonly warnings: readonly string[];
}

export type ThresholdSettings = Pick<Settings, 'volumeFraction' | 'level' | 'volumeTolerance' | 'saddle'>;

/** One run of the threshold stage: ask for levels, take the outlines built there, then finish. */
export interface ThresholdRun {
  next(): LevelRequest | undefined;
  record(outline: OutlineBuild): void;
  finish(): ThresholdRecord;
}

/** Share of samples at or above `level`; without a level, 1 for a solid constant field and 0 otherwise. */
function pixelFraction(grid: DensityGrid, level: number | null, solidConstant: boolean): number {
  if (level === null) return solidConstant ? 1 : 0;
  let pixels = 0;
  const v = grid.values;
  for (let k = 0; k < v.length; k++) if (v[k] >= level) pixels++;
  return pixels / v.length;
}

export function thresholdSearch(field: ThresholdInput, s: ThresholdSettings): ThresholdRun {
  const target = s.volumeFraction ?? Math.min(1, Math.max(0, field.mean));
  const { grid, domainArea } = field;
  const search = new ThresholdSearch<SmoothResult>(grid, {
    target,
    level: s.level,
    saddle: s.saddle,
    volumeTolerance: s.volumeTolerance,
    min: field.min,
    max: field.max,
    domainArea,
  });
  let builds = 0;
  let contourMs = 0;
  let smoothMs = 0;
  let asked: LevelRequest | undefined;
  return {
    next() {
      asked = search.next();
      return asked;
    },
    record(outline) {
      if (asked && asked.level !== null) builds++;
      contourMs += outline.contourMs;
      smoothMs += outline.smoothMs;
      search.record(outline);
    },
    finish() {
      const choice = search.finish();
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
    },
  };
}
