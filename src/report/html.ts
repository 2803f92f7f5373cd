/**
 * The HTML report: one self-contained page (no network), a pure function of one Report plus the pictures
 * the pipeline drew (SVG strings, embedded as data URLs).
 */
import type { Report } from '../types.js';
import { fmt, pct } from './number.js';

export interface HtmlPictures {
  /** The final outline as a standalone SVG document. */
  readonly outlineSvg?: string;
}

export function escapeHtml(s: string): string {
  return s.replace(/[&<>"']/g, (ch) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[ch] as string);
}

function dataUrl(svg: string): string {
  return `data:image/svg+xml;base64,${Buffer.from(svg, 'utf8').toString('base64')}`;
}

function table(rows: readonly (readonly [string, string])[]): string {
  return `<table>${rows.map(([k, v]) => `<tr><th>${escapeHtml(k)}</th><td>${escapeHtml(v)}</td></tr>`).join('')}</table>`;
}

function settingValue(v: unknown): string {
  if (v === null) return 'auto';
  if (Array.isArray(v)) return v.join(', ');
  return String(v);
}

export function formatHtml(r: Report, pictures: HtmlPictures = {}): string {
  const t = r.threshold;
  const g = r.geometry;
  const s = r.smoothing;
  const title = `rhoform report — ${r.input.file}`;
  const checks =
    r.checks.length === 0
      ? '<p>No manufacturability checks were requested for this run.</p>'
      : `<table class="checks"><tr><th>status</th><th>check</th><th>measured</th><th>limit</th><th>message</th></tr>${r.checks
          .map(
            (c) =>
              `<tr class="${c.status}"><td>${c.status}</td><td>${escapeHtml(c.id)}</td><td>${fmt(c.measured)} ${c.unit}</td><td>${c.comparison} ${fmt(c.limit)} ${c.unit}</td><td>${escapeHtml(c.message)}</td></tr>`,
          )
          .join('')}</table>`;
  const cells = r.settings.values === 'nodes' ? [r.input.nx - 1, r.input.ny - 1] : [r.input.nx, r.input.ny];
  const domain = `${fmt(cells[0] * r.input.cellSize[0])} × ${fmt(cells[1] * r.input.cellSize[1])} mm`;
  const picture = pictures.outlineSvg
    ? `<figure><img alt="final outline" src="${dataUrl(pictures.outlineSvg)}"><figcaption>Final outline over the ${domain} domain (material filled, holes cut).</figcaption></figure>`
    : '';
  const result =
    r.checks.length === 0
      ? '<p>Geometry and report written; no manufacturability checks ran.</p>'
      : `<p>Result: <span class="status ${r.summary.status}">${r.summary.status.toUpperCase()}</span> — ${r.summary.pass} passed, ${r.summary.warn} warned, ${r.summary.fail} failed.</p>`;
  return `<!DOCTYPE html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>${escapeHtml(title)}</title>
<style>
body{font:15px/1.45 system-ui,sans-serif;margin:2rem auto;max-width:1100px;padding:0 1rem;color:#1d232b}
h1{font-size:1.4rem}h2{font-size:1.1rem;margin-top:2rem;border-bottom:1px solid #d6dbe1}
table{border-collapse:collapse;margin:.5rem 0}th,td{text-align:left;padding:.2rem .8rem .2rem 0;vertical-align:top}
th{font-weight:600;color:#47505c}figure{margin:1rem 0}img{max-width:100%;border:1px solid #d6dbe1;background:#fff}
.status{font-weight:700;padding:.1rem .5rem;border-radius:3px}.pass{color:#17692c}.warn{color:#8a5a00}.fail{color:#a11b1b}
.cautions{background:#fff6e5;border-left:4px solid #d08c00;padding:.6rem 1rem}
</style></head><body>
<h1>${escapeHtml(title)}</h1>
${result}
<div class="cautions"><strong>Cautions</strong><ul>${r.cautions.map((c) => `<li>${escapeHtml(c)}</li>`).join('')}</ul></div>
${picture}
<h2>Threshold</h2>
${table([
  ['mode', t.mode],
  ['level', t.level === null ? '–' : fmt(t.level, 6)],
  ['target volume fraction', pct(t.targetFraction)],
  ['achieved (polygon area)', pct(t.achievedFraction)],
  ['cells at or above the level', pct(t.pixelFraction)],
])}
<h2>Geometry</h2>
${table([
  ['polygons / holes', `${g.polygons} / ${g.holes}`],
  ['area', `${fmt(g.area, 6)} mm²`],
  ['perimeter', `${fmt(g.perimeter, 6)} mm`],
  ['vertices', `${g.vertices} (raw contour ${s.rawVertices})`],
  ['largest deviation from the raw contour', `${fmt(s.maxDeviation, 3)} mm (budget ${fmt(s.tolerance, 3)} mm)`],
  ['bounding box', `${g.bbox.map((v) => fmt(v)).join(', ')} mm`],
])}
<h2>Checks</h2>
${checks}
<h2>Input</h2>
${table([
  ['file', r.input.file],
  ['format', r.input.format],
  ['size', `${r.input.nx} × ${r.input.ny}`],
  ['cell size', `${r.input.cellSize.map((v) => fmt(v)).join(' × ')} mm`],
  ['range', `${fmt(r.input.min)} … ${fmt(r.input.max)}`],
  ['mean', fmt(r.input.mean, 6)],
  ['grey level M_nd', `${fmt(r.input.greyLevel, 3)} %`],
  ['non-finite values', String(r.input.nonFinite)],
  ['sha256', r.input.sha256],
])}
<h2>Settings</h2>
${table(Object.entries(r.settings).map(([k, v]) => [k, settingValue(v)] as const))}
${r.warnings.length ? `<h2>Warnings</h2><ul>${r.warnings.map((w) => `<li>${escapeHtml(w)}</li>`).join('')}</ul>` : ''}
<p><small>${escapeHtml(r.tool.name)} ${escapeHtml(r.tool.version)}</small></p>
</body></html>
`;
}
