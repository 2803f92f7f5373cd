#!/usr/bin/env node
/** The `rhoform` binary: run the command line, set the exit code, never call process.exit. */
import { runAsync } from './run.js';

process.exitCode = await runAsync(process.argv.slice(2), {
  stdout: (t) => void process.stdout.write(t),
  stderr: (t) => void process.stderr.write(t),
  isTTY: process.stdout.isTTY === true,
  stderrIsTTY: process.stderr.isTTY === true,
  env: process.env,
  cwd: process.cwd(),
});
