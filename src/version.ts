/** The tool's version; test/cli/version.test.ts keeps it equal to package.json. */
export const VERSION = '0.1.0';
