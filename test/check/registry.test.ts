/**
 * The registry against the documented contract: each check's unit and comparison as the check table of
 * docs/checks/README.md states them (read from the file, not copied), and the planner's defaults
 * (always-on checks, off without a limit, presets filled in, explicit options and --severity winning).
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { resolveLimits } from '../../src/check/limits.js';
import { CHECK_IDS } from '../../src/check/ids.js';
import { CHECKS, planChecks } from '../../src/check/registry.js';
import { resolveSettings, type Settings } from '../../src/settings.js';

/** Unit and comparison as the docs' table words them: "…, mm" → mm; sizes pass when large (>=). */
const table = readFileSync('docs/checks/README.md', 'utf8')
  .split('\n')
  .filter((l) => l.startsWith('| ['))
  .map((l) => {
    const [, name, measures, , severity] = l.split('|').map((c) => c.trim());
    return { id: /\[([a-z-]+)\]/.exec(name)![1], measures, severity };
  });

const plan = (s: Partial<Settings>, mode: 'volume' | 'level' | 'constant' = 'volume') => {
  const settings = resolveSettings(s);
  return planChecks(settings, { tolerance: 0.25, limits: resolveLimits(settings).limits, mode });
};

describe('check registry', () => {
  it('registers every id once, in the order of ids.ts and of the docs table', () => {
    expect(CHECKS.map((c) => c.id)).toEqual([...CHECK_IDS]);
    expect(table.map((r) => r.id)).toEqual([...CHECK_IDS]);
  });

  it("each check's unit and comparison match the docs table", () => {
    for (const def of CHECKS) {
      const row = table.find((r) => r.id === def.id)!;
      const unit = /mm²/.test(row.measures) ? 'mm2' : /, mm$/.test(row.measures) ? 'mm' : /%$/.test(row.measures) ? '%' : /, MPa$/.test(row.measures) ? 'MPa' : '1';
      expect(def.unit, def.id).toBe(unit);
      // docs: sizes are "thinnest / narrowest / tightest / smallest" (pass when large); errors and areas of extras pass when small
      const large = /^(thinnest|narrowest|tightest|area of the smallest)/.test(row.measures);
      expect(def.comparison, def.id).toBe(large ? '>=' : '<=');
    }
  });

  it('plans the always-on checks with their documented severities; size checks are off without a limit', () => {
    const p = plan({});
    expect(p.map((c) => c.def.id)).toEqual(['volume-fraction', 'islands', 'outline-fidelity', 'grey-level']);
    for (const c of p) expect(c.severity).toBe(table.find((r) => r.id === c.def.id)!.severity);
    expect(plan({}, 'level').find((c) => c.def.id === 'volume-fraction')!.severity).toBe('warn'); // not searched
  });

  it('with the grid known, small-holes is on by default at 4 cell areas; --min-hole-area wins', () => {
    // docs/checks/README.md, "Features below the grid's resolution": 4 · hx · hy
    const withGrid = (s: Partial<Settings>) => {
      const settings = resolveSettings(s);
      return planChecks(settings, { tolerance: 0.25, limits: resolveLimits(settings, [2, 0.5]).limits, mode: 'volume' });
    };
    const p = withGrid({});
    expect(p.map((c) => c.def.id)).toEqual(['volume-fraction', 'islands', 'small-holes', 'outline-fidelity', 'grey-level']);
    expect(p.find((c) => c.def.id === 'small-holes')!.limit).toBe(4);
    expect(withGrid({ minHoleArea: 7 }).find((c) => c.def.id === 'small-holes')!.limit).toBe(7);
    expect(withGrid({ severity: { 'small-holes': 'off' } }).some((c) => c.def.id === 'small-holes')).toBe(false);
  });

  it('a preset fills the size limits, an explicit option wins, --severity overrides or removes', () => {
    const preset = plan({ process: 'milling' });
    expect(preset.find((c) => c.def.id === 'min-inner-radius')!.limit).toBe(1.5);
    expect(preset.find((c) => c.def.id === 'min-hole-size')!.limit).toBe(3); // 2 × tool radius
    const own = plan({ process: 'milling', toolRadius: 2, minMember: 1.2 });
    expect(own.find((c) => c.def.id === 'min-inner-radius')!.limit).toBe(2);
    expect(own.find((c) => c.def.id === 'min-hole-size')!.limit).toBe(4); // follows --tool-radius
    expect(own.find((c) => c.def.id === 'min-member-size')!.limit).toBe(1.2);
    const sev = plan({ minMember: 2, severity: { 'min-member-size': 'warn', islands: 'off' } });
    expect(sev.find((c) => c.def.id === 'min-member-size')!.severity).toBe('warn');
    expect(sev.map((c) => c.def.id)).not.toContain('islands');
  });
});
