/**
 * The HTML stress figure (`--loads`): present with a structure record, absent without; its colour bar spans
 * 0 … the peak stress in MPa; one arrow per load and a support mark per (thinned) node; the deformed outline
 * states its magnification. The deformation is the bilinear interpolation of the nodal displacements: a uniform
 * bar in tension stretches its far end by FL/(EA) × the scale (Gere & Timoshenko, Mechanics of Materials).
 */
import { describe, expect, it } from 'vitest';
import { parseLoads } from '../../src/loads/parse.js';
import { build } from '../../src/pipeline.js';
import { formatHtml } from '../../src/report/html.js';
import { deformationScale, stressColor } from '../../src/report/stress-figure.js';
import { resolveSettings } from '../../src/settings.js';
import '../support/build-parts.js';

const bytes = new TextEncoder().encode(Array.from({ length: 6 }, () => Array(30).fill('1').join(',')).join('\n') + '\n');
const spec = parseLoads(
  JSON.stringify({
    rhoformLoads: 1,
    material: { E: 70000, nu: 0.3 },
    thickness: 2,
    supports: [
      { fix: 'x', edge: 'left', name: 'wall' },
      { fix: 'y', point: [0, 0] },
    ],
    loads: [{ force: [1200, 0], edge: 'right', name: 'pull' }],
  }),
  'bar.loads.json',
);

describe('stress figure', () => {
  const r = build({ name: 'bar.csv', bytes }, resolveSettings({ loads: 'bar.loads.json', allowableStress: 80 }), { loads: spec });
  const html = formatHtml(r.report, r.pictures());

  it('is drawn with a colour bar in MPa up to the peak, the allowable marked, one arrow per load', () => {
    expect(html).toContain('id="fig-stress"');
    expect(html).toContain('aria-label="stress colour scale in MPa"');
    // uniform stress F/A = 1200 / (6 · 2) = 100 MPa (Gere & Timoshenko): the peak and the bar's end
    const peak = r.report.structure!.designs.final.peakStress!.value;
    expect(peak).toBeCloseTo(100, 6);
    expect(html).toMatch(/von Mises stress, MPa \(0 … 100,/);
    expect(html).toContain('line: allowable 80 MPa');
    expect(r.report.checks.find((c) => c.id === 'peak-stress')!.status).toBe('fail');
    expect((html.match(/<g class="loads">/g) ?? []).length).toBe(1);
    expect(html).toMatch(/L1 1200 N/);
    expect(html).toMatch(/displacements magnified × \d+/);
  });

  it('is absent without loads', () => {
    const plain = build({ name: 'bar.csv', bytes }, resolveSettings({}));
    expect(formatHtml(plain.report, plain.pictures())).not.toContain('fig-stress');
  });

  it('scales the deformation to about 4 % of the larger side with a 1-2-5 number; the colour scale runs blue to red', () => {
    // end displacement FL/(EA) = 1200·30 / (70000 · 12) = 0.042857 mm along x and the Poisson contraction
    // ν·σ/E·h = 0.3 · 100/70000 · 6 = 0.002571 mm across at the free corner; 4 % of 30 mm = 1.2 mm → × 28 → 20
    const d = r.report.structure!.designs.final.maxDisplacement.value;
    expect(d).toBeCloseTo(Math.hypot((1200 * 30) / (70000 * 12), (0.3 * 100 * 6) / 70000), 9);
    expect(deformationScale(d, 30)).toBe(20);
    expect(stressColor(0)[2]).toBeGreaterThan(stressColor(0)[0]);
    expect(stressColor(1)[0]).toBeGreaterThan(stressColor(1)[2]);
  });
});
