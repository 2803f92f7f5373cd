/**
 * How the text and HTML reports show a repaired run (docs/repair.md, docs/report-schema.md): the checks before
 * repair next to the final ones, one row per repair, and where each acted. Formatting of our own report; the
 * numbers are invented (test/report/sample.ts), the tests check how they are shown.
 */
import { describe, expect, it } from 'vitest';
import { formatHtml } from '../../src/report/html.js';
import { formatText } from '../../src/report/text.js';
import type { PolygonSet, Report } from '../../src/types.js';
import { check, loc, sampleChecks, sampleReport } from './sample.js';

function repaired(): Report {
  const after = sampleChecks().map((c) =>
    c.id === 'min-member-size' ? check('min-member-size', 'pass', { measured: 2.1, limit: 2, message: 'all members at least 2 mm' }) : c,
  );
  return sampleReport({
    checks: after,
    checksBeforeRepair: sampleChecks(),
    repairs: [
      { id: 'thicken', area: 41.5, locations: [loc(12.5, 40.25, 1.52), loc(30, 10, 1.61)], checks: ['min-member-size'], skipped: null, locationsTotal: 2, unresolved: null },
      { id: 'open-corners', area: 0, locations: [], checks: ['min-inner-radius'], skipped: 'its check min-inner-radius is off (no limit, or --severity …=off)', locationsTotal: 0, unresolved: null },
      { id: 'fill-holes', area: 3, locations: [loc(60, 20, 2.98)], checks: ['min-hole-size', 'small-holes'], skipped: null, locationsTotal: 1, unresolved: '1 narrow place of 2.98 mm at x 60 y 20 mm beside a passive void' },
    ],
    finishing: { areaChange: 41.5, fractionChange: 41.5 / 7200, maxDeviation: 1.1 },
  });
}

const square = (x: number, y: number, s: number): PolygonSet => ({
  polygons: [{ outer: [[x, y], [x + s, y], [x + s, y + s], [x, y + s]], holes: [] }],
});

describe('text report of a repaired run', () => {
  const text = formatText(repaired(), { color: false });

  it('shows the checks before repair, the repairs, then the final checks, in that order', () => {
    const a = text.indexOf('Before repair');
    const b = text.indexOf('Repairs (--repair)');
    const c = text.indexOf('After repair (the geometry written)');
    expect(a).toBeGreaterThan(0);
    expect(b).toBeGreaterThan(a);
    expect(c).toBeGreaterThan(b);
    // the failed member check appears before repair (unnumbered places) and passes after it
    expect(text.slice(a, b)).toMatch(/FAIL {2}min-member-size/);
    expect(text.slice(a, b)).toMatch(/· x 12\.5 y 40\.25 mm/);
    expect(text.slice(c)).toMatch(/PASS {2}min-member-size/);
  });

  it('one row per repair: places and area, or why it did nothing', () => {
    expect(text).toMatch(/REPAIR {2}thicken {7}2 places, area \+41\.5 mm² \(for min-member-size\)/);
    expect(text).toMatch(/REPAIR {2}open-corners {2}did nothing: its check min-inner-radius is off/);
    expect(text).toMatch(/REPAIR {2}fill-holes {4}1 place, area \+3 mm² .*\n\s+not repaired: 1 narrow place of 2\.98 mm at x 60 y 20 mm beside a passive\s+void/);
  });

  it('the result line says the verdict is after repair', () => {
    expect(text).toMatch(/^result .*failed.*\(after repair\)$/m);
  });

  it('states the change after smoothing as reported, not checked', () => {
    expect(text).toMatch(/final {6}area 3240 mm² \(\+41\.5 mm² after smoothing\)/);
    expect(text).toMatch(/reported, not checked/);
  });

  it('without repairs the plain check table is unchanged (no before/after headings)', () => {
    const plain = formatText(sampleReport(), { color: false });
    expect(plain).not.toMatch(/Before repair|After repair/);
  });
});

describe('HTML report of a repaired run', () => {
  const r = repaired();
  const html = formatHtml(r, {
    domain: [0, 0, 120, 60],
    polygons: square(0, 0, 60),
    beforeRepair: square(0, 0, 50),
    repaired: square(50, 0, 10),
  });

  it('has a repair figure with the changed material, the outline before repair and R-labelled sites', () => {
    expect(html).toMatch(/<figure id="fig-repair">/);
    expect(html).toMatch(/class="rp-changed"/);
    expect(html).toMatch(/class="rp-before"/);
    expect((html.match(/class="rp-site" data-r="1"/g) ?? []).length).toBe(2); // two thicken places
    expect(html).not.toMatch(/data-r="2"/); // open-corners did nothing
  });

  it('says in the headline that the verdict is after repair, with the count before', () => {
    expect(html).toMatch(/<p class="result">.*— after <a href="#repairs">repair<\/a> \(before: 1 failed, 2 warned\)\.<\/p>/);
  });

  it('has the repairs table with ids R1, R2 and the before-repair column in the checks table', () => {
    expect(html).toMatch(/<tr id="repair-1">.*?R1.*?thicken/s);
    expect(html).toMatch(/<tr id="repair-2">.*?did nothing/s);
    expect(html).toMatch(/<tr id="repair-3">.*?not repaired: 1 narrow place/s);
    expect(html).toMatch(/<th>before repair<\/th>/);
    // the member check row shows FAIL before and PASS now
    const row = /<tr class="pass"><td><span class="badge pass">PASS<\/span><\/td><td class="id">min-member-size<\/td><td class="n">(.*?)<\/td>/.exec(html);
    expect(row?.[1]).toMatch(/FAIL.*1\.52 mm/);
  });
});
