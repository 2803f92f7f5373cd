/**
 * Bundles the library for the preview page (docs/preview.md) with esbuild: the worker that runs `build`
 * (web/worker.ts → dist/web/preview-worker.js) and the page script (web/page.ts → dist/web/preview-page.js),
 * each one self-contained IIFE that `rhoform preview` inlines into the page. Run by `npm run build`.
 *
 * The library is pure TypeScript; the Node built-ins it uses get browser stand-ins that do only what it needs
 * (web/shims/): node:crypto's sha256 (the report's input.sha256), node:zlib's inflateSync (MAT and VTI readers) and
 * Buffer's base64 (PNG data URLs).
 * js-angusj-clipper is taken in its web build (WebAssembly embedded as a data: URL); its asm.js fallback is
 * left out (every browser the page targets runs WebAssembly), which halves its size.
 */
import { build } from 'esbuild';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = resolve(dirname(fileURLToPath(import.meta.url)), '..');

/** The esbuild plugin that points the library's Node-only imports at their browser versions. */
const browserPlugin = {
  name: 'rhoform-browser',
  setup(b) {
    b.onResolve({ filter: /^node:crypto$/ }, () => ({ path: join(root, 'web/shims/crypto.ts') }));
    b.onResolve({ filter: /^node:zlib$/ }, () => ({ path: join(root, 'web/shims/zlib.ts') }));
    b.onResolve({ filter: /^js-angusj-clipper$/ }, () => ({ path: join(root, 'node_modules/js-angusj-clipper/web/index.js') }));
    b.onResolve({ filter: /^\.\/wasm\/clipper$/ }, (a) =>
      a.importer.includes('js-angusj-clipper') ? { path: 'asmjs-fallback', namespace: 'rhoform-empty' } : undefined,
    );
    b.onLoad({ filter: /.*/, namespace: 'rhoform-empty' }, () => ({
      contents: 'module.exports = function () { throw new Error("the asm.js fallback of the boolean engine is not bundled"); };',
      loader: 'js',
    }));
    b.onResolve({ filter: /^node:/ }, (a) => ({ errors: [{ text: `${a.path} is not available in the browser bundle (imported by ${a.importer})` }] }));
  },
};

/** Builds both bundles into `outdir` (default dist/web); returns their paths. */
export async function bundle(outdir = join(root, 'dist/web')) {
  const common = {
    bundle: true,
    platform: 'browser',
    format: 'iife',
    target: ['chrome110', 'firefox115'],
    minify: true,
    legalComments: 'eof',
    charset: 'utf8',
    logLevel: 'warning',
    plugins: [browserPlugin],
    inject: [join(root, 'web/shims/buffer.ts')],
    // src/parallel names a pass's module by its URL for worker threads; the page has no lanes, so the URL is unused
    define: { 'import.meta.url': '""' },
    absWorkingDir: root,
  };
  const worker = join(outdir, 'preview-worker.js');
  const page = join(outdir, 'preview-page.js');
  await build({ ...common, entryPoints: [join(root, 'web/worker.ts')], outfile: worker });
  await build({ ...common, entryPoints: [join(root, 'web/page.ts')], outfile: page });
  return { worker, page };
}

if (process.argv[1] && resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  const t0 = performance.now();
  const out = await bundle(process.argv[2] ? resolve(process.argv[2]) : undefined);
  process.stderr.write(`bundled ${out.worker} and ${out.page} in ${Math.round(performance.now() - t0)} ms\n`);
}
