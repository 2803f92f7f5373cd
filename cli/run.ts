/**
 * The commands. Returns an exit code and never calls process.exit (cli/main.ts sets process.exitCode).
 * stdout carries only the product (summary or JSON); warnings and errors go to stderr.
 */
import { existsSync } from 'node:fs';
import { basename, dirname, extname, isAbsolute, join, relative, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { RhoformError, UsageError } from '../src/errors.js';
import { parsePassive } from '../src/passive/parse.js';
import type { PassiveRegions } from '../src/passive/types.js';
import { build, inspect } from '../src/pipeline.js';
import { formatHtml } from '../src/report/html.js';
import { formatJson } from '../src/report/json.js';
import { fmt } from '../src/report/number.js';
import { formatText } from '../src/report/text.js';
import { loadBooleanEngine } from '../src/geom/clipper.js';
import { needsBooleanEngine, REPAIR_IDS, resolveSettings, type OutputFormat, type Settings } from '../src/settings.js';
import type { Report } from '../src/types.js';
import { VERSION } from '../src/version.js';
import { parseArgs, type ParsedArgs } from './args.js';
import { readInput, writeOutputsAtomically, type PlannedOutput } from './files.js';
import { HELP } from './messages.js';
import { buildNotice, inputBytes, progressMode } from './batch/progress.js';

export interface Io {
  stdout(text: string): void;
  stderr(text: string): void;
  /** Whether stdout is a terminal (for colour). */
  readonly isTTY: boolean;
  /** Whether stderr is a terminal (progress redrawn in place); absent = not a terminal. */
  readonly stderrIsTTY?: boolean;
  readonly env: Readonly<Record<string, string | undefined>>;
  readonly cwd: string;
}

/** Exit codes of docs/cli.md. */
export const EXIT_OK = 0;
export const EXIT_CHECK_FAILED = 1;
export const EXIT_ERROR = 2;

const here = dirname(fileURLToPath(import.meta.url));
/** The package root, from src (cli/) or from the compiled dist/cli/. */
function packageRoot(): string {
  for (const up of ['..', '../..']) {
    const root = resolve(here, up);
    if (existsSync(join(root, 'package.json'))) return root;
  }
  return resolve(here, '..');
}

/**
 * The bundled demo: a grid of our own scenario and the settings it is meant to be built with — 2 mm cells, and
 * the bracket is waterjet-cut from 8 mm aluminium sheet (fixtures/grids/demo-bracket.md), so the checks use
 * that process's generic limits; its bolt holes and motor pad are passive regions of its own file; and it is
 * repaired, so the report shows the findings before repair next to the repaired result.
 */
export const DEMO = {
  file: 'fixtures/grids/demo-bracket.npy',
  settings: {
    cellSize: [2, 2],
    process: 'waterjet-cut',
    thickness: 8,
    passive: 'fixtures/passive/demo-bracket.passive.json',
    repair: [...REPAIR_IDS],
  } as Partial<Settings>,
};

const SUFFIX: Record<OutputFormat, string> = { dxf: '.dxf', svg: '.svg', json: '.report.json', html: '.report.html' };

function stem(file: string): string {
  const b = basename(file);
  const ext = extname(b);
  return ext ? b.slice(0, -ext.length) : b;
}

/** A path as a person would type it here: relative to the working folder when inside it, else absolute. */
function displayPath(cwd: string, path: string): string {
  const rel = relative(cwd, path);
  return rel && !rel.startsWith('..') && !isAbsolute(rel) ? rel : path;
}

function useColor(args: ParsedArgs, io: Io): boolean {
  if (args.cli.color === false) return false;
  if (io.env.NO_COLOR !== undefined && io.env.NO_COLOR !== '') return false;
  return io.isTTY;
}

/** Exit code of one grid's report (docs/cli.md): 1 when a check failed, or warned under `--fail-on warn`. */
export function reportExitCode(report: Report, failOn: 'warn' | 'fail'): number {
  if (report.summary.fail > 0) return EXIT_CHECK_FAILED;
  if (failOn === 'warn' && report.summary.warn > 0) return EXIT_CHECK_FAILED;
  return EXIT_OK;
}

/** Read and parse a passive-region file (docs/passive.md); `name` as the user gave it, for messages. */
function readPassive(path: string, name: string): PassiveRegions {
  const bytes = readInput(path, name);
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    throw new RhoformError('E_PASSIVE_JSON', 'expected UTF-8 text (JSON), found bytes that are not UTF-8', { file: name });
  }
  return parsePassive(text, name);
}

/**
 * Build one grid file into `outDir` (the outputs of `formats`, geometry only when `writeGeometry`), atomically,
 * and return its report. Prints nothing: callers decide what goes to stdout and stderr. Throws RhoformError on
 * bad input or an unwritable output (then nothing is written).
 */
export function buildFile(
  settings: Settings,
  opts: { cwd: string; file: string; name?: string; writeGeometry: boolean; force: boolean; outDir: string; passivePath?: string },
): { report: Report; warnings: readonly string[]; exitCode: number } {
  const inputPath = resolve(opts.cwd, opts.file);
  const name = opts.name ?? opts.file;
  const bytes = readInput(inputPath, name);
  const passivePath = settings.passive === null ? null : (opts.passivePath ?? resolve(opts.cwd, settings.passive));
  const passive = passivePath === null ? null : readPassive(passivePath, settings.passive as string);
  const result = build({ name, bytes }, settings, { passive });
  const report = result.report;
  const formats: OutputFormat[] = opts.writeGeometry ? settings.formats : settings.formats.filter((f) => f === 'json' || f === 'html');
  const base = join(resolve(opts.cwd, opts.outDir), stem(opts.file));
  const paths = formats.map((f) => ({ format: f, path: base + SUFFIX[f] }));
  report.outputs = paths.map((p) => ({ file: displayPath(opts.cwd, p.path), format: p.format }));
  const planned: PlannedOutput[] = [];
  let svg: string | undefined;
  for (const p of paths) {
    let content: string;
    if (p.format === 'dxf') content = result.dxf();
    else if (p.format === 'svg') content = svg ??= result.svg();
    else if (p.format === 'json') content = formatJson(report);
    else content = formatHtml(report, result.pictures());
    planned.push({ path: p.path, content });
  }
  writeOutputsAtomically(planned, passivePath === null ? [inputPath] : [inputPath, passivePath], opts.force);
  return { report, warnings: result.warnings, exitCode: reportExitCode(report, settings.failOn) };
}

function runBuild(
  args: ParsedArgs,
  io: Io,
  opts: { file: string; name?: string; writeGeometry: boolean; force: boolean; outDir: string; passivePath?: string },
): number {
  const settings = resolveSettings(args.settings);
  // Progress (docs/scale.md): a build runs synchronously, so a large input gets one start line on stderr.
  const done = buildNotice(io.stderr, progressMode(args.cli.quiet, io.stderrIsTTY === true), opts.name ?? opts.file, inputBytes(resolve(io.cwd, opts.file)));
  let built: ReturnType<typeof buildFile>;
  try {
    built = buildFile(settings, { ...opts, cwd: io.cwd });
  } finally {
    done();
  }
  const { report, warnings, exitCode } = built;
  for (const w of warnings) io.stderr(`rhoform: warning: ${w}\n`);
  if (args.cli.json) io.stdout(formatJson(report));
  else if (!args.cli.quiet) io.stdout(formatText(report, { color: useColor(args, io) }));
  return exitCode;
}

function runInspect(args: ParsedArgs, io: Io): number {
  const settings = resolveSettings(args.settings);
  const file = args.files[0];
  const bytes = readInput(resolve(io.cwd, file), file);
  const r = inspect({ name: file, bytes }, settings);
  for (const w of r.warnings) io.stderr(`rhoform: warning: ${w}\n`);
  if (args.cli.json) {
    io.stdout(formatJson({ schemaVersion: r.schemaVersion, tool: r.tool, input: r.input, greyShare: r.greyShare, histogram: r.histogram }));
    return EXIT_OK;
  }
  if (args.cli.quiet) return EXIT_OK;
  const i = r.input;
  const [hx, hy] = i.cellSize;
  const maxCount = Math.max(1, ...r.histogram.counts);
  const lines = [
    `file        ${i.file} (${i.format.toUpperCase()})`,
    `size        ${i.nx} × ${i.ny} = ${i.nx * i.ny} values, cell ${hx === hy ? fmt(hx) : `${fmt(hx)} × ${fmt(hy)}`} mm${settings.cellSizeDefaulted && r.layout !== 'long' ? ' (default)' : r.layout === 'long' ? ' (from the x, y columns)' : ''}`,
    `range       ${fmt(i.min, 6)} … ${fmt(i.max, 6)}`,
    `mean        ${fmt(i.mean, 6)} (the default volume fraction)`,
    `grey level  M_nd ${fmt(i.greyLevel, 4)} % (Sigmund 2007); grey cells (0.1 < ρ < 0.9) ${(100 * r.greyShare).toFixed(1)} %`,
    `non-finite  ${i.nonFinite}`,
    'histogram',
    ...r.histogram.counts.map((c, b) => {
      const bar = '█'.repeat(Math.round((40 * c) / maxCount));
      return `  ${r.histogram.edges[b].toFixed(1)}–${r.histogram.edges[b + 1].toFixed(1)} ${String(c).padStart(9)} ${bar}`;
    }),
  ];
  io.stdout(`${lines.join('\n')}\n`);
  return EXIT_OK;
}

function runDemo(args: ParsedArgs, io: Io): number {
  const root = packageRoot();
  const file = join(root, DEMO.file);
  const outDir = args.cli.outDir ?? 'rhoform-demo';
  const demoArgs: ParsedArgs = { ...args, settings: { ...DEMO.settings, ...args.settings } };
  // The demo replaces its own earlier output (and only that): the same names in its own folder.
  // The demo's own passive-region file sits in the package; a --passive of the user's replaces it.
  const passivePath = args.settings.passive === undefined ? join(root, DEMO.settings.passive as string) : undefined;
  const code = runBuild(demoArgs, io, { file, name: DEMO.file, writeGeometry: true, force: true, outDir, passivePath });
  if (!args.cli.json && !args.cli.quiet) {
    io.stdout(`\nThe demo grid is ${DEMO.file} (a bracket of our own invention: fixtures/grids/demo-bracket.md).\nIts DXF, SVG and reports are in ${resolve(io.cwd, outDir)}/\n`);
  }
  return code;
}

/** Run one command line; returns the exit code. */
export function run(argv: readonly string[], io: Io): number {
  let args: ParsedArgs;
  try {
    args = parseArgs(argv);
    switch (args.command) {
      case 'help':
        io.stdout(HELP);
        return EXIT_OK;
      case 'version':
        io.stdout(`${VERSION}\n`);
        return EXIT_OK;
      case 'inspect':
        return runInspect(args, io);
      case 'demo': {
        const code = runDemo(args, io);
        return code === EXIT_ERROR ? code : EXIT_OK;
      }
      case 'batch':
      case 'merge':
        // These run on worker threads and the event loop: see runAsync.
        throw new UsageError(`${args.command} runs asynchronously; call runAsync (the rhoform binary does)`);
      case 'build':
      case 'check':
        return runBuild(args, io, {
          file: args.files[0],
          writeGeometry: args.command === 'build',
          force: args.cli.force,
          outDir: args.cli.outDir ?? '.',
        });
    }
  } catch (e) {
    return reportError(e, io);
  }
}

/** Print a fatal error on stderr (a RhoformError with its code, anything else as an internal error); returns 2. */
export function reportError(e: unknown, io: Io): number {
  if (e instanceof RhoformError) {
    io.stderr(`rhoform: error ${e.code}: ${e.message}\n`);
    return EXIT_ERROR;
  }
  const err = e as Error;
  io.stderr(`rhoform: internal error: ${err?.stack ?? String(e)}\nPlease report this with the input file and the command line.\n`);
  return EXIT_ERROR;
}

/**
 * Run one command line, including the asynchronous commands (`batch` on worker threads, `merge`); the
 * rhoform binary calls this. Other commands run as in `run`.
 */
export async function runAsync(argv: readonly string[], io: Io): Promise<number> {
  let args: ParsedArgs;
  try {
    args = parseArgs(argv);
  } catch (e) {
    return run(argv, io);
  }
  if (args.command !== 'batch' && args.command !== 'merge') {
    // The boolean engine loads on demand (src/geom/clipper.ts): only runs that use it pay its start-up.
    const s = args.command === 'demo' ? { ...DEMO.settings, ...args.settings } : args.settings;
    if (args.command !== 'help' && args.command !== 'version' && needsBooleanEngine(resolveSettings(s))) await loadBooleanEngine();
    return run(argv, io);
  }
  try {
    const { runBatch, runMerge } = await import('./batch.js');
    return args.command === 'batch' ? await runBatch(args, io) : await runMerge(args, io);
  } catch (e) {
    return reportError(e, io);
  }
}
