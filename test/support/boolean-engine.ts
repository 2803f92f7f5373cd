/** vitest setup: load the polygon boolean engine once per test file (the CLI and the library load it on demand). */
import { loadBooleanEngine } from '../../src/geom/clipper.js';

await loadBooleanEngine();
