/**
 * A preview page in Firefox (headless, Debian's firefox-esr), driven over WebDriver BiDi on the loopback
 * interface: waits for rhoformPreview.ready, compares files() with what `rhoform build` wrote (the JSON report
 * without its run figures: timings, peakMemory, the re-check's solver seconds), applies a change
 * and a bad value, and saves a screenshot. Not part of `npm test` (CI has no Firefox); run by hand:
 *
 *   rhoform preview G.npy [options] --out-dir D && rhoform build G.npy [same options] --out-dir D
 *   node --experimental-websocket scripts/preview-firefox.mjs D/G.preview.html shot.png D/G
 *
 * Node 20 has WebSocket behind --experimental-websocket. docs/preview.md, "Browsers".
 */
import { spawn } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
const [page, shot, cliBase] = process.argv.slice(2);
const profile = mkdtempSync(join(tmpdir(), 'ff-'));
// port 0: Firefox picks a free port and names it on stderr ("WebDriver BiDi listening on ws://127.0.0.1:N")
const ff = spawn('firefox', ['--headless', '--remote-debugging-port', '0', '--profile', profile, '--no-remote'], { stdio: ['ignore', 'ignore', 'pipe'] });
let err = '';
const url = await new Promise((res, rej) => {
  const t = setTimeout(() => rej(new Error(`Firefox did not start: ${err.slice(0, 500)}`)), 30_000);
  ff.stderr.on('data', (d) => {
    err += d;
    const m = /WebDriver BiDi listening on (ws:\/\/[^\s]+)/.exec(err);
    if (m) { clearTimeout(t); res(m[1]); }
  });
});
const ws = new WebSocket(`${url}/session`);
await new Promise((res, rej) => { ws.onopen = res; ws.onerror = (e) => rej(new Error('ws error ' + err.slice(0, 500))); });
let id = 0; const pending = new Map(); const logs = [];
ws.onmessage = (e) => { const m = JSON.parse(e.data); if (m.id && pending.has(m.id)) { pending.get(m.id)(m); pending.delete(m.id); } else if (m.method === 'log.entryAdded') logs.push(`${m.params.level}: ${m.params.text}`); };
const call = (method, params) => new Promise((res) => { const i = ++id; pending.set(i, res); ws.send(JSON.stringify({ id: i, method, params })); });
const ok = (m) => { if (m.type === 'error' || m.error) throw new Error(JSON.stringify(m).slice(0, 800)); return m.result; };
ok(await call('session.new', { capabilities: {} }));
ok(await call('session.subscribe', { events: ['log.entryAdded'] }));
const tree = ok(await call('browsingContext.getTree', {}));
const context = tree.contexts[0].context;
ok(await call('browsingContext.setViewport', { context, viewport: { width: 1280, height: 900 } }));
const t0 = Date.now();
ok(await call('browsingContext.navigate', { context, url: 'file://' + page, wait: 'complete' }));
const ev = async (expression) => { const r = ok(await call('script.evaluate', { expression, target: { context }, awaitPromise: true })); if (r.type === 'exception') throw new Error(JSON.stringify(r.exceptionDetails).slice(0, 800)); return r.result.value; };
console.log('ready', await ev('window.rhoformPreview.ready.then(() => JSON.stringify(window.rhoformPreview.report().summary))'), Date.now() - t0, 'ms');
const files = JSON.parse(await ev('window.rhoformPreview.files().then((f) => JSON.stringify(f))'));
const suf = { dxf: '.dxf', svg: '.svg', json: '.report.json', html: '.report.html' };
// the JSON report's run figures (timings, peakMemory, the re-check's solver seconds) differ between any two runs
const runFigures = (t) =>
  t.replace(/,\n {2}"timings": \{[^}]*\}(?:,\n {2}"peakMemory": [0-9]+)?\n\}\n$/, '\n}\n').replace(/("seconds": )[0-9.e+-]+/g, '$1…');
for (const k of Object.keys(suf)) {
  const same = k === 'json' ? runFigures(files[k]) === runFigures(readFileSync(cliBase + suf[k], 'utf8')) : files[k] === readFileSync(cliBase + suf[k], 'utf8');
  console.log(k, same ? `identical to the CLI${k === 'json' ? ' (run figures aside)' : ''}` : 'DIFFERS');
}
console.log('apply', await ev('window.rhoformPreview.apply({ minMember: 6, repair: [] }).then((r) => JSON.stringify(r.summary))'));
console.log('bad', await ev('window.rhoformPreview.apply({ minMember: "abc" }).then(() => "accepted?!", (e) => e.code + ": " + e.message)'));
await ev('new Promise((r) => setTimeout(r, 1500))');
const s = ok(await call('browsingContext.captureScreenshot', { context }));
writeFileSync(shot, Buffer.from(s.data, 'base64'));
console.log('logs', JSON.stringify(logs));
ws.close();
ff.kill();
rmSync(profile, { recursive: true, force: true });
