/**
 * Every option of a run, resolved, with its default. The CLI parses argv into a Partial<Settings>;
 * `resolveSettings` fills the defaults; the report prints the result (docs/report-schema.md `settings`).
 */
/** How a saddle cell of marching squares is resolved (docs/contour.md). */
export type SaddleRuleName = 'decider' | 'join' | 'split';

export type OutputFormat = 'dxf' | 'svg' | 'json' | 'html' | 'stl' | '3mf';

/** Every output format `--formats` accepts, in the order of docs/output-formats.md. */
export const OUTPUT_FORMATS: readonly OutputFormat[] = ['dxf', 'svg', 'json', 'html', 'stl', '3mf'];

/** The repairs of `--repair` (docs/repair.md), in the order they run; each is tied to check ids. */
export const REPAIR_IDS = ['thicken', 'fill-holes', 'open-corners', 'drop-islands'] as const;
export type RepairName = (typeof REPAIR_IDS)[number];

/** A grid edge that is a symmetry plane (`--mirror`): the mirror image is added beyond it. */
export const MIRROR_EDGES = ['left', 'right', 'bottom', 'top'] as const;
export type MirrorEdge = (typeof MIRROR_EDGES)[number];

/** A check's severity as set by `--severity <id>=off|warn|fail` (docs/checks/README.md). */
export type SeverityName = 'off' | 'warn' | 'fail';

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
  /** MAT/VTK/VTI: the variable or array to read (`--field`); null = the only candidate in the file. */
  field: string | null;
  /** PNG: which end of the grey scale is solid (`--image-solid`). */
  imageSolid: 'dark' | 'light';
  /** PNG: the channel of a colour image to read (`--image-channel`); null = refuse colour images. */
  imageChannel: 'luminance' | 'r' | 'g' | 'b' | null;
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
  /** Grid edges unfolded as symmetry planes (`--mirror`, repeatable), in the order given. */
  mirror: MirrorEdge[];
  /** The passive-region file as given (`--passive`); null = none. Its parsed content is passed to `build`. */
  passive: string | null;
  /** Write rings that are circles within the tolerance as true circles (`--circles`). */
  circles: boolean;
  // checks (docs/checks/; null = off unless a process preset sets it)
  /** mm: smallest allowed local width of the solid (`--min-member`). */
  minMember: number | null;
  /** mm: smallest allowed hole or gap (`--min-hole`). */
  minHole: number | null;
  /** mm: radius of the milling tool; concave corners tighter than it are findings (`--tool-radius`). */
  toolRadius: number | null;
  /** mm²: islands up to this area are tolerated; 0 = every extra piece is an island (`--min-island-area`). */
  minIslandArea: number;
  /** mm²: smallest allowed hole area (`--min-hole-area`); null = the default, 4 cell areas (src/check/small-holes.ts). */
  minHoleArea: number | null;
  /** %: M_nd of the input above which grey-level warns (`--grey-warn`). */
  greyWarn: number;
  /** Process preset id (`--process`); its limits fill the size limits not given explicitly. */
  process: string | null;
  /** mm: sheet thickness for the sheet-cutting presets (`--thickness`). */
  thickness: number | null;
  /** Per-check severity overrides (`--severity <id>=off|warn|fail`, repeatable). */
  severity: Record<string, SeverityName>;
  /** Lowest status that makes the exit code 1 (`--fail-on`). */
  failOn: 'warn' | 'fail';
  /** Repairs to run after the checks (`--repair[=list]`), in REPAIR_IDS order; empty = none. */
  repair: RepairName[];
  // structural re-check (docs/structure.md; the report shows these four only when `loads` is given)
  /** The loads file as given (`--loads`); null = no structural re-check. Its parsed content is passed to `build`. */
  loads: string | null;
  /** %: largest allowed compliance increase of the final geometry over the input design (`--max-stiffness-loss`). */
  maxStiffnessLoss: number;
  /** MPa: allowable von Mises stress of the final geometry (`--allowable-stress`); null = peak-stress off. */
  allowableStress: number | null;
  /** Largest number of finite elements before the grid is coarsened by an integer factor (`--fe-max-elements`). */
  feMaxElements: number;
  // output
  formats: OutputFormat[];
  units: 'mm' | 'in';
  /**
   * Write the annotations (passive-region references, findings, where repairs acted, labels) beside the part:
   * `<name>.notes.dxf` on non-plotting layers and groups in the SVG (`--annotations`). Off: the part only.
   */
  annotations: boolean;
  /** Fit the final outline with circular arcs and lines within the outline tolerance (`--arcs`). */
  arcs: boolean;
  /** DXF version of the part file (`--dxf-version`). */
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

/** Defaults filled in; `cellSizeDefaulted` follows from whether a cell size was given. */
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

/**
 * Whether a run with these settings needs the polygon boolean engine (src/geom/clipper.ts), which is loaded on
 * demand: passive regions, symmetry and repair use it; a plain build does not.
 */
/** The settings of the structural re-check, which the report lists only when `--loads` is given. */
export const STRUCTURE_SETTINGS = ['loads', 'maxStiffnessLoss', 'allowableStress', 'feMaxElements'] as const;

export function needsBooleanEngine(s: Pick<Settings, 'passive' | 'mirror' | 'repair'>): boolean {
  return s.passive !== null || s.mirror.length > 0 || s.repair.length > 0;
}
