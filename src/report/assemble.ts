/**
 * The report, assembled once from the stages' records (docs/report-schema.md). The key order of every object is
 * the JSON order of the report: keep it, the bytes of `--json` and the report files depend on it.
 */
import type { CheckPlan } from '../check/stage.js';
import { measureFinishing } from '../check/finishing.js';
import { summarize } from '../check/run.js';
import type { PreparedField } from '../field/stage.js';
import type { PassiveRecord } from '../passive/stage.js';
import type { RepairStageRecord } from '../repair/stage.js';
import type { Settings } from '../settings.js';
import type { ThresholdRecord } from '../threshold/stage.js';
import type { FeAnalysis } from '../fe/analyse.js';
import type { StructureRecord } from '../fe/stage.js';
import { STRUCTURE_SETTINGS } from '../settings.js';
import type { CheckResult, PolygonSet, Report, ReportSettings, StructureAnalysis, StructureReport } from '../types.js';
import { VERSION } from '../version.js';
import { CAUTIONS, STRUCTURE_CAUTION } from './cautions.js';
import { summarizeGeometry } from './geometry.js';
import type { WrittenShape } from '../write/stage.js';

export interface ReportRecords {
  readonly settings: Settings;
  readonly field: PreparedField;
  readonly threshold: ThresholdRecord;
  readonly passive: PassiveRecord;
  readonly plan: CheckPlan;
  /** The checks on the final outline (after repair when it ran). */
  readonly checks: readonly CheckResult[];
  /** With `--repair`: the checks before it, and what it did. */
  readonly beforeRepair: readonly CheckResult[] | null;
  readonly repair: RepairStageRecord | null;
  /** The outline written. */
  readonly final: PolygonSet;
  /** The outline as the files hold it (true circles, arcs); the geometry block measures it. */
  readonly written?: WrittenShape;
  /** Every non-fatal remark of the run, in order. */
  readonly warnings: readonly string[];
  /** The structural re-check (`--loads`); absent or null without. */
  readonly structure?: StructureRecord | null;
}

/** One design of the report's `structure` block (DESIGN §12 `Analysis`). */
function analysisReport(a: FeAnalysis): StructureAnalysis {
  const { iterations, relativeResidual, converged, seconds } = a.solver;
  return {
    compliance: a.compliance,
    maxDisplacement: { value: a.maxDisplacement.value, x: a.maxDisplacement.x, y: a.maxDisplacement.y },
    peakStress: a.peakStress === null ? null : { value: a.peakStress.value, x: a.peakStress.x, y: a.peakStress.y },
    solver: { iterations, relativeResidual, converged, seconds },
  };
}

/** The report's `structure` block (DESIGN §12) from the structure stage's record. */
export function structureReport(st: StructureRecord, loadsFile: string): StructureReport {
  const f = st.final.analysis;
  const { penal, minStiffness } = st.spec.interpolation;
  return {
    loadsFile,
    material: { E: st.spec.material.E, nu: st.spec.material.nu },
    thickness: st.thickness,
    interpolation: { penal, minStiffness },
    elements: [f.elements[0], f.elements[1]],
    elementSize: [f.elementSize[0], f.elementSize[1]],
    coarsened: f.coarsened,
    designs: {
      input: analysisReport(st.input.analysis),
      ...(st.beforeRepair ? { beforeRepair: analysisReport(st.beforeRepair.analysis) } : {}),
      final: analysisReport(f),
    },
    complianceChange: st.complianceChange,
  };
}

/** Every option, resolved for this grid: the cell size and layout read, the tolerance used, the preset's limits. */
export function reportSettings(s: Settings, field: PreparedField, plan: CheckPlan): ReportSettings {
  // Long-form CSV infers the cell size from the coordinates: report what was used, and that it was not assumed.
  const [hx, hy] = field.grid.cellSize;
  const out: ReportSettings = {
    ...s,
    cellSize: [hx, hy],
    // A VTK file's spacing is its cell size unless --cell-size was given.
    cellSizeDefaulted: s.cellSizeDefaulted && field.layout !== 'long' && field.cellSizeSource !== 'file',
    cellSizeSource: field.layout === 'long' ? 'coordinates' : field.cellSizeSource === 'file' ? 'file' : s.cellSizeDefaulted ? 'default' : 'option',
    layout: field.layout,
    tolerance: field.tolerance,
    minMember: plan.limits.minMember,
    minHole: plan.limits.minHole,
    toolRadius: plan.limits.toolRadius,
    minHoleArea: plan.limits.minHoleArea ?? s.minHoleArea,
  };
  // The structural re-check's options appear only when it ran, so runs without --loads keep their bytes.
  if (s.loads === null) for (const k of STRUCTURE_SETTINGS) delete out[k];
  return out;
}

/** The report of a run; `outputs` is empty (the CLI fills it once the files are written). */
export function assembleReport(r: ReportRecords): Report {
  const { settings: s, field, threshold, passive } = r;
  const { smoothed } = threshold;
  const report: Report = {
    schemaVersion: 1,
    tool: { name: 'rhoform', version: VERSION },
    input: field.input,
    settings: reportSettings(s, field, r.plan),
    threshold: threshold.summary,
    geometry: {
      ...summarizeGeometry(r.written?.polygons ?? r.final, field.domainArea, r.written ?? {}),
      ...(r.written?.arcFit ? { arcFit: r.written.arcFit } : {}),
    },
    smoothing: {
      maxDeviation: smoothed.maxDeviation,
      tolerance: field.tolerance,
      rawArea: smoothed.areaBefore,
      area: smoothed.areaAfter,
      rawVertices: smoothed.verticesBefore,
      vertices: smoothed.verticesAfter,
    },
    checks: [...r.checks],
    repairs: r.repair ? [...r.repair.records] : [],
    summary: { status: 'pass', pass: 0, warn: 0, fail: 0 },
    outputs: [],
    warnings: [...r.warnings],
    cautions: [...CAUTIONS],
  };
  if (r.plan.process !== null) report.process = r.plan.process;
  if (field.planes.length > 0) report.symmetry = field.planes.map((p, k) => ({ edge: s.mirror[k], axis: p.axis, at: p.at }));
  if (field.passive && field.passiveSamples) {
    report.passive = {
      file: s.passive ?? '(given)',
      solid: field.passive.regions.filter((x) => x.role === 'solid').length,
      void: field.passive.regions.filter((x) => x.role === 'void').length,
      solidSamples: field.passiveSamples.solid,
      voidSamples: field.passiveSamples.void,
      area: passive.area,
      circles: passive.exact?.ringCircles.length ?? 0,
    };
  }
  if (r.beforeRepair) report.checksBeforeRepair = [...r.beforeRepair];
  if (r.structure) {
    report.structure = structureReport(r.structure, s.loads ?? r.structure.spec.file);
    report.cautions.push(STRUCTURE_CAUTION);
  }
  report.summary = summarize(report.checks);
  if (r.final !== smoothed.polygons) report.finishing = measureFinishing(r.final, smoothed.areaAfter, threshold.raw, field.domainArea, field.tolerance);
  return report;
}
