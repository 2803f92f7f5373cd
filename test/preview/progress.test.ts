/**
 * The build's progress callback (src/pipeline.ts `onStage`), which the preview page's worker turns into its
 * progress bar (docs/preview.md): one call per stage as it ends, in order, numbered 1 … total, where total is
 * `buildStageCount` — for a plain build, one with repair, one with the demo's load case and one with both —
 * and the names are the stages the report's `timings` list (the same build measured them).
 */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { parseArgs } from '../../cli/args.js';
import { parseLoadsBytes } from '../../src/loads/parse.js';
import { parsePassiveBytes } from '../../src/passive/parse.js';
import { build, buildStageCount, prepareBuild } from '../../src/pipeline.js';
import { resolveSettings } from '../../src/settings.js';

const ROOT = fileURLToPath(new URL('../..', import.meta.url));
const DEMO = 'fixtures/grids/demo-bracket.npy';
const PASSIVE = 'fixtures/passive/demo-bracket.passive.json';
const LOADS = 'fixtures/loads/demo-bracket.loads.json';

describe('build progress (onStage, buildStageCount)', { timeout: 120_000 }, () => {
  const cases: [string, string[]][] = [
    ['plain', []],
    ['repair', ['--min-member', '6', '--repair']],
    ['loads', ['--loads', LOADS]],
    ['loads and repair', ['--loads', LOADS, '--min-member', '6', '--repair']],
  ];
  it.each(cases)('%s: one call per stage, numbered 1 … total, named as in timings', async (_name, extra) => {
    const s = resolveSettings(parseArgs(['build', DEMO, '--cell-size', '2', '--passive', PASSIVE, ...extra]).settings);
    await prepareBuild(s);
    const read = (f: string) => new Uint8Array(readFileSync(`${ROOT}/${f}`));
    const loads = s.loads === null ? null : parseLoadsBytes(read(LOADS), LOADS);
    const calls: [string, number, number][] = [];
    const r = build({ name: DEMO, bytes: read(DEMO) }, s, { passive: parsePassiveBytes(read(PASSIVE), PASSIVE), loads, onStage: (n, d, t) => calls.push([n, d, t]) });
    const total = buildStageCount(s, loads !== null);
    expect(calls.map((c) => c[1])).toEqual(Array.from({ length: total }, (_, k) => k + 1));
    expect(calls.every((c) => c[2] === total)).toBe(true);
    expect([...new Set(calls.map((c) => c[0]))].sort()).toEqual(Object.keys(r.timings).filter((k) => k !== 'contour' && k !== 'smooth').sort());
    expect(calls.filter((c) => c[0] === 'structure').length).toBe(loads === null ? 0 : s.repair.length > 0 ? 3 : 2);
  });
});
