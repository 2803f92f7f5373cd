/**
 * `rhoform batch` and `rhoform merge` (docs/scale.md). Placeholder until the batch runner lands: both refuse
 * with a usage error rather than pretending to work.
 */
import { UsageError } from '../src/errors.js';
import type { ParsedArgs } from './args.js';
import type { Io } from './run.js';

export async function runBatch(_args: ParsedArgs, _io: Io): Promise<number> {
  throw new UsageError('batch: not available in this build yet');
}

export async function runMerge(_args: ParsedArgs, _io: Io): Promise<number> {
  throw new UsageError('merge: not available in this build yet');
}
