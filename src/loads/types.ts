/**
 * The load case of the structural re-check (DESIGN §12, docs/structure.md): material, thickness, the
 * optimizer's interpolation, supports and loads, each placed by one selector. Coordinates in mm in the report
 * frame (y up, origin at the lower-left corner of the grid), forces in N, E in MPa.
 */
import type { Point } from '../types.js';

export type Edge = 'left' | 'right' | 'bottom' | 'top';

/** Where a support or load acts; exactly one per entry. */
export type Selector =
  | { readonly kind: 'edge'; readonly edge: Edge }
  | { readonly kind: 'point'; readonly at: Point }
  | { readonly kind: 'segment'; readonly a: Point; readonly b: Point }
  | { readonly kind: 'circle'; readonly center: Point; readonly radius: number }
  | { readonly kind: 'rect'; readonly min: Point; readonly max: Point };

export type Fix = 'x' | 'y' | 'xy';

interface Entry {
  readonly selector: Selector;
  /** The entry's `name`, or null. */
  readonly name: string | null;
  /** Key path in the file, e.g. `supports[2]`. */
  readonly path: string;
  /** Where the entry starts in the file (1-based), for messages about it. */
  readonly line?: number;
  readonly col?: number;
}

export interface Support extends Entry {
  readonly fix: Fix;
}

export interface Load extends Entry {
  /** Total force [Fx, Fy], N. */
  readonly force: Point;
}

export interface LoadsSpec {
  /** The file as named in messages. */
  readonly file: string;
  readonly material: { readonly E: number; readonly nu: number };
  /** Plate thickness, mm (plane stress); null when the file leaves it to `--thickness`. */
  readonly thickness: number | null;
  /** SIMP penalty p and minimum stiffness ratio r: E_e = E·(r + ρᵖ(1 − r)). */
  readonly interpolation: { readonly penal: number; readonly minStiffness: number };
  readonly supports: readonly Support[];
  readonly loads: readonly Load[];
  /** Where the `supports` array starts in the file (1-based), for messages about the supports together. */
  readonly supportsAt?: { readonly line?: number; readonly col?: number };
}
