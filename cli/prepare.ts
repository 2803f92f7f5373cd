/**
 * What a command needs beyond the core of a build, loaded before its synchronous run: through src/pipeline.ts
 * `prepareBuild`, the input's reader, the boolean engine, the repairs, the structural re-check and the solid
 * writers; here, the HTML report, the loads-file parser and the preview command. A plain build of an NPY or CSV
 * grid into DXF, SVG and JSON loads none of them (docs/notes/read-write.md).
 */
import { join, resolve } from 'node:path';
import { RhoformError } from '../src/errors.js';
import { prepareBuild } from '../src/pipeline.js';
import { DETECT_BYTES } from '../src/read/detect.js';
import { resolveSettings, type Settings } from '../src/settings.js';
import type { ParsedArgs } from './args.js';
import { DEMO } from './demo.js';
import { readHead } from './files.js';
import { packageRoot } from './package-root.js';

let html: typeof import('../src/report/html.js').formatHtml | null = null;
let loadsParser: typeof import('../src/loads/parse.js').parseLoadsBytes | null = null;
let preview: typeof import('./preview.js').runPreview | null = null;

function need<T>(part: T | null, what: string): T {
  if (part === null) throw new RhoformError('E_INTERNAL', `${what} is not loaded: await prepareRun() first (cli/start.ts runAsync does)`);
  return part;
}

export const htmlFormatter = () => need(html, 'the HTML report');
export const loadsParserLoaded = () => need(loadsParser, 'the loads-file parser');
export const previewCommand = () => need(preview, 'the preview command');

async function loadHtml(): Promise<void> {
  html ??= (await import('../src/report/html.js')).formatHtml;
}

async function loadLoadsParser(): Promise<void> {
  loadsParser ??= (await import('../src/loads/parse.js')).parseLoadsBytes;
}

async function loadPreview(): Promise<void> {
  preview ??= (await import('./preview.js')).runPreview;
}

/** What a build with `settings` needs; `input`: the grid file's path, whose first bytes name its reader. */
export async function prepareSettings(settings: Settings, input: string | null): Promise<void> {
  const head = input === null ? null : readHead(input, DETECT_BYTES);
  await Promise.all([
    prepareBuild(settings, head === null || input === null ? undefined : { name: input, bytes: head }),
    settings.formats.includes('html') ? loadHtml() : null,
    settings.loads !== null ? loadLoadsParser() : null,
  ]);
}

/**
 * Loads what the command of `args` needs. Never throws: settings or files it cannot make sense of are left
 * to the run itself, which reports them.
 */
export async function prepareRun(args: ParsedArgs, cwd: string): Promise<void> {
  try {
    switch (args.command) {
      case 'build':
      case 'check':
      case 'inspect':
        return await prepareSettings(resolveSettings(args.settings), resolve(cwd, args.files[0]));
      case 'demo':
        return await prepareSettings(resolveSettings({ ...DEMO.settings, ...args.settings }), join(packageRoot(), DEMO.file));
      case 'preview':
        await Promise.all([loadPreview(), prepareSettings(resolveSettings(args.settings), resolve(cwd, args.files[0]))]);
        return;
      default:
        return;
    }
  } catch {
    // reported by the run
  }
}

/** Every part a run may need (the batch worker, whose files and settings vary; tests that call `run`). */
export async function prepareEverything(): Promise<void> {
  await Promise.all([
    prepareBuild({ passive: 'any', mirror: ['left'], repair: ['thicken'], loads: 'any', formats: ['stl'] }),
    loadHtml(),
    loadLoadsParser(),
    loadPreview(),
  ]);
}
