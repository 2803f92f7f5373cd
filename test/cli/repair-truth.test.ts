/**
 * Reports that tell the truth after `--repair` (docs/checks/volume-fraction.md): the demo bracket's repairs add
 * material, so the part written holds more than the target volume. The re-check of `volume-fraction` measures
 * that part and warns (not fails), the text headline and the HTML header show the final fraction beside the
 * achieved one; before repair nothing changes.
 *
 * Sources: the measured value is the definition |final − target| / target (DESIGN §4, docs/checks/volume-fraction.md);
 * the final area it uses is the report's geometry area, which test/write/cad-files.test.ts checks against the DXF
 * read back by an independent parser (dxf-parser) to 1e-6.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import type { Report } from '../../src/types.js';
import '../support/boolean-engine.js';
import { cli, tempDir } from './harness.js';

const pct = (f: number, d: number) => `${(100 * f).toFixed(d)} %`;

describe('after --repair the report measures the part written', () => {
  it('volume-fraction warns with the final fraction; the headline and the header tiles show it', () => {
    const dir = tempDir();
    const r = cli(['demo', '--out-dir', 'd'], dir);
    expect(r.code).toBe(0);
    const report = JSON.parse(readFileSync(join(dir, 'd/demo-bracket.report.json'), 'utf8')) as Report;
    const t = report.threshold;
    const final = report.geometry.finalFraction;
    // the demo's repairs add about 1 100 mm² to a 11 500 mm² part: far beyond the 0.1 % tolerance
    expect(Math.abs(final - t.targetFraction) / t.targetFraction).toBeGreaterThan(0.05);

    const before = report.checksBeforeRepair!.find((c) => c.id === 'volume-fraction')!;
    expect(before.status).toBe('pass');
    expect(before.measured).toBeCloseTo(Math.abs(t.achievedFraction - t.targetFraction) / t.targetFraction, 12);

    const after = report.checks.find((c) => c.id === 'volume-fraction')!;
    expect(after.status).toBe('warn');
    // definition: |final − target| / target, final = the written part's area / domain area (report geometry)
    expect(after.measured!).toBeCloseTo(Math.abs(final - t.targetFraction) / t.targetFraction, 9);
    expect(after.message).toContain(`holds ${pct(final, 2)} against the target ${pct(t.targetFraction, 2)}`);
    expect(after.message).toMatch(/repair moved it/);
    expect(report.summary.fail).toBe(0);

    // the text headline: the final fraction beside the achieved one
    expect(r.stdout.replace(/\s+/g, ' ')).toContain(`achieved ${pct(t.achievedFraction, 3)}, final ${pct(final, 3)} (after repair)`);
    // the HTML header tiles
    const html = readFileSync(join(dir, 'd/demo-bracket.report.html'), 'utf8');
    expect(html).toContain(`<dt>achieved</dt><dd>${pct(t.achievedFraction, 2)}</dd>`);
    expect(html).toContain(`<dt>final (after repair)</dt><dd>${pct(final, 2)}</dd>`);
  });
});
