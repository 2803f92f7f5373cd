/**
 * The structure stage inside `build` (docs/structure.md, DESIGN §12): the record a build with loads carries, the
 * report block assembled from it, and the three structural checks on analytic cases.
 */
import { describe, expect, it } from 'vitest';
import { analyse } from '../../src/fe/analyse.js';
import { structureDesign, structureStage, structureStart } from '../../src/fe/stage.js';
import { structureLines } from '../../src/report/structure-text.js';
import { parseLoads } from '../../src/loads/parse.js';
import { build } from '../../src/pipeline.js';
import { resolveSettings, type Settings } from '../../src/settings.js';
import type { LoadsSpec } from '../../src/loads/types.js';
import '../support/build-parts.js';

/** A CSV grid (file row 1 = top) of f(x, y) at the centres of nx × ny cells of 1 mm. */
function csv(nx: number, ny: number, f: (x: number, y: number) => number): Uint8Array {
  const rows: string[] = [];
  for (let j = ny - 1; j >= 0; j--) {
    const row: string[] = [];
    for (let i = 0; i < nx; i++) row.push(f(i + 0.5, j + 0.5).toFixed(4));
    rows.push(row.join(','));
  }
  return new TextEncoder().encode(rows.join('\n') + '\n');
}

function loads(o: object): LoadsSpec {
  return parseLoads(JSON.stringify({ rhoformLoads: 1, material: { E: 70000, nu: 0.3 }, thickness: 5, ...o }), 'case.loads.json');
}

function run(bytes: Uint8Array, spec: LoadsSpec, s: Partial<Settings> = {}) {
  return build({ name: 'grid.csv', bytes }, resolveSettings({ loads: 'case.loads.json', ...s }), { loads: spec });
}

const cantilever = loads({
  supports: [{ fix: 'xy', edge: 'left' }],
  loads: [{ force: [0, -1000], edge: 'right', name: 'tip shear' }],
});

describe('structure stage in build', () => {
  it('a solid rectangle cantilever: the final geometry is the input design, so the compliance change is 0', () => {
    // Analytic: a grid of ρ = 1 thresholds to the domain rectangle, whose exact area fractions are all 1, so
    // both designs have the same element stiffness E and the same compliance. Bound: 1e-9 relative (the two
    // solves differ only in the rounding of the fractions and stop at residual 1e-8; the compliance error is of
    // the order of the residual squared times the condition — far below 1e-9 here).
    const r = run(csv(40, 8, () => 1), cantilever);
    const st = r.report.structure!;
    expect(st).toBeDefined();
    expect(Math.abs(st.complianceChange)).toBeLessThan(1e-9);
    const sc = r.report.checks.find((c) => c.id === 'stiffness-change')!;
    expect(sc.status).toBe('pass');
    expect(Math.abs(sc.measured!)).toBeLessThan(1e-7);
    expect(r.report.checks.find((c) => c.id === 'load-path')!.measured).toBe(0);
    // Timoshenko tip deflection of this cantilever, as a sanity bound on the record (Gere & Timoshenko,
    // Mechanics of Materials): PL³/(3EI) + PL/(κGA), κ = 5/6; at 8 elements through the depth within 3 %.
    const [L, h, t, P, E, nu] = [40, 8, 5, 1000, 70000, 0.3];
    const I = (t * h ** 3) / 12;
    const G = E / (2 * (1 + nu));
    const delta = (P * L ** 3) / (3 * E * I) + (P * L) / ((5 / 6) * G * t * h);
    expect(Math.abs(st.designs.final.maxDisplacement.value / delta - 1)).toBeLessThan(0.03);
  });

  it('the record matches direct analyse() calls on the same grid and outline, and the report block follows DESIGN §12', () => {
    // a grey design (ramp) so that the interpolation matters: ρ = 0.3 … 1 along y
    const bytes = csv(60, 20, (_x, y) => 0.3 + (0.7 * y) / 20);
    const r = run(bytes, cantilever, { level: 0.5 });
    const rec = r.structure!;
    const grid = { nx: 60, ny: 20, hx: 1, hy: 1 };
    const input = analyse(grid, { kind: 'density', values: r.grid.values }, cantilever);
    const final = analyse(grid, { kind: 'geometry', polygons: rec.polygons }, cantilever);
    expect(rec.input.analysis.compliance).toBe(input.compliance);
    expect(rec.final.analysis.compliance).toBe(final.compliance);
    expect(rec.beforeRepair).toBeNull();
    const st = r.report.structure!;
    expect(Object.keys(st)).toEqual(['loadsFile', 'material', 'thickness', 'interpolation', 'elements', 'elementSize', 'coarsened', 'designs', 'complianceChange']);
    expect(st.designs.input.compliance).toBe(input.compliance);
    expect(st.complianceChange).toBeCloseTo(final.compliance / input.compliance - 1, 12);
    expect(st.elements).toEqual([60, 20]);
    expect(st.coarsened).toBe(1);
    expect(st.designs.final.solver.converged).toBe(true);
    expect(st.designs.final.solver.iterations).toBeGreaterThan(0);
    expect(r.report.settings.loads).toBe('case.loads.json');
    expect(r.report.cautions.some((c) => c.includes('not a certified analysis'))).toBe(true);
  });

  it('--fe-max-elements coarsens by an integer factor and the report says so', () => {
    const r = run(csv(60, 20, () => 1), cantilever, { feMaxElements: 400 });
    const st = r.report.structure!;
    // smallest c with ⌈60/c⌉·⌈20/c⌉ ≤ 400: c = 2 gives 30 × 10 = 300
    expect(st.coarsened).toBe(2);
    expect(st.elements).toEqual([30, 10]);
    expect(st.elementSize).toEqual([2, 2]);
  });

  it('without loads there is no structure block, no structural check and no structure setting', () => {
    const r = build({ name: 'grid.csv', bytes: csv(20, 10, () => 1) }, resolveSettings({}));
    expect(r.report.structure).toBeUndefined();
    expect(r.structure).toBeNull();
    expect(r.report.checks.map((c) => c.id)).not.toContain('stiffness-change');
    expect('loads' in r.report.settings).toBe(false);
    expect('feMaxElements' in r.report.settings).toBe(false);
  });
});

describe('stiffness-change', () => {
  // A beam of depth 10 whose input design is a full rectangle (ρ = 1 everywhere, compliance C0) against a
  // final geometry thresholded at level 0.5 from a design whose lower half is grey ρ = 0.45: the outline keeps
  // only the upper half. The input design's lower half is soft (0.45³ E) but not void, so the final geometry
  // is less stiff than the input design: a positive change, far above 10 %.
  const bytes = csv(40, 10, (_x, y) => (y < 5 ? 0.45 : 1));
  const clamped = loads({ supports: [{ fix: 'xy', edge: 'left' }], loads: [{ force: [0, -500], segment: [[40, 5], [40, 10]], name: 'tip' }] });

  it('breaks the default limit of 10 % and warns by default, with the largest displacement as its place', () => {
    const r = run(bytes, clamped, { level: 0.5 });
    const c = r.report.checks.find((x) => x.id === 'stiffness-change')!;
    expect(c.measured!).toBeGreaterThan(10);
    expect(c.status).toBe('warn');
    expect(c.limit).toBe(10);
    expect(c.unit).toBe('%');
    expect(c.locations.length).toBe(1);
    const d = r.report.structure!.designs.final.maxDisplacement;
    expect([c.locations[0].x, c.locations[0].y]).toEqual([d.x, d.y]);
    expect(c.locations[0].fileRow).toBeGreaterThanOrEqual(1);
    expect(c.locations[0].fileCol).toBe(40); // the tip column of the file
  });

  it('--max-stiffness-loss sets the limit; --severity makes it fail or turns it off', () => {
    const measured = run(bytes, clamped, { level: 0.5 }).report.checks.find((x) => x.id === 'stiffness-change')!.measured!;
    const loose = run(bytes, clamped, { level: 0.5, maxStiffnessLoss: Math.ceil(measured) + 1 }).report.checks.find((x) => x.id === 'stiffness-change')!;
    expect(loose.status).toBe('pass');
    expect(loose.locations.length).toBe(0);
    const strict = run(bytes, clamped, { level: 0.5, severity: { 'stiffness-change': 'fail' } });
    expect(strict.report.checks.find((x) => x.id === 'stiffness-change')!.status).toBe('fail');
    expect(strict.report.summary.status).toBe('fail');
    const off = run(bytes, clamped, { level: 0.5, severity: { 'stiffness-change': 'off' } });
    expect(off.report.checks.map((x) => x.id)).not.toContain('stiffness-change');
  });
});

describe('peak-stress', () => {
  // A quarter of a plate with a circular hole (radius a = 10 mm at the origin, half-width 50, half-length 150,
  // 1 mm cells; symmetry supports) under remote tension σ = 40 MPa. Kirsch (G. Kirsch, Z. VDI 42:797–807,
  // 1898): the stress at the hole edge across the load is 3σ; with Heywood's finite-width factor at d/W = 0.2
  // (Pilkey & Pilkey, Peterson's Stress Concentration Factors, 3rd ed., 2008, from memory) 3.14σ = 126 MPa.
  // The element-centre sample reads about 14 % low at a/h = 10 (test/fe/kirsch.test.ts): about 108 MPa.
  // An allowable of 2σ = 80 MPa lies below it: the check must fail, with its worst finding at the hole edge
  // on the y axis (x ≈ 0, r ≈ a + h/2).
  const a = 10;
  const sigma = 40;
  const bytes = csv(150, 50, (x, y) => Math.max(0, Math.min(1, 0.5 + (Math.hypot(x, y) - a) / 2)));
  const plate = loads({
    supports: [
      { fix: 'x', edge: 'left', name: 'symmetry, x' },
      { fix: 'y', edge: 'bottom', name: 'symmetry, y' },
    ],
    loads: [{ force: [sigma * 50 * 5, 0], edge: 'right', name: 'remote tension' }],
  });

  it('fails when the allowable is below the Kirsch peak, with a finding at the hole edge', () => {
    const r = run(bytes, plate, { level: 0.5, allowableStress: 2 * sigma });
    const c = r.report.checks.find((x) => x.id === 'peak-stress')!;
    expect(c.status).toBe('fail');
    expect(c.unit).toBe('MPa');
    // within the Kirsch/Heywood band of test/fe/kirsch.test.ts: (7/6 + 1/2)·h/a below 3.14σ, and not above it
    expect(c.measured!).toBeGreaterThan(3.14 * sigma * (1 - (7 / 6 + 0.5) / a));
    expect(c.measured!).toBeLessThan(3.14 * sigma * 1.02);
    const worst = c.locations[0];
    expect(Math.hypot(worst.x, worst.y)).toBeGreaterThanOrEqual(a - 0.5);
    expect(Math.hypot(worst.x, worst.y)).toBeLessThanOrEqual(a + 2);
    expect(worst.x).toBeLessThan(0.3 * a);
    expect(worst.measured).toBe(c.measured);
    // file row/col through the reader's locate: row 1 is the top (y = 50), so y ≈ 10.5 is row 40
    expect(worst.fileCol).toBe(Math.floor(worst.x) + 1);
    expect(worst.fileRow).toBe(50 - Math.floor(worst.y));
  });

  it('passes when the allowable is above the peak, and is absent without --allowable-stress', () => {
    const hi = run(bytes, plate, { level: 0.5, allowableStress: 4 * sigma }).report.checks.find((x) => x.id === 'peak-stress')!;
    expect(hi.status).toBe('pass');
    expect(hi.locations.length).toBe(0);
    const none = run(bytes, plate, { level: 0.5 });
    expect(none.report.checks.map((x) => x.id)).not.toContain('peak-stress');
  });
});

describe('load-path', () => {
  it('a bar cut in two: the free half is a piece held by no support', () => {
    // solid except a void gap 4 cells wide in the middle: the right half carries the load and touches no support
    const bytes = csv(40, 8, (x) => (x > 18 && x < 22 ? 0 : 1));
    const r = run(bytes, cantilever, { level: 0.5 });
    const c = r.report.checks.find((x) => x.id === 'load-path')!;
    expect(c.status).toBe('fail');
    expect(c.measured).toBe(1);
    expect(c.locations[0].x).toBeGreaterThan(22);
  });

  it('a load placed in a hole sits in void', () => {
    const bytes = csv(40, 20, (x, y) => (Math.hypot(x - 30, y - 10) < 5 ? 0 : 1));
    const spec = loads({ supports: [{ fix: 'xy', edge: 'left' }], loads: [{ force: [0, -100], point: [30, 10], name: 'pin' }] });
    const r = run(bytes, spec, { level: 0.5 });
    const c = r.report.checks.find((x) => x.id === 'load-path')!;
    expect(c.status).toBe('fail');
    expect(c.locations.map((l) => [l.x, l.y])).toEqual([[30, 10]]);
  });
});

describe('solver non-convergence', () => {
  it('a solve stopped above its tolerance is a warning and marked in the text block, never a silent number', () => {
    const r = run(csv(40, 8, () => 1), cantilever);
    const grid = { grid: r.grid };
    const start = structureStart(grid, cantilever, { thickness: null, feMaxElements: 500_000 });
    const rect = { polygons: [{ outer: [[0, 0], [40, 0], [40, 8], [0, 8]] as [number, number][], holes: [] }] };
    const capped = structureDesign({ ...start, options: { ...start.options, maxIterations: 1, tol: 1e-15 } }, rect);
    expect(capped.analysis.solver.converged).toBe(false);
    const rec = structureStage(start, null, capped, rect);
    expect(rec.warnings).toHaveLength(1);
    expect(rec.warnings[0]).toMatch(/final geometry stopped after 1 iteration at relative residual .* approximate/);
    const text = structureLines({ ...r.report, structure: { ...r.report.structure!, designs: { ...r.report.structure!.designs, final: { ...r.report.structure!.designs.final, solver: { ...capped.analysis.solver } } } } });
    expect(text.join('\n')).toMatch(/NOT CONVERGED/);
  });
});
