/** Types of scripts/bundle.mjs (for the tests, which build the page bundles before they write pages). */
export function bundle(outdir?: string): Promise<{ worker: string; page: string }>;
