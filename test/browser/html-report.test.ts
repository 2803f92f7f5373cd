/**
 * The HTML report of the demo bracket opened in a real browser (headless Chromium through playwright-core):
 * the browser, not our own string checks, says whether the page loads cleanly, stays offline, draws its
 * pictures and shows the tables. A full-page screenshot goes to test-output/browser/html-report.png.
 *
 * Chromium: /usr/bin/chromium (Debian package `chromium`) or env RHOFORM_CHROMIUM. Missing: skipped locally
 * with a message, failed under CI (env CI set), see chromium.ts.
 */
import { mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { build } from '../../src/pipeline.js';
import { numberFindings } from '../../src/check/findings.js';
import { formatHtml } from '../../src/report/html.js';
import { resolveSettings } from '../../src/settings.js';
import type { Report } from '../../src/types.js';
import { chromiumFound, launchChromium, missingMessage, underCi } from './chromium.js';
import { watchContext, type PageLog } from './watch.js';
import { changedShare, decodePixels, hideRasters, readPage, type PageFacts } from './in-page.js';
import '../support/build-parts.js';

const FIGURES = ['fig-density', 'fig-thickness', 'fig-curve'] as const;
const SCREENSHOT = fileURLToPath(new URL('../../test-output/browser/html-report.png', import.meta.url));
const DEMO = fileURLToPath(new URL('../../fixtures/grids/demo-bracket.npy', import.meta.url));
const VIEWPORT = { width: 1280, height: 900 };

if (!chromiumFound && !underCi) console.warn(`browser test skipped: ${missingMessage}`);

/** Width and height from a PNG's IHDR chunk (PNG spec, W3C 2nd ed. §5.2 signature, §11.2.2 IHDR). */
function pngSize(png: Uint8Array): [number, number] {
  const b = Buffer.from(png.buffer, png.byteOffset, png.byteLength);
  expect(Array.from(b.subarray(0, 8))).toEqual([137, 80, 78, 71, 13, 10, 26, 10]);
  expect(b.subarray(12, 16).toString('latin1')).toBe('IHDR');
  return [b.readUInt32BE(16), b.readUInt32BE(20)];
}

function pngDataUrlBytes(url: string): Uint8Array {
  const m = /^data:image\/png;base64,([A-Za-z0-9+/=]+)$/.exec(url);
  expect(m, `a PNG data URL, found ${url.slice(0, 40)}…`).not.toBeNull();
  return Buffer.from(m![1], 'base64');
}

it.runIf(!chromiumFound && underCi)('Chromium is installed (CI must run the browser test, not skip it)', () => {
  expect.fail(`CI=${process.env.CI}: ${missingMessage}`);
});

describe.skipIf(!chromiumFound)('HTML report in headless Chromium', { timeout: 60_000 }, () => {
  let dir = '';
  let docUrl = '';
  let report: Report;
  let browser: Browser | undefined;
  let context: BrowserContext;
  let page: Page;
  let facts: PageFacts;
  let log: PageLog;

  beforeAll(async () => {
    const bytes = new Uint8Array(readFileSync(DEMO));
    const result = build({ name: 'demo-bracket.npy', bytes }, resolveSettings({ cellSize: [2, 2], process: 'waterjet-cut', thickness: 8 }));
    report = result.report;
    dir = mkdtempSync(join(tmpdir(), 'rhoform-browser-'));
    const file = join(dir, 'demo-bracket.report.html');
    writeFileSync(file, formatHtml(report, result.pictures()));
    docUrl = pathToFileURL(file).href;

    browser = await launchChromium();
    context = await browser.newContext({ viewport: VIEWPORT });
    log = await watchContext(context);
    page = await context.newPage();
    await page.goto(docUrl, { waitUntil: 'load', timeout: 30_000 });
    facts = await page.evaluate(readPage, [...FIGURES]);

    mkdirSync(join(SCREENSHOT, '..'), { recursive: true });
    await page.screenshot({ path: SCREENSHOT, fullPage: true });
  }, 60_000);

  afterAll(async () => {
    await browser?.close();
    if (dir !== '') rmSync(dir, { recursive: true, force: true });
  }, 60_000);

  /** Screenshot (PNG data URL) of the picture of a figure: its first <svg>, without the caption. */
  async function pictureShot(id: string): Promise<string> {
    const shot = await page.locator(`#${id} > svg`).first().screenshot({ animations: 'disabled' });
    return `data:image/png;base64,${shot.toString('base64')}`;
  }

  /** Runs an in-page measuring function on a blank page of its own, so the report page stays untouched. */
  async function onBlank<R>(f: (blank: Page) => Promise<R>): Promise<R> {
    const blank = await browser!.newPage();
    try {
      return await f(blank);
    } finally {
      await blank.close();
    }
  }

  it('loads with no console error, no script error and no request but the file itself', () => {
    expect(log.consoleErrors).toEqual([]);
    expect(log.pageErrors).toEqual([]);
    expect(log.sockets).toEqual([]);
    expect(log.failed).toEqual([]);
    // data: URLs (the inline pictures) are allowed; everything else must be the report file itself
    expect(log.requests.filter((u) => !u.startsWith('data:'))).toEqual([docUrl]);
  });

  it('control: the same watchers and decoder catch a page that errs, reaches out and holds a broken picture', async () => {
    const bad = join(dir, 'control.html');
    writeFileSync(
      bad,
      '<!DOCTYPE html><html><body><script>console.error("control error"); setTimeout(() => { throw new Error("control throw"); });</script>' +
        '<img src="http://192.0.2.1/control.png"><svg><image href="data:image/png;base64,iVBORw0KGgoAAAAA"/></svg></body></html>',
    );
    const ctx = await browser!.newContext();
    try {
      const seen = await watchContext(ctx);
      const p = await ctx.newPage();
      await p.goto(pathToFileURL(bad).href, { waitUntil: 'load' });
      await p.waitForTimeout(200); // let the deferred throw land
      expect(seen.consoleErrors.some((m) => m.includes('control error'))).toBe(true);
      expect(seen.pageErrors.some((m) => m.includes('control throw'))).toBe(true);
      expect(seen.requests).toContain('http://192.0.2.1/control.png'); // 192.0.2.0/24: TEST-NET-1, RFC 5737
      await expect(p.evaluate(decodePixels, 'data:image/png;base64,iVBORw0KGgoAAAAA')).rejects.toThrow();
    } finally {
      await ctx.close();
    }
  });

  it('draws the three figures at a non-zero size, each with drawn content', () => {
    for (const id of FIGURES) {
      const f = facts.figures[id];
      expect(f, `#${id} present`).not.toBeNull();
      expect(f!.svg.width, `#${id} svg width`).toBeGreaterThan(100);
      expect(f!.svg.height, `#${id} svg height`).toBeGreaterThan(50);
      expect(f!.content.width, `#${id} drawing width`).toBeGreaterThan(0);
      expect(f!.content.height, `#${id} drawing height`).toBeGreaterThan(0);
    }
    // the outline is drawn by <use href="#rf-outline">: a non-zero box means the reference resolved
    for (const id of ['fig-density', 'fig-thickness']) {
      const uses = facts.figures[id]!.uses;
      expect(uses.length, `#${id} <use> of the outline`).toBeGreaterThan(0);
      for (const u of uses) expect(u.width * u.height, `#${id} outline box`).toBeGreaterThan(0);
    }
  });

  it('decodes every raster picture at the size its PNG header gives, with more than one colour', async () => {
    for (const id of ['fig-density', 'fig-thickness']) {
      const images = facts.figures[id]!.images;
      expect(images.length, `#${id} raster images`).toBeGreaterThan(0);
      for (const im of images) {
        expect(im.width * im.height, `#${id} image on screen`).toBeGreaterThan(0);
        const [w, h] = pngSize(pngDataUrlBytes(im.href));
        const px = await page.evaluate(decodePixels, im.href); // rejects when Chromium cannot decode it
        expect([px.width, px.height], `#${id} decoded size vs IHDR`).toEqual([w, h]);
        expect(px.colours, `#${id} distinct colours`).toBeGreaterThan(8); // a grey or colour ramp, not a flat fill
      }
    }
  });

  it('shows each picture on screen: ink in every figure, and the rasters make up much of their figure', async () => {
    for (const id of FIGURES) {
      const shot = await pictureShot(id);
      const px = await onBlank((b) => b.evaluate(decodePixels, shot));
      expect(px.colours, `#${id} distinct colours on screen`).toBeGreaterThan(16);
      // common practice, no source: a drawn chart inks a few % of its box; the plan figures are mostly drawing
      expect(px.inked, `#${id} share of non-white pixels`).toBeGreaterThan(id === 'fig-curve' ? 0.01 : 0.2);
    }
    // hide the raster images and shoot again: what changes is what the rasters drew (outline, markers and
    // scale bar stay), so a broken or blank image would change next to nothing
    for (const id of ['fig-density', 'fig-thickness']) {
      const shown = await pictureShot(id);
      expect(await page.evaluate(hideRasters, [id, true] as const)).toBeGreaterThan(0);
      const hidden = await pictureShot(id);
      await page.evaluate(hideRasters, [id, false] as const);
      const changed = await onBlank((b) => b.evaluate(changedShare, [shown, hidden] as const));
      expect(changed, `#${id} pixels drawn by the raster`).toBeGreaterThan(0.1);
    }
  });

  it('has one checks-table row per check, in report order, with its id and status', () => {
    const word = { pass: 'PASS', warn: 'WARN', fail: 'FAIL' } as const;
    expect(report.checks.length).toBeGreaterThan(0);
    expect(facts.checks.map((r) => r.cls)).toEqual(report.checks.map((c) => c.status));
    expect(facts.checks.map((r) => r.cells[0])).toEqual(report.checks.map((c) => word[c.status]));
    expect(facts.checks.map((r) => r.cells[1])).toEqual(report.checks.map((c) => c.id));
    expect(facts.checks.every((r) => r.shown), 'every checks row takes room on screen').toBe(true);
  });

  it('numbers the findings 1..N in the table and the density figure, as the failing checks list them', () => {
    // expected straight from the report: checks in order, each non-passing check's locations in order
    const expected = report.checks.flatMap((c) => (c.status === 'pass' ? [] : c.locations.map(() => ({ checkId: c.id, status: c.status }))));
    const N = expected.length;
    expect(N, 'the demo has located findings').toBeGreaterThan(0);
    expect(numberFindings(report).map((f) => ({ checkId: f.checkId, status: f.status }))).toEqual(expected);

    const ones = Array.from({ length: N }, (_, i) => i + 1);
    expect(facts.findings.map((r) => r.id)).toEqual(ones.map((n) => `finding-${n}`));
    expect(facts.findings.map((r) => Number(r.cells[0]))).toEqual(ones);
    expect(facts.findings.map((r) => r.cls)).toEqual(expected.map((f) => f.status));
    expect(facts.findings.every((r) => r.shown), 'every findings row takes room on screen').toBe(true);
    expect(facts.findings.map((r) => r.cells[1].split(/\s+/).at(-1))).toEqual(expected.map((f) => f.checkId));

    // every finding has exactly one marker in Figure 1 (drawn failures-on-top, so compare sorted by number)
    const markers = [...facts.figures['fig-density']!.markers].sort((a, b) => a.n - b.n);
    expect(markers).toEqual(expected.map((f, i) => ({ n: i + 1, status: f.status })));
    // Figure 2 marks the member-size findings only, with their numbers from the same list
    const thick = facts.figures['fig-thickness']!.markers.map((m) => m.n).sort((a, b) => a - b);
    expect(thick).toEqual(ones.filter((n) => expected[n - 1].checkId === 'min-member-size'));
    // each marker links to its table row, and the browser finds that row
    for (const id of ['fig-density', 'fig-thickness']) {
      for (const l of facts.figures[id]!.links) expect(l, `${id} link`).toEqual({ href: l.href, resolves: true });
    }
  });

  it('saved a full-page screenshot as wide as the viewport and as tall as the page', async () => {
    const [w, h] = pngSize(readFileSync(SCREENSHOT));
    const pageHeight = await page.evaluate(() => (globalThis as unknown as { document: { documentElement: { scrollHeight: number } } }).document.documentElement.scrollHeight);
    expect(w).toBe(VIEWPORT.width);
    expect(h).toBe(pageHeight);
  });
});
