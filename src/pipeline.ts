/**
 * The only place that knows the order of the stages (DEVELOPERS.md, layout):
 * read → prepare (range, non-finite; `--mirror` unfolding; passive regions on the samples) → threshold
 * (volume-preserving, on the smoothed area) → contour → smooth → finish (exact symmetry; passive regions by
 * exact booleans) → checks → repair and re-check → report → write.
 * Pure: bytes and settings in, strings and a report out. The CLI does every file operation.
 */
import { resolveLimits } from './check/limits.js';
import { locator } from './check/locate.js';
import { planChecks } from './check/registry.js';
import { runChecks, summarize } from './check/run.js';
import type { CheckContext } from './check/types.js';
import { contourGrid } from './contour/index.js';
import { RhoformError, UsageError } from './errors.js';
import { levelCurve } from './field/curve.js';
import { fieldMean, gridDomain } from './field/mean.js';
import { mirrorPlanes, unfoldGrid, unfoldLocate } from './field/mirror.js';
import { prepareGrid } from './field/prepare.js';
import { polygonSetArea } from './geom/area.js';
import { ringsOf } from './geom/clipper.js';
import { circleRings, finishOutline, finishingOf, repairStage } from './finish.js';
import type { PassiveExactResult } from './passive/exact.js';
import type { WriterExtra } from './write/types.js';
import { symmetricArea } from './geom/symmetry.js';
import { applyPassiveToGrid } from './passive/cells.js';
import { mirrorPassive } from './passive/mirror.js';
import type { PassiveRegions } from './passive/types.js';
import { describeInput, loadGrid, type InputFile } from './input.js';
import { buildMorphology, choosePixel } from './morph/index.js';
import type { Morphology } from './morph/types.js';
import { CAUTIONS } from './report/cautions.js';
import { numberFindings } from './report/findings.js';
import type { HtmlPictures } from './report/html.js';
import { summarizeGeometry } from './report/geometry.js';
import type { Settings } from './settings.js';
import { smoothPolygons, type SmoothResult } from './smooth/smooth.js';
import { chooseThreshold } from './threshold/choose.js';
import type { DensityGrid, PolygonSet, Report } from './types.js';
import { VERSION } from './version.js';
import { writeDxf } from './write/dxf.js';
import { writeSvg } from './write/svg.js';

export { inspect, loadGrid, type InputFile, type InspectResult } from './input.js';

export interface BuildResult {
  /** The report; `outputs` is empty — the CLI fills it once files are written. */
  readonly report: Report;
  readonly grid: DensityGrid;
  readonly raw: PolygonSet;
  readonly smoothed: SmoothResult;
  readonly warnings: string[];
  /** Full contour + smooth passes the volume search needed (1 for --level). */
  readonly builds: number;
  /** Milliseconds spent per stage (read, prepare, threshold = search + contour + smooth). */
  readonly timings: Readonly<Record<string, number>>;
  /** Render the geometry files on demand (the CLI asks only for the formats it writes). */
  dxf(): string;
  svg(): string;
  /** The picture data of the HTML report (the local-thickness map only when it is cheap or already built). */
  pictures(): HtmlPictures;
}

/** Grids up to this many samples get a local-thickness picture even when no size check built the engine. */
const THICKNESS_PICTURE_CELLS = 500_000;
/** Longer side of the local-thickness picture, pixels. */
const THICKNESS_PICTURE_SIDE = 600;

/** Runs `f`; a RhoformError that names no file gets `name` (the stages are pure and do not know it). */
function withFileName<T>(name: string, f: () => T): T {
  try {
    return f();
  } catch (e) {
    if (e instanceof RhoformError && e.where && e.where.file === undefined) throw e.withFile(name);
    throw e;
  }
}

/** Inputs of a build beside the grid: the parsed passive-region file (`--passive`; the CLI reads and parses it). */
export interface BuildExtras {
  readonly passive?: PassiveRegions | null;
}

/**
 * The same smoothing result judged by another area (mm²): a view that keeps its lazy members (copying it would
 * run the deviation measure).
 */
function withArea(sm: SmoothResult, areaAfter: number): SmoothResult {
  return Object.create(sm, { areaAfter: { value: areaAfter, enumerable: true } }) as SmoothResult;
}

/** Smallest and largest finite value of a grid (after passive regions changed some samples). */
function valueRange(values: Float64Array): { min: number; max: number } {
  let min = Infinity;
  let max = -Infinity;
  for (let k = 0; k < values.length; k++) {
    const v = values[k];
    if (v < min) min = v;
    if (v > max) max = v;
  }
  return { min, max };
}

/** `rhoform build`: the main job. Throws RhoformError on bad input (exit 2). */
export function build(input: InputFile, s: Settings, more: BuildExtras = {}): BuildResult {
  const timings: Record<string, number> = {};
  let t0 = performance.now();
  const lap = (name: string) => {
    const t = performance.now();
    timings[name] = (timings[name] ?? 0) + (t - t0);
    t0 = t;
  };
  const read = loadGrid(input, s);
  lap('read');
  const prep = withFileName(input.name, () =>
    prepareGrid(read.grid, read.locate, { valueRange: s.valueRange, clip: s.clip, nonFinite: s.nonFinite }),
  );
  const desc = describeInput(input, read, s, prep.inputStats);
  const warnings = [...read.warnings, ...prep.warnings];
  // --mirror: the grid is unfolded in its own frame (docs/symmetry.md); findings map back to the source cells.
  const planes = s.mirror.length > 0 ? mirrorPlanes(prep.grid, s.mirror) : [];
  let grid = planes.length > 0 ? unfoldGrid(prep.grid, s.mirror) : prep.grid;
  const locate = planes.length > 0 ? unfoldLocate(read.locate, prep.grid, s.mirror) : read.locate;
  // --passive, first act: the samples they cover become 1 or 0, so the threshold and contours see them.
  // With --mirror the regions' mirror images are added, so a half model's bolt hole has a true-circle twin.
  const passive = more.passive ? mirrorPassive(more.passive, planes) : null;
  const [hx, hy] = grid.cellSize;
  const tolerance = s.tolerance ?? 0.25 * Math.min(hx, hy);
  const passiveCells = passive ? applyPassiveToGrid(grid, passive, { inset: Math.hypot(hx, hy) + tolerance }) : null;
  if (passiveCells) grid = passiveCells.grid;
  const range = grid === prep.grid ? { min: prep.min, max: prep.max } : valueRange(grid.values);
  lap('prepare');
  const domain = gridDomain(grid);
  const domainArea = (domain[2] - domain[0]) * (domain[3] - domain[1]);
  const smoothOpts = { iterations: s.smooth, lambda: s.smoothLambda, mu: s.smoothMu, tolerance, domain } as const;

  // The target is the prepared field's mean: with passive regions, the field they set (docs/passive.md).
  const mean = grid.placement === 'nodes' || grid !== prep.grid ? fieldMean(grid) : prep.mean;
  const target = s.volumeFraction ?? Math.min(1, Math.max(0, mean));

  let builds = 0;
  let tContour = 0;
  let tSmooth = 0;
  const empty: PolygonSet = { polygons: [] };
  const choice = chooseThreshold(
    grid,
    { target, level: s.level, saddle: s.saddle, volumeTolerance: s.volumeTolerance, min: range.min, max: range.max, domainArea },
    (L) => {
      const a = performance.now();
      const r = L === null ? empty : contourGrid(grid, L, s.saddle);
      const b = performance.now();
      const smoothedHere = smoothPolygons(r, smoothOpts);
      // With --mirror the outline written is the symmetrized one: judge the volume on its area (exact, no
      // booleans), so the search meets the target with the geometry that is written (docs/symmetry.md).
      const sm = planes.length > 0 ? withArea(smoothedHere, symmetricArea(smoothedHere.polygons, planes)) : smoothedHere;
      if (L !== null) builds++;
      tContour += b - a;
      tSmooth += performance.now() - b;
      return { raw: r, smoothed: sm };
    },
  );
  const { mode, level } = choice;
  const { raw, smoothed } = choice.chosen;
  warnings.push(...choice.warnings);
  lap('threshold');
  timings.threshold -= tContour + tSmooth;
  timings.contour = tContour;
  timings.smooth = tSmooth;

  let pixels = 0;
  const v = grid.values;
  if (level !== null) for (let k = 0; k < v.length; k++) if (v[k] >= level) pixels++;
  const pixelFraction = level === null ? (mode === 'constant' && range.min >= 0.5 ? 1 : 0) : pixels / v.length;

  // Finish: exact symmetry about the mirror planes, then passive regions' second act, exact booleans.
  const finished = finishOutline(smoothed.polygons, planes, passive, domain, tolerance);
  let final = finished.polygons;
  let passiveExact = finished.passive;
  const passiveArea = passiveExact ? polygonSetArea(final) - smoothed.areaAfter : 0;
  lap('finish');

  const geometry = summarizeGeometry(final, domainArea);
  const { limits, process } = withFileName(input.name, () => resolveLimits(s));
  // A tool wider than the part cannot mill any pocket of it, and its open-space margin would need a raster
  // many times the grid: refuse it as a usage error rather than spend the memory.
  const span = Math.max(domain[2] - domain[0], domain[3] - domain[1]);
  if (limits.toolRadius !== null && !(limits.toolRadius <= span)) {
    throw new UsageError(`--tool-radius: expected a radius up to the larger side of the domain (${span} mm), found ${limits.toolRadius} mm`);
  }
  // Long-form CSV infers the cell size from the coordinates: report what was used, and that it was not assumed.
  const inferred = read.layout === 'long';
  const settings: Record<string, unknown> = {
    ...s,
    cellSize: [hx, hy],
    cellSizeDefaulted: s.cellSizeDefaulted && !inferred,
    layout: read.layout,
    tolerance,
    minMember: limits.minMember,
    minHole: limits.minHole,
    toolRadius: limits.toolRadius,
  };
  const report: Report = {
    schemaVersion: 1,
    tool: { name: 'rhoform', version: VERSION },
    input: desc.input,
    settings,
    threshold: {
      mode,
      level,
      targetFraction: target,
      achievedFraction: domainArea > 0 ? smoothed.areaAfter / domainArea : 0,
      pixelFraction,
    },
    geometry,
    smoothing: {
      maxDeviation: smoothed.maxDeviation,
      tolerance,
      rawArea: smoothed.areaBefore,
      area: smoothed.areaAfter,
      rawVertices: smoothed.verticesBefore,
      vertices: smoothed.verticesAfter,
    },
    checks: [],
    repairs: [],
    summary: { status: 'pass', pass: 0, warn: 0, fail: 0 },
    outputs: [],
    warnings,
    cautions: [...CAUTIONS],
  };
  if (process !== null) report.process = process;
  if (planes.length > 0) report.symmetry = planes.map((p, k) => ({ edge: s.mirror[k], axis: p.axis, at: p.at }));
  if (passive && passiveCells) {
    report.passive = {
      file: s.passive ?? '(given)',
      solid: passive.regions.filter((r) => r.role === 'solid').length,
      void: passive.regions.filter((r) => r.role === 'void').length,
      solidSamples: passiveCells.solidSamples,
      voidSamples: passiveCells.voidSamples,
      area: passiveArea,
      circles: passiveExact?.ringCircles.length ?? 0,
    };
  }

  // Checks (docs/checks/README.md): one morphology engine per outline, built on first use and shared by the
  // size checks.
  const pixel = choosePixel(grid.cellSize, domain);
  let morph: Morphology | undefined;
  const smoothingDeviation = { max: smoothed.maxDeviation, resolution: smoothed.deviationResolution };
  const inFile = locator(grid, locate);
  const planned = planChecks(s, { tolerance, limits, mode });
  const check = (polygons: PolygonSet, solid: PassiveExactResult | null) => {
    morph = undefined;
    const ctx: CheckContext = {
      polygons,
      raw,
      ...(polygons !== smoothed.polygons ? { smoothed: smoothed.polygons } : {}),
      domain,
      grid,
      report,
      tolerance,
      smoothingDeviation,
      morphology: () => (morph ??= buildMorphology(polygons, { domain, pixel })),
      ...(solid ? { passiveSolid: solid.solidRings } : {}),
    };
    return runChecks(planned, ctx, inFile);
  };
  report.checks = check(final, passiveExact);
  lap('checks');

  // Repair (docs/repair.md), then the same checks again on the result: they set the summary and exit code.
  let repair: { before: PolygonSet; changed: PolygonSet } | null = null;
  if (s.repair.length > 0) {
    const before = final;
    const done = repairStage({ polygons: final, settings: s, limits, planned, planes, passive, passiveSolid: passiveExact?.solidRings ?? [], domain, tolerance, pixel, locate: inFile });
    final = done.polygons;
    passiveExact = done.passive;
    report.repairs = done.records;
    report.checksBeforeRepair = report.checks;
    lap('repair');
    report.checks = check(final, passiveExact);
    report.geometry = summarizeGeometry(final, domainArea);
    lap('checks');
    repair = { before, changed: done.changed };
  }
  report.summary = summarize(report.checks);
  if (final !== smoothed.polygons) report.finishing = finishingOf(final, smoothed.areaAfter, raw, domainArea, tolerance);

  const findings = numberFindings(report);
  const extras: WriterExtra[] = [];
  if (findings.length > 0) {
    extras.push({ layer: 'finding', markers: findings.map((f) => ({ x: f.location.x, y: f.location.y, label: String(f.n), note: f.checkId })) });
  }
  if (repair) {
    // Where the repairs acted: the material they changed, and R<k> markers as in the HTML report.
    const markers = report.repairs.flatMap((r, k) => r.locations.map((L) => ({ x: L.x, y: L.y, label: `R${k + 1}`, note: r.id })));
    extras.push({ layer: 'repair', rings: ringsOf(repair.changed), markers });
  }
  const writerInput = { polygons: final, domain, units: s.units, extras, ringCircles: circleRings(final, passiveExact?.ringCircles ?? [], s.circles, tolerance) };
  // The local-thickness picture: from the checks' engine when they built one; else, on grids small enough, from
  // an engine at the picture's own resolution (one raster pixel per picture pixel; a picture, not a check).
  const pictureThickness = () => {
    if (morph) return morph.thicknessMap(THICKNESS_PICTURE_SIDE);
    if (grid.values.length > THICKNESS_PICTURE_CELLS) return undefined;
    const span = Math.max(domain[2] - domain[0], domain[3] - domain[1]);
    return buildMorphology(final, { domain, pixel: Math.max(pixel, span / THICKNESS_PICTURE_SIDE) }).thicknessMap(THICKNESS_PICTURE_SIDE);
  };
  return {
    report,
    grid,
    raw,
    smoothed,
    warnings,
    timings,
    builds,
    dxf: () => writeDxf(writerInput),
    svg: () => writeSvg(writerInput),
    pictures: () => ({
      grid,
      polygons: final,
      domain,
      curve: levelCurve(grid),
      ...(repair ? { beforeRepair: repair.before, repaired: repair.changed } : {}),
      thickness: pictureThickness(),
    }),
  };
}
