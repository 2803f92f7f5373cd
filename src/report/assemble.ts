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
import type { CheckResult, PolygonSet, Report, ReportSettings } from '../types.js';
import { VERSION } from '../version.js';
import { CAUTIONS } from './cautions.js';
import { summarizeGeometry } from './geometry.js';

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
  /** Every non-fatal remark of the run, in order. */
  readonly warnings: readonly string[];
}

/** Every option, resolved for this grid: the cell size and layout read, the tolerance used, the preset's limits. */
export function reportSettings(s: Settings, field: PreparedField, plan: CheckPlan): ReportSettings {
  // Long-form CSV infers the cell size from the coordinates: report what was used, and that it was not assumed.
  const [hx, hy] = field.grid.cellSize;
  return {
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
    geometry: summarizeGeometry(r.final, field.domainArea),
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
  report.summary = summarize(report.checks);
  if (r.final !== smoothed.polygons) report.finishing = measureFinishing(r.final, smoothed.areaAfter, threshold.raw, field.domainArea, field.tolerance);
  return report;
}
