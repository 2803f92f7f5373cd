/**
 * The only place that knows the order of the stages (DEVELOPERS.md, layout):
 * read → prepare → threshold (volume-preserving, on the smoothed area) → contour → smooth → report → write.
 * Pure: bytes and settings in, strings and a report out. The CLI does every file operation.
 */
import { createHash } from 'node:crypto';
import { contourGrid, levelBandModel } from './contour/index.js';
import { RhoformError } from './errors.js';
import { fieldMean, gridDomain } from './field/mean.js';
import { prepareGrid } from './field/prepare.js';
import { fieldStats, histogram, type Histogram } from './field/stats.js';
import { readGrid } from './read/detect.js';
import type { ReadOptions, ReadResult } from './read/types.js';
import { CAUTIONS } from './report/cautions.js';
import { summarizeGeometry } from './report/geometry.js';
import type { Settings } from './settings.js';
import { smoothPolygons, type SmoothResult } from './smooth/smooth.js';
import { volumeLevel } from './threshold/volume.js';
import type { DensityGrid, PolygonSet, Report } from './types.js';
import { VERSION } from './version.js';
import { writeDxf } from './write/dxf.js';
import { writeSvg } from './write/svg.js';

/** One input, as the CLI hands it over. */
export interface InputFile {
  /** The name as given by the user (used in messages and the report). */
  readonly name: string;
  readonly bytes: Uint8Array;
}

function readOptions(s: Settings): ReadOptions {
  return {
    cellSize: s.cellSize,
    rowOrder: s.rowOrder,
    values: s.values,
    layout: s.layout,
    decimalComma: s.decimalComma,
    maxCells: s.maxCells,
  };
}

/** Read and validate the grid file; errors carry the file name. */
export function loadGrid(input: InputFile, s: Settings): ReadResult {
  const read = readGrid(input.bytes, input.name, readOptions(s));
  const g = read.grid;
  if (g.placement === 'nodes' && (g.nx < 2 || g.ny < 2)) {
    throw new RhoformError('E_GRID_SIZE', `expected at least 2×2 nodal values (--values nodes), found ${g.ny}×${g.nx}`, {
      file: input.name,
    });
  }
  return read;
}

export interface InspectResult {
  readonly schemaVersion: 1;
  readonly tool: Report['tool'];
  readonly input: Report['input'];
  readonly histogram: Histogram;
  /** Share (0..1) of grey samples (0.1 < ρ < 0.9), after range mapping. */
  readonly greyShare: number;
  /** Layout read ('long' infers the cell size from the coordinates). */
  readonly layout: 'grid' | 'long';
  readonly warnings: string[];
}

function sha256(bytes: Uint8Array): string {
  return createHash('sha256').update(bytes).digest('hex');
}

/** Range-map without refusing anything: what `inspect` describes. */
function mapRange(grid: DensityGrid, [lo, hi]: readonly [number, number]): DensityGrid {
  const out = new Float64Array(grid.values.length);
  const scale = 1 / (hi - lo);
  for (let k = 0; k < out.length; k++) out[k] = (grid.values[k] - lo) * scale;
  return { ...grid, values: out };
}

function describeInput(input: InputFile, read: ReadResult, s: Settings): { input: Report['input']; greyShare: number; mapped: DensityGrid } {
  const g = read.grid;
  const raw = fieldStats(g);
  const identity = s.valueRange[0] === 0 && s.valueRange[1] === 1;
  const mapped = identity ? g : mapRange(g, s.valueRange);
  const st = identity ? raw : fieldStats(mapped);
  return {
    input: {
      file: input.name,
      sha256: sha256(input.bytes),
      format: read.format,
      nx: g.nx,
      ny: g.ny,
      cellSize: [g.cellSize[0], g.cellSize[1]],
      min: raw.min,
      max: raw.max,
      mean: st.mean,
      greyLevel: st.greyLevel,
      nonFinite: raw.nonFinite,
    },
    greyShare: st.greyShare,
    mapped,
  };
}

/** `rhoform inspect`: statistics only; never fails on non-finite values. */
export function inspect(input: InputFile, s: Settings): InspectResult {
  const read = loadGrid(input, s);
  const d = describeInput(input, read, s);
  return {
    schemaVersion: 1,
    tool: { name: 'rhoform', version: VERSION },
    input: d.input,
    histogram: histogram(d.mapped, 10, 0, 1),
    greyShare: d.greyShare,
    layout: read.layout,
    warnings: [...read.warnings],
  };
}

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
}

/** `rhoform build`: the main job. Throws RhoformError on bad input (exit 2). */
export function build(input: InputFile, s: Settings): BuildResult {
  const timings: Record<string, number> = {};
  let t0 = performance.now();
  const lap = (name: string) => {
    const t = performance.now();
    timings[name] = (timings[name] ?? 0) + (t - t0);
    t0 = t;
  };
  const read = loadGrid(input, s);
  lap('read');
  const desc = describeInput(input, read, s);
  const prep = prepareGrid(read.grid, read.locate, { valueRange: s.valueRange, clip: s.clip, nonFinite: s.nonFinite });
  lap('prepare');
  const grid = prep.grid;
  const warnings = [...read.warnings, ...prep.warnings];
  const domain = gridDomain(grid);
  const domainArea = (domain[2] - domain[0]) * (domain[3] - domain[1]);
  const [hx, hy] = grid.cellSize;
  const tolerance = s.tolerance ?? 0.25 * Math.min(hx, hy);
  const smoothOpts = { iterations: s.smooth, lambda: s.smoothLambda, mu: s.smoothMu, tolerance, domain } as const;

  const mean = grid.placement === 'nodes' ? fieldMean(grid) : prep.mean;
  const target = s.volumeFraction ?? Math.min(1, Math.max(0, mean));
  const pg = { min: prep.min, max: prep.max };
  const constant = pg.min === pg.max;

  let mode: Report['threshold']['mode'];
  let level: number | null;
  let raw: PolygonSet;
  let smoothed: SmoothResult;
  let builds = 0;
  let tContour = 0;
  let tSmooth = 0;
  const contourAt = (L: number) => {
    builds++;
    const a = performance.now();
    const r = contourGrid(grid, L, s.saddle);
    const b = performance.now();
    const sm = smoothPolygons(r, smoothOpts);
    tContour += b - a;
    tSmooth += performance.now() - b;
    return { raw: r, sm };
  };
  if (constant && s.level === null) {
    mode = 'constant';
    level = null;
    const solid = pg.min >= 0.5;
    raw = solid ? contourGrid(grid, pg.min, s.saddle) : { polygons: [] };
    smoothed = smoothPolygons(raw, smoothOpts);
    warnings.push(`the field is constant (${pg.min}): the part is ${solid ? 'solid everywhere' : 'empty'}`);
  } else if (s.level !== null) {
    mode = 'level';
    level = s.level;
    ({ raw, sm: smoothed } = contourAt(level));
  } else if (!(target > 0)) {
    mode = 'volume';
    level = null;
    raw = { polygons: [] };
    smoothed = smoothPolygons(raw, smoothOpts);
    warnings.push('the target volume fraction is 0: the part is empty');
  } else {
    mode = 'volume';
    const model = levelBandModel(grid, s.saddle);
    const found = volumeLevel(model, target * domainArea, s.volumeTolerance, (L) => {
      const c = contourAt(L);
      return { area: c.sm.areaAfter, rawArea: c.sm.areaBefore, value: c };
    });
    level = found.level;
    ({ raw, sm: smoothed } = found.build.value);
  }
  lap('threshold');
  if (mode === 'volume' && target > 0 && domainArea > 0) {
    const rel = Math.abs(smoothed.areaAfter / domainArea - target) / target;
    if (rel > s.volumeTolerance) {
      warnings.push(
        `the volume search reached ${(100 * smoothed.areaAfter / domainArea).toFixed(3)} % against a target of ${(100 * target).toFixed(3)} % (relative error ${rel.toExponential(2)} > --volume-tolerance ${s.volumeTolerance}); the grid is too coarse or too binary for the area to vary smoothly with the level`,
      );
    }
  }
  timings.threshold -= tContour + tSmooth;
  timings.contour = tContour;
  timings.smooth = tSmooth;
  if (smoothed.polygons.polygons.length === 0 && mode !== 'constant' && target > 0) warnings.push('the part is empty at this level');

  let pixels = 0;
  const v = grid.values;
  if (level !== null) for (let k = 0; k < v.length; k++) if (v[k] >= level) pixels++;
  const pixelFraction = level === null ? (mode === 'constant' && pg.min >= 0.5 ? 1 : 0) : pixels / v.length;

  const geometry = summarizeGeometry(smoothed.polygons, domainArea);
  // Long-form CSV infers the cell size from the coordinates: report what was used, and that it was not assumed.
  const inferred = read.layout === 'long';
  const settings: Record<string, unknown> = {
    ...s,
    cellSize: [hx, hy],
    cellSizeDefaulted: s.cellSizeDefaulted && !inferred,
    layout: read.layout,
    tolerance,
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
  const writerInput = { polygons: smoothed.polygons, domain, units: s.units } as const;
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
  };
}
