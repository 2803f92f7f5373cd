import { describe, expect, it } from 'vitest';
import { numberFindings } from '../../src/check/findings.js';
import { formatText, TEXT_FINDINGS_PER_CHECK, TEXT_WIDTH } from '../../src/report/text.js';
import { check, loc, sampleReport, sampleSettings } from './sample.js';

// ECMA-48 §5.3: control sequences start with ESC (0x1B); stripping CSI "ESC [ … m" leaves the plain text
const ESC = '\u001b';
const strip = (s: string) => s.replace(/\u001b\[[0-9;]*m/g, '');

describe('text report', () => {
  const r = sampleReport();
  const plain = formatText(r, { color: false });
  const lines = plain.split('\n');

  it('holds no escape byte without colour, and the same text with colour once escapes are removed', () => {
    expect(plain.includes(ESC)).toBe(false);
    const colored = formatText(r, { color: true });
    expect(colored.includes(ESC)).toBe(true);
    expect(strip(colored)).toBe(plain);
  });

  it('prints one row per check: status, id, measured / limit with unit, message', () => {
    for (const c of r.checks) {
      const rows = lines.filter((l) => new RegExp(`^\\s+(PASS|WARN|FAIL)\\s+${c.id}\\s`).test(l));
      expect(rows).toHaveLength(1);
      expect(rows[0]).toContain(c.status.toUpperCase());
    }
    // the hand-built values: 1.52 mm against ≥ 2 mm; null measured shows '–'; a percentage keeps its unit
    expect(lines.find((l) => l.includes('min-member-size'))).toMatch(/1\.52 mm \/ ≥ 2 mm\s+members thinner/);
    expect(lines.find((l) => l.includes(' islands '))).toMatch(/– \/ ≥ 0 mm²/);
    expect(lines.find((l) => l.includes('grey-level'))).toMatch(/31\.2 % \/ ≤ 25 %/);
  });

  it('summarises status and counts as the report has them', () => {
    const s = r.summary;
    const line = lines.find((l) => l.startsWith('result'));
    expect(line).toBe(`result     FAIL  5 checks: ${s.pass} passed, ${s.warn} warned, ${s.fail} failed; ${numberFindings(r).length} located findings`);
    // counted by hand from sampleChecks(): 2 pass (volume-fraction, islands), 2 warn, 1 fail
    expect([s.pass, s.warn, s.fail]).toEqual([2, 2, 1]);
  });

  it('numbers findings exactly as numberFindings and counts the rest', () => {
    const numbered = numberFindings(r);
    const shown = lines.filter((l) => /^\s+#\d+ /.test(l)).map((l) => l.trim());
    const expected = r.checks
      .filter((c) => c.status !== 'pass')
      .flatMap((c) =>
        numbered
          .filter((f) => f.checkId === c.id)
          .slice(0, TEXT_FINDINGS_PER_CHECK)
          .map((f) => `#${f.n} x ${f.location.x} y ${f.location.y} mm (row ${f.location.fileRow}, col ${f.location.fileCol}) ${f.location.measured} mm`),
      );
    expect(shown).toEqual(expected);
    // min-member-size stores 5 of 12 places; 3 are shown → 9 more
    expect(plain).toContain('… and 9 more');
    expect(shown[0]).toBe('#1 x 12.5 y 40.25 mm (row 20, col 13) 1.52 mm');
    expect(shown[3]).toMatch(/^#6 /); // min-hole-size starts after the 5 stored member findings
  });

  it('stays within 100 columns', () => {
    for (const l of lines) expect(l.length).toBeLessThanOrEqual(TEXT_WIDTH);
  });

  it('says so when no checks ran', () => {
    const t = formatText(sampleReport({ checks: [], summary: { status: 'pass', pass: 0, warn: 0, fail: 0 } }), { color: false });
    expect(t).toContain('No manufacturability checks ran');
    expect(t).not.toMatch(/\bPASS\b/);
  });

  it('prints the limits of a process preset with the fabricator caution', () => {
    const t = formatText(sampleReport({ settings: sampleSettings({ process: 'laser-cut', minMember: 1.5, minHole: 2, toolRadius: null, thickness: 3 }) }), { color: false });
    expect(t).toMatch(/process\s+laser-cut: limits used min member 1\.5 mm, min hole 2 mm, min island area 0 mm², thickness\s+3 mm/);
    expect(t).toMatch(/fabricator's limits govern/);
    expect(formatText(sampleReport(), { color: false })).not.toMatch(/^process/m);
  });

  it('shows every stored finding of a check when the total is small, with no "more" line', () => {
    const rr = sampleReport({ checks: [check('min-hole-size', 'warn', { locations: [loc(1, 2, 2.5)], locationsTotal: 1 })] });
    const t = formatText(rr, { color: false });
    expect(t).toContain('#1 x 1 y 2 mm (row 58, col 2) 2.5 mm');
    expect(t).not.toContain('more');
  });
});
