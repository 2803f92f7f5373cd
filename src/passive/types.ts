/** Passive regions: fixed solid or void primitives, mm, y up (docs/passive.md). */
import type { Point } from '../types.js';

/** Void wins over solid. */
export type PassiveRole = 'solid' | 'void';

/** mm, y up; a polygon is simple, either orientation. */
export type PassiveShape =
  | { readonly kind: 'circle'; readonly cx: number; readonly cy: number; readonly r: number }
  | { readonly kind: 'rect'; readonly x0: number; readonly y0: number; readonly x1: number; readonly y1: number }
  | { readonly kind: 'polygon'; readonly points: readonly Point[] };

export interface PassiveRegion {
  readonly role: PassiveRole;
  readonly shape: PassiveShape;
  readonly name: string | null;
  /** Key path in the file, e.g. "regions[2]". */
  readonly path: string;
}

export interface PassiveRegions {
  readonly regions: readonly PassiveRegion[];
}
