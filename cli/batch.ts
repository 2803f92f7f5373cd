/**
 * `rhoform batch` and `rhoform merge` (docs/scale.md).
 *
 * batch: collect the inputs (cli/batch/collect.ts), place their outputs (layout.ts), take this run's shard
 * (shard.ts), build the files on a pool of worker threads (pool.ts, worker.ts — each calls buildFile), show
 * progress on stderr (progress.ts), then write batch-summary.csv/.json (summary.ts) and print the table.
 * merge: join shard summaries (merge.ts) into one summary, written and printed the same way.
 */
import { existsSync, readFileSync } from 'node:fs';
import { availableParallelism } from 'node:os';
import { join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { RhoformError, UsageError } from '../src/errors.js';
import { resolveSettings } from '../src/settings.js';
import { VERSION } from '../src/version.js';
import type { ParsedArgs } from './args.js';
import { collectInputs } from './batch/collect.js';
import { placeOutputs } from './batch/layout.js';
import { mergeSummaries, parseSummary, type LoadedSummary } from './batch/merge.js';
import { runPool } from './batch/pool.js';
import { formatBatchTable } from './batch/print.js';
import { BatchProgress, progressMode } from './batch/progress.js';
import { selectShard } from './batch/shard.js';
import { errorRow, makeSummary, summaryCsv, summaryJson, summaryNames, type BatchSummary, type SummaryRow } from './batch/summary.js';
import type { WorkerAnswer, WorkerSetup, WorkerTask } from './batch/worker.js';
import { installTempSweep, readInput, writeOutputsAtomically } from './files.js';
import { displayPath, reportError, useColor, type Io } from './io.js';

const TOOL = { name: 'rhoform' as const, version: VERSION };

function terminalColumns(io: Io): number | undefined {
  const c = Number(io.env.COLUMNS);
  return Number.isInteger(c) && c > 0 ? c : undefined;
}

/** The summary paths of a run (absolute); refuses existing ones without --force before any work starts. */
function summaryPaths(outDir: string, shard: ParsedArgs['cli']['shard'], force: boolean): { csv: string; json: string } {
  const names = summaryNames(shard);
  const paths = { csv: join(outDir, names.csv), json: join(outDir, names.json) };
  if (!force) {
    for (const p of [paths.csv, paths.json]) {
      if (existsSync(p)) throw new RhoformError('E_OUTPUT_EXISTS', `expected a new file, found an existing one (use --force to replace it)`, { file: p });
    }
  }
  return paths;
}

/**
 * Write the summary files and print the product (the table, or the JSON with --json). A summary that cannot
 * be written is reported on stderr and makes the exit code 2; the table is still printed (the files' own
 * outputs were written).
 */
function writeSummary(args: ParsedArgs, io: Io, summary: BatchSummary, paths: { csv: string; json: string }, inputs: readonly string[]): number {
  let code = summary.exitCode;
  let written: string[] = [];
  try {
    writeOutputsAtomically(
      [
        { path: paths.csv, content: summaryCsv(summary.files) },
        { path: paths.json, content: summaryJson(summary) },
      ],
      inputs,
      args.cli.force,
    );
    written = [displayPath(io.cwd, paths.csv), displayPath(io.cwd, paths.json)];
  } catch (e) {
    code = reportError(e, io);
  }
  if (args.cli.json) io.stdout(summaryJson(summary));
  else if (!args.cli.quiet) io.stdout(formatBatchTable(summary, { color: useColor(args.cli.color, io), written }));
  return code;
}

/** The worker script beside this module (compiled: dist/cli/batch/worker.js). */
function workerUrl(): URL {
  const url = new URL('./batch/worker.js', import.meta.url);
  if (!existsSync(fileURLToPath(url))) {
    throw new RhoformError(
      'E_INTERNAL',
      `batch: expected the worker script at ${fileURLToPath(url)}, found nothing (batch runs from the compiled package: npm run build)`,
    );
  }
  return url;
}

export async function runBatch(args: ParsedArgs, io: Io): Promise<number> {
  const settings = resolveSettings(args.settings);
  const outDir = resolve(io.cwd, args.cli.outDir ?? '.');
  const { inputs, notes } = collectInputs(args.files, io.cwd);
  if (inputs.length === 0) throw new UsageError(`batch: expected grid files, found none in ${args.files.join(', ')}`);
  const { placed } = placeOutputs(inputs, outDir);
  const mine = selectShard(placed, args.cli.shard);
  const paths = summaryPaths(outDir, args.cli.shard, args.cli.force);

  const quiet = args.cli.quiet;
  const progress = new BatchProgress(io.stderr, mine.length, progressMode(quiet, io.stderrIsTTY === true), { columns: terminalColumns(io) });
  if (!quiet) for (const n of notes) progress.note(`rhoform: note: ${n}`);

  const rows: SummaryRow[] = new Array<SummaryRow>(mine.length);
  const taskIndex: number[] = [];
  const tasks: WorkerTask[] = [];
  // An error's progress line: its code and message, without repeating the file name that leads the line.
  const detail = (r: SummaryRow) => {
    if (r.status !== 'error') return undefined;
    const msg = r.error ?? '';
    return `${r.errorCode} ${msg.startsWith(`${r.file}:`) ? msg.slice(r.file.length + 1).trimStart() : msg}`;
  };
  mine.forEach((f, i) => {
    if (f.error) {
      rows[i] = errorRow(f.file, f.error.code, f.error.message);
      progress.fileDone(f.file, 'error', 0, detail(rows[i]));
    } else {
      taskIndex.push(i);
      tasks.push({ file: f.file, path: f.path, outDir: f.outDir });
    }
  });

  // SIGINT/SIGTERM: remove this run's temp files in every folder it writes to, then end as the signal says.
  const uninstallSweep = installTempSweep([outDir, ...tasks.map((t) => t.outDir)]);
  if (tasks.length > 0) {
    const setup: WorkerSetup = { kind: 'rhoform-batch', settings, cwd: io.cwd, force: args.cli.force };
    await runPool<WorkerTask, WorkerAnswer>(tasks, {
      workerUrl: workerUrl(),
      workerData: setup,
      jobs: args.cli.jobs ?? availableParallelism(),
      crashed: (t, reason) => ({
        row: errorRow(t.file, 'E_INTERNAL', `${t.file}: the worker building this file stopped (${reason})`),
        warnings: [],
      }),
      onResult: (k, _t, a) => {
        rows[taskIndex[k]] = a.row;
        if (!quiet) for (const w of a.warnings) progress.note(`rhoform: warning: ${a.row.file}: ${w}`);
        if (a.internal) progress.note(`rhoform: internal error in ${a.row.file}: ${a.internal}\nPlease report this with the input file and the command line.`);
        progress.fileDone(a.row.file, a.row.status, a.row.timeMs, detail(a.row));
      },
      onOutput: (text) => progress.note(text),
    });
  }
  progress.finish();

  const summary = makeSummary(TOOL, settings as unknown as Record<string, unknown>, args.cli.shard, rows);
  try {
    return writeSummary(args, io, summary, paths, inputs.map((f) => f.path));
  } finally {
    uninstallSweep();
  }
}

export async function runMerge(args: ParsedArgs, io: Io): Promise<number> {
  const outDir = resolve(io.cwd, args.cli.outDir ?? '.');
  const loaded: LoadedSummary[] = args.files.map((f) => {
    const path = resolve(io.cwd, f);
    const text = new TextDecoder().decode(readInput(path, f, { what: 'summary' }));
    return { name: f, summary: parseSummary(f, text) };
  });
  const { summary, notes } = mergeSummaries(loaded, TOOL);
  if (!args.cli.quiet) for (const n of notes) io.stderr(`rhoform: note: ${n}\n`);
  const paths = summaryPaths(outDir, null, args.cli.force);
  return writeSummary(args, io, summary, paths, args.files.map((f) => resolve(io.cwd, f)));
}
