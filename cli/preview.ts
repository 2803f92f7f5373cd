/**
 * `rhoform preview <grid> [options]`: writes `<name>.preview.html` into --out-dir, one self-contained page with
 * the grid file inside (its bytes, deflated), the passive-region and loads files, and the library bundled for the
 * browser (dist/web/, made by `npm run build`). Every option given is the page's starting state. The page
 * runs the same `build` as the CLI and offers the same files (docs/preview.md, DESIGN §13).
 */
import { existsSync, readFileSync } from 'node:fs';
import { basename, extname, join, resolve } from 'node:path';
import { deflateSync } from 'node:zlib';
import { RhoformError } from '../src/errors.js';
import { parseLoadsBytes } from '../src/loads/parse.js';
import type { LoadsSpec } from '../src/loads/types.js';
import { parsePassiveBytes } from '../src/passive/parse.js';
import { build, loadGrid } from '../src/pipeline.js';
import { resolveSettings } from '../src/settings.js';
import { pageHtml } from '../web/shared/page-html.js';
import type { Embedded } from '../web/shared/protocol.js';
import type { ParsedArgs } from './args.js';
import { readGridInput, readInput, writeOutputsAtomically } from './files.js';
import { displayPath, type Io } from './io.js';
import { packageRoot } from './package-root.js';

/**
 * Largest grid a page embeds unless --max-cells says otherwise: 2000 × 1000 samples. The page holds the file
 * (a float64 NPY of that size is 16 MB, deflated and in base64 about 15–21 MB of HTML) and the browser holds
 * the grid several times over while it builds; beyond this a page gets slow to open and to mail.
 */
export const PREVIEW_MAX_CELLS = 2_000_000;


/** The two browser bundles, as text. */
function bundles(): { worker: string; page: string } {
  const dir = join(packageRoot(), 'dist', 'web');
  const read = (name: string) => {
    const path = join(dir, name);
    if (!existsSync(path)) {
      throw new RhoformError('E_INTERNAL', `the page bundle ${path} is missing: run npm run build (it bundles the library for the browser)`);
    }
    return readFileSync(path, 'utf8');
  };
  return { worker: read('preview-worker.js'), page: read('preview-page.js') };
}

function stem(file: string): string {
  const b = basename(file);
  const ext = extname(b);
  return ext ? b.slice(0, -ext.length) : b;
}

/** Writes the preview page of `args.files[0]`; returns the exit code (0 written, 2 refused). */
export function runPreview(args: ParsedArgs, io: Io): number {
  const file = args.files[0];
  const settings = resolveSettings(args.settings);
  const inputPath = resolve(io.cwd, file);
  // Read as `rhoform build` reads (cli/build-file.ts): the grid bounded by --max-cells, the passive file by its size.
  const bytes = readGridInput(inputPath, file, settings.maxCells);
  let passive: Embedded['passive'] = null;
  let passivePath: string | null = null;
  let regions = null;
  if (settings.passive !== null) {
    passivePath = resolve(io.cwd, settings.passive);
    const pbytes = readInput(passivePath, settings.passive, { what: 'passive-region file' });
    regions = parsePassiveBytes(pbytes, settings.passive);
    passive = { name: settings.passive, bytes: Buffer.from(pbytes).toString('base64') };
  }
  let loads: Embedded['loads'] = null;
  let loadsPath: string | null = null;
  let spec: LoadsSpec | null = null;
  if (settings.loads !== null) {
    loadsPath = resolve(io.cwd, settings.loads);
    const lbytes = readInput(loadsPath, settings.loads, { what: 'loads file' });
    spec = parseLoadsBytes(lbytes, settings.loads);
    loads = { name: settings.loads, bytes: Buffer.from(lbytes).toString('base64') };
  }
  const { nx, ny } = loadGrid({ name: file, bytes }, settings).grid;
  const limit = args.settings.maxCells ?? PREVIEW_MAX_CELLS;
  if (nx * ny > limit) {
    throw new RhoformError(
      'E_GRID_SIZE',
      `expected at most ${limit} samples for a preview page (it embeds the grid), found ${ny}×${nx} = ${nx * ny}; ` +
        `give --max-cells ${nx * ny} to embed it anyway (a larger, slower page), or use rhoform build`,
      { file },
    );
  }
  // One build here, as `rhoform build` would run it: bad input or settings are refused now (exit 2), not in the page.
  build({ name: file, bytes }, settings, { passive: regions, loads: spec });
  const outDir = resolve(io.cwd, args.cli.outDir ?? '.');
  const data: Embedded = {
    version: 1,
    file,
    given: args.settings,
    outDir: args.cli.outDir,
    outputsBase: displayPath(io.cwd, join(outDir, stem(file))),
    grid: deflateSync(bytes, { level: 9 }).toString('base64'),
    gridBytes: bytes.length,
    passive,
    loads,
    cells: nx * ny,
  };
  const { worker, page } = bundles();
  const html = pageHtml({ title: `rhoform preview — ${file}`, data, worker, page });
  const out = join(outDir, `${stem(file)}.preview.html`);
  const inputs = [inputPath, ...(passivePath === null ? [] : [passivePath]), ...(loadsPath === null ? [] : [loadsPath])];
  writeOutputsAtomically([{ path: out, content: html }], inputs, args.cli.force);
  const shown = displayPath(io.cwd, out);
  const size = Buffer.byteLength(html, 'utf8');
  if (args.cli.json) io.stdout(`${JSON.stringify({ page: shown, bytes: size, nx, ny })}\n`);
  else if (!args.cli.quiet) {
    io.stdout(`wrote      ${shown} (${(size / 1e6).toFixed(2)} MB; ${nx}×${ny} grid inside; open it in a browser, no network needed)\n`);
  }
  return 0;
}
