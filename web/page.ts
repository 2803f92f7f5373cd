/**
 * The preview page (docs/preview.md): controls, the plan view, the report panel and `window.rhoformPreview`
 * (DESIGN §13). The state is a set of command-line options parsed by the CLI's own parser; the worker runs
 * the library's `build` on the embedded grid and answers with the outline first, then the checks.
 */
import { RhoformError } from '../src/errors.js';
import { numberFindings } from '../src/check/findings.js';
import { fmt } from '../src/report/number.js';
import type { Report } from '../src/types.js';
import { Controls, type Change } from './page/controls.js';
import { ReportPanel } from './page/panel.js';
import { PAGE_STYLE } from './page/style.js';
import { LAYERS, PlanView, imageOf, ringsPath, type Scene } from './page/view.js';
import { buildCommand, optionWords, settingsOf, withChanges, type OptionWords } from './shared/options.js';
import { OUTPUT_SUFFIX, type Embedded, type FromWorker, type PicturesMessage, type ProgressMessage, type ReportMessage, type ToWorker } from './shared/protocol.js';

type Files = { dxf: string; svg: string; json: string; html: string };

interface PreviewApi {
  ready: Promise<void>;
  settings(): Record<string, unknown>;
  apply(changes: Record<string, unknown>): Promise<Report>;
  report(): Report;
  files(): Promise<Files>;
}

/** Grids above this many samples show the progress bar as soon as a build starts; smaller ones after PROGRESS_DELAY. */
const PROGRESS_CELLS = 200_000;
/** Milliseconds a build runs before the progress bar shows on a small grid (a quick change shows no flicker). */
const PROGRESS_DELAY = 300;

function el<K extends keyof HTMLElementTagNameMap>(tag: K, attrs: Record<string, string> = {}, text = ''): HTMLElementTagNameMap[K] {
  const e = document.createElement(tag);
  for (const [k, v] of Object.entries(attrs)) e.setAttribute(k, v);
  if (text) e.textContent = text;
  return e;
}

/** An error as the CLI prints it: a RhoformError keeps code and message; anything else is internal. */
function asError(code: string, message: string): RhoformError {
  const e = new RhoformError(code as RhoformError['code'], message);
  e.message = message;
  return e;
}

const data = JSON.parse(document.getElementById('rhoform-data')!.textContent!) as Embedded;
const stem = data.outputsBase.split('/').pop()!;

// ---- layout
const style = el('style');
style.textContent = PAGE_STYLE;
document.head.append(style);
const top = el('header', { class: 'top' });
top.append(el('h1', {}, 'rhoform preview '), el('span', { class: 'file' }, data.file));
const status = el('span', { class: 'status', id: 'status', role: 'status' }, 'starting…');
top.append(status);
const aside = el('aside', { id: 'controls' });
const main = el('main');
const toolbar = el('div', { class: 'toolbar' });
const layerBox = el('div', { class: 'layers' });
for (const l of LAYERS) {
  if (l.id === 'stress' && data.loads === null) continue;
  const id = `layer-${l.id}`;
  const cb = el('input', { type: 'checkbox', id });
  cb.checked = l.on;
  const lab = el('label', { for: id }, l.label);
  layerBox.append(cb, el('span', { class: `sw sw-${l.id}`, 'aria-hidden': 'true' }), lab);
  cb.addEventListener('change', () => {
    view.shown[l.id] = cb.checked;
    view.draw();
    legend();
  });
}
const fitBtn = el('button', { type: 'button', id: 'fit' }, 'Fit');
const key = el('div', { class: 'legend', id: 'legend' });
/** What the colours mean, for the layers shown. */
function legend(): void {
  const parts: string[] = [];
  if (view.shown.density) parts.push('density: white 0 … dark grey 1');
  if (view.shown.thickness && pics?.m.thickness) {
    const lim = result?.report.settings.minMember;
    parts.push(`local thickness 0 … ${fmt(pics.m.thicknessMax, 3)} mm (purple → yellow)${typeof lim === 'number' ? `, red below ${fmt(lim)} mm` : ''}`);
  } else if (view.shown.thickness) parts.push('no thickness map for these settings');
  if (view.shown.stress && pics?.m.stress) parts.push('stress: von Mises, MPa (scale below the view)');
  else if (view.shown.stress && data.loads !== null && result && typeof result.report.settings.loads !== 'string') parts.push('no stress: the structural re-check is off');
  if (view.shown.outline) parts.push('blue: outline written (orange while the checks run)');
  if (view.shown.repair && pics?.repaired) parts.push('green: material the repair changed, dashed grey: outline before repair');
  if (view.shown.passive && pics?.m.passive) parts.push('purple: passive solid, dashed orange: passive void');
  key.textContent = parts.join(' · ');
  showStressInfo();
}
/** The stress figure's colour bar and caption (the HTML report's), under the view while the stress layer shows. */
function showStressInfo(): void {
  const st = view.shown.stress ? pics?.m.stress ?? null : null;
  stressInfo.hidden = st === null;
  if (st === null || stressInfo.dataset.v === String(pics!.v)) return;
  stressInfo.dataset.v = String(pics!.v);
  stressInfo.innerHTML = `${st.legend}<p class="caption">${st.caption}</p>`; // the report module's HTML, escaped there
}
toolbar.append(layerBox, fitBtn);
const stage = el('div', { class: 'stage' });
const canvas = el('canvas', { id: 'view', 'aria-label': 'plan view of the part, report frame in mm' });
const progress = el('div', { class: 'progress', id: 'progress', role: 'progressbar', 'aria-label': 'build progress', 'aria-valuemin': '0', hidden: '' });
const progressBar = el('div', { class: 'bar' });
progress.append(progressBar);
const readout = el('div', { class: 'readout', id: 'readout' }, 'drag to pan · wheel to zoom · double-click to fit');
const stressInfo = el('div', { class: 'stress-info', id: 'stress-info', hidden: '' });
stage.append(canvas, progress);
const side = el('section', { class: 'side' });
const cmdBox = el('div', { class: 'cmd' });
const cmd = el('code', { id: 'command' });
const copyBtn = el('button', { type: 'button', id: 'copy' }, 'Copy');
cmdBox.append(el('span', { class: 'k' }, 'same files from the command line'), cmd, copyBtn);
const downloads = el('div', { class: 'downloads' });
downloads.append(el('span', { class: 'k' }, 'download'));
for (const f of ['dxf', 'svg', 'json', 'html'] as const) {
  const b = el('button', { type: 'button', id: `download-${f}`, 'data-format': f }, `${stem}${OUTPUT_SUFFIX[f]}`);
  b.addEventListener('click', () => void download(f));
  downloads.append(b);
}
const panelHost = el('div', { id: 'report' });
side.append(cmdBox, downloads, panelHost);
main.append(toolbar, key, stage, readout, stressInfo, side);
document.body.append(top, aside, main);

const view = new PlanView(canvas, readout);
fitBtn.addEventListener('click', () => view.fit());
const controls = new Controls(aside, data.passive !== null, data.loads !== null);
const panel = new ReportPanel(panelHost);

// ---- state
let words: OptionWords = optionWords(data.given); // the options of the result shown
let requested: OptionWords = words; // the options of the newest request
let result: ReportMessage | null = null; // the report shown
/** The pictures shown (paths and images made once per message). */
let pics: { v: number; m: PicturesMessage; outline: Path2D; beforeRepair: Path2D | null; repaired: Path2D | null; thickness: Scene['thickness'] } | null = null;
/** The newest outline, when newer than the pictures (the fast first answer, or the report's own). */
let newest: { v: number; path: Path2D } | null = null;
let version = 0;
const asked = new Map<number, { words: OptionWords; at: number; keys: readonly string[] }>();
const waiters: { v: number; resolve: (r: Report) => void; reject: (e: Error) => void }[] = [];
let filesCache: { v: number; files: Promise<Files> } | null = null;
const filesWaiters = new Map<number, { resolve: (f: Files) => void; reject: (e: Error) => void }>();
let density: Scene['density'] = null;
let grid: Scene['grid'] = null;
let readyResolve!: () => void;
let readyReject!: (e: Error) => void;
const ready = new Promise<void>((res, rej) => {
  readyResolve = res;
  readyReject = rej;
});

const workerUrl = URL.createObjectURL(new Blob([document.getElementById('rhoform-worker')!.textContent!], { type: 'text/javascript' }));
const worker = new Worker(workerUrl);
const send = (m: ToWorker) => worker.postMessage(m);

function setStatus(text: string, cls: string): void {
  status.textContent = text;
  status.className = `status ${cls}`;
}

let progressTimer: ReturnType<typeof setTimeout> | null = null;

function busy(): void {
  const a = asked.get(version);
  if (!a) return;
  setStatus('updating…', 'busy');
  progressBar.style.width = '0%';
  progress.removeAttribute('aria-valuenow');
  if (progressTimer !== null) clearTimeout(progressTimer);
  progressTimer = null;
  if (data.cells > PROGRESS_CELLS) progress.hidden = false;
  else progressTimer = setTimeout(() => (progress.hidden = false), PROGRESS_DELAY);
}

/** The newest request's build is over (its pictures are drawn, or it failed): the bar goes. */
function idle(): void {
  if (progressTimer !== null) clearTimeout(progressTimer);
  progressTimer = null;
  progress.hidden = true;
}

/** A stage of the newest request ended: the bar and the status line say how far it is. */
function onProgress(m: ProgressMessage): void {
  if (m.v !== version) return;
  progress.setAttribute('aria-valuemax', String(m.total));
  progress.setAttribute('aria-valuenow', String(m.done));
  progress.setAttribute('aria-valuetext', `${m.done} of ${m.total} steps done (${m.stage})`);
  progressBar.style.width = `${(100 * m.done) / m.total}%`;
  document.body.dataset.progress = `${m.v}:${m.done}/${m.total}`;
  if (!result || result.v < m.v) {
    const what = m.phase === 're-check' && document.body.dataset.checks === String(m.v) ? 'checks updated · structural re-check' : m.phase;
    setStatus(`${what}: ${m.done}/${m.total} steps done (${m.stage})…`, 'busy');
  }
}

/** Sends the options as a build request; returns its version. Throws the CLI's UsageError on a bad value. */
function request(next: OptionWords, keys: readonly string[]): number {
  const { settings } = settingsOf(data.file, next);
  const v = ++version;
  requested = next;
  asked.set(v, { words: next, at: performance.now(), keys });
  filesCache = null;
  send({ t: 'build', v, settings });
  busy();
  return v;
}

function change(changes: Change, keys: readonly string[]): Promise<Report> {
  const c: Record<string, unknown> = { ...changes };
  if (c.passive === 'embedded') c.passive = data.passive?.name ?? null;
  if (c.loads === 'embedded') c.loads = data.loads?.name ?? null;
  let v: number;
  try {
    v = request(withChanges(requested, c, result ? (result.report.settings as unknown as Record<string, unknown>) : null, data.passive?.name ?? null, data.loads?.name ?? null), keys);
  } catch (e) {
    const err = e instanceof RhoformError ? e : asError('E_INTERNAL', String(e));
    return Promise.reject(err);
  }
  return new Promise<Report>((resolve, reject) => waiters.push({ v, resolve, reject }));
}

controls.onChange = (c, keys) => {
  controls.clearErrors(keys);
  change(c, keys).catch((e: RhoformError) => {
    const k = controls.keyOfMessage(e.message);
    controls.showError(k && !keys.includes(k) ? [...keys, k] : keys, `${e.code}: ${e.message}`);
  });
};

function drawScene(): void {
  if (!pics) return;
  const fresh = newest !== null && newest.v > pics.v ? newest : null;
  view.setScene({
    domain: pics.m.domain,
    density,
    thickness: pics.thickness,
    outline: fresh?.path ?? pics.outline,
    outlineOnly: fresh !== null && (!result || result.v < fresh.v),
    beforeRepair: fresh ? null : pics.beforeRepair,
    repaired: fresh ? null : pics.repaired,
    passive: pics.m.passive,
    findings: result ? numberFindings(result.report) : [],
    grid,
    stress: pics.m.stress,
    stressStale: fresh !== null || (result !== null && result.v > pics.v),
  });
}

function onOutline(v: number, path: Path2D): void {
  if (newest && v <= newest.v) return;
  newest = { v, path };
  drawScene();
  document.body.dataset.outline = String(v);
}

function onPictures(m: PicturesMessage): void {
  if (m.density) density = imageOf(m.density);
  if (m.grid) grid = m.grid;
  pics = {
    v: m.v,
    m,
    outline: ringsPath(m.outline),
    beforeRepair: m.beforeRepair ? ringsPath(m.beforeRepair) : null,
    repaired: m.repaired ? ringsPath(m.repaired) : null,
    thickness: m.thickness ? imageOf(m.thickness) : null,
  };
  drawScene();
  if (!newest || m.v > newest.v) document.body.dataset.outline = String(m.v);
  document.body.dataset.pictures = String(m.v);
  if (m.v === version) idle();
  legend();
  settle();
}

function onReport(m: ReportMessage): void {
  const a = asked.get(m.v);
  result = m;
  words = a?.words ?? words;
  for (const k of [...asked.keys()]) if (k <= m.v) asked.delete(k);
  if (m.outline) onOutline(m.v, ringsPath(m.outline));
  else drawScene();
  document.body.dataset.result = String(m.v);
  document.body.dataset.checks = String(m.v);
  const r = m.report;
  controls.show(settingsOf(data.file, words).given as Record<string, unknown>, r.settings as unknown as Record<string, unknown>, r.threshold, r.settings.passive !== null, typeof r.settings.loads === 'string');
  panel.show(m.reportHtml, r);
  cmd.textContent = buildCommand(data.file, words, data.outDir);
  const took = a ? performance.now() - a.at : m.ms;
  if (m.v === version) {
    const word = { pass: 'PASS', warn: 'WARN', fail: 'FAIL' }[r.summary.status];
    setStatus(`${word} · ${r.checks.length} checks: ${r.summary.pass} passed, ${r.summary.warn} warned, ${r.summary.fail} failed · updated in ${fmt(took, 3)} ms`, r.summary.status);
    status.title = Object.entries(m.timings).map(([k, t]) => `${k} ${Math.round(t)} ms`).join(', ');
  }
  for (let k = waiters.length - 1; k >= 0; k--) {
    if (waiters[k].v <= m.v) {
      waiters[k].resolve(r);
      waiters.splice(k, 1);
    }
  }
  settle();
}

/** The first build is done when its report and its pictures are shown. */
function settle(): void {
  if (result && pics && document.body.dataset.ready !== 'true') {
    document.body.dataset.ready = 'true';
    readyResolve();
  }
}

function onError(v: number, code: string, message: string): void {
  const err = asError(code, message);
  if (v === 0) {
    setStatus(`cannot start: ${code}: ${message}`, 'fail');
    readyReject(err);
    return;
  }
  const a = asked.get(v);
  for (const k of [...asked.keys()]) if (k <= v) asked.delete(k);
  // back to the options of the result shown; the control keeps the bad value and shows why
  requested = words;
  if (a) {
    const k = controls.keyOfMessage(message);
    controls.showError(k ? [...new Set([...a.keys, k])] : a.keys, `${code}: ${message}`);
  }
  if (v === version) {
    idle();
    setStatus(`not updated: ${code}: ${message}`, 'fail');
  }
  for (let k = waiters.length - 1; k >= 0; k--) {
    if (waiters[k].v <= v) {
      waiters[k].reject(err);
      waiters.splice(k, 1);
    }
  }
  if (document.body.dataset.ready !== 'true') readyReject(err);
}

worker.onmessage = (e: MessageEvent<FromWorker>) => {
  const m = e.data;
  if (m.t === 'ready') {
    try {
      request(words, []);
    } catch (err) {
      onError(0, (err as RhoformError).code ?? 'E_INTERNAL', (err as Error).message);
    }
  } else if (m.t === 'outline') {
    if (result && m.v <= result.v) return;
    onOutline(m.v, ringsPath(m.outline));
    if (m.v === version) setStatus('outline updated · checking…', 'busy');
  } else if (m.t === 'report') {
    onReport(m);
  } else if (m.t === 'pictures') {
    onPictures(m);
  } else if (m.t === 'progress') {
    onProgress(m);
  } else if (m.t === 'checks') {
    // the checks without the structural re-check, while it runs: shown, marked; the state moves on with the report
    if (m.v !== version || (result && result.v >= m.v)) return;
    panel.show(m.reportHtml, m.report, true);
    document.body.dataset.checks = String(m.v);
    setStatus('checks updated · structural re-check running…', 'busy');
  } else if (m.t === 'files') {
    filesWaiters.get(m.v)?.resolve(m.files);
    filesWaiters.delete(m.v);
  } else if (m.t === 'error') {
    const fw = filesWaiters.get(m.v);
    if (fw) {
      fw.reject(asError(m.code, m.message));
      filesWaiters.delete(m.v);
    } else onError(m.v, m.code, m.message);
  }
};
worker.onerror = (e) => {
  e.preventDefault();
  onError(0, 'E_INTERNAL', e.message || 'the worker stopped');
};
send({ t: 'init', data });

panel.onFinding = (n) => {
  const f = result ? numberFindings(result.report).find((x) => x.n === n) : undefined;
  if (!f || !result) return;
  const [hx, hy] = result.report.input.cellSize;
  view.zoomTo(f.location.x, f.location.y, 16 * Math.max(hx, hy, f.location.measured || 0));
};
view.onFindingClick = (n) => panel.highlight(n);

function files(): Promise<Files> {
  if (!result) return Promise.reject(asError('E_INTERNAL', 'no result yet: await rhoformPreview.ready'));
  if (result.v !== version) {
    // a newer build is on its way: the files are those of the state the page is going to
    return new Promise<Files>((resolve, reject) => waiters.push({ v: version, resolve: () => files().then(resolve, reject), reject }));
  }
  const v = result.v;
  if (filesCache?.v === v) return filesCache.files;
  const p = new Promise<Files>((resolve, reject) => filesWaiters.set(v, { resolve, reject }));
  send({ t: 'files', v });
  filesCache = { v, files: p };
  return p;
}

async function download(f: keyof Files): Promise<void> {
  const all = await files();
  const type = { dxf: 'application/dxf', svg: 'image/svg+xml', json: 'application/json', html: 'text/html' }[f];
  const url = URL.createObjectURL(new Blob([all[f]], { type }));
  const a = el('a', { href: url, download: `${stem}${OUTPUT_SUFFIX[f]}` });
  document.body.append(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
}

copyBtn.addEventListener('click', async () => {
  const text = cmd.textContent ?? '';
  try {
    await navigator.clipboard.writeText(text);
  } catch {
    const range = document.createRange();
    range.selectNodeContents(cmd);
    const sel = getSelection();
    sel?.removeAllRanges();
    sel?.addRange(range);
    document.execCommand('copy');
  }
  copyBtn.textContent = 'Copied';
  setTimeout(() => (copyBtn.textContent = 'Copy'), 1500);
});

const api: PreviewApi = {
  ready,
  settings: () => structuredClone(result?.report.settings ?? {}),
  apply: (c) => {
    const keys = Object.keys(c ?? {}).flatMap((k) => controls.keysOf(k));
    controls.clearErrors(keys);
    const p = change(c, keys);
    p.catch((e: RhoformError) => {
      // shown where a user would look: the refused value in its control, with the CLI's message under it
      for (const [k, v] of Object.entries(c ?? {})) controls.showValue(k, v);
      if (keys.length > 0 || controls.keyOfMessage(e.message)) {
        const k = controls.keyOfMessage(e.message);
        controls.showError(k && !keys.includes(k) ? [...keys, k] : keys, `${e.code}: ${e.message}`);
      }
    });
    return p;
  },
  report: () => {
    if (!result) throw asError('E_INTERNAL', 'no report yet: await rhoformPreview.ready');
    return structuredClone(result.report);
  },
  files,
};
(window as unknown as { rhoformPreview: PreviewApi }).rhoformPreview = api;
