/**
 * The preview page's worker: the library's own `build` (src/pipeline.ts) on the embedded grid, off the page's
 * thread, so the page never freezes. Each request gets two answers: the outline first (a build without the
 * size checks and repair, which is fast), then the full result with the checks, the report and the pictures.
 * With a load case (`--loads`) a third comes between them: the checks without the structural re-check, so the
 * re-check's solves (about half a second on the demo) hold back neither the outline nor the other checks.
 * Requests that arrive while a build runs are coalesced: only the newest is built. As each stage of a build ends,
 * the worker says so (a progress message: steps done of the steps this request runs).
 *
 * The files it hands back (dxf, svg, json, html) are what `rhoform build` writes with the same settings: the
 * same code, the same input bytes, the same passive file (DESIGN §13).
 */
import { RhoformError } from '../src/errors.js';
import { loadBooleanEngine } from '../src/geom/clipper.js';
import { parseLoadsBytes } from '../src/loads/parse.js';
import type { LoadsSpec } from '../src/loads/types.js';
import { parsePassiveBytes } from '../src/passive/parse.js';
import type { PassiveRegions } from '../src/passive/types.js';
import { build, buildStageCount, prepareBuild, type BuildResult } from '../src/pipeline.js';
import { MAX_PICTURE_SIDE } from '../src/report/figures.js';
import type { HtmlPictures } from '../src/report/html.js';
import { formatHtml } from '../src/report/html.js';
import { formatJson } from '../src/report/json.js';
import { stressFigure } from '../src/report/stress-figure.js';
import { planFrame } from '../src/report/svg-figures.js';
import { densityRaster, thicknessMax, thicknessRaster, type PlacedRaster } from '../src/report/raster.js';
import type { Settings } from '../src/settings.js';
import type { PolygonSet } from '../src/types.js';
import { type Embedded, type FlatRings, type FromWorker, type PlacedRgba, type ProgressMessage, type StressLayer, type ToWorker } from './shared/protocol.js';
import { outputNames } from '../cli/output-names.js';

interface WorkerScope {
  onmessage: ((e: { data: ToWorker }) => void) | null;
  postMessage(m: FromWorker, transfer?: ArrayBuffer[]): void;
  fetch?: unknown;
}
const scope = self as unknown as WorkerScope;

/** Longest side of the density picture, pixels. */
const DENSITY_SIDE = 1600;

let data: Embedded | null = null;
let bytes: Uint8Array | null = null;
let passive: PassiveRegions | null = null;
let loads: LoadsSpec | null = null;
let last: { v: number; result: BuildResult; pictures?: HtmlPictures } | null = null;
let densityKey = '';
let pending: { v: number; settings: Settings } | null = null;
const filesWanted: number[] = [];
let busy = false;

function decodeBase64(b64: string): Uint8Array {
  const s = atob(b64);
  const out = new Uint8Array(s.length);
  for (let k = 0; k < s.length; k++) out[k] = s.charCodeAt(k);
  return out;
}

/** zlib inflate by the browser's own DecompressionStream (no request: the bytes are already here). */
async function inflate(deflated: Uint8Array): Promise<Uint8Array> {
  const stream = new Blob([deflated as BlobPart]).stream().pipeThrough(new DecompressionStream('deflate'));
  return new Uint8Array(await new Response(stream).arrayBuffer());
}

function flatten(set: PolygonSet): FlatRings {
  let n = 0;
  let rings = 0;
  for (const p of set.polygons) {
    rings += 1 + p.holes.length;
    n += p.outer.length + p.holes.reduce((a, h) => a + h.length, 0);
  }
  const coords = new Float64Array(2 * n);
  const start = new Int32Array(rings + 1);
  const hole = new Uint8Array(rings);
  let o = 0;
  let r = 0;
  const put = (ring: readonly (readonly [number, number])[], isHole: boolean) => {
    start[r] = o;
    hole[r++] = isHole ? 1 : 0;
    for (const [x, y] of ring) {
      coords[2 * o] = x;
      coords[2 * o + 1] = y;
      o++;
    }
  };
  for (const p of set.polygons) {
    put(p.outer, false);
    for (const h of p.holes) put(h, true);
  }
  start[rings] = o;
  return { coords, start, hole };
}

function rgbaOf(p: PlacedRaster): PlacedRgba {
  const { width, height, colorType, data: src } = p.image;
  const rgba = new Uint8ClampedArray(width * height * 4);
  for (let k = 0; k < width * height; k++) {
    if (colorType === 6) {
      rgba[4 * k] = src[4 * k];
      rgba[4 * k + 1] = src[4 * k + 1];
      rgba[4 * k + 2] = src[4 * k + 2];
      rgba[4 * k + 3] = src[4 * k + 3];
    } else if (colorType === 2) {
      rgba[4 * k] = src[3 * k];
      rgba[4 * k + 1] = src[3 * k + 1];
      rgba[4 * k + 2] = src[3 * k + 2];
      rgba[4 * k + 3] = 255;
    } else {
      const spp = colorType === 4 ? 2 : 1;
      const g = src[spp * k];
      rgba[4 * k] = g;
      rgba[4 * k + 1] = g;
      rgba[4 * k + 2] = g;
      rgba[4 * k + 3] = spp === 2 ? src[2 * k + 1] : 255;
    }
  }
  return { width, height, rgba, extent: p.extent };
}

function post(m: FromWorker, transfer: ArrayBuffer[] = []): void {
  scope.postMessage(m, transfer);
}

function fail(v: number, e: unknown): void {
  if (e instanceof RhoformError) post({ t: 'error', v, code: e.code, message: e.message });
  else post({ t: 'error', v, code: 'E_INTERNAL', message: e instanceof Error ? `${e.message}\n${e.stack ?? ''}` : String(e) });
}

/** Lets queued messages in, so a newer request can supersede the one in hand. */
function breathe(): Promise<void> {
  return new Promise((r) => setTimeout(r, 0));
}

/** The settings of the fast first answer: the same outline, without the size checks, repair and re-check. */
function outlineOnly(s: Settings): Settings | null {
  return heavyChecks(s) || s.loads !== null ? { ...s, minMember: null, minHole: null, toolRadius: null, process: null, repair: [], loads: null } : null;
}

/** Whether a build runs the size checks or repair (the slow part of a build without a load case). */
function heavyChecks(s: Settings): boolean {
  return s.repair.length > 0 || s.minMember !== null || s.minHole !== null || s.toolRadius !== null || s.process !== null;
}

/** Counts the steps of one request and reports each as it ends (ProgressMessage). */
class Progress {
  private done = 0;
  constructor(
    private readonly v: number,
    private readonly total: number,
  ) {}
  step(phase: ProgressMessage['phase'], stage: string): void {
    this.done = Math.min(this.total, this.done + 1);
    post({ t: 'progress', v: this.v, phase, stage, done: this.done, total: this.total });
  }
  /** Skips the steps of a phase that did not run to its end (an error is reported by the build after it). */
  skipTo(done: number): void {
    this.done = Math.max(this.done, Math.min(this.total, done));
  }
}

/** The stress figure of the re-check, as the HTML report draws it (report/figures.ts), for the stress layer. */
function stressLayer(r: BuildResult, domain: readonly [number, number, number, number]): StressLayer | null {
  if (r.structure === null) return null;
  let f;
  try {
    f = planFrame(domain);
  } catch {
    return null; // an empty domain has no figure
  }
  const fig = stressFigure(r.structure, f, r.report.settings.allowableStress ?? null, MAX_PICTURE_SIDE);
  if (fig === null) return null;
  // the plan figure's viewBox without the band below the domain that holds the report's scale bar (the view has its own)
  const m = f.margin;
  const viewBox = `${-m} ${-m} ${f.w + 2 * m} ${f.h + 2 * m}`;
  return { body: fig.body, viewBox, minX: f.minX, maxY: f.maxY, margin: f.margin, w: f.w, h: f.h, legend: fig.legend, caption: fig.caption };
}

function inputKey(s: Settings): string {
  const { cellSize, rowOrder, values, layout, valueRange, decimalComma, nonFinite, clip, mirror, passive: p, tolerance } = s;
  return JSON.stringify([cellSize, rowOrder, values, layout, valueRange, decimalComma, nonFinite, clip, mirror, p, tolerance]);
}

function runBuild(s: Settings, progress: Progress, phase: ProgressMessage['phase']): BuildResult {
  const result = build(
    { name: data!.file, bytes: bytes! },
    s,
    { passive: s.passive === null ? null : passive, loads: s.loads === null ? null : loads, onStage: (stage) => progress.step(phase, stage) },
  );
  // run figures to 0.01 ms, as the CLI writes them (they measure this run and differ between runs: docs/preview.md)
  for (const k of Object.keys(result.timings)) result.timings[k] = Math.round(result.timings[k] * 100) / 100;
  result.report.outputs = outputNames(data!.outputsBase, s.formats, s.annotations).map((p) => ({ file: p.path, format: p.format, ...(p.annotations ? { annotations: true as const } : {}) }));
  return result;
}

async function buildOne(v: number, s: Settings): Promise<void> {
  await prepareBuild(s, { name: data!.file, bytes: bytes! }); // the input's reader, the repairs, the re-check: loaded once
  const withLoads = s.loads !== null;
  // with a load case: the checks first without the re-check; when they are light, that build gives the outline too
  const pre = withLoads ? { ...s, loads: null } : null;
  const quick = pre !== null && !heavyChecks(pre) ? null : outlineOnly(s);
  const quickSteps = quick ? buildStageCount(quick, false) : 0;
  const preSteps = pre ? buildStageCount(pre, false) : 0;
  const progress = new Progress(v, quickSteps + preSteps + buildStageCount(s, withLoads) + 1);
  if (quick) {
    const t0 = performance.now();
    try {
      const r = build({ name: data!.file, bytes: bytes! }, quick, { passive: s.passive === null ? null : passive, onStage: (stage) => progress.step('outline', stage) });
      const outline = flatten(r.smoothed.polygons);
      post({ t: 'outline', v, outline, ms: performance.now() - t0 }, [outline.coords.buffer as ArrayBuffer]);
    } catch {
      // the full build below reports the error with its own message
    }
    progress.skipTo(quickSteps);
    await breathe();
    if (pending !== null && pending.v > v) return; // superseded
  }
  if (pre) {
    const t0 = performance.now();
    try {
      const r = build({ name: data!.file, bytes: bytes! }, pre, { passive: s.passive === null ? null : passive, onStage: (stage) => progress.step('checks', stage) });
      if (quick === null) {
        const outline = flatten(r.smoothed.polygons);
        post({ t: 'outline', v, outline, ms: performance.now() - t0 }, [outline.coords.buffer as ArrayBuffer]);
      }
      post({ t: 'checks', v, report: r.report, reportHtml: formatHtml(r.report), ms: performance.now() - t0 });
    } catch {
      // the full build below reports the error with its own message
    }
    progress.skipTo(quickSteps + preSteps);
    await breathe();
    if (pending !== null && pending.v > v) return; // superseded
  }
  const t0 = performance.now();
  let result: BuildResult;
  try {
    result = runBuild(s, progress, withLoads ? 're-check' : 'checks');
  } catch (e) {
    fail(v, e);
    return;
  }
  last = { v, result };
  const report = result.report;
  const tb = performance.now();
  // Without a fast first answer, the smoothed outline is the one written unless passive regions, --mirror or
  // --repair finish it: then the pictures bring it.
  const plain = s.passive === null && s.mirror.length === 0 && s.repair.length === 0;
  const early = quick === null && plain ? flatten(result.smoothed.polygons) : null;
  post(
    { t: 'report', v, report, reportHtml: formatHtml(report), outline: early, ms: tb - t0, timings: { build: tb - t0, ...result.timings } },
    early ? [early.coords.buffer as ArrayBuffer] : [],
  );
  await breathe();
  if ((pending !== null && pending.v > v) || last.v !== v) return; // superseded: its pictures are not needed
  const tp = performance.now();
  const pictures = (last.pictures = result.pictures());
  const key = inputKey(s);
  const density = key === densityKey ? null : rgbaOf(densityRaster(result.grid, DENSITY_SIDE));
  densityKey = key;
  const g = result.grid;
  const grid =
    density === null
      ? null
      : {
          nx: g.nx,
          ny: g.ny,
          cellSize: g.cellSize,
          origin: g.origin,
          placement: g.placement ?? 'cells',
          values: Float32Array.from(g.values),
          fileRows: report.input.ny,
          topDown: s.rowOrder === 'top-down',
          mirrored: s.mirror.length > 0,
        };
  const map = pictures.thickness;
  const tmax = map ? thicknessMax(map) : 0;
  const minMember = report.settings.minMember;
  const thickness = map ? rgbaOf(thicknessRaster(map, { max: tmax, limit: typeof minMember === 'number' ? minMember : null })) : null;
  const outline = flatten(pictures.polygons ?? { polygons: [] });
  const beforeRepair = pictures.beforeRepair ? flatten(pictures.beforeRepair) : null;
  const repaired = pictures.repaired ? flatten(pictures.repaired) : null;
  const stress = stressLayer(result, pictures.domain ?? [0, 0, 0, 0]);
  const transfer = [outline, beforeRepair, repaired].flatMap((f) => (f ? [f.coords.buffer as ArrayBuffer] : []));
  for (const p of [density, thickness]) if (p) transfer.push(p.rgba.buffer as ArrayBuffer);
  if (grid) transfer.push(grid.values.buffer as ArrayBuffer);
  progress.step(withLoads ? 're-check' : 'checks', 'pictures');
  post(
    {
      t: 'pictures',
      v,
      outline,
      beforeRepair,
      repaired,
      domain: pictures.domain ?? [0, 0, 0, 0],
      density,
      grid,
      thickness,
      thicknessMax: tmax,
      passive: s.passive === null ? null : passive,
      stress,
      ms: performance.now() - tp,
    },
    transfer,
  );
}

function files(v: number): void {
  if (last === null || last.v !== v) {
    post({ t: 'error', v, code: 'E_INTERNAL', message: `the files of build ${v} are gone: a newer build replaced them` });
    return;
  }
  const r = last.result;
  try {
    post({ t: 'files', v, files: { dxf: r.dxf(), svg: r.svg(), json: formatJson(r.report), html: formatHtml(r.report, (last.pictures ??= r.pictures())) } });
  } catch (e) {
    fail(v, e);
  }
}

async function pump(): Promise<void> {
  if (busy) return;
  busy = true;
  try {
    for (;;) {
      if (pending !== null) {
        const { v, settings } = pending;
        pending = null;
        await buildOne(v, settings);
        await breathe();
      } else if (filesWanted.length > 0) {
        files(filesWanted.shift()!);
      } else break;
    }
  } finally {
    busy = false;
  }
}

async function init(d: Embedded): Promise<void> {
  const t0 = performance.now();
  data = d;
  // The boolean engine embeds its WebAssembly as a data: URL and would fetch() it; without fetch it decodes it
  // in place. The worker needs no fetch at all, so none is left to it.
  scope.fetch = undefined;
  const [grid] = await Promise.all([inflate(decodeBase64(d.grid)), loadBooleanEngine()]);
  if (grid.length !== d.gridBytes) throw new RhoformError('E_INTERNAL', `embedded grid: expected ${d.gridBytes} bytes, found ${grid.length}`);
  bytes = grid;
  if (d.passive) {
    passive = parsePassiveBytes(decodeBase64(d.passive.bytes), d.passive.name);
  }
  if (d.loads) loads = parseLoadsBytes(decodeBase64(d.loads.bytes), d.loads.name);
  post({ t: 'ready', ms: performance.now() - t0 });
}

scope.onmessage = (e) => {
  const m = e.data;
  if (m.t === 'init') {
    init(m.data).catch((err) => fail(0, err));
  } else if (m.t === 'build') {
    pending = { v: m.v, settings: m.settings };
    void pump();
  } else if (m.t === 'files') {
    filesWanted.push(m.v);
    void pump();
  }
};
