/** The load case of the structural re-check (docs/structure.md): mm, y up; forces N, E MPa. */
import type { Point } from '../types.js';

export type Edge = 'left' | 'right' | 'bottom' | 'top';

/** Exactly one per entry. */
export type Selector =
  | { readonly kind: 'edge'; readonly edge: Edge }
  | { readonly kind: 'point'; readonly at: Point }
  | { readonly kind: 'segment'; readonly a: Point; readonly b: Point }
  | { readonly kind: 'circle'; readonly center: Point; readonly radius: number }
  | { readonly kind: 'rect'; readonly min: Point; readonly max: Point };

export type Fix = 'x' | 'y' | 'xy';

interface Entry {
  readonly selector: Selector;
  readonly name: string | null;
  /** Key path, e.g. `supports[2]`; line and col 1-based. */
  readonly path: string;
  /** 1-based, for messages about the entry. */
  readonly line?: number;
  readonly col?: number;
}

export interface Support extends Entry {
  readonly fix: Fix;
}

export interface Load extends Entry {
  /** N. */
  readonly force: Point;
}

export interface LoadsSpec {
  readonly file: string;
  readonly material: { readonly E: number; readonly nu: number };
  /** mm; null: `--thickness` gives it. */
  readonly thickness: number | null;
  /** E_e = E·(r + ρᵖ(1 − r)), p = penal, r = minStiffness. */
  readonly interpolation: { readonly penal: number; readonly minStiffness: number };
  readonly supports: readonly Support[];
  readonly loads: readonly Load[];
  /** Where the `supports` array starts, for messages about the supports together. */
  readonly supportsAt?: { readonly line?: number; readonly col?: number };
}
