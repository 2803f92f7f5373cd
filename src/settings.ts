/** Every option of a run, resolved, with its default; the report prints it (docs/report-schema.md `settings`). */

/** How a saddle cell of marching squares is resolved (docs/contour.md). */
export type SaddleRuleName = 'decider' | 'join' | 'split';

export type OutputFormat = 'dxf' | 'svg' | 'json' | 'html' | 'stl' | '3mf';

/** In the order of docs/output-formats.md. */
export const OUTPUT_FORMATS: readonly OutputFormat[] = ['dxf', 'svg', 'json', 'html', 'stl', '3mf'];

/** The repairs of `--repair` (docs/repair.md), in the order they run. */
export const REPAIR_IDS = ['thicken', 'fill-holes', 'open-corners', 'drop-islands'] as const;
export type RepairName = (typeof REPAIR_IDS)[number];

export const MIRROR_EDGES = ['left', 'right', 'bottom', 'top'] as const;
export type MirrorEdge = (typeof MIRROR_EDGES)[number];

export type SeverityName = 'off' | 'warn' | 'fail';

export interface Settings {
  /** mm; [hx, hy]. */
  cellSize: [number, number];
  /** True when 1 mm was assumed. */
  cellSizeDefaulted: boolean;
  rowOrder: 'top-down' | 'bottom-up';
  values: 'cells' | 'nodes';
  layout: 'grid' | 'long' | 'auto';
  valueRange: [number, number];
  decimalComma: boolean;
  nonFinite: 'error' | 'void';
  clip: boolean;
  maxCells: number;
  /** MAT/VTK/VTI variable; null = the only candidate. */
  field: string | null;
  imageSolid: 'dark' | 'light';
  /** PNG colour channel; null = refuse colour images. */
  imageChannel: 'luminance' | 'r' | 'g' | 'b' | null;
  /** Target solid fraction (0..1); null = the mean of the prepared densities. */
  volumeFraction: number | null;
  volumeTolerance: number;
  /** Fixed iso-level; null = volume-preserving search. */
  level: number | null;
  saddle: SaddleRuleName;
  /** Taubin λ|μ pairs. */
  smooth: number;
  smoothLambda: number;
  smoothMu: number;
  /** mm; null = 0.25 × the smaller cell side. */
  tolerance: number | null;
  mirror: MirrorEdge[];
  /** File names as given (`--passive`, `--loads`); the parsed content is passed to `build`. */
  passive: string | null;
  circles: boolean;
  /** Size limits, mm (areas mm²); null = off unless a process preset sets it (docs/checks/). */
  minMember: number | null;
  minHole: number | null;
  toolRadius: number | null;
  /** 0 = every extra piece is an island. */
  minIslandArea: number;
  /** null = 4 cell areas (src/check/small-holes.ts). */
  minHoleArea: number | null;
  /** %. */
  greyWarn: number;
  process: string | null;
  /** mm, for the sheet presets. */
  thickness: number | null;
  severity: Record<string, SeverityName>;
  /** Lowest status that makes the exit code 1. */
  failOn: 'warn' | 'fail';
  /** In REPAIR_IDS order; empty = none. */
  repair: RepairName[];
  /** null = no structural re-check (docs/structure.md). */
  loads: string | null;
  /** %: compliance increase allowed. */
  maxStiffnessLoss: number;
  /** MPa; null = peak-stress off. */
  allowableStress: number | null;
  feMaxElements: number;
  formats: OutputFormat[];
  units: 'mm' | 'in';
  /** `<name>.notes.dxf` and SVG groups beside the part (`--annotations`). */
  annotations: boolean;
  arcs: boolean;
  dxfVersion: 'r12' | 'r2000';
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
  field: null,
  imageSolid: 'dark',
  imageChannel: null,
  volumeFraction: null,
  volumeTolerance: 0.001,
  level: null,
  saddle: 'decider',
  smooth: 2,
  smoothLambda: 0.33,
  smoothMu: -0.34,
  tolerance: null,
  mirror: [],
  passive: null,
  circles: false,
  minMember: null,
  minHole: null,
  toolRadius: null,
  minIslandArea: 0,
  minHoleArea: null,
  greyWarn: 25,
  process: null,
  thickness: null,
  severity: {},
  failOn: 'fail',
  repair: [],
  loads: null,
  maxStiffnessLoss: 10,
  allowableStress: null,
  feMaxElements: 500_000, // = FE_MAX_ELEMENTS (src/fe/analyse.ts; settings sit below fe/ in the layers)
  formats: ['dxf', 'svg', 'json', 'html'],
  units: 'mm',
  annotations: false,
  arcs: false,
  dxfVersion: 'r2000',
};

export function resolveSettings(partial: Partial<Settings>): Settings {
  const s: Settings = {
    ...DEFAULT_SETTINGS,
    ...partial,
    severity: { ...(partial.severity ?? {}) },
    mirror: [...(partial.mirror ?? [])],
    repair: REPAIR_IDS.filter((r) => (partial.repair ?? []).includes(r)),
  };
  s.cellSizeDefaulted = partial.cellSize === undefined;
  return s;
}

/** Listed in the report only with `--loads`. */
export const STRUCTURE_SETTINGS = ['loads', 'maxStiffnessLoss', 'allowableStress', 'feMaxElements'] as const;

/** Passive regions, symmetry and repair need the boolean engine (src/geom/clipper.ts); a plain build does not. */
export function needsBooleanEngine(s: Pick<Settings, 'passive' | 'mirror' | 'repair'>): boolean {
  return s.passive !== null || s.mirror.length > 0 || s.repair.length > 0;
}
