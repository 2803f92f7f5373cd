/**
 * What `rhoform preview` embeds in the page, and the messages between the page and its worker. Pure data
 * types and two small helpers; no DOM, no Node.
 */
import type { PassiveRegions } from '../../src/passive/types.js';
import type { Settings } from '../../src/settings.js';
import type { Report } from '../../src/types.js';

/** The page's embedded data (JSON in a `<script type="application/json" id="rhoform-data">`). */
export interface Embedded {
  readonly version: 1;
  /** The grid file's name as given on the command line (report input.file; DESIGN §13). */
  readonly file: string;
  /** The options given to `rhoform preview` (parseArgs(...).settings): the page's starting state. */
  readonly given: Partial<Settings>;
  /** `--out-dir` as given, or null (the command line shown repeats it). */
  readonly outDir: string | null;
  /** The output paths `rhoform build` would report, without the suffix (e.g. "out/demo-bracket"). */
  readonly outputsBase: string;
  /** The grid file's bytes, zlib-deflated (RFC 1950), base64. */
  readonly grid: string;
  /** Length of the grid file, bytes (a check on the inflated data). */
  readonly gridBytes: number;
  /** The passive-region file, when --passive was given: its name as given and its bytes, base64. */
  readonly passive: { readonly name: string; readonly bytes: string } | null;
  /** The loads file (`--loads`, the structural re-check), when given: its name as given and its bytes, base64. */
  readonly loads: { readonly name: string; readonly bytes: string } | null;
  /** Samples of the grid (nx × ny), for the page's decision to show progress. */
  readonly cells: number;
}

/** Suffix of each output file, as the CLI names them. */
export { OUTPUT_SUFFIX } from '../../cli/output-names.js';

/** A set of rings flattened for transfer: ring k is coords[2·start[k] … 2·start[k+1]), hole[k] = 1 for a hole. */
export interface FlatRings {
  readonly coords: Float64Array;
  readonly start: Int32Array;
  readonly hole: Uint8Array;
}

/** An image to draw in report-frame millimetres: RGBA rows from the top, covering `extent` [x0, y0, x1, y1]. */
export interface PlacedRgba {
  readonly width: number;
  readonly height: number;
  readonly rgba: Uint8ClampedArray;
  readonly extent: readonly [number, number, number, number];
}

/** The grid as shown under the cursor: the prepared samples (values[j·nx + i], j up). */
export interface GridView {
  readonly nx: number;
  readonly ny: number;
  readonly cellSize: readonly [number, number];
  readonly origin: readonly [number, number];
  readonly placement: 'cells' | 'nodes';
  readonly values: Float32Array;
  /** Rows of the grid file (for the file row under the cursor) and whether row 1 is the top. */
  readonly fileRows: number;
  readonly topDown: boolean;
  /** Unfolded by --mirror: samples beyond the file's own are mirror images. */
  readonly mirrored: boolean;
}

/**
 * The stress figure of the structural re-check (`--loads`), as the HTML report draws it (report/stress-figure.ts):
 * the SVG body in the figure frame (mm, x' = x − minX, y' = maxY − y; viewBox = `viewBox`), the colour bar and
 * the caption (HTML text, escaped by the report module).
 */
export interface StressLayer {
  readonly body: string;
  readonly viewBox: string;
  /** The figure frame's domain corner: figure (0, 0) is report (minX, maxY). */
  readonly minX: number;
  readonly maxY: number;
  /** The viewBox's margin, mm, and the figure's size w × h (the domain), mm. */
  readonly margin: number;
  readonly w: number;
  readonly h: number;
  readonly legend: string;
  readonly caption: string;
}

export type ToWorker =
  | { readonly t: 'init'; readonly data: Embedded }
  | { readonly t: 'build'; readonly v: number; readonly settings: Settings }
  | { readonly t: 'files'; readonly v: number };

export interface OutlineMessage {
  readonly t: 'outline';
  readonly v: number;
  readonly outline: FlatRings;
  readonly ms: number;
}

/** The report of a full build (checks, repair): sent as soon as the build ends, before its pictures. */
export interface ReportMessage {
  readonly t: 'report';
  readonly v: number;
  readonly report: Report;
  /** formatHtml(report) without pictures: the page shows its summary, checks, findings and repairs. */
  readonly reportHtml: string;
  /** The outline, when no fast first answer was sent (then the written outline is the smoothed one). */
  readonly outline: FlatRings | null;
  readonly ms: number;
  /** Milliseconds per stage of the build (BuildResult.timings, plus 'build'). */
  readonly timings: Record<string, number>;
}

/**
 * With a load case: the report of the build without the structural re-check, sent before the full build (which
 * adds the re-check and its checks). The page shows its checks as they stand, marked as waiting for the re-check.
 */
export interface ChecksMessage {
  readonly t: 'checks';
  readonly v: number;
  readonly report: Report;
  readonly reportHtml: string;
  readonly ms: number;
}

/** The pictures of a full build: the written outline, the outline before repair, the density and thickness. */
export interface PicturesMessage {
  readonly t: 'pictures';
  readonly v: number;
  readonly outline: FlatRings;
  readonly beforeRepair: FlatRings | null;
  readonly repaired: FlatRings | null;
  readonly domain: readonly [number, number, number, number];
  /** Set when the grid (and so the density picture) differs from the last one sent. */
  readonly density: PlacedRgba | null;
  readonly grid: GridView | null;
  readonly thickness: PlacedRgba | null;
  readonly thicknessMax: number;
  readonly passive: PassiveRegions | null;
  /** The stress figure of the structural re-check, when it ran and found stress. */
  readonly stress: StressLayer | null;
  readonly ms: number;
}

/**
 * A build's progress: `done` of `total` steps finished, the last one named `stage` (a stage of the library's
 * build, as in the report's timings, or the worker's own "pictures"). `phase` says which answer it works towards:
 * the outline first, then the checks, and with a load case the structural re-check last.
 */
export interface ProgressMessage {
  readonly t: 'progress';
  readonly v: number;
  readonly phase: 'outline' | 'checks' | 're-check';
  readonly stage: string;
  readonly done: number;
  readonly total: number;
}

export type FromWorker =
  | { readonly t: 'ready'; readonly ms: number }
  | OutlineMessage
  | ReportMessage
  | PicturesMessage
  | ProgressMessage
  | ChecksMessage
  | { readonly t: 'files'; readonly v: number; readonly files: { dxf: string; svg: string; json: string; html: string } }
  | { readonly t: 'error'; readonly v: number; readonly code: string; readonly message: string };
