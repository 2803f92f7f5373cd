/**
 * The entry of the rhoform binary: parses the command line, loads only what its command needs
 * (cli/prepare.ts), then runs it — `--help` and `--version` load nothing beyond the argument parser.
 */
import { parseArgs, type ParsedArgs } from './args.js';
import { EXIT_OK, reportError, type Io } from './io.js';
import { HELP } from './messages.js';
import { VERSION } from '../src/version.js';

/** Run one command line, the asynchronous commands (`batch` on worker threads, `merge`) included; returns the exit code. */
export async function runAsync(argv: readonly string[], io: Io): Promise<number> {
  let args: ParsedArgs | null = null;
  try {
    args = parseArgs(argv);
  } catch {
    // run() reports it
  }
  if (args?.command === 'help') {
    io.stdout(HELP);
    return EXIT_OK;
  }
  if (args?.command === 'version') {
    io.stdout(`${VERSION}\n`);
    return EXIT_OK;
  }
  if (args?.command === 'batch' || args?.command === 'merge') {
    try {
      const { runBatch, runMerge } = await import('./batch.js');
      return args.command === 'batch' ? await runBatch(args, io) : await runMerge(args, io);
    } catch (e) {
      return reportError(e, io);
    }
  }
  if (args !== null) await (await import('./prepare.js')).prepareRun(args, io.cwd);
  const { run } = await import('./run.js');
  return run(argv, io);
}
