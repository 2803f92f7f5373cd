/**
 * Public types of the morphology engine. Frame: mm, y up, origin at the lower-left corner of the grid; outside
 * the domain is open space (void) for both phases (docs/checks/README.md).
 */
import type { Domain, PolygonSet } from '../types.js';

export type Phase = 'solid' | 'void';

export interface MorphologyOptions {
  /** Domain rectangle [minX, minY, maxX, maxY], mm. */
  readonly domain: Domain;
  /** Square raster pixel, mm, > 0. */
  readonly pixel: number;
}

/** One place thinner than asked: its thinnest point (mm, y up) and the local width there (mm). */
export interface WidthPlace {
  readonly x: number;
  readonly y: number;
  readonly width: number;
}

export interface WidthSurvey {
  /** Smallest local width (mm) over the counted medial axis, and where it is (mm); null when there is none. */
  readonly min: number | null;
  readonly minAt: { readonly x: number; readonly y: number } | null;
  /** One entry per connected place whose local width is below the asked value, thinnest first. */
  readonly places: readonly WidthPlace[];
  /** ± accuracy of the widths, mm. */
  readonly resolution: number;
}

/** Counted medial samples (θ ≥ 120°) thinner than asked: disc centre (x[k], y[k]) and radius[k], mm; width 2·radius. */
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
  /** Tightest corner radius found (mm); null when no corner is tighter than the tool. */
  readonly min: number | null;
  /** One entry per corner (connected uncut region) deeper than the depth allowance, tightest first. */
  readonly places: readonly CornerPlace[];
  /** ± accuracy of the radii, mm. */
  readonly resolution: number;
}

/** Local thickness of the solid on a coarse raster (for pictures). */
export interface ThicknessMap {
  readonly nx: number;
  readonly ny: number;
  /** The rectangle the raster covers, mm [minX, minY, maxX, maxY]. */
  readonly domain: Domain;
  /** values[j * nx + i], j up: local thickness, mm; NaN on void. */
  readonly values: Float32Array;
}

export interface Morphology {
  /** The raster pixel size used, mm. */
  readonly pixel: number;
  /** Local width of one phase (θ-simplified medial axis); places below `below` mm are listed. */
  width(phase: Phase, below: number): WidthSurvey;
  /** The counted medial samples of one phase thinner than `below` mm (what width() groups), raster order. */
  medial(phase: Phase, below: number): MedialPoints;
  /** Concave corners of the solid that a disc of radius `toolRadius` (mm) leaves uncut deeper than `depth` (mm). */
  corners(toolRadius: number, depth: number): CornerSurvey;
  /** Local thickness raster of the solid, at most `maxSide` pixels along the longer side. */
  thicknessMap(maxSide: number): ThicknessMap;
}
