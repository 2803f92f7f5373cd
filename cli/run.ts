/**
 * The commands. Returns an exit code and never calls process.exit (cli/main.ts sets process.exitCode).
 * stdout carries only the product (summary or JSON); warnings and errors go to stderr.
 */
import { join, resolve } from 'node:path';
import { UsageError } from '../src/errors.js';
import { inspect } from '../src/pipeline.js';
import { formatJson } from '../src/report/json.js';
import { fmt } from '../src/report/number.js';
import { formatText } from '../src/report/text.js';
import { resolveSettings } from '../src/settings.js';
import { VERSION } from '../src/version.js';
import { parseArgs, type ParsedArgs } from './args.js';
import { buildFile } from './build-file.js';
import { formatTimings } from './timings.js';
import { readGridInput } from './files.js';
import { EXIT_ERROR, EXIT_OK, reportError, useColor, type Io } from './io.js';
import { HELP } from './messages.js';
import { buildNotice, inputBytes, progressMode } from './batch/progress.js';
import { packageRoot } from './package-root.js';
import { laneTarget, startLanes } from '../src/parallel/node.js';
import { DEMO } from './demo.js';
import { previewCommand } from './prepare.js';


function runBuild(
  args: ParsedArgs,
  io: Io,
  opts: { file: string; name?: string; writeGeometry: boolean; force: boolean; outDir: string; passivePath?: string; loadsPath?: string },
): number {
  const settings = resolveSettings(args.settings);
  const bytes = inputBytes(resolve(io.cwd, opts.file));
  // Both cores for the large raster passes (src/parallel; RHOFORM_THREADS=1 keeps one thread); the threads
  // start during the read when the file is large (16 MB: 2 M cells of f8) and a split pass will come (size
  // checks or the HTML pictures), else at their first task
  const splits = settings.formats.includes('html') || settings.process !== null ||
    settings.minMember !== null || settings.minHole !== null || settings.toolRadius !== null;
  startLanes(laneTarget(io.env), splits && bytes >= 16 * 2 ** 20);
  // Progress (docs/scale.md): a build runs synchronously, so a large input gets one start line on stderr.
  const done = buildNotice(io.stderr, progressMode(args.cli.quiet, io.stderrIsTTY === true), opts.name ?? opts.file, bytes);
  let built: ReturnType<typeof buildFile>;
  try {
    built = buildFile(settings, { ...opts, cwd: io.cwd });
  } finally {
    done();
  }
  const { report, warnings, exitCode } = built;
  for (const w of warnings) io.stderr(`rhoform: warning: ${w}\n`);
  if (args.cli.timings) io.stderr(formatTimings(report.timings ?? {}, built.after, report.peakMemory, performance.now()));
  if (args.cli.json) io.stdout(formatJson(report));
  else if (!args.cli.quiet) io.stdout(formatText(report, { color: useColor(args.cli.color, io) }));
  return exitCode;
}

function runInspect(args: ParsedArgs, io: Io): number {
  const settings = resolveSettings(args.settings);
  const file = args.files[0];
  const bytes = readGridInput(resolve(io.cwd, file), file, settings.maxCells);
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
    `size        ${i.nx} × ${i.ny} = ${i.nx * i.ny} values, cell ${hx === hy ? fmt(hx) : `${fmt(hx)} × ${fmt(hy)}`} mm${r.cellSizeSource === 'file' ? ' (from the file)' : settings.cellSizeDefaulted && r.layout !== 'long' ? ' (default)' : r.layout === 'long' ? ' (from the x, y columns)' : ''}`,
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
  // force: the demo replaces its own earlier output in its own folder. Its passive-region and loads files sit in
  // the package; the user's --passive or --loads replaces them.
  const passivePath = args.settings.passive === undefined ? join(root, DEMO.settings.passive as string) : undefined;
  const loadsPath = args.settings.loads === undefined ? join(root, DEMO.settings.loads as string) : undefined;
  const code = runBuild(demoArgs, io, { file, name: DEMO.file, writeGeometry: true, force: true, outDir, passivePath, loadsPath });
  if (!args.cli.json && !args.cli.quiet) {
    io.stdout(`\nThe demo grid is ${DEMO.file} (a bracket of our own invention: fixtures/grids/demo-bracket.md).\nIts DXF, SVG and reports are in ${resolve(io.cwd, outDir)}/\n`);
  }
  return code;
}

/**
 * `rhoform check` asks for a verdict: it writes its report files (JSON and HTML) only when told where
 * (`--out-dir`); otherwise nothing is written and the report's `settings.formats` and `outputs` are empty
 * (docs/cli.md, "check writes no file unless asked").
 */
export function checkFiles(args: ParsedArgs): ParsedArgs {
  if (args.cli.outDir !== null) return args;
  return { ...args, settings: { ...args.settings, formats: [] } };
}

/**
 * Run one command line; returns the exit code. `batch` and `merge`, and the parts a command loads on demand,
 * need `runAsync` (cli/start.ts), or cli/prepare.ts `prepareEverything` awaited once before.
 */
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
        // asynchronous: cli/start.ts runAsync
        throw new UsageError(`${args.command} runs asynchronously; call runAsync (the rhoform binary does)`);
      case 'preview':
        return previewCommand()(args, io);
      case 'build':
        return runBuild(args, io, { file: args.files[0], writeGeometry: true, force: args.cli.force, outDir: args.cli.outDir ?? '.' });
      case 'check':
        return runBuild(checkFiles(args), io, { file: args.files[0], writeGeometry: false, force: args.cli.force, outDir: args.cli.outDir ?? '.' });
    }
  } catch (e) {
    return reportError(e, io);
  }
}
