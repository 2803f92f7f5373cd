/**
 * What every command shares at the edge of the process: the streams and environment (`Io`), the exit codes of
 * docs/cli.md, how a fatal error is printed, whether to colour, and how a path is shown. Used by the single
 * build (run.ts) and by the batch (batch.ts, batch/).
 */
import { isAbsolute, relative } from 'node:path';
import { RhoformError } from '../src/errors.js';
import type { Report } from '../src/types.js';

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

/** Exit code of one grid's report (docs/cli.md): 1 when a check failed, or warned under `--fail-on warn`. */
export function reportExitCode(report: Pick<Report, 'summary'>, failOn: 'warn' | 'fail'): number {
  if (report.summary.fail > 0) return EXIT_CHECK_FAILED;
  if (failOn === 'warn' && report.summary.warn > 0) return EXIT_CHECK_FAILED;
  return EXIT_OK;
}

/** Print a fatal error on stderr (a RhoformError with its code, anything else as an internal error); returns 2. */
export function reportError(e: unknown, io: Pick<Io, 'stderr'>): number {
  if (e instanceof RhoformError) {
    io.stderr(`rhoform: error ${e.code}: ${e.message}\n`);
    return EXIT_ERROR;
  }
  const err = e as Error;
  io.stderr(`rhoform: internal error: ${err?.stack ?? String(e)}\nPlease report this with the input file and the command line.\n`);
  return EXIT_ERROR;
}

/** Colour on stdout: not with `--no-color` (`color === false`) or a non-empty NO_COLOR, and only on a terminal. */
export function useColor(color: boolean | null, io: Pick<Io, 'env' | 'isTTY'>): boolean {
  if (color === false) return false;
  if (io.env.NO_COLOR !== undefined && io.env.NO_COLOR !== '') return false;
  return io.isTTY;
}

/** A path as a person would type it here: relative to `cwd` when inside it, else absolute. */
export function displayPath(cwd: string, path: string): string {
  const rel = relative(cwd, path);
  return rel && !rel.startsWith('..') && !isAbsolute(rel) ? rel : path;
}
