/**
 * Passive regions: parts of the design that are fixed before and after thresholding — bolt holes, bearing pads,
 * a clamped face. Each region is a primitive in mm in the report frame (y up, origin at the lower-left corner of
 * the input grid; docs/conventions.md) with a role: 'solid' (always material) or 'void' (never material).
 * Void wins where a solid and a void primitive overlap (a bolt hole through a pad). docs/passive.md.
 */
import type { Point } from '../types.js';

/** 'solid': always material; 'void': never material (void wins over solid). */
export type PassiveRole = 'solid' | 'void';

/** A primitive in mm, y up. */
export type PassiveShape =
  /** Disc of centre (cx, cy) and radius r > 0. */
  | { readonly kind: 'circle'; readonly cx: number; readonly cy: number; readonly r: number }
  /** Axis-aligned rectangle, x0 < x1, y0 < y1. */
  | { readonly kind: 'rect'; readonly x0: number; readonly y0: number; readonly x1: number; readonly y1: number }
  /** Simple polygon (≥ 3 distinct points, non-zero area, no self-intersection), either orientation, implicitly closed. */
  | { readonly kind: 'polygon'; readonly points: readonly Point[] };

/** One region of a passive-region file. */
export interface PassiveRegion {
  readonly role: PassiveRole;
  readonly shape: PassiveShape;
  /** The optional `name` from the file; null when absent. */
  readonly name: string | null;
  /** Key path of the region in the file, e.g. "regions[2]" (for messages). */
  readonly path: string;
}

/** The content of a passive-region file (an empty list is allowed and changes nothing). */
export interface PassiveRegions {
  readonly regions: readonly PassiveRegion[];
}
