/** Runs the CLI in-process with captured streams, in a fresh temporary folder. */
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { prepareEverything } from '../../cli/prepare.js';
import { run } from '../../cli/run.js';

// `run` is synchronous: what runAsync loads on demand (the HTML report, the preview command…) is loaded here once.
await prepareEverything();

export interface CliRun {
  code: number;
  stdout: string;
  stderr: string;
}

export function tempDir(): string {
  return mkdtempSync(join(tmpdir(), 'rhoform-test-'));
}

export function cli(argv: string[], cwd: string, env: Record<string, string | undefined> = {}, isTTY = false): CliRun {
  let stdout = '';
  let stderr = '';
  const code = run(argv, {
    stdout: (t) => (stdout += t),
    stderr: (t) => (stderr += t),
    isTTY,
    env,
    cwd,
  });
  return { code, stdout, stderr };
}
