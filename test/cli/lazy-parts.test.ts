/**
 * The binary's entry (cli/start.ts `runAsync`) loads on demand what a run needs: a fresh module graph, as a new
 * process has, reads a MAT file through runAsync with the MAT reader loaded for it, and a plain NPY build loads
 * neither the other readers nor the HTML report. The grids: fixtures/mat/double.mat and double.npy hold the same
 * matrix (scipy.io.savemat and numpy.save, fixtures/make/make_mat_fixtures.py; fixtures/mat/manifest.json pairs them),
 * so the DXF drawn from each must be the same bytes.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it, vi } from 'vitest';
import { tempDir } from './harness.js';

const FIXTURES = fileURLToPath(new URL('../../fixtures/mat/', import.meta.url));

type Start = typeof import('../../cli/start.js');
type Run = typeof import('../../cli/run.js');
type Registry = typeof import('../../src/read/registry.js');

/** A module graph of its own: nothing loaded yet, as at the start of a process. */
async function fresh(): Promise<{ start: Start; run: Run; registry: Registry }> {
  vi.resetModules();
  return {
    start: await import('../../cli/start.js'),
    run: await import('../../cli/run.js'),
    registry: await import('../../src/read/registry.js'),
  };
}

function io(cwd: string) {
  const out = { stdout: '', stderr: '' };
  return { out, io: { stdout: (t: string) => void (out.stdout += t), stderr: (t: string) => void (out.stderr += t), isTTY: false, env: {}, cwd } };
}

describe('parts loaded on demand', () => {
  it('runAsync loads the MAT reader for a MAT input; the DXF equals the one drawn from the same matrix as NPY', async () => {
    const { start } = await fresh();
    const dir = tempDir();
    for (const f of ['double.mat', 'double.npy']) {
      const { out, io: sink } = io(dir);
      const code = await start.runAsync(['build', join(FIXTURES, f), '--formats', 'dxf,json', '--out-dir', f, '--quiet'], sink);
      expect(out.stderr).not.toContain('E_INTERNAL');
      expect(code).toBeLessThan(2);
    }
    const mat = readFileSync(join(dir, 'double.mat', 'double.dxf'), 'utf8');
    expect(mat).toBe(readFileSync(join(dir, 'double.npy', 'double.dxf'), 'utf8'));
  });

  it('the synchronous run, with nothing loaded, refuses a MAT input with E_INTERNAL naming the loader', async () => {
    const { run } = await fresh();
    const { out, io: sink } = io(tempDir());
    expect(run.run(['build', join(FIXTURES, 'double.mat'), '--formats', 'dxf', '--quiet'], sink)).toBe(2);
    expect(out.stderr).toMatch(/E_INTERNAL: .*the MAT reader is not loaded: await prepareBuild/);
  });

  it('a plain NPY build into DXF and JSON loads no other reader', async () => {
    const { start, registry } = await fresh();
    const { out, io: sink } = io(tempDir());
    expect(await start.runAsync(['build', join(FIXTURES, 'double.npy'), '--formats', 'dxf,json', '--quiet'], sink)).toBeLessThan(2);
    expect(out.stderr).toBe('');
    for (const f of ['mat', 'vtk', 'vti', 'png'] as const) expect(() => registry.registeredReader(f)).toThrow(/not loaded/);
    const prepare = await import('../../cli/prepare.js'); // the same fresh graph
    expect(() => prepare.htmlFormatter()).toThrow(/the HTML report is not loaded/);
  });
});
