#!/usr/bin/env node
/** The `rhoform` binary: run the command line, set the exit code, never call process.exit. */
import { spawnSync } from 'node:child_process';
import { availableParallelism } from 'node:os';
import { fileURLToPath } from 'node:url';
import { primeAllocator } from './allocator.js';

const argv = process.argv.slice(2);

/**
 * `rhoform batch` with more than one worker thread runs in a Node started with `--single-threaded-gc`: the
 * workers share one V8 platform, whose parallel GC helper threads would compete with them for the cores
 * (docs/performance.md, "Batch throughput"). A V8 flag cannot be set once V8 runs, so the binary starts itself
 * again, once, with the flag (RHOFORM_BATCH_GC=default keeps the default collector).
 */
function wantsSingleThreadedGc(): boolean {
  if (argv[0] !== 'batch' || process.execArgv.includes('--single-threaded-gc')) return false;
  if (process.env.RHOFORM_BATCH_GC === 'default' || availableParallelism() < 2) return false;
  const k = argv.findIndex((a) => a === '--jobs' || a.startsWith('--jobs='));
  const jobs = k < 0 ? null : argv[k].startsWith('--jobs=') ? argv[k].slice(7) : argv[k + 1];
  return jobs !== '1';
}

if (wantsSingleThreadedGc()) {
  const child = spawnSync(process.execPath, ['--single-threaded-gc', ...process.execArgv, fileURLToPath(import.meta.url), ...argv], { stdio: 'inherit' });
  if (child.error) {
    process.stderr.write(`rhoform: error E_INTERNAL: cannot start the batch process (${child.error.message})\n`);
    process.exitCode = 2;
  } else {
    process.exitCode = child.status ?? 2; // killed by a signal: the run did not finish
  }
} else {
  primeAllocator();
  const { runAsync } = await import('./start.js');
  process.exitCode = await runAsync(argv, {
    stdout: (t) => void process.stdout.write(t),
    stderr: (t) => void process.stderr.write(t),
    isTTY: process.stdout.isTTY === true,
    stderrIsTTY: process.stderr.isTTY === true,
    env: process.env,
    cwd: process.cwd(),
  });
}
