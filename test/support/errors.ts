import { RhoformError } from '../../src/errors.js';

/** The RhoformError `f` throws; any other exception is rethrown, and no exception at all fails with `message`. */
export function rhoformErrorOf(f: () => unknown, message = 'expected a RhoformError'): RhoformError {
  try {
    f();
  } catch (e) {
    if (e instanceof RhoformError) return e;
    throw e;
  }
  throw new Error(message);
}
