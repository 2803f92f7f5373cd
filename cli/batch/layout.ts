/**
 * Where each file of a batch writes its outputs (docs/scale.md, "Output folders").
 *
 * Outputs are named after the input's stem (x.npy → x.dxf, x.svg, x.report.json, x.report.html), so two
 * inputs with the same stem would overwrite each other. The rule, decided once over the whole sorted list
 * (before sharding, so every shard lays out alike):
 *
 * 1. No two inputs share a stem (compared without letter case, as some file systems do): every output goes
 *    straight into the out-dir.
 * 2. Otherwise every input keeps its folder relative to the deepest folder that holds all inputs:
 *    runs/a/x.npy and runs/b/x.npy → <out-dir>/a/x.dxf and <out-dir>/b/x.dxf.
 * 3. Inputs that still collide — same folder, same stem, different extension (x.csv and x.npy) — are each
 *    recorded as an error (E_USAGE) and not built: no choice between them is made silently.
 */
import { basename, dirname, extname, join, relative, sep } from 'node:path';
import type { BatchInput } from './collect.js';

export interface PlacedInput extends BatchInput {
  /** Absolute folder that receives this file's outputs. */
  readonly outDir: string;
}

function stemKey(path: string): string {
  const b = basename(path);
  const e = extname(b);
  return (e ? b.slice(0, -e.length) : b).toLowerCase();
}

/** The deepest folder containing every path in `dirs` (absolute folders). */
export function commonFolder(dirs: readonly string[]): string {
  if (dirs.length === 0) return sep;
  let parts = dirs[0].split(sep);
  for (const d of dirs.slice(1)) {
    const q = d.split(sep);
    let k = 0;
    while (k < parts.length && k < q.length && parts[k] === q[k]) k++;
    parts = parts.slice(0, k);
  }
  const joined = parts.join(sep);
  return joined === '' ? sep : joined;
}

/** Place every input (sorted list) under `outDir` (absolute) by the rule above. */
export function placeOutputs(inputs: readonly BatchInput[], outDir: string): { placed: PlacedInput[]; mirrored: boolean } {
  const good = inputs.filter((f) => f.error === null);
  const stems = new Set<string>();
  let clash = false;
  for (const f of good) {
    const k = stemKey(f.path);
    if (stems.has(k)) clash = true;
    stems.add(k);
  }
  if (!clash) return { placed: inputs.map((f) => ({ ...f, outDir })), mirrored: false };

  const base = commonFolder(good.map((f) => dirname(f.path)));
  const target = (f: BatchInput) => join(outDir, relative(base, dirname(f.path)));
  const groups = new Map<string, BatchInput[]>();
  for (const f of good) {
    const key = `${target(f).toLowerCase()}${sep}${stemKey(f.path)}`;
    const g = groups.get(key);
    if (g) g.push(f);
    else groups.set(key, [f]);
  }
  const clashing = new Map<BatchInput, BatchInput[]>();
  for (const g of groups.values()) if (g.length > 1) for (const f of g) clashing.set(f, g);

  const placed = inputs.map((f): PlacedInput => {
    if (f.error !== null) return { ...f, outDir };
    const g = clashing.get(f);
    if (!g) return { ...f, outDir: target(f) };
    const others = g.filter((o) => o !== f).map((o) => o.file);
    return {
      ...f,
      outDir: target(f),
      error: {
        code: 'E_USAGE',
        message: `${f.file}: expected one input per name in a folder, found ${others.join(', ')} beside it (their outputs would have the same names); rename one or run them in separate batches`,
      },
    };
  });
  return { placed, mirrored: true };
}
