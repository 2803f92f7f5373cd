import { describe, it, expect } from 'vitest';
import { RhoformError } from '../../src/errors.js';
import {
  MILLING_TOOL_RADIUS, PROCESS_IDS, WATERJET_KERF, isProcessId, needsThickness, processLimits, processTitle,
  type ProcessId,
} from '../../src/check/process.js';

const value = (id: ProcessId, t: number | null = null, r: number | null = null) => {
  const l = processLimits(id, t, r);
  return { minMember: l.minMember?.value ?? null, minHole: l.minHole?.value ?? null, toolRadius: l.toolRadius?.value ?? null };
};

describe('process presets against the published rules of thumb', () => {
  it('laser-cut: web ≥ t, hole Ø ≥ t with a 1 mm floor', () => {
    // docs/references.md §8.2 (fabricator design guide): web/bridge between cuts ≥ t; hole Ø ≥ t (min 1 mm)
    expect(value('laser-cut', 3)).toEqual({ minMember: 3, minHole: 3, toolRadius: null });
    expect(value('laser-cut', 0.5)).toEqual({ minMember: 0.5, minHole: 1, toolRadius: null }); // the 1 mm floor
  });

  it('waterjet-cut: hole ≥ t, web ≥ t, never below the kerf; inner radius = kerf / 2', () => {
    // docs/references.md §8.2: kerf ≈ 0.03 in = 0.762 mm (fabricator design guide); hole ≥ t, web ≥ t [common practice, unconfirmed]
    expect(WATERJET_KERF).toBeCloseTo(0.762, 12); // 1 in = 25.4 mm exactly (NIST SP 811)
    const w = value('waterjet-cut', 6);
    expect([w.minMember, w.minHole]).toEqual([6, 6]);
    expect(w.toolRadius).toBeCloseTo(0.381, 12);
    // [D] a jet of kerf k cannot cut a hole narrower than k, nor an inner corner tighter than k/2
    expect(value('waterjet-cut', 0.5).minHole).toBeCloseTo(0.762, 12);
    expect(value('waterjet-cut', 0.5).toolRadius).toBeCloseTo(0.381, 12);
  });

  it('milling: walls 0.8 mm (metal), tool radius common practice, min hole = 2 × tool radius', () => {
    // docs/references.md §8.4: walls ≥ 0.8 mm metal (machining-shop guides); the tool radius is common practice, no source
    // [D] docs/references.md §8.4: the hole check with r = R_tool flags slots narrower than 2·R_tool
    expect(MILLING_TOOL_RADIUS).toBe(1.5);
    expect(value('milling')).toEqual({ minMember: 0.8, minHole: 3, toolRadius: 1.5 });
    expect(processLimits('milling', null).toolRadius!.source).toMatch(/common practice, no source/);
    // the derived hole limit follows an explicit --tool-radius
    expect(value('milling', null, 2.5).minHole).toBe(5);
  });

  it('material extrusion: wall 0.8 mm (2 × 0.4 nozzle), hole Ø 2.0 mm', () => {
    // docs/references.md §8.1, first MEX row (fabricator design guides)
    expect(value('material-extrusion')).toEqual({ minMember: 0.8, minHole: 2.0, toolRadius: null });
  });

  it('vat photopolymerization: wall 0.5 mm, hole Ø 0.5 mm', () => {
    // docs/references.md §8.1, first VPP row (fabricator design guides)
    expect(value('vat-photopolymerization')).toEqual({ minMember: 0.5, minHole: 0.5, toolRadius: null });
  });

  it('powder bed fusion, polymer: wall 0.8 mm, hole Ø 1.5 mm (upper ends of the ranges)', () => {
    // docs/references.md §8.1 PBF-LB/P row: wall 0.7–0.8, hole Ø 1.0–1.5 (fabricator design guides)
    expect(value('pbf-polymer')).toEqual({ minMember: 0.8, minHole: 1.5, toolRadius: null });
  });

  it('powder bed fusion, metal: wall 0.5 mm, hole Ø 1.0 mm', () => {
    // docs/references.md §8.1 PBF-LB/M row: wall 0.4 supported / 1.0 unsupported; 0.5; hole Ø 0.5–1.0 (fabricator design guides)
    expect(value('pbf-metal')).toEqual({ minMember: 0.5, minHole: 1.0, toolRadius: null });
  });
});

describe('thickness', () => {
  it('the sheet presets scale linearly with t', () => {
    // docs/references.md §8.2: the laser and waterjet rules are multiples of t
    for (const id of ['laser-cut', 'waterjet-cut'] as const) {
      const a = value(id, 2), b = value(id, 8);
      expect(b.minMember).toBeCloseTo(4 * a.minMember!, 12);
      expect(b.minHole).toBeCloseTo(4 * a.minHole!, 12);
    }
  });

  it('a sheet process without a thickness is a usage error naming --thickness', () => {
    for (const id of PROCESS_IDS.filter(needsThickness)) {
      let err: unknown;
      try { processLimits(id, null); } catch (e) { err = e; }
      expect(err).toBeInstanceOf(RhoformError);
      expect((err as RhoformError).code).toBe('E_USAGE');
      expect((err as RhoformError).message).toMatch(/--thickness/);
    }
    expect(PROCESS_IDS.filter(needsThickness)).toEqual(['laser-cut', 'waterjet-cut']);
  });

  it('a bad thickness is a usage error naming --thickness; NaN cannot slip through', () => {
    for (const t of [0, -1, NaN, Infinity]) expect(() => processLimits('laser-cut', t)).toThrow(/--thickness/);
    expect(() => processLimits('milling', null, 0)).toThrow(/--tool-radius/);
  });

  it('non-sheet processes need no thickness and ignore one', () => {
    for (const id of PROCESS_IDS.filter((p) => !needsThickness(p))) {
      expect(processLimits(id, null)).toEqual(processLimits(id, 7));
    }
  });
});

describe('every preset', () => {
  it('has a title, positive values and a non-empty source for each value it sets', () => {
    expect(PROCESS_IDS.length).toBe(7);
    for (const id of PROCESS_IDS) {
      expect(isProcessId(id)).toBe(true);
      expect(processTitle(id).length).toBeGreaterThan(0);
      const l = processLimits(id, 2);
      const set = [l.minMember, l.minHole, l.toolRadius].filter((v) => v !== null);
      expect(set.length).toBeGreaterThan(0);
      for (const v of set) {
        expect(v!.value).toBeGreaterThan(0);
        expect(v!.source.trim().length).toBeGreaterThan(0);
      }
    }
    expect(isProcessId('laser')).toBe(false);
  });

  it('names the additive categories as ISO/ASTM 52900 does', () => {
    // ISO/ASTM 52900 process categories (docs/references.md §8 header: category names, no trademarks)
    expect(processTitle('material-extrusion')).toMatch(/^Material extrusion/);
    expect(processTitle('vat-photopolymerization')).toMatch(/^Vat photopolymerization/);
    expect(processTitle('pbf-polymer')).toMatch(/^Powder bed fusion/);
    expect(processTitle('pbf-metal')).toMatch(/^Powder bed fusion/);
  });
});
