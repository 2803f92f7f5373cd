/** Data types shared by every stage. mm, y up, origin lower-left; outer rings CCW, holes CW, rings implicitly closed (docs/conventions.md). */

/** A scalar field on a regular grid, mm, y up. */
export interface DensityGrid {
  /** Samples along x; cells + 1 for nodal grids. */
  readonly nx: number;
  readonly ny: number;
  /** [hx, hy], mm. */
  readonly cellSize: readonly [number, number];
  /** Lower-left corner of the domain, mm. */
  readonly origin: readonly [number, number];
  /** values[j * nx + i], j up from the bottom row; NaN marks a non-finite input sample. */
  readonly values: Float64Array;
  /** Samples at cell centres or on cell corners. */
  readonly placement: 'cells' | 'nodes';
}

export type Point = readonly [x: number, y: number];
export type Ring = readonly Point[];
/** One piece of material; polygons of a set never overlap, and material inside a hole is a polygon of its own. */
export interface Polygon {
  readonly outer: Ring;
  readonly holes: readonly Ring[];
}
export interface PolygonSet {
  readonly polygons: readonly Polygon[];
}

import type { Settings } from './settings.js';

/** [minX, minY, maxX, maxY], mm, y up (the grid's cells, unfolded under `--mirror`). */
export type Domain = readonly [minX: number, minY: number, maxX: number, maxY: number];

export type InputFormat = 'csv' | 'npy' | 'mat' | 'vtk' | 'vti' | 'png';

/** One repair's record (docs/report-schema.md `repairs`); area mm², signed; locations at most 100, measured before repair. */
export interface RepairRecord {
  id: string;
  area: number;
  locations: Location[];
  checks: string[];
  skipped: string | null;
  locationsTotal: number;
  unresolved: string | null;
}

/** A finding or repair place: mm, y up, and the 1-based file position. */
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
  measured: number | null;
  limit: number;
  unit: 'mm' | 'mm2' | '%' | '1' | 'MPa';
  comparison: '>=' | '<=';
  resolution: number;
  method: string;
  message: string;
  locations: Location[];
  locationsTotal: number;
}

/** The report's `settings`: resolved for this grid (tolerance in mm, layout read, limits after a preset). Key order is the JSON order. */
export interface ReportSettings extends Omit<Settings, 'tolerance' | 'layout' | StructureSettingKey>, Partial<Pick<Settings, StructureSettingKey>> {
  tolerance: number;
  layout: 'grid' | 'long';
  cellSizeSource?: 'option' | 'default' | 'file' | 'coordinates';
}

/** Listed in the report only with `--loads`. */
type StructureSettingKey = 'loads' | 'maxStiffnessLoss' | 'allowableStress' | 'feMaxElements';

/** A structural value at a place: mm, MPa or N·mm as named; x, y in mm. */
export interface StructureLocated {
  value: number;
  x: number;
  y: number;
}

/** One design analysed (docs/structure.md): compliance N·mm, maxDisplacement mm, peakStress MPa (null when no element is half full). */
export interface StructureAnalysis {
  compliance: number;
  maxDisplacement: StructureLocated;
  peakStress: StructureLocated | null;
  solver: { iterations: number; relativeResidual: number; converged: boolean; seconds: number };
}

export interface StructureReport {
  loadsFile: string;
  material: { E: number /* MPa */; nu: number };
  thickness: number /* mm */;
  interpolation: { penal: number; minStiffness: number };
  elements: [number, number];
  elementSize: [number, number] /* mm */;
  coarsened: number;
  designs: { input: StructureAnalysis; beforeRepair?: StructureAnalysis; final: StructureAnalysis };
  /** final.compliance / input.compliance − 1. */
  complianceChange: number;
}

/** The report's `threshold` (docs/threshold.md); fractions of the domain area. */
export interface ThresholdSummary {
  mode: 'volume' | 'level' | 'constant';
  /** Null for a constant field. */
  level: number | null;
  targetFraction: number;
  /** Smoothed polygon area / domain area, before passive regions and repair. */
  achievedFraction: number;
  pixelFraction: number;
}

/** The JSON report, schemaVersion 1; every field is described in docs/report-schema.md. Fields may be added, never renamed or removed. */
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
    /** Segments, arcs and circles of the part's files; shortestSegment mm. */
    written?: { lines: number; arcs: number; circles: number; shortestSegment: number | null };
    arcFit?: ArcFitSummary;
  };
  smoothing: {
    maxDeviation: number /* mm */;
    tolerance: number /* mm */;
    rawArea: number /* mm² */;
    area: number /* mm² */;
    rawVertices: number;
    vertices: number;
  };
  process?: {
    id: string;
    title: string;
    thickness: number | null;
    values: Record<'minMember' | 'minHole' | 'toolRadius', { value: number; source: string } | null>;
  };
  checks: CheckResult[];
  repairs: RepairRecord[];
  /** With `--repair`: the checks before it; `checks` are then the repaired geometry's. */
  checksBeforeRepair?: CheckResult[];
  symmetry?: { edge: 'left' | 'right' | 'bottom' | 'top'; axis: 'x' | 'y'; at: number /* mm */ }[];
  passive?: {
    file: string;
    solid: number;
    void: number;
    solidSamples: number;
    voidSamples: number;
    /** mm², signed. */
    area: number;
    circles: number;
  };
  finishing?: {
    /** mm², signed. */
    areaChange: number;
    fractionChange: number;
    /** mm; null without a raw contour. */
    maxDeviation: number | null;
  };
  structure?: StructureReport;
  summary: { status: Status; pass: number; warn: number; fail: number };
  outputs: { file: string; format: 'dxf' | 'svg' | 'json' | 'html' | 'stl' | '3mf'; annotations?: true }[];
  warnings: string[];
  cautions: string[];
  /** Milliseconds per stage, in the order run; volatile. */
  timings?: Record<string, number>;
  /** Bytes: peak resident set; volatile. */
  peakMemory?: number;
}

/** What `--arcs` did (report `geometry.arcFit`); lengths in mm. */
export interface ArcFitSummary {
  segmentsBefore: number;
  segmentsAfter: number;
  arcs: number;
  /** Largest sampled distance of the fitted pieces from the raw contour, certified within `tolerance`. */
  maxDeviation: number;
  tolerance: number;
}
