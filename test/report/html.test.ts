import { inflateSync } from 'node:zlib';
import { describe, expect, it } from 'vitest';
import { CAUTIONS } from '../../src/report/cautions.js';
import { numberFindings } from '../../src/check/findings.js';
import { escapeHtml, formatHtml } from '../../src/report/html.js';
import { niceBelow, outlinePathData, planFrame } from '../../src/report/svg-figures.js';
import { check, loc, platePictures, sampleReport, sampleSettings } from './sample.js';

/** HTML void elements (HTML Living Standard §13.1.2): they take no end tag. */
const VOID = new Set(['area', 'base', 'br', 'col', 'embed', 'hr', 'img', 'input', 'link', 'meta', 'source', 'track', 'wbr']);

/** Opened tags that are never closed, or closed out of order; [] when every tag is balanced. */
function unbalanced(html: string): string[] {
  const problems: string[] = [];
  const stack: string[] = [];
  const body = html.replace(/<!DOCTYPE[^>]*>/i, '').replace(/<style>[^<]*<\/style>/, '');
  for (const m of body.matchAll(/<(\/?)([a-zA-Z][\w:-]*)((?:[^>"']|"[^"]*"|'[^']*')*?)(\/?)>/g)) {
    const [, close, name, , self] = m;
    const tag = name.toLowerCase();
    if (self === '/' || VOID.has(tag)) continue;
    if (close === '') stack.push(tag);
    else if (stack.pop() !== tag) problems.push(`</${tag}> at ${m.index}`);
  }
  return [...problems, ...stack.map((t) => `<${t}> never closed`)];
}

/** Every PNG data URL of the page, decoded to its IHDR width and height (RFC 2083 §4.1.1). */
function pngSizes(html: string): [number, number][] {
  return [...html.matchAll(/data:image\/png;base64,([A-Za-z0-9+/=]+)/g)].map((m) => {
    const b = Buffer.from(m[1], 'base64');
    expect(Array.from(b.subarray(0, 8))).toEqual([137, 80, 78, 71, 13, 10, 26, 10]);
    expect(b.subarray(12, 16).toString('latin1')).toBe('IHDR');
    return [b.readUInt32BE(16), b.readUInt32BE(20)];
  });
}

describe('HTML report', () => {
  const r = sampleReport();
  const pictures = platePictures(240, 120, 120, 60, [2, 4], { noise: 0.05 });
  const html = formatHtml(r, pictures);

  it('is one page whose every tag is closed', () => {
    expect(html.startsWith('<!DOCTYPE html>')).toBe(true);
    expect(unbalanced(html)).toEqual([]);
    expect(unbalanced('<div><svg><g></svg></div>')).not.toEqual([]); // the checker itself catches a missing </g>
  });

  it('is self-contained: no URL scheme of the network, no script, only data: and in-page references', () => {
    expect(html).not.toMatch(/https?:/i);
    expect(html).not.toMatch(/<script/i);
    for (const m of html.matchAll(/\s(?:src|href)="([^"]*)"/g)) expect(m[1]).toMatch(/^(data:|#)/);
    for (const m of html.matchAll(/url\(([^)]*)\)/g)) expect(m[1]).toMatch(/^#/);
  });

  it('numbers the findings 1..N alike in the picture and the table, as numberFindings does', () => {
    const numbered = numberFindings(r);
    const N = numbered.length;
    expect(N).toBe(7); // 5 stored member findings + 2 hole findings of sampleChecks()
    const fig1 = html.slice(html.indexOf('<figure id="fig-density"'), html.indexOf('</figure>', html.indexOf('<figure id="fig-density"')));
    // drawing order puts failures on top; sorted by number, the markers are exactly the numbered findings
    const inPicture = [...fig1.matchAll(/<g class="mk (warn|fail)" data-n="(\d+)">/g)].map((m) => [Number(m[2]), m[1]] as const);
    expect([...inPicture].sort((a, b) => a[0] - b[0])).toEqual(numbered.map((f) => [f.n, f.status]));
    expect(inPicture.at(-1)?.[1]).toBe('fail');
    const inTable = [...html.matchAll(/<tr id="finding-(\d+)" class="(warn|fail)"><td class="n">(\d+)<\/td><td><span class="badge \w+">\w+<\/span> ([\w-]+)<\/td>/g)];
    expect(inTable.map((m) => [Number(m[1]), Number(m[3]), m[4]])).toEqual(numbered.map((f) => [f.n, f.n, f.checkId]));
    expect(inTable.map((m) => Number(m[1]))).toEqual(Array.from({ length: N }, (_, i) => i + 1));
  });

  it('draws each finding where it is: y flipped once, y′ = maxY − y', () => {
    // finding #1 at (12.5, 40.25) in a 120 × 60 mm domain → figure (12.5, 19.75); frame decimals 2 for a 120 mm domain
    expect(html).toMatch(/<g class="mk fail" data-n="1"><title>[^<]*<\/title><circle cx="12.5" cy="19.75"/);
  });

  it('has one checks-table row per check with status, id, measured, limit, resolution, method, message', () => {
    const table = html.slice(html.indexOf('<table class="grid checks">'), html.indexOf('</table>', html.indexOf('<table class="grid checks">')));
    const rows = [...table.matchAll(/<tr class="(pass|warn|fail)">(.*?)<\/tr>/g)];
    expect(rows.map((m) => m[1])).toEqual(r.checks.map((c) => c.status));
    for (const [i, m] of rows.entries()) {
      const cells = [...m[2].matchAll(/<td[^>]*>(.*?)<\/td>/g)].map((c) => c[1]);
      expect(cells).toHaveLength(7);
      expect(cells[1]).toBe(r.checks[i].id);
    }
    expect(table).toContain('<td class="n">1.52 mm</td><td class="n">≥ 2 mm</td><td class="n">± 0.05 mm</td>');
  });

  it('carries every caution, the figures, the legend limit and the curve marks', () => {
    for (const c of CAUTIONS) expect(html).toContain(escapeHtml(c));
    for (const id of ['fig-density', 'fig-thickness', 'fig-curve']) expect(html).toContain(`<figure id="${id}">`);
    expect(html).toContain('red: below 2 mm (min member)'); // settings.minMember = 2 in the sample
    expect(html).toContain('level 0.4812');
    expect(html).toContain('target 45.00 %');
    expect(html).toContain('120 × 60 mm domain');
    for (const [w, h] of pngSizes(html)) expect(Math.max(w, h)).toBeLessThanOrEqual(1200);
  });

  it('escapes text from the input: a file name holding a script tag stays text', () => {
    const evil = sampleReport({
      input: { ...r.input, file: '<script>alert(1)</script>.csv' },
      checks: [check('islands', 'warn', { message: 'a <b>bold</b> "claim" & more', locations: [loc(1, 1, 2)], locationsTotal: 1 })],
    });
    const page = formatHtml(evil, pictures);
    expect(page).not.toMatch(/<script/i);
    expect(page).toContain('&lt;script&gt;alert(1)&lt;/script&gt;.csv');
    expect(page).toContain('a &lt;b&gt;bold&lt;/b&gt; &quot;claim&quot; &amp; more');
    expect(unbalanced(page)).toEqual([]);
  });

  it('leaves out each figure whose data is missing', () => {
    const none = formatHtml(r);
    expect(none).not.toContain('<figure');
    expect(unbalanced(none)).toEqual([]);
    const curveOnly = formatHtml(r, { curve: pictures.curve });
    expect([...curveOnly.matchAll(/<figure id="([\w-]+)"/g)].map((m) => m[1])).toEqual(['fig-curve']);
    expect(curveOnly).toContain('<strong>Figure 1.</strong>');
    const gridOnly = formatHtml(r, { grid: pictures.grid });
    expect([...gridOnly.matchAll(/<figure id="([\w-]+)"/g)].map((m) => m[1])).toEqual(['fig-density']);
    expect(gridOnly).not.toContain('<use');
  });

  it('says so when no checks ran, and shows a process preset with the fabricator caution', () => {
    const page = formatHtml(sampleReport({ checks: [], summary: { status: 'pass', pass: 0, warn: 0, fail: 0 }, settings: sampleSettings({ process: 'waterjet-cut', minMember: 3, thickness: 10 }) }));
    expect(page).toContain('no manufacturability checks ran');
    expect(page).not.toContain('class="badge pass"');
    expect(page).toContain('<strong>Process preset waterjet-cut:</strong> limits used min member 3 mm, min island area 0 mm², thickness 10 mm.');
    expect(page).toMatch(/limits of your fabricator, machine and material govern/);
  });

  it('stays under 5 MB for a noisy 4000 × 2000 grid with every picture and 200 hole rings of 1000 points', () => {
    const big = platePictures(4000, 2000, 4000, 2000, [10, 20], { seg: 1000, noise: 0.3, thicknessSide: 1200, noisyThickness: true });
    const many = Array.from({ length: 100 }, (_, k) => loc(20 * k + 5, 10 * k + 5, 1 + k / 100, 1, 2000));
    const page = formatHtml(
      sampleReport({
        input: { ...r.input, nx: 4000, ny: 2000 },
        checks: [check('min-member-size', 'fail', { locations: many, locationsTotal: 250 }), check('min-hole-size', 'warn', { locations: many, locationsTotal: 100 })],
      }),
      big,
    );
    expect(Buffer.byteLength(page, 'utf8')).toBeLessThan(5 * 1024 * 1024); // docs/output-formats.md bound
    for (const [w, h] of pngSizes(page)) expect(Math.max(w, h)).toBeLessThanOrEqual(1200);
    expect(page.match(/<tr id="finding-/g)).toHaveLength(200);
  }, 30_000);
});

describe('plan figure geometry', () => {
  it('writes the outline in integer quanta with y flipped once', () => {
    // domain 40 × 20 mm → quantum 10^floor(log10(40 / 12000)) = 0.001 mm
    const f = planFrame([0, 0, 40, 20]);
    const d = outlinePathData({ polygons: [{ outer: [[10, 5], [20, 5], [20, 15], [10, 15]], holes: [] }] }, f, 0);
    // analytic: (10, 5) → (10, 20 − 5) = (10, 15) mm = (10000, 15000) quanta; then relative steps
    expect(d).toBe('M10000 15000l10000 0 0 -10000 -10000 0z');
    const inflated = outlinePathData({ polygons: [{ outer: [[10, 5], [20, 5], [20, 15], [10, 15]], holes: [] }] }, planFrame([5, 0, 45, 20]), 0);
    expect(inflated.startsWith('M5000 15000')).toBe(true); // x′ = x − minX
  });

  it('picks 1-2-5 scale-bar lengths', () => {
    // 1-2-5 series (common practice for scale bars and axis ticks, no source)
    expect([niceBelow(48), niceBelow(24), niceBelow(19.9), niceBelow(800), niceBelow(0.37)]).toEqual([20, 20, 10, 500, 0.2]);
  });
});
