/**
 * vitest setup: load once per test file what the library loads on demand and many tests use: the polygon
 * boolean engine and the MAT/VTK/VTI/PNG readers. Tests that build with repairs, loads or solids import
 * ./build-parts.js; test/cli/harness.ts loads the CLI's own parts.
 */
import { loadBooleanEngine } from '../../src/geom/clipper.js';
import { loadReaders } from '../../src/read/detect.js';

await Promise.all([loadBooleanEngine(), loadReaders()]);
