/**
 * The batch worker thread (cli/batch/pool.ts protocol): builds one grid file per task with `buildFile`
 * (cli/build-file.ts) and answers with its summary row and warnings. A bad file is an answer (a row with its error
 * code), never a crash; an unexpected exception is answered as E_INTERNAL with its stack.
 */
import { parentPort, workerData } from 'node:worker_threads';
import { RhoformError } from '../../src/errors.js';
import type { Settings } from '../../src/settings.js';
import { buildFile } from '../build-file.js';
import { prepareSettings } from '../prepare.js';
import { errorRow, rowFromReport, type SummaryRow } from './summary.js';

export interface WorkerSetup {
  /** Marks the setup of this worker (so that importing this module elsewhere never answers messages). */
  readonly kind: 'rhoform-batch';
  readonly settings: Settings;
  readonly cwd: string;
  readonly force: boolean;
}

export interface WorkerTask {
  /** As shown in the summary and the report (`input.file`). */
  readonly file: string;
  /** Absolute input path. */
  readonly path: string;
  /** Absolute folder for this file's outputs. */
  readonly outDir: string;
}

export interface WorkerAnswer {
  readonly row: SummaryRow;
  readonly warnings: readonly string[];
  /** Stack of an unexpected exception, for stderr. */
  readonly internal?: string;
}

/** Build one file; never throws. */
export function processTask(setup: WorkerSetup, task: WorkerTask): WorkerAnswer {
  const t0 = performance.now();
  try {
    const r = buildFile(setup.settings, {
      cwd: setup.cwd,
      file: task.path,
      name: task.file,
      writeGeometry: true,
      force: setup.force,
      outDir: task.outDir,
    });
    return { row: rowFromReport(task.file, r.report, r.exitCode, Math.round(performance.now() - t0)), warnings: r.warnings };
  } catch (e) {
    const ms = Math.round(performance.now() - t0);
    if (e instanceof RhoformError) return { row: errorRow(task.file, e.code, e.message, ms), warnings: [] };
    const err = e as Error;
    return {
      row: errorRow(task.file, 'E_INTERNAL', `${task.file}: internal error: ${err?.message ?? String(e)}`, ms),
      warnings: [],
      internal: err?.stack ?? String(e),
    };
  }
}

const setupData = workerData as WorkerSetup | null | undefined;
if (parentPort && setupData?.kind === 'rhoform-batch') {
  // what the builds need, every reader included (files vary); messages wait in the port meanwhile
  await prepareSettings(setupData.settings, null);
  const port = parentPort;
  const setup = setupData;
  port.on('message', (m: { id: number; task: WorkerTask }) => {
    port.postMessage({ id: m.id, result: processTask(setup, m.task) });
  });
}
