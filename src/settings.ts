/**
 * Every option of a run, resolved, with its default. The CLI parses argv into a Partial<Settings>;
 * `resolveSettings` fills the defaults; the report prints the result (docs/report-schema.md `settings`).
 */
/** How a saddle cell of marching squares is resolved (docs/contour.md). */
export type SaddleRuleName = 'decider' | 'join' | 'split';

export type OutputFormat = 'dxf' | 'svg' | 'json' | 'html';

export interface Settings {
  // input
  /** mm; [hx, hy]. */
  cellSize: [number, number];
  /** True when --cell-size was not given and 1 mm was assumed. */
  cellSizeDefaulted: boolean;
  rowOrder: 'top-down' | 'bottom-up';
  values: 'cells' | 'nodes';
  layout: 'grid' | 'long' | 'auto';
  valueRange: [number, number];
  decimalComma: boolean;
  nonFinite: 'error' | 'void';
  clip: boolean;
  maxCells: number;
  // geometry
  /** Target solid fraction (0..1); null = the mean of the prepared densities. */
  volumeFraction: number | null;
  /** Relative tolerance of the smoothed area against the target. */
  volumeTolerance: number;
  /** Fixed iso-level; null = volume-preserving search. */
  level: number | null;
  saddle: SaddleRuleName;
  /** Taubin λ|μ iterations (pairs). */
  smooth: number;
  smoothLambda: number;
  smoothMu: number;
  /** mm: largest allowed distance of the final outline from the raw contour; null = 0.25 × the smaller cell side. */
  tolerance: number | null;
  // output
  formats: OutputFormat[];
  units: 'mm' | 'in';
}

export const DEFAULT_SETTINGS: Settings = {
  cellSize: [1, 1],
  cellSizeDefaulted: true,
  rowOrder: 'top-down',
  values: 'cells',
  layout: 'auto',
  valueRange: [0, 1],
  decimalComma: false,
  nonFinite: 'error',
  clip: false,
  maxCells: 50_000_000,
  volumeFraction: null,
  volumeTolerance: 0.001,
  level: null,
  saddle: 'decider',
  smooth: 2,
  smoothLambda: 0.33,
  smoothMu: -0.34,
  tolerance: null,
  formats: ['dxf', 'svg', 'json', 'html'],
  units: 'mm',
};

/** Defaults filled in; `cellSizeDefaulted` follows from whether a cell size was given. */
export function resolveSettings(partial: Partial<Settings>): Settings {
  const s: Settings = { ...DEFAULT_SETTINGS, ...partial };
  s.cellSizeDefaulted = partial.cellSize === undefined;
  return s;
}
