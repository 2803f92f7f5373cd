/**
 * One grid file built into its output files: read the input (and the passive-region file), build, render the
 * formats asked for and write them atomically. Shared by `rhoform build`/`check`/`demo` (run.ts) and the batch
 * worker (batch/worker.ts). Prints nothing: callers decide what goes to stdout and stderr.
 */
import { basename, extname, join, resolve } from 'node:path';
import { RhoformError } from '../src/errors.js';
import type { LoadsSpec } from '../src/loads/types.js';
import { parsePassiveBytes } from '../src/passive/parse.js';
import type { PassiveRegions } from '../src/passive/types.js';
import { build } from '../src/pipeline.js';
import { formatJson } from '../src/report/json.js';
import type { OutputFormat, Settings } from '../src/settings.js';
import type { Report } from '../src/types.js';
import { readGridFile, readInput, writeOutputsAtomically, type PlannedOutput } from './files.js';
import { displayPath, reportExitCode } from './io.js';
import { outputNames } from './output-names.js';
import { htmlFormatter, loadsParserLoaded } from './prepare.js';


function stem(file: string): string {
  const b = basename(file);
  const ext = extname(b);
  return ext ? b.slice(0, -ext.length) : b;
}

/** Bytes: the peak resident set of this process so far (Node reports kibibytes). */
export function peakMemory(): number {
  return process.resourceUsage().maxRSS * 1024;
}

/** Read and parse a passive-region file (docs/passive.md); `name` as the user gave it, for messages. */
function readPassive(path: string, name: string): PassiveRegions {
  return parsePassiveBytes(readInput(path, name, { what: 'passive-region file' }), name);
}

/** Read and parse a loads file (docs/structure.md); `name` as the user gave it, for messages. */
function readLoads(path: string, name: string): LoadsSpec {
  return loadsParserLoaded()(readInput(path, name, { what: 'loads file' }), name);
}

export interface BuildFileOptions {
  readonly cwd: string;
  readonly file: string;
  /** The name shown in messages and the report; default `file`. */
  readonly name?: string;
  readonly writeGeometry: boolean;
  readonly force: boolean;
  readonly outDir: string;
  /** Where the passive-region file is, when not `settings.passive` relative to `cwd` (the demo's own). */
  readonly passivePath?: string;
  /** Where the loads file is, when not `settings.loads` relative to `cwd` (the demo's own). */
  readonly loadsPath?: string;
}

/**
 * Build one grid file into `outDir` (the outputs of `formats`, geometry only when `writeGeometry`), atomically,
 * and return its report. Throws RhoformError on bad input or an unwritable output (then nothing is written).
 * What the settings need beyond the core must be loaded first (cli/prepare.ts prepareSettings).
 */
export function buildFile(
  settings: Settings,
  opts: BuildFileOptions,
): {
  report: Report;
  warnings: readonly string[];
  exitCode: number;
  /** Milliseconds spent after the report was formatted (json, files), for `--timings`. */
  after: Readonly<Record<string, number>>;
} {
  const inputPath = resolve(opts.cwd, opts.file);
  const name = opts.name ?? opts.file;
  const { bytes, room } = readGridFile(inputPath, name, settings.maxCells);
  const passivePath = settings.passive === null ? null : (opts.passivePath ?? resolve(opts.cwd, settings.passive));
  const passive = passivePath === null || settings.passive === null ? null : readPassive(passivePath, settings.passive);
  const loadsPath = settings.loads === null ? null : (opts.loadsPath ?? resolve(opts.cwd, settings.loads));
  const loads = loadsPath === null || settings.loads === null ? null : readLoads(loadsPath, settings.loads);
  // The buffer is this function's own and is not read again: the build may flip (and widen) an NPY file's data inside it.
  const result = build({ name, bytes, consumable: true, room }, settings, { passive, loads });
  const report = result.report;
  const formats: OutputFormat[] = opts.writeGeometry ? settings.formats : settings.formats.filter((f) => f === 'json' || f === 'html');
  const base = join(resolve(opts.cwd, opts.outDir), stem(opts.file));
  const paths = outputNames(base, formats, settings.annotations);
  report.outputs = paths.map((p) => ({ file: displayPath(opts.cwd, p.path), format: p.format, ...(p.annotations ? { annotations: true as const } : {}) }));
  // The report's timings (the same object as result.timings) get the renderings made before the JSON is formatted:
  // every other file first, then the JSON with every figure known by then.
  const timings = result.timings;
  const timed = <T>(key: string, f: () => T, into: Record<string, number> = timings): T => {
    const t0 = performance.now();
    const v = f();
    into[key] = (into[key] ?? 0) + (performance.now() - t0);
    return v;
  };
  const content: (string | Uint8Array | undefined)[] = [];
  let svg: string | undefined;
  paths.forEach((p, k) => {
    if (p.annotations) content[k] = timed('notes', () => result.notesDxf());
    else if (p.format === 'dxf') content[k] = timed('dxf', () => result.dxf());
    else if (p.format === 'stl' || p.format === '3mf') content[k] = timed(p.format, () => result.solid(p.format as 'stl' | '3mf'));
    else if (p.format === 'svg') content[k] = svg ??= timed('svg', () => result.svg());
    else if (p.format === 'html') content[k] = timed('html', () => htmlFormatter()(report, result.pictures()));
  });
  report.peakMemory = peakMemory();
  for (const k of Object.keys(timings)) timings[k] = Math.round(timings[k] * 100) / 100;
  // What happens after the JSON is formatted is not in the report: its own formatting and the file writes.
  const after: Record<string, number> = {};
  paths.forEach((p, k) => {
    if (p.format === 'json') content[k] = timed('json', () => formatJson(report), after);
  });
  const planned: PlannedOutput[] = paths.map((p, k) => ({ path: p.path, content: content[k] as string | Uint8Array }));
  const inputs = [inputPath, ...(passivePath === null ? [] : [passivePath]), ...(loadsPath === null ? [] : [loadsPath])];
  timed('files', () => writeOutputsAtomically(planned, inputs, opts.force), after);
  return { report, warnings: result.warnings, exitCode: reportExitCode(report, settings.failOn), after };
}
