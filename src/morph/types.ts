/**
 * Public types of the morphology engine (src/morph/): local width of the solid and void phases, concave
 * corners a tool cannot reach, and a local-thickness raster for pictures.
 *
 * Frame: millimetres, y up, origin at the lower-left corner of the grid (docs/conventions.md).
 * Outside the domain rectangle is open space (void) for both phases (docs/checks/README.md).
 */
import type { PolygonSet } from '../types.js';

export type Phase = 'solid' | 'void';

export interface MorphologyOptions {
  /** Domain rectangle [minX, minY, maxX, maxY] in mm. */
  readonly domain: readonly [number, number, number, number];
  /** Raster pixel size in mm (square pixels), > 0. */
  readonly pixel: number;
}

/** One place thinner than asked: its thinnest point (mm, y up) and the local width there (mm). */
export interface WidthPlace {
  readonly x: number;
  readonly y: number;
  readonly width: number;
}

export interface WidthSurvey {
  /** Smallest local width (mm) over the counted medial axis of the phase; null when there is none. */
  readonly min: number | null;
  /** Where that smallest width is (mm); null when `min` is null. */
  readonly minAt: { readonly x: number; readonly y: number } | null;
  /** One entry per connected place whose local width is below the asked value, thinnest first. */
  readonly places: readonly WidthPlace[];
  /** ± accuracy of the widths, mm. */
  readonly resolution: number;
}

/**
 * Counted medial samples of one phase thinner than asked (θ-simplified medial axis, θ ≥ 120°), as typed arrays:
 * sample k is the centre (x[k], y[k]) in mm (y up) of a disc of radius radius[k] mm inside the phase that touches
 * the boundary at two points seen under ≥ 120° from it; local width there = 2·radius[k].
 */
export interface MedialPoints {
  readonly count: number;
  readonly x: Float64Array;
  readonly y: Float64Array;
  readonly radius: Float64Array;
}

/** A concave corner of the solid a disc of the tool radius cannot reach: where, and its radius (mm). */
export interface CornerPlace {
  readonly x: number;
  readonly y: number;
  readonly radius: number;
}

export interface CornerSurvey {
  /** Tightest corner radius among the corners found (mm); null when no corner is tighter than the tool. */
  readonly min: number | null;
  /** One entry per corner (connected uncut region) deeper than the depth allowance, tightest first. */
  readonly places: readonly CornerPlace[];
  /** ± accuracy of the radii, mm. */
  readonly resolution: number;
}

/** Local thickness of the solid on a coarse raster (for pictures). */
export interface ThicknessMap {
  /** Pixels across and up. */
  readonly nx: number;
  readonly ny: number;
  /** The rectangle the raster covers, mm [minX, minY, maxX, maxY]. */
  readonly domain: readonly [number, number, number, number];
  /** values[j * nx + i], j counting up from the bottom row: local thickness in mm; NaN on void. */
  readonly values: Float32Array;
}

export interface Morphology {
  /** The raster pixel size used, mm. */
  readonly pixel: number;
  /** Local width of one phase (θ-simplified medial axis); places below `below` mm are listed. */
  width(phase: Phase, below: number): WidthSurvey;
  /**
   * Every counted medial sample of one phase whose local width 2·radius is below `below` mm (the samples the
   * width survey groups into places), in raster order; several per pixel along an axis (additive).
   */
  medial(phase: Phase, below: number): MedialPoints;
  /** Concave corners of the solid that a disc of radius `toolRadius` (mm) leaves uncut deeper than `depth` (mm). */
  corners(toolRadius: number, depth: number): CornerSurvey;
  /** Local thickness raster of the solid, at most `maxSide` pixels along the longer side. */
  thicknessMap(maxSide: number): ThicknessMap;
}
