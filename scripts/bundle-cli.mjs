/**
 * Bundles the command line with esbuild (docs/architecture.md, "The binary"): `rhoform` starts from a handful of
 * files instead of ~150 ES modules, whose resolution and loading cost ≈ 0.2 s of every run (docs/performance.md,
 * "Start-up: the CLI as one bundle"). Run by `npm run build` after tsc, which it follows: the library
 * (dist/src/, the package's exports) stays tsc's output; only the binary changes form.
 *
 * Layout, in `<dist>` (default dist/):
 *   cli/main.js          the binary (package.json bin, `npm start`): cli/main.ts, in place of tsc's file
 *   bin/*.js             the code it loads: one chunk per lazily imported part (cli/prepare.ts, prepareBuild's
 *                        readers, repairs, re-check and figures, batch) and chunks they share
 *   bin/worker.js        the lanes' thread (src/parallel/worker.ts)
 *   bin/batch/worker.js  the batch worker thread (cli/batch/worker.ts)
 *   bin/lane-<name>.js   one per module that hands tasks to the lanes (see LANE_MODULES)
 * Third-party packages are bundled too (measured: fewer files to load; docs/performance.md), except the two
 * emscripten outputs of js-angusj-clipper — its WebAssembly build, whose binary it embeds, and its asm.js fallback
 * — which stay in node_modules and are required from there when the boolean engine loads (see clipperNative).
 *
 * Modules that use `import.meta` must keep working from the bundle; each is listed below, and the build fails on
 * one that is not:
 * - RELATIVE: they find files relative to themselves (the worker scripts, the package root), with paths that hold
 *   as long as their code sits directly in dist/bin/ (as deep below the package root as dist/cli/), or for
 *   cli/main.ts in dist/cli/main.js. Checked on the output after each build.
 * - LANE_MODULES: they name themselves to the lanes (src/parallel/lanes.ts) by `import.meta.url`, and a lane's
 *   thread imports that URL and calls an export by name. In the bundle their code sits in a shared chunk whose
 *   exports are whatever the other chunks need, under names of esbuild's choosing; so each becomes an entry of
 *   its own (an entry keeps its exports and their names) and `import.meta.url` in it the URL of that entry.
 */
import { build } from 'esbuild';
import { mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { basename, dirname, join, relative, resolve, sep } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = resolve(dirname(fileURLToPath(import.meta.url)), '..');

export const RELATIVE = ['cli/main.ts', 'cli/batch.ts', 'cli/package-root.ts', 'src/parallel/node.ts'];
export const LANE_MODULES = ['src/morph/edt.ts', 'src/morph/medial.ts', 'src/morph/nearest.ts', 'src/report/png.ts'];

/** The entry of a lane module, relative to dist/bin/. */
export const laneEntry = (m) => `lane-${basename(m, '.ts')}.js`;

const posix = (p) => p.split(sep).join('/');

/** The esbuild plugin that places the modules using `import.meta` (see the file's comment). */
const moduleUrlPlugin = {
  name: 'rhoform-module-urls',
  setup(b) {
    b.onLoad({ filter: /\.ts$/ }, (a) => {
      const rel = posix(relative(root, a.path));
      const text = readFileSync(a.path, 'utf8');
      if (!text.includes('import.meta')) return undefined;
      if (LANE_MODULES.includes(rel)) {
        const url = `new URL(${JSON.stringify(`./${laneEntry(rel)}`)}, import.meta.url).href`;
        return { contents: text.replaceAll('import.meta.url', url), loader: 'ts' };
      }
      if (RELATIVE.includes(rel)) return undefined;
      return {
        errors: [{ text: `${rel} uses import.meta; scripts/bundle-cli.mjs must be told how it works from the bundle (RELATIVE or LANE_MODULES)` }],
      };
    });
  },
};

/**
 * js-angusj-clipper's wrapper (CommonJS) requires its engine, `./wasm/clipper-wasm` or `./wasm/clipper`, only when
 * the engine is loaded; both stay the package's own files (0.2 and 0.35 MB that a build without booleans never
 * reads), required at run time by their path in the package.
 */
const clipperNative = {
  name: 'rhoform-clipper-native',
  setup(b) {
    b.onResolve({ filter: /^\.\/wasm\/clipper(-wasm)?$/ }, (a) =>
      a.importer.includes(`${sep}js-angusj-clipper${sep}`) ? { path: `js-angusj-clipper/universal/wasm/${basename(a.path)}.js`, external: true } : undefined,
    );
  },
};

/**
 * An ES module has no `require`; esbuild's helper for a CommonJS `require` of an external module (clipperNative)
 * looks for one in the scope of the file that defines the helper. That file gets one, made by createRequire.
 */
const REQUIRE_HELPER = 'Dynamic require of "';
// on the file's first line, so that the source map's lines still hold
const REQUIRE_LINE = 'import { createRequire as __rhoformCreateRequire } from "node:module"; const require = __rhoformCreateRequire(import.meta.url); ';

function withRequire(text) {
  if (!text.includes(REQUIRE_HELPER)) return text;
  const hashbang = text.startsWith('#!') ? text.slice(0, text.indexOf('\n') + 1) : '';
  return hashbang + REQUIRE_LINE + text.slice(hashbang.length);
}

/** Fails when a module of RELATIVE or LANE_MODULES landed where its paths do not hold. */
function checkPlacement(metafile, outRoot) {
  const where = new Map();
  for (const [out, info] of Object.entries(metafile.outputs)) {
    for (const input of Object.keys(info.inputs)) (where.get(input) ?? where.set(input, []).get(input)).push(posix(relative(outRoot, resolve(root, out))));
  }
  const wrong = [];
  for (const m of [...RELATIVE, ...LANE_MODULES]) {
    const outs = where.get(m) ?? [];
    const ok = m === 'cli/main.ts' ? (o) => o === 'cli/main.js' : (o) => /^bin\/[^/]+\.js$/.test(o);
    if (outs.length === 0 || !outs.every(ok)) wrong.push(`${m} → ${outs.join(', ') || 'nowhere'}`);
  }
  if (wrong.length > 0) throw new Error(`the CLI bundle placed modules where their paths do not hold: ${wrong.join('; ')}`);
}

/** Bundles the CLI into `dist` (default dist/), replacing `<dist>/bin/` and `<dist>/cli/main.js`; returns the files written. */
export async function bundleCli(dist = join(root, 'dist')) {
  const result = await build({
    absWorkingDir: root,
    entryPoints: [
      { in: 'cli/main.ts', out: 'cli/main' },
      { in: 'src/parallel/worker.ts', out: 'bin/worker' },
      { in: 'cli/batch/worker.ts', out: 'bin/batch/worker' },
      ...LANE_MODULES.map((m) => ({ in: m, out: `bin/${laneEntry(m).slice(0, -3)}` })),
    ],
    outdir: dist,
    chunkNames: 'bin/[name]-[hash]',
    bundle: true,
    splitting: true,
    format: 'esm',
    platform: 'node',
    target: 'node20',
    charset: 'utf8',
    legalComments: 'none',
    // for stack traces in TypeScript terms: node --enable-source-maps dist/cli/main.js …
    sourcemap: 'linked',
    sourcesContent: false,
    metafile: true,
    write: false,
    logLevel: 'warning',
    plugins: [moduleUrlPlugin, clipperNative],
  });
  checkPlacement(result.metafile, dist);
  const helpers = result.outputFiles.filter((f) => f.path.endsWith('.js') && f.text.includes(REQUIRE_HELPER)).length;
  if (helpers > 1) throw new Error(`expected esbuild's require helper in at most one file of the CLI bundle, found it in ${helpers}`);
  rmSync(join(dist, 'bin'), { recursive: true, force: true });
  for (const f of result.outputFiles) {
    mkdirSync(dirname(f.path), { recursive: true });
    writeFileSync(f.path, f.path.endsWith('.js') ? withRequire(f.text) : f.contents);
  }
  return result.outputFiles.map((f) => f.path);
}

if (process.argv[1] && resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  const t0 = performance.now();
  const files = await bundleCli(process.argv[2] ? resolve(process.argv[2]) : undefined);
  process.stderr.write(`bundled the CLI into ${files.length} files in ${Math.round(performance.now() - t0)} ms\n`);
}
