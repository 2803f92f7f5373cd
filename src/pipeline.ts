/** The only place that knows the order of the stages (docs/architecture.md). Pure: the CLI does every file operation. */
import { checkStage, planStage, type CheckRecord } from './check/stage.js';
import type { StructureDesign, StructureRecord, StructureStart } from './fe/stage.js';
import { levelCurve } from './field/curve.js';
import { prepareStage, withFileName } from './field/stage.js';
import { loadBooleanEngine } from './geom/clipper.js';
import { RhoformError, UsageError } from './errors.js';
import { loadGrid, type InputFile } from './input.js';
import { loadReaders } from './read/detect.js';
import type { LoadsSpec } from './loads/types.js';
import { buildMorphology } from './morph/index.js';
import { passiveStage } from './passive/stage.js';
import type { PassiveRegions } from './passive/types.js';
import type { RepairStageRecord } from './repair/stage.js';
import { assembleReport } from './report/assemble.js';
import type { HtmlPictures } from './report/html.js';
import { needsBooleanEngine, type Settings } from './settings.js';
import type { SmoothResult } from './smooth/smooth.js';
import { outlineStage, outlineWorkspace, type OutlineInput, type OutlineSettings } from './smooth/stage.js';
import { thresholdSearch, type ThresholdInput, type ThresholdRecord, type ThresholdSettings } from './threshold/stage.js';
import type { StructureCheckInput } from './check/types.js';
import type { DensityGrid, PolygonSet, Report } from './types.js';
import { loadSolidWriter, writeStage, writtenShape, type WrittenShape } from './write/stage.js';
import { summarizeGeometry } from './report/geometry.js';

export { inspect, loadGrid, type InputFile, type InspectResult } from './input.js';

export interface BuildResult {
  /** `outputs` is empty: the CLI fills it. */
  readonly report: Report;
  readonly grid: DensityGrid;
  readonly raw: PolygonSet;
  readonly smoothed: SmoothResult;
  readonly warnings: string[];
  /** Full contour + smooth passes of the volume search (1 for --level). */
  readonly builds: number;
  /** Milliseconds per stage; the same object as the report's `timings`, so a renderer may add entries. */
  readonly timings: Record<string, number>;
  /** Geometry files, rendered on demand. */
  dxf(): string;
  notesDxf(): string;
  svg(): string;
  /** Extruded by `--thickness` (mm). */
  solid(format: 'stl' | '3mf'): Uint8Array;
  /** The local-thickness map only when cheap or already built. */
  pictures(): HtmlPictures;
  readonly structure: StructureRecord | null;
}

/** Grids up to this many samples get a local-thickness picture even when no size check built the engine. */
const THICKNESS_PICTURE_CELLS = 500_000;
/** Pixels. */
const THICKNESS_PICTURE_SIDE = 600;

/** The parsed `--passive` and `--loads` files (the CLI reads and parses them). */
export interface BuildExtras {
  readonly passive?: PassiveRegions | null;
  readonly loads?: LoadsSpec | null;
  /**
   * Called as each stage ends, with its name (as in `timings`), the stages done and the stages this build runs
   * in all (`buildStageCount`): a caller's progress indication. It runs on the build's own thread.
   */
  readonly onStage?: (stage: string, done: number, total: number) => void;
}

/**
 * How many stages `build` runs for these settings: read, prepare, threshold, passive, checks, write and report,
 * plus repair and its second checks with `--repair`, and with `--loads` the structure stage once per outline
 * analysed and once to finish.
 */
export function buildStageCount(s: Pick<Settings, 'repair'>, withLoads: boolean): number {
  const repair = s.repair.length > 0;
  return 7 + (repair ? 2 : 0) + (withLoads ? (repair ? 3 : 2) : 0);
}

function structureView(start: StructureStart, d: StructureDesign): StructureCheckInput {
  return { input: start.input.analysis, geometry: d.analysis, reach: d.reach, x0: start.grid.x0, y0: start.grid.y0 };
}

/** What prepareBuild reads of the settings; `loads` and `formats` may be left out when the build uses neither. */
export type BuildNeeds = Pick<Settings, 'passive' | 'mirror' | 'repair'> & Partial<Pick<Settings, 'loads' | 'formats'>>;

type FeStage = typeof import('./fe/stage.js');

let feModule: FeStage | null = null;
let repairModule: typeof import('./repair/stage.js') | null = null;
let figures: typeof import('./report/figures.js') | null = null;

function loaded<T>(part: T | null, what: string): T {
  if (part === null) throw new RhoformError('E_INTERNAL', `${what} is not loaded: await prepareBuild(settings) before build()`);
  return part;
}

/**
 * Loads, once each, what a build needs: the boolean engine, the repairs, the re-check, the solid writers, and the
 * input's reader (`input.bytes` may be its first DETECT_BYTES; every reader without an input). Await before `build`.
 */
export async function prepareBuild(s: BuildNeeds, input?: { readonly name: string; readonly bytes: Uint8Array }): Promise<void> {
  await Promise.all([
    needsBooleanEngine(s) ? loadBooleanEngine() : null,
    s.repair.length > 0 ? import('./repair/stage.js').then((m) => void (repairModule = m)) : null,
    s.loads !== null && s.loads !== undefined ? import('./fe/stage.js').then((m) => void (feModule = m)) : null,
    s.formats?.some((f) => f === 'stl' || f === '3mf') ? loadSolidWriter() : null,
    s.formats?.includes('html') ? import('./report/figures.js').then((m) => void (figures = m)) : null,
    loadReaders(input),
  ]);
}

/**
 * The threshold stage with the outlines it asks for (docs/architecture.md). Its builds share one workspace:
 * each writes over the working arrays of the one before (fresh memory costs more than the work; no record
 * refers to them).
 */
export function thresholdStage(field: ThresholdInput & OutlineInput, s: ThresholdSettings & OutlineSettings): ThresholdRecord {
  const search = thresholdSearch(field, s);
  const workspace = outlineWorkspace();
  for (let q = search.next(); q; q = search.next()) search.record(outlineStage(field, q.level, s, workspace, q.straddling));
  return search.finish();
}

/** Stage times and progress: `lap(name)` closes the stage that just ran. */
function stageClock(total: number, onStage: BuildExtras['onStage']) {
  const timings: Record<string, number> = {};
  let t0 = performance.now();
  let done = 0;
  const lap = (name: string): void => {
    const t = performance.now();
    timings[name] = (timings[name] ?? 0) + (t - t0);
    onStage?.(name, ++done, total);
    t0 = performance.now();
  };
  return { timings, lap };
}

/** The structural re-check through a build (`--loads`): the input design at once, then each outline the checks judge. */
interface Recheck {
  /** Analyses `polygons` as the part now; the outline analysed before becomes the before-repair design. */
  analyse(polygons: PolygonSet): StructureCheckInput;
  /** The report's record of the designs analysed, `final` the written part. */
  finish(final: PolygonSet): StructureRecord;
}

function startRecheck(field: Parameters<FeStage['structureStart']>[0], loads: LoadsSpec | null, s: Settings): Recheck | null {
  if ((loads === null) !== (s.loads === null)) throw new UsageError('the structural re-check needs both settings.loads (the file name) and the parsed loads file');
  if (loads === null) return null;
  const fe = loaded(feModule, 'the structural re-check');
  const start = fe.structureStart(field, loads, s);
  let before: StructureDesign | null = null;
  let current: StructureDesign | null = null;
  return {
    analyse(polygons) {
      before = current;
      current = fe.structureDesign(start, polygons);
      return structureView(start, current);
    },
    finish(final) {
      if (current === null) throw new RhoformError('E_INTERNAL', 'the structural re-check finished before any outline was analysed');
      return fe.structureStage(start, before, current, final);
    },
  };
}

/** `rhoform build`. Throws RhoformError on bad input (exit 2). */
export function build(input: InputFile, s: Settings, more: BuildExtras = {}): BuildResult {
  const loads = more.loads ?? null;
  const { timings, lap } = stageClock(buildStageCount(s, loads !== null), more.onStage);
  if (s.thickness === null && s.formats.some((f) => f === 'stl' || f === '3mf')) {
    throw new UsageError(`--formats ${s.formats.filter((f) => f === 'stl' || f === '3mf').join(',')}: expected --thickness <mm> (the extrusion of the solid), found none`);
  }
  const read = loadGrid(input, s);
  lap('read');
  const field = prepareStage(input, read, s, more.passive ?? null, { consume: true }); // `read` is not used again
  lap('prepare');
  if (s.formats.includes('html')) figures?.startDensityPicture(field.grid); // a head start only: the same bytes without it
  const threshold = thresholdStage(field, s);
  lap('threshold');
  timings.threshold -= threshold.contourMs + threshold.smoothMs;
  timings.contour = threshold.contourMs;
  timings.smooth = threshold.smoothMs;
  const passive = passiveStage(threshold.smoothed, field);
  lap('passive');

  const plan = withFileName(input.name, () => planStage(field, threshold.summary.mode, s));
  const recheck = startRecheck(field, loads, s);
  const recheckView = (polygons: PolygonSet): StructureCheckInput | null => {
    if (recheck === null) return null;
    const view = recheck.analyse(polygons);
    lap('structure');
    return view;
  };
  const checkInput = { ...field, raw: threshold.raw, smoothed: threshold.smoothed, threshold: threshold.summary, greyLevel: field.input.greyLevel };
  const view = recheckView(passive.polygons);
  let checks: CheckRecord = checkStage(passive.polygons, passive.exact?.solidRings ?? null, checkInput, plan, view);
  lap('checks');

  let final = passive.polygons;
  let exact = passive.exact;
  let repair: RepairStageRecord | null = null;
  let beforeRepair: CheckRecord | null = null;
  let shape: WrittenShape | undefined;
  if (s.repair.length > 0) {
    repair = loaded(repairModule, 'the repair stage').repairStage({
      polygons: final,
      settings: s,
      limits: plan.limits,
      planned: plan.planned,
      planes: field.planes,
      passive: field.passive,
      passiveSolid: exact?.solidRings ?? [],
      domain: field.domain,
      tolerance: field.tolerance,
      simplify: Math.min(Math.max(0, field.tolerance - threshold.smoothed.maxDeviation), field.tolerance / 16),
      pixel: plan.pixel,
      locate: plan.locate,
    });
    final = repair.polygons;
    exact = repair.passive;
    lap('repair');
    const repairedView = recheckView(final);
    beforeRepair = checks;
    // after a repair, volume-fraction judges the area the files will hold
    shape = writtenShape({ polygons: final, domain: field.domain, tolerance: field.tolerance, passiveCircles: exact?.ringCircles ?? [], passive: field.passive, raw: threshold.raw }, s);
    const writtenArea = summarizeGeometry(shape.polygons, field.domainArea, shape).area;
    checks = checkStage(final, exact?.solidRings ?? null, { ...checkInput, repaired: true, writtenArea }, plan, repairedView);
    lap('checks');
  }
  const structure = recheck === null ? null : recheck.finish(final);
  if (structure !== null) lap('structure');
  const warnings = [...field.warnings, ...threshold.warnings, ...(structure?.warnings ?? [])];
  const files = writeStage(
    { polygons: final, domain: field.domain, tolerance: field.tolerance, passiveCircles: exact?.ringCircles ?? [], checks: checks.results, repair, passive: field.passive, raw: threshold.raw },
    s,
    shape,
  );
  lap('write');
  const report = assembleReport({
    settings: s,
    field,
    threshold,
    passive,
    plan,
    checks: checks.results,
    beforeRepair: beforeRepair?.results ?? null,
    repair,
    final,
    written: files.shape,
    warnings,
    structure,
  });
  lap('report');
  report.timings = timings;
  const { grid, domain } = field;
  const finalChecks = checks;
  // the local-thickness picture: the checks' engine, else on small grids one at the picture's resolution
  const pictureThickness = () => {
    const morph = finalChecks.morphology();
    if (morph) return morph.thicknessMap(THICKNESS_PICTURE_SIDE);
    if (grid.values.length > THICKNESS_PICTURE_CELLS) return undefined;
    const span = Math.max(domain[2] - domain[0], domain[3] - domain[1]);
    return buildMorphology(final, { domain, pixel: Math.max(plan.pixel, span / THICKNESS_PICTURE_SIDE) }).thicknessMap(THICKNESS_PICTURE_SIDE);
  };
  return {
    report,
    grid,
    raw: threshold.raw,
    smoothed: threshold.smoothed,
    warnings,
    timings,
    builds: threshold.builds,
    structure,
    dxf: files.dxf,
    notesDxf: files.notesDxf,
    svg: files.svg,
    solid: files.solid,
    pictures: () => ({
      grid,
      polygons: final,
      domain,
      curve: levelCurve(grid),
      ...(repair ? { beforeRepair: repair.before, repaired: repair.changed } : {}),
      thickness: pictureThickness(),
      ...(structure ? { structure } : {}),
    }),
  };
}
