/**
 * Data types shared by every stage.
 *
 * Conventions (docs/conventions.md):
 * - one frame everywhere: millimetres, y up, origin at the lower-left corner of the grid;
 * - cell values sit at cell centres; nodal values (an (nx+1)×(ny+1) grid) sit on cell corners;
 * - outer rings are counter-clockwise (positive signed area), holes clockwise;
 * - rings are implicitly closed: the last point is not a copy of the first.
 */

/** Scalar field sampled on a regular grid. Lengths in mm, y up. */
export interface DensityGrid {
  /** Number of samples along x (columns). For nodal grids this is cells + 1. */
  readonly nx: number;
  /** Number of samples along y (rows). For nodal grids this is cells + 1. */
  readonly ny: number;
  /** Cell size [hx, hy] in mm; square cells have hx = hy. */
  readonly cellSize: readonly [number, number];
  /** Lower-left corner of the domain in mm. */
  readonly origin: readonly [number, number];
  /** values[j * nx + i]; j counts UP from the bottom row. NaN marks a non-finite input cell. */
  readonly values: Float64Array;
  /** Where the samples sit: at cell centres (default) or on cell corners. */
  readonly placement: 'cells' | 'nodes';
}

/** A point in mm, y up. */
export type Point = readonly [x: number, y: number];
/** A closed ring; the closing edge from the last point to the first is implicit. */
export type Ring = readonly Point[];
/** One piece of material: a counter-clockwise outer ring and its clockwise holes. */
export interface Polygon {
  readonly outer: Ring;
  readonly holes: readonly Ring[];
}
/** All material of a part. Polygons never overlap; material inside a hole is a separate polygon. */
export interface PolygonSet {
  readonly polygons: readonly Polygon[];
}

import type { Settings } from './settings.js';

/** The domain rectangle [minX, minY, maxX, maxY], mm, y up (the grid's cells, unfolded under `--mirror`). */
export type Domain = readonly [minX: number, minY: number, maxX: number, maxY: number];

/** Where a grid came from, as far as the report is concerned. */
export type InputFormat = 'csv' | 'npy' | 'mat' | 'vtk' | 'vti' | 'png';

/** One repair of `--repair` (docs/repair.md): what it changed and where. */
export interface RepairRecord {
  id: string;
  /** mm², signed: material added (+) or removed (−). */
  area: number;
  /** Where it acted (report frame), worst first, at most 100; `measured` is the value before repair. */
  locations: Location[];
  /** Additive: the check ids this repair answers. */
  checks: string[];
  /** Additive: why it did nothing, or null when it ran. */
  skipped: string | null;
  /** Additive: the number of places it acted on (locations may be capped). */
  locationsTotal: number;
  /** Additive: what this repair could not fix and why (count, worst value, where, reason), or null. */
  unresolved: string | null;
}

/** A located finding or repair, in the report frame (mm, y up) and as a 1-based file position. */
export interface Location {
  x: number;
  y: number;
  measured: number;
  fileRow: number;
  fileCol: number;
}

export type Status = 'pass' | 'warn' | 'fail';

export interface CheckResult {
  id: string;
  status: Status;
  /** Worst value found; null when there is nothing to measure. */
  measured: number | null;
  limit: number;
  unit: 'mm' | 'mm2' | '%' | '1' | 'MPa';
  comparison: '>=' | '<=';
  /** ± accuracy of the method, same unit. */
  resolution: number;
  method: string;
  message: string;
  /** Worst first, at most 100. */
  locations: Location[];
  locationsTotal: number;
}

/**
 * Every option of the run as the report prints it: the settings resolved for this grid (the tolerance in mm, the
 * layout read, the size limits after a process preset, the cell size used). Key order is the JSON order.
 */
export interface ReportSettings extends Omit<Settings, 'tolerance' | 'layout' | StructureSettingKey>, Partial<Pick<Settings, StructureSettingKey>> {
  /** mm: the outline's deviation budget actually used. */
  tolerance: number;
  /** The layout read ('auto' resolved). */
  layout: 'grid' | 'long';
  /** Where the cell size came from (additive): `--cell-size`, the 1 mm default, the file (VTK spacing), long-form coordinates. */
  cellSizeSource?: 'option' | 'default' | 'file' | 'coordinates';
}

/** Settings of the structural re-check: in the report only when `--loads` is given (additive). */
type StructureSettingKey = 'loads' | 'maxStiffnessLoss' | 'allowableStress' | 'feMaxElements';

/** A value of the structural re-check at a place: mm, MPa or N·mm as named; x, y in mm (report frame, y up). */
export interface StructureLocated {
  value: number;
  x: number;
  y: number;
}

/** One design analysed by the structural re-check (DESIGN §12 `Analysis`; docs/structure.md). */
export interface StructureAnalysis {
  /** f·u, N·mm. */
  compliance: number;
  /** mm, at a node of an element at least half full. */
  maxDisplacement: StructureLocated;
  /** MPa, von Mises at the centre of an element at least half full; null when none is. */
  peakStress: StructureLocated | null;
  solver: { iterations: number; relativeResidual: number; converged: boolean; seconds: number };
}

/** The report's `structure` block (DESIGN §12; additive, present only with `--loads`). */
export interface StructureReport {
  loadsFile: string;
  material: { E: number /* MPa */; nu: number };
  thickness: number /* mm */;
  interpolation: { penal: number; minStiffness: number };
  elements: [number, number];
  elementSize: [number, number] /* mm */;
  /** 1 = none; else the integer coarsening factor. */
  coarsened: number;
  designs: { input: StructureAnalysis; beforeRepair?: StructureAnalysis; final: StructureAnalysis };
  /** final.compliance / input.compliance − 1. */
  complianceChange: number;
}

/** The threshold stage's choice (report `threshold`; docs/threshold.md). Fractions of the domain area. */
export interface ThresholdSummary {
  mode: 'volume' | 'level' | 'constant';
  /** The iso-level; null when there is no level (a constant field). */
  level: number | null;
  targetFraction: number;
  /** Smoothed polygon area / domain area, before passive regions and repair. */
  achievedFraction: number;
  /** Share of samples at or above the level. */
  pixelFraction: number;
}

/** The JSON report, schemaVersion 1 (docs/report-schema.md). Fields may be added, never renamed or removed. */
export interface Report {
  schemaVersion: 1;
  tool: { name: 'rhoform'; version: string };
  input: {
    file: string;
    sha256: string;
    format: InputFormat;
    nx: number;
    ny: number;
    cellSize: [number, number];
    min: number;
    max: number;
    mean: number;
    greyLevel: number;
    nonFinite: number;
  };
  settings: ReportSettings;
  threshold: ThresholdSummary;
  geometry: {
    polygons: number;
    holes: number;
    area: number;
    perimeter: number;
    vertices: number;
    bbox: [number, number, number, number];
    finalFraction: number;
    /**
     * Additive: what the part's geometry files hold (DXF in mm): straight segments, circular-arc segments
     * (`--arcs`) and true circles, and the shortest written segment (mm; chord length for an arc; null when
     * every ring is a circle or there is none). area, perimeter, vertices and bbox above are of the same geometry.
     */
    written?: { lines: number; arcs: number; circles: number; shortestSegment: number | null };
    /** Additive, with `--arcs`: the part's segments before the arc fit (lines) and the fit's measured deviation. */
    arcFit?: ArcFitSummary;
  };
  /** Smoothing and simplification, measured against the raw iso-contour (added in schema 1, additive). */
  smoothing: {
    maxDeviation: number /* mm */;
    tolerance: number /* mm */;
    rawArea: number /* mm² */;
    area: number /* mm² */;
    rawVertices: number;
    vertices: number;
  };
  /** The process preset used (`--process`), its own values with sources; absent without a preset. Additive. */
  process?: {
    id: string;
    title: string;
    thickness: number | null;
    values: Record<'minMember' | 'minHole' | 'toolRadius', { value: number; source: string } | null>;
  };
  checks: CheckResult[];
  repairs: RepairRecord[];
  /**
   * The checks on the outline before repair, when `--repair` ran (additive). `checks` are then the final,
   * repaired geometry's: the summary and the exit code follow them.
   */
  checksBeforeRepair?: CheckResult[];
  /** Symmetry planes the grid was unfolded about (`--mirror`), in the order applied (additive; absent without). */
  symmetry?: { edge: 'left' | 'right' | 'bottom' | 'top'; axis: 'x' | 'y'; at: number /* mm */ }[];
  /** Passive regions applied (`--passive`; additive; absent without). */
  passive?: {
    file: string;
    solid: number;
    void: number;
    /** Samples of the grid set to 1 / 0 before the threshold. */
    solidSamples: number;
    voidSamples: number;
    /** mm², signed: what the exact booleans after smoothing changed. */
    area: number;
    /** Passive-void circles written as true circles. */
    circles: number;
  };
  /**
   * What happened after smoothing (passive regions, symmetry, repair): the area change and how far the final
   * outline is from the raw iso-contour. Reported, never failed (additive; absent when nothing changed it).
   */
  finishing?: {
    /** mm², signed: final area − smoothed area. */
    areaChange: number;
    /** finalFraction − achievedFraction. */
    fractionChange: number;
    /** mm: largest distance from the final outline to the raw iso-contour (directed Hausdorff); null without a raw contour. */
    maxDeviation: number | null;
  };
  /** The structural re-check (`--loads`, DESIGN §12; additive, absent without). */
  structure?: StructureReport;
  summary: { status: Status; pass: number; warn: number; fail: number };
  /** Files written; `annotations: true` marks `<name>.notes.dxf` (additive). */
  outputs: { file: string; format: 'dxf' | 'svg' | 'json' | 'html' | 'stl' | '3mf'; annotations?: true }[];
  /** Non-fatal remarks of the run (also printed on stderr). Additive. */
  warnings: string[];
  cautions: string[];
  /**
   * Milliseconds per stage of this run (additive; volatile: differs between runs of the same input). Keys in
   * the order the stages ran: read, prepare, threshold (the level search alone), contour, smooth, passive,
   * structure, checks, repair, write, report, and the renderings the CLI made before the report was written
   * (dxf, svg, notes, stl, 3mf, html).
   */
  timings?: Record<string, number>;
  /** Bytes: the process's peak resident set when the report was written (additive, volatile; set by the CLI). */
  peakMemory?: number;
}

/** What `--arcs` did (report `geometry.arcFit`, additive). Lengths in mm. */
export interface ArcFitSummary {
  /** Segments of the part before the fit (straight, as the rings were). */
  segmentsBefore: number;
  /** Segments after: straight lines plus arcs. */
  segmentsAfter: number;
  arcs: number;
  /**
   * Largest sampled distance from the fitted pieces (arcs and merged lines) to the raw iso-contour, mm; the
   * sampling certifies that no point of a piece is farther than `tolerance` (docs/output-formats.md, Arcs).
   */
  maxDeviation: number;
  /** The bound they were fitted to: the outline tolerance (`--tolerance`), mm. */
  tolerance: number;
}
