/**
 * The import rule of docs/architecture.md, read from the sources with the TypeScript compiler's own import
 * scanner (`ts.preProcessFile`, static, type-only and dynamic imports alike): imports point one way — shared
 * types, then geom/, then the stages, then the report, then the pipeline, then cli/ — and no module imports
 * itself through others. A new folder of src/ must be given its layer here (and in docs/architecture.md).
 */
import { readdirSync, readFileSync } from 'node:fs';
import { dirname, join, relative, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import ts from 'typescript';
import { describe, expect, it } from 'vitest';

const root = resolve(dirname(fileURLToPath(import.meta.url)), '../..');

/** The layers, lowest first: a module may import from its own layer or a lower one, never a higher one. */
export const LAYERS: readonly (readonly string[])[] = [
  ['src/types.ts', 'src/errors.ts', 'src/version.ts', 'src/settings.ts'],
  ['src/parallel'],
  ['src/geom'],
  ['src/read', 'src/field', 'src/contour', 'src/smooth', 'src/threshold', 'src/passive', 'src/morph', 'src/check', 'src/repair', 'src/write', 'src/fe', 'src/loads', 'src/json', 'src/input.ts'],
  ['src/report'],
  ['src/pipeline.ts', 'src/index.ts', 'src/preview'],
  ['cli'],
];

/** The layer of a module (path relative to the package root), or -1 when no layer names it. */
export function layerOf(file: string): number {
  return LAYERS.findIndex((names) => names.some((n) => file === n || file.startsWith(`${n}/`)));
}

function sources(dir: string): string[] {
  const out: string[] = [];
  for (const e of readdirSync(join(root, dir), { withFileTypes: true })) {
    const p = `${dir}/${e.name}`;
    if (e.isDirectory()) out.push(...sources(p));
    else if (e.name.endsWith('.ts') && !e.name.endsWith('.d.ts')) out.push(p);
  }
  return out;
}

/** Relative imports of one module, as package-relative .ts paths. */
export function importsOf(file: string, text: string): string[] {
  const info = ts.preProcessFile(text, true, true);
  return info.importedFiles
    .map((f) => f.fileName)
    .filter((n) => n.startsWith('.'))
    .map((n) => relative(root, resolve(root, dirname(file), n)).replace(/\.js$/, '.ts'));
}

/** Every cycle's members, each cycle once (Tarjan's strongly connected components with more than one module). */
export function cycles(graph: ReadonlyMap<string, readonly string[]>): string[][] {
  let index = 0;
  const idx = new Map<string, number>();
  const low = new Map<string, number>();
  const stack: string[] = [];
  const on = new Set<string>();
  const out: string[][] = [];
  const visit = (v: string): void => {
    idx.set(v, index);
    low.set(v, index++);
    stack.push(v);
    on.add(v);
    for (const w of graph.get(v) ?? []) {
      if (!graph.has(w)) continue;
      if (!idx.has(w)) {
        visit(w);
        low.set(v, Math.min(low.get(v)!, low.get(w)!));
      } else if (on.has(w)) low.set(v, Math.min(low.get(v)!, idx.get(w)!));
    }
    if (low.get(v) === idx.get(v)) {
      const comp: string[] = [];
      let w: string;
      do {
        w = stack.pop()!;
        on.delete(w);
        comp.push(w);
      } while (w !== v);
      if (comp.length > 1 || (graph.get(v) ?? []).includes(v)) out.push(comp.sort());
    }
  };
  for (const v of graph.keys()) if (!idx.has(v)) visit(v);
  return out;
}

const files = [...sources('src'), ...sources('cli')];
const graph = new Map(files.map((f) => [f, importsOf(f, readFileSync(join(root, f), 'utf8'))] as const));

describe('import graph of src/ and cli/ (docs/architecture.md)', () => {
  it('reads a realistic graph (the scanner finds the imports it must)', () => {
    // Guards the test itself: a scanner that found nothing would pass every rule below.
    expect(graph.get('src/pipeline.ts')).toContain('src/threshold/stage.ts');
    expect(graph.get('cli/start.ts')).toContain('cli/batch.ts'); // a dynamic import
    expect(files.length).toBeGreaterThan(100);
  });

  it('gives every module a layer', () => {
    expect(files.filter((f) => layerOf(f) < 0)).toEqual([]);
  });

  it('has no import from a lower layer to a higher one', () => {
    const upward: string[] = [];
    for (const [from, tos] of graph) {
      for (const to of tos) if (layerOf(to) > layerOf(from)) upward.push(`${from} → ${to}`);
    }
    expect(upward).toEqual([]);
  });

  it('has no import cycle', () => {
    expect(cycles(graph)).toEqual([]);
  });

  it('finds a cycle and an upward import when there is one (the rules can fail)', () => {
    expect(cycles(new Map([['a', ['b']], ['b', ['c']], ['c', ['a']], ['d', ['a']]]))).toEqual([['a', 'b', 'c']]);
    expect(layerOf('src/geom/area.ts')).toBeLessThan(layerOf('src/check/run.ts'));
    expect(layerOf('cli/run.ts')).toBe(LAYERS.length - 1);
  });
});
