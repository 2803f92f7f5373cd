/** Types of scripts/bundle-cli.mjs (for the tests, which bundle the CLI into a temporary dist/). */
export function bundleCli(dist?: string): Promise<string[]>;
/** Modules that find files relative to themselves (paths from the package root, .ts). */
export const RELATIVE: readonly string[];
/** Modules that name themselves to the lanes by import.meta.url; each gets an entry of its own. */
export const LANE_MODULES: readonly string[];
/** The entry of a lane module, relative to dist/bin/. */
export function laneEntry(module: string): string;
