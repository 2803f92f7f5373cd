/**
 * The preview page (`rhoform preview`, docs/preview.md) in a real browser (headless Chromium through
 * playwright-core): real controls are typed into, dragged and selected, and the page's outline, checks and
 * summary must change as they should; its files — from `window.rhoformPreview.files()` and from the download
 * buttons — must be byte for byte what `rhoform build` writes with the command line the page shows, for three
 * settings (the demo with its passive file and repair; the same after typed, selected and ticked changes; a
 * small grid with a fixed level, inch units and circles) and for the demo's load case (the structural re-check,
 * its checks, its summary and its stress layer). The page must make no request but its own file and
 * its worker's Blob, and log no error. Update latencies are measured and printed (targets in docs/preview.md;
 * timing targets are not asserted in tests). Screenshots go to test-output/browser/.
 *
 * Chromium: /usr/bin/chromium (Debian package `chromium`) or env RHOFORM_CHROMIUM. Missing: skipped locally
 * with a message, failed under CI (env CI set), see chromium.ts.
 */
import { mkdirSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Report } from '../../src/types.js';
import { bundle } from '../../scripts/bundle.mjs';
import { cli } from '../cli/harness.js';
import { chromiumFound, launchChromium, missingMessage, underCi } from './chromium.js';
import { watchContext, type PageLog } from './watch.js';

const ROOT = fileURLToPath(new URL('../..', import.meta.url));
const OUT = fileURLToPath(new URL('../../test-output/browser/', import.meta.url));
const DEMO = 'fixtures/grids/demo-bracket.npy';
const PASSIVE = 'fixtures/passive/demo-bracket.passive.json';
const SMALL = 'fixtures/grids/realistic-lbracket-60x60.npy';
const LOADS = 'fixtures/loads/demo-bracket.loads.json';
const VIEWPORT = { width: 1280, height: 900 };
const SUFFIX = { dxf: '.dxf', svg: '.svg', json: '.report.json', html: '.report.html' } as const;
type Files = Record<keyof typeof SUFFIX, string>;

if (!chromiumFound && !underCi) console.warn(`browser test skipped: ${missingMessage}`);

it.runIf(!chromiumFound && underCi)('Chromium is installed (CI must run the preview test, not skip it)', () => {
  expect.fail(`CI=${process.env.CI}: ${missingMessage}`);
});

/** Splits a command line as the page shows it (words, or words in single quotes). */
function shellWords(line: string): string[] {
  const out: string[] = [];
  for (const m of line.matchAll(/'((?:[^']|'\\'')*)'|(\S+)/g)) out.push(m[1] !== undefined ? m[1].replace(/'\\''/g, "'") : m[2]);
  return out;
}

/** Runs the command line the page shows (plus --force --quiet, which change no file) and reads what it wrote. */
function buildAsShown(command: string): Files {
  const words = shellWords(command);
  expect(words.slice(0, 2)).toEqual(['rhoform', 'build']);
  const r = cli([...words.slice(1), '--force', '--quiet'], ROOT);
  expect(r.stderr).toBe('');
  expect(r.code === 0 || r.code === 1, `exit code ${r.code}`).toBe(true);
  const k = words.indexOf('--out-dir');
  const base = join(resolve(ROOT, words[k + 1]), words[2].split('/').pop()!.replace(/\.[^.]*$/, ''));
  return Object.fromEntries(Object.entries(SUFFIX).map(([f, s]) => [f, readFileSync(base + s, 'utf8')])) as Files;
}

/**
 * The report's run figures — `timings` (stage → ms) and `peakMemory` (bytes) — measure the run itself and differ
 * between any two runs (docs/preview.md): they are cut out of the JSON before the byte comparison; every other byte
 * must agree.
 */
function withoutRunFigures(text: string): string {
  const cut = text.replace(/,\n {2}"timings": \{\n(?: {4}"[a-z0-9]+": [0-9.e+-]+,?\n)* {2}\}(?:,\n {2}"peakMemory": [0-9]+)?\n\}\n$/, '\n}\n');
  expect(cut, 'the run figures are cut out exactly').not.toBe(text);
  return cut;
}

/**
 * The structural re-check's solver times (`structure.designs.*.solver.seconds`, DESIGN §12) are run figures of the
 * same kind: wall time of one solve, different between any two runs. Their values are masked; the key stays.
 */
function withoutSolverSeconds(text: string): string {
  const designs = (text.match(/"solver": \{/g) ?? []).length;
  let masked = 0;
  const out = text.replace(/("solver": \{\n(?: {10}"[a-zA-Z]+": [^\n]+,\n)* {10}"seconds": )[0-9.e+-]+\n/g, (_, head: string) => {
    masked++;
    return `${head}(run figure)\n`;
  });
  expect(masked, 'every solver time is masked, nothing else').toBe(designs);
  return out;
}

/** A file as compared: the JSON report without its run figures, the others whole. */
function comparable(f: keyof Files, text: string): string {
  return f === 'json' ? withoutSolverSeconds(withoutRunFigures(text)) : text;
}

/** The first differing position of two texts, with some context (for a readable failure). */
function firstDiff(a: string, b: string): string {
  let i = 0;
  while (i < a.length && a[i] === b[i]) i++;
  return i === a.length && i === b.length ? 'identical' : `at ${i}: page …${JSON.stringify(a.slice(i - 40, i + 40))} vs cli …${JSON.stringify(b.slice(i - 40, i + 40))}`;
}

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)];
}

describe.skipIf(!chromiumFound)('preview page in headless Chromium', { timeout: 180_000 }, () => {
  let dir = '';
  let browser: Browser | undefined;
  let context: BrowserContext;
  let page: Page;
  let log: PageLog;
  const pages: string[] = [];
  const latency = { outline: [] as number[], checks: [] as number[], checksRepair: [] as number[], loadsOutline: [] as number[], loadsChecks: [] as number[], loadsRecheck: [] as number[] };

  const report = () => page.evaluate('window.rhoformPreview.report()') as Promise<Report>;
  const files = (p: Page = page) => p.evaluate('window.rhoformPreview.files()') as Promise<Files>;
  const resultVersion = async () => Number(await page.evaluate('document.body.dataset.result'));
  const command = async (p: Page = page) => (await p.locator('#command').textContent()) ?? '';
  const summary = () => page.locator('#report .result').innerText();
  /** Waits until a result newer than `v` is shown. */
  const nextResult = (v: number) => page.waitForFunction(`Number(document.body.dataset.result) > ${v}`, null, { timeout: 60_000 });

  /** Waits until the pictures of the newest result are drawn and no build is running. */
  const settled = () =>
    page.waitForFunction(
      `document.body.dataset.pictures === document.body.dataset.result && document.querySelector('#status').className.indexOf('busy') < 0`,
      null,
      { timeout: 60_000 },
    );
  /** Starts recording, in the page, when the next control event happens and when outline and checks follow. */
  const armTimer = () =>
    page.evaluate(`(() => {
      const t = (window.__lat = { at: null, outline: null, result: null });
      const o0 = document.body.dataset.outline, r0 = document.body.dataset.result;
      const mark = () => { if (t.at === null) t.at = performance.now(); };
      document.addEventListener('change', mark, { capture: true, once: true });
      document.addEventListener('input', mark, { capture: true, once: true });
      new MutationObserver((_, obs) => {
        const now = performance.now();
        if (t.outline === null && document.body.dataset.outline !== o0) t.outline = now;
        if (t.result === null && document.body.dataset.result !== r0) { t.result = now; obs.disconnect(); }
      }).observe(document.body, { attributes: true });
    })()`);
  const readTimer = async () => {
    await page.waitForFunction('window.__lat && window.__lat.result !== null', null, { timeout: 60_000 });
    const t = (await page.evaluate('window.__lat')) as { at: number; outline: number; result: number };
    return { outline: t.outline - t.at, checks: t.result - t.at };
  };

  beforeAll(async () => {
    await bundle();
    dir = mkdtempSync(join(tmpdir(), 'rhoform-preview-browser-'));
    for (const argv of [
      ['preview', DEMO, '--cell-size', '2', '--process', 'waterjet-cut', '--thickness', '8', '--passive', PASSIVE, '--repair', '--out-dir', join(dir, 'demo')],
      ['preview', SMALL, '--cell-size', '1.5', '--level', '0.5', '--smooth', '0', '--units', 'in', '--circles', '--out-dir', join(dir, 'small')],
      ['preview', DEMO, '--cell-size', '2', '--process', 'waterjet-cut', '--thickness', '8', '--passive', PASSIVE, '--loads', LOADS, '--out-dir', join(dir, 'loads')],
    ]) {
      const r = cli(argv, ROOT);
      expect(r.stderr).toBe('');
      expect(r.code).toBe(0);
    }
    pages.push(join(dir, 'demo', 'demo-bracket.preview.html'), join(dir, 'small', 'realistic-lbracket-60x60.preview.html'), join(dir, 'loads', 'demo-bracket.preview.html'));
    mkdirSync(OUT, { recursive: true });
    browser = await launchChromium();
    context = await browser.newContext({ viewport: VIEWPORT, acceptDownloads: true });
    log = await watchContext(context);
    page = await context.newPage();
    await page.goto(pathToFileURL(pages[0]).href, { waitUntil: 'load' });
    await page.evaluate('window.rhoformPreview.ready');
  }, 120_000);

  afterAll(async () => {
    await browser?.close();
    if (dir !== '') rmSync(dir, { recursive: true, force: true });
    if (latency.outline.length > 0) {
      console.log(
        `preview latency on the demo grid (120×60), ms — new outline: median ${median(latency.outline).toFixed(0)} ` +
          `(${latency.outline.map((x) => x.toFixed(0)).join(', ')}); new checks without repair: median ${median(latency.checks).toFixed(0)} ` +
          `(${latency.checks.map((x) => x.toFixed(0)).join(', ')}); with repair: ${latency.checksRepair.map((x) => x.toFixed(0)).join(', ')}`,
      );
    }
    if (latency.loadsChecks.length > 0) {
      console.log(
        `preview latency with the demo's load case (--loads, structural re-check), ms — new outline: median ${median(latency.loadsOutline).toFixed(0)} ` +
          `(${latency.loadsOutline.map((x) => x.toFixed(0)).join(', ')}); new checks (before the re-check): median ${median(latency.loadsChecks).toFixed(0)} ` +
          `(${latency.loadsChecks.map((x) => x.toFixed(0)).join(', ')}); with the re-check: median ${median(latency.loadsRecheck).toFixed(0)} ` +
          `(${latency.loadsRecheck.map((x) => x.toFixed(0)).join(', ')})`,
      );
    }
  }, 60_000);

  it('starts in the state given on the command line, with the check table and summary of the HTML report', async () => {
    const r = await report();
    expect(r.settings).toMatchObject({ cellSize: [2, 2], process: 'waterjet-cut', thickness: 8, passive: PASSIVE, repair: ['thicken', 'fill-holes', 'open-corners', 'drop-islands'] });
    expect(await command()).toBe(`rhoform build ${DEMO} --cell-size 2 --passive ${PASSIVE} --process waterjet-cut --thickness 8 --repair --out-dir ${join(dir, 'demo')}`);
    // the same rows as the report's check table, in report order
    const rows = page.locator('#report table.checks tbody tr');
    expect(await rows.count()).toBe(r.checks.length);
    for (let k = 0; k < r.checks.length; k++) {
      expect(await rows.nth(k).locator('td.id').innerText()).toBe(r.checks[k].id);
      expect(await rows.nth(k).getAttribute('class')).toBe(r.checks[k].status);
    }
    expect(await summary()).toContain(`${r.summary.pass} passed, ${r.summary.warn} warned, ${r.summary.fail} failed`);
    await page.screenshot({ path: join(OUT, 'preview.png') });
  });

  it('setting 1 (demo, passive file, repair): files() and all four downloads are byte-identical to rhoform build', async () => {
    const cliFiles = buildAsShown(await command());
    const got = await files();
    for (const f of Object.keys(SUFFIX) as (keyof Files)[]) expect(comparable(f, got[f]) === comparable(f, cliFiles[f]), `${f}: ${firstDiff(comparable(f, got[f]), comparable(f, cliFiles[f]))}`).toBe(true);
    // the summary line, the check table and the findings read as in the HTML report the CLI wrote (opened in
    // the same browser)
    const shown = async (p: Page) => ({
      result: await p.locator('.result').innerText(),
      checks: await p.locator('table.checks').innerText(),
      repairs: await p.locator('table.repairs').innerText(),
    });
    const reportPage = await context.newPage();
    await reportPage.setContent(cliFiles.html, { waitUntil: 'load' });
    expect(await shown(page)).toEqual(await shown(reportPage));
    await reportPage.close();
    for (const f of Object.keys(SUFFIX) as (keyof Files)[]) {
      const [dl] = await Promise.all([page.waitForEvent('download'), page.click(`#download-${f}`)]);
      expect(dl.suggestedFilename()).toBe(`demo-bracket${SUFFIX[f]}`);
      const text = readFileSync((await dl.path())!, 'utf8');
      expect(comparable(f, text) === comparable(f, cliFiles[f]), `download ${f}: ${firstDiff(comparable(f, text), comparable(f, cliFiles[f]))}`).toBe(true);
    }
  });

  it('typing a value changes the checks and the command line; a bad value is shown at its control with the CLI message', async () => {
    const before = await report();
    let v = await resultVersion();
    await armTimer();
    await page.fill('#ctl-minMember', '6');
    await page.press('#ctl-minMember', 'Enter');
    await nextResult(v);
    latency.checksRepair.push((await readTimer()).checks);
    const r = await report();
    expect(r.settings.minMember).toBe(6);
    const member = r.checksBeforeRepair!.find((c) => c.id === 'min-member-size')!;
    expect(member.limit).toBe(6);
    expect(before.checksBeforeRepair!.find((c) => c.id === 'min-member-size')!.limit).toBe(8);
    expect(await command()).toContain('--min-member 6');

    // a bad value: the CLI's code and message under the control, the typed text kept, the result unchanged
    const bad = cli(['build', DEMO, '--min-member', 'abc'], ROOT);
    expect(bad.code).toBe(2);
    const cliMessage = bad.stderr.replace(/^rhoform: error /, '').trim();
    v = await resultVersion();
    await page.fill('#ctl-minMember', 'abc');
    await page.press('#ctl-minMember', 'Enter');
    await expect.poll(() => page.locator('#ctl-minMember-error').innerText()).toBe(cliMessage);
    expect(await page.inputValue('#ctl-minMember')).toBe('abc');
    expect(await page.getAttribute('#ctl-minMember', 'aria-invalid')).toBe('true');
    expect(await resultVersion()).toBe(v);
    expect((await report()).settings.minMember).toBe(6);
    // corrected: the error goes
    await page.fill('#ctl-minMember', '7');
    await page.press('#ctl-minMember', 'Enter');
    await nextResult(v);
    expect(await page.locator('#ctl-minMember-error').innerText()).toBe('');
    expect((await report()).settings.minMember).toBe(7);
  });

  it('selecting and ticking change the outline, repairs and checks; setting 2 files are byte-identical to rhoform build', async () => {
    let v = await resultVersion();
    await page.selectOption('#ctl-saddle', 'join');
    await nextResult(v);
    expect((await report()).settings.saddle).toBe('join');
    v = await resultVersion();
    await page.click('#ctl-repair-thicken'); // untick
    await nextResult(v);
    const r = await report();
    expect(r.settings.repair).toEqual(['fill-holes', 'open-corners', 'drop-islands']);
    expect(r.repairs.map((x) => x.id)).not.toContain('thicken');
    // without thickening, the thin struts stay: min-member-size fails after repair, and the summary says so
    expect(r.checks.find((c) => c.id === 'min-member-size')!.status).toBe('fail');
    expect(r.summary.status).toBe('fail');
    expect(await summary()).toContain(`${r.summary.fail} failed`);
    const cmd = await command();
    expect(cmd).toContain('--repair=fill-holes,open-corners,drop-islands');
    expect(cmd).toContain('--saddle join');
    const cliFiles = buildAsShown(cmd);
    const got = await files();
    for (const f of Object.keys(SUFFIX) as (keyof Files)[]) expect(comparable(f, got[f]) === comparable(f, cliFiles[f]), `${f}: ${firstDiff(comparable(f, got[f]), comparable(f, cliFiles[f]))}`).toBe(true);
  });

  it('a build reports its progress step by step, and the last result stays shown until the new one is ready', async () => {
    await settled();
    const v = await resultVersion();
    const rows0 = await page.locator('#report table.checks tbody tr').count();
    expect(rows0).toBeGreaterThan(0);
    // every change of the progress bar, with what the page showed at that moment
    await page.evaluate(`(() => {
      const bar = document.querySelector('#progress');
      const rows = () => document.querySelector('#report').shadowRoot.querySelectorAll('table.checks tbody tr').length;
      window.__progress = [];
      new MutationObserver(() => {
        window.__progress.push({ done: Number(bar.getAttribute('aria-valuenow')), total: Number(bar.getAttribute('aria-valuemax')),
          shown: !bar.hidden, result: Number(document.body.dataset.result), rows: rows() });
      }).observe(bar, { attributes: true });
    })()`);
    await page.selectOption('#ctl-saddle', 'split'); // a build with three repairs: several seconds
    await nextResult(v);
    await settled();
    type Step = { done: number; total: number; shown: boolean; result: number; rows: number };
    const steps = ((await page.evaluate('window.__progress')) as Step[]).filter((x) => x.done > 0);
    // outline build (7 stages) + full build with repair (9: read … report, with repair and its second checks) + pictures
    expect(steps.length).toBeGreaterThan(3);
    const total = steps[0].total;
    expect(total).toBe(7 + 9 + 1);
    expect(steps.every((x) => x.total === total)).toBe(true);
    for (let k = 1; k < steps.length; k++) expect(steps[k].done).toBeGreaterThanOrEqual(steps[k - 1].done);
    expect(steps.at(-1)!.done).toBe(total);
    // the bar showed (a build over 300 ms), and until the new report came the old one stayed: same version, same table
    expect(steps.some((x) => x.shown)).toBe(true);
    const before = steps.filter((x) => x.result === v);
    expect(before.length).toBeGreaterThan(0);
    expect(before.every((x) => x.rows === rows0)).toBe(true);
    expect(await page.isHidden('#progress')).toBe(true);
    expect((await report()).settings.saddle).toBe('split');
    await page.selectOption('#ctl-saddle', 'join');
    await nextResult(await resultVersion());
    await settled(); // no picture of this build may arrive while the next test times its changes
  });

  it('dragging the volume target moves the outline: more material, a lower level, a larger area', async () => {
    await page.evaluate('window.rhoformPreview.apply({ repair: [], minMember: null })');
    await settled();
    for (const target of ['0.38', '0.40', '0.42', '0.36', '0.39']) {
      await armTimer();
      const v = await resultVersion();
      await page.fill('#ctl-volumeFraction', target);
      await page.press('#ctl-volumeFraction', 'Enter');
      await nextResult(v);
      const t = await readTimer();
      latency.outline.push(t.outline);
      latency.checks.push(t.checks);
    }
    const before = await report();
    const slider = page.locator('#ctl-volumeFraction-slider');
    const box = (await slider.boundingBox())!;
    const v = await resultVersion();
    const y = box.y + box.height / 2;
    await page.mouse.move(box.x + box.width * before.threshold.targetFraction, y);
    await page.mouse.down();
    for (const f of [0.42, 0.46, 0.5]) await page.mouse.move(box.x + box.width * f, y, { steps: 3 });
    await page.mouse.up();
    await nextResult(v);
    await settled();
    const after = await report();
    expect(after.threshold.targetFraction).toBeGreaterThan(before.threshold.targetFraction + 0.05);
    expect(after.threshold.level!).toBeLessThan(before.threshold.level!);
    expect(after.geometry.area).toBeGreaterThan(before.geometry.area);
    expect(await page.inputValue('#ctl-volumeFraction')).toBe(String(after.settings.volumeFraction));
    expect(await summary()).not.toBe('');
  });

  it('apply() rejects an invalid value with the CLI code and message, and keeps the state', async () => {
    const before = await report();
    const err = (await page.evaluate(
      'window.rhoformPreview.apply({ toolRadius: -1 }).then(() => null, (e) => ({ code: e.code, message: e.message }))',
    )) as { code: string; message: string } | null;
    const bad = cli(['build', DEMO, '--tool-radius', '-1'], ROOT);
    expect(err).toEqual({ code: 'E_USAGE', message: bad.stderr.replace(/^rhoform: error E_USAGE: /, '').trim() });
    // an error the build finds (a sheet process without a thickness): the same as the CLI's
    const err2 = (await page.evaluate(
      'window.rhoformPreview.apply({ thickness: null }).then(() => null, (e) => ({ code: e.code, message: e.message }))',
    )) as { code: string; message: string } | null;
    const bad2 = cli(['build', DEMO, '--process', 'waterjet-cut'], ROOT);
    expect(bad2.code).toBe(2);
    expect(`rhoform: error ${err2!.code}: ${err2!.message}\n`).toBe(bad2.stderr);
    expect(await report()).toEqual(before);
    expect(await page.evaluate('window.rhoformPreview.settings()')).toEqual(before.settings);
  });

  it('layers hide and show; a finding row zooms to it; wheel, drag and double-click; passive regions off and on; the cursor shows mm, row, column and density', async () => {
    const shot = () => page.locator('#view').screenshot();
    await page.evaluate('window.rhoformPreview.apply({ volumeFraction: null, minMember: 8, repair: [] })');
    await settled();
    const r = await report();
    expect(r.checks.some((c) => c.status === 'fail' && c.locations.length > 0)).toBe(true);
    const base = await shot();
    await page.click('#layer-density');
    const noDensity = await shot();
    expect(noDensity.equals(base)).toBe(false);
    await page.click('#layer-density');
    await page.click('#layer-thickness');
    expect((await shot()).equals(base)).toBe(false);
    await page.click('#layer-thickness');
    expect((await shot()).equals(base)).toBe(true);
    await page.locator('#report #finding-1').click();
    expect(await page.locator('#report #finding-1').getAttribute('class')).toContain('sel');
    const zoomed = await shot();
    expect(zoomed.equals(base)).toBe(false);
    await page.screenshot({ path: join(OUT, 'preview-finding.png') });
    await page.click('#fit');
    expect((await shot()).equals(base)).toBe(true);
    const box = (await page.locator('#view').boundingBox())!;
    // wheel zooms about the cursor, a drag pans, a double-click fits again
    await page.mouse.move(box.x + box.width / 2, box.y + box.height / 2);
    await page.mouse.wheel(0, -400);
    const wheeled = await shot();
    expect(wheeled.equals(base)).toBe(false);
    await page.mouse.down();
    await page.mouse.move(box.x + box.width / 2 + 80, box.y + box.height / 2 + 30, { steps: 4 });
    await page.mouse.up();
    expect((await shot()).equals(wheeled)).toBe(false);
    await page.dblclick('#view');
    expect((await shot()).equals(base)).toBe(true);
    // the passive regions switched off and on again: the option leaves and returns, the checks follow
    let v = await resultVersion();
    await page.click('#ctl-passive');
    await nextResult(v);
    expect((await report()).settings.passive).toBeNull();
    expect(await command()).not.toContain('--passive');
    v = await resultVersion();
    await page.click('#ctl-passive');
    await nextResult(v);
    expect((await report()).settings.passive).toBe(PASSIVE);
    expect(await command()).toContain(`--passive ${PASSIVE}`);
    await settled();
    await page.mouse.move(box.x + box.width / 2, box.y + box.height / 2);
    expect(await page.locator('#readout').textContent()).toMatch(/^x [\d.]+ mm {2}y [\d.]+ mm {2}· {2}cell: file row \d+, col \d+ {2}· {2}density [\d.e-]+$/);
  });

  it('setting 3 (a small grid: fixed level, no smoothing, inch units, circles): files byte-identical to rhoform build', async () => {
    const small = await context.newPage();
    await small.goto(pathToFileURL(pages[1]).href, { waitUntil: 'load' });
    await small.evaluate('window.rhoformPreview.ready');
    const r = (await small.evaluate('window.rhoformPreview.report()')) as Report;
    expect(r.threshold.mode).toBe('level');
    expect(r.settings).toMatchObject({ units: 'in', circles: true, smooth: 0, level: 0.5 });
    const cliFiles = buildAsShown(await command(small));
    const got = await files(small);
    for (const f of Object.keys(SUFFIX) as (keyof Files)[]) expect(comparable(f, got[f]) === comparable(f, cliFiles[f]), `${f}: ${firstDiff(comparable(f, got[f]), comparable(f, cliFiles[f]))}`).toBe(true);
    await small.screenshot({ path: join(OUT, 'preview-small.png') });
    await small.close();
  });

  it("setting 4 (the demo's load case, --loads): the re-check's checks, summary and stress layer; a limit typed changes the result; files byte-identical", async () => {
    const lp = await context.newPage();
    await lp.goto(pathToFileURL(pages[2]).href, { waitUntil: 'load' });
    await lp.evaluate('window.rhoformPreview.ready');
    const rep = () => lp.evaluate('window.rhoformPreview.report()') as Promise<Report>;
    const settledHere = () =>
      lp.waitForFunction(`document.body.dataset.pictures === document.body.dataset.result && document.querySelector('#status').className.indexOf('busy') < 0`, null, { timeout: 60_000 });
    await settledHere();
    let r = await rep();
    expect(r.settings.loads).toBe(LOADS);
    expect(r.structure?.loadsFile).toBe(LOADS);
    expect(r.checks.map((c) => c.id)).toEqual(expect.arrayContaining(['stiffness-change', 'load-path']));
    expect(await command(lp)).toBe(`rhoform build ${DEMO} --cell-size 2 --passive ${PASSIVE} --loads ${LOADS} --process waterjet-cut --thickness 8 --out-dir ${join(dir, 'loads')}`);
    // the same summary, check table and stress caption as the HTML report rhoform build writes
    let cliFiles = buildAsShown(await command(lp));
    const reportPage = await context.newPage();
    const shown = async (p: Page, caption: string) => ({
      result: await p.locator('.result').innerText(),
      checks: await p.locator('table.checks').innerText(),
      caption: (await p.locator(caption).innerText()).replace(/^Figure \d+\. /, ''),
    });
    await reportPage.setContent(cliFiles.html, { waitUntil: 'load' });
    expect(await shown(lp, '#stress-info .caption')).toEqual(await shown(reportPage, '#fig-stress figcaption'));
    expect(await lp.locator('#report pre.structure').innerText()).toContain(`Structural re-check (--loads ${LOADS}; plane stress, E 70000 MPa`);
    let got = await files(lp);
    for (const f of Object.keys(SUFFIX) as (keyof Files)[]) expect(comparable(f, got[f]) === comparable(f, cliFiles[f]), `${f}: ${firstDiff(comparable(f, got[f]), comparable(f, cliFiles[f]))}`).toBe(true);
    await lp.screenshot({ path: join(OUT, 'preview-stress.png') });

    // the stress layer hides and shows again
    const view = () => lp.locator('#view').screenshot();
    const base = await view();
    expect(await lp.isVisible('#stress-layer')).toBe(true);
    await lp.click('#layer-stress');
    expect(await lp.isHidden('#stress-layer')).toBe(true);
    expect(await lp.isHidden('#stress-info')).toBe(true);
    expect((await view()).equals(base)).toBe(false);
    await lp.click('#layer-stress');
    expect(await lp.isVisible('#stress-layer')).toBe(true);
    expect((await view()).equals(base)).toBe(true);

    // an allowable stress below the peak: peak-stress appears and fails, the summary and the command line follow
    const peak = r.structure!.designs.final.peakStress!.value;
    const allowable = String(Math.floor(peak / 2));
    let v = Number(await lp.evaluate('document.body.dataset.result'));
    await lp.fill('#ctl-allowableStress', allowable);
    await lp.press('#ctl-allowableStress', 'Enter');
    await lp.waitForFunction(`Number(document.body.dataset.result) > ${v}`, null, { timeout: 60_000 });
    await settledHere();
    r = await rep();
    const ps = r.checks.find((c) => c.id === 'peak-stress')!;
    expect(ps.status).toBe('fail');
    expect(ps.limit).toBe(Number(allowable));
    expect(r.summary.status).toBe('fail');
    expect(await lp.locator('#report .result').innerText()).toContain(`${r.summary.fail} failed`);
    expect(await command(lp)).toContain(`--loads ${LOADS} `);
    expect(await command(lp)).toContain(` --allowable-stress ${allowable} `);
    expect(await lp.locator('#stress-info').innerText()).toContain(`allowable ${allowable} MPa`);
    cliFiles = buildAsShown(await command(lp));
    got = await files(lp);
    for (const f of Object.keys(SUFFIX) as (keyof Files)[]) expect(comparable(f, got[f]) === comparable(f, cliFiles[f]), `${f}: ${firstDiff(comparable(f, got[f]), comparable(f, cliFiles[f]))}`).toBe(true);

    // the volume target moves the outline and so the stiffness change (measured latencies printed at the end)
    for (const target of ['0.30', '0.42', '0.36']) {
      v = Number(await lp.evaluate('document.body.dataset.result'));
      const before = (await rep()).checks.find((c) => c.id === 'stiffness-change')!.measured;
      await lp.evaluate(`(() => {
        const t = (window.__lat = { at: performance.now(), outline: null, checks: null, result: null, waiting: false });
        const o0 = document.body.dataset.outline, c0 = document.body.dataset.checks, r0 = document.body.dataset.result;
        new MutationObserver((_, obs) => {
          const now = performance.now();
          if (t.outline === null && document.body.dataset.outline !== o0) t.outline = now;
          if (t.checks === null && document.body.dataset.checks !== c0) {
            t.checks = now;
            t.waiting = document.querySelector('#report').shadowRoot.querySelector('#waiting') !== null;
          }
          if (t.result === null && document.body.dataset.result !== r0) { t.result = now; obs.disconnect(); }
        }).observe(document.body, { attributes: true });
      })()`);
      await lp.fill('#ctl-volumeFraction', target);
      await lp.press('#ctl-volumeFraction', 'Enter');
      await lp.waitForFunction(`Number(document.body.dataset.result) > ${v}`, null, { timeout: 60_000 });
      const t = (await lp.evaluate('window.__lat')) as { at: number; outline: number; checks: number; result: number; waiting: boolean };
      latency.loadsOutline.push(t.outline - t.at);
      latency.loadsChecks.push(t.checks - t.at);
      latency.loadsRecheck.push(t.result - t.at);
      // the checks came before the re-check, marked as waiting for it (unless the full result came at once)
      expect(t.checks).toBeLessThanOrEqual(t.result);
      if (t.checks < t.result) expect(t.waiting).toBe(true);
      expect(await lp.locator('#report #waiting').count()).toBe(0);
      expect((await rep()).checks.find((c) => c.id === 'stiffness-change')!.measured).not.toBe(before);
    }

    // the re-check off: no structure, no stress layer, no --loads; on again: back
    v = Number(await lp.evaluate('document.body.dataset.result'));
    await lp.click('#ctl-loads');
    await lp.waitForFunction(`Number(document.body.dataset.result) > ${v}`, null, { timeout: 60_000 });
    await settledHere();
    r = await rep();
    expect(r.structure).toBeUndefined();
    expect(r.checks.map((c) => c.id)).not.toContain('stiffness-change');
    expect(await command(lp)).not.toContain('--loads');
    expect(await command(lp)).not.toContain('--allowable-stress');
    expect(await lp.isHidden('#stress-layer')).toBe(true);
    expect(await lp.isChecked('#ctl-loads')).toBe(false);
    expect(await lp.isDisabled('#ctl-allowableStress')).toBe(true);
    v = Number(await lp.evaluate('document.body.dataset.result'));
    await lp.click('#ctl-loads');
    await lp.waitForFunction(`Number(document.body.dataset.result) > ${v}`, null, { timeout: 60_000 });
    await settledHere();
    expect((await rep()).structure?.loadsFile).toBe(LOADS);
    expect(await lp.isVisible('#stress-layer')).toBe(true);
    await reportPage.close();
    await lp.close();
  });

  it('made no request but the pages and their workers, and logged no error', () => {
    expect(log.consoleErrors).toEqual([]);
    expect(log.pageErrors).toEqual([]);
    expect(log.sockets).toEqual([]);
    expect(log.failed).toEqual([]);
    const own = new Set(pages.map((p) => pathToFileURL(p).href));
    const other = log.requests.filter((u) => !own.has(u) && !u.startsWith('blob:'));
    expect(other).toEqual([]);
    // the build ran in a worker started from a Blob URL (no file, no network)
    expect(page.workers().map((w) => w.url().slice(0, 5))).toEqual(['blob:']);
  });
});
