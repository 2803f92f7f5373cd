/**
 * The HTML report: one self-contained page (no network, no script; pictures as inline SVG and PNG data
 * URLs), a pure function of one Report plus optional picture data. Lengths in mm, report frame y up with
 * the origin at the lower-left corner of the grid.
 */
import type { CheckResult, Report } from '../types.js';
import { escapeHtml } from './escape.js';
import { figuresHtml, type HtmlPictures } from './figures.js';
import { numberFindings, type NumberedFinding } from '../check/findings.js';
import { fmt, pct } from './number.js';
import { PAGE_CSS } from './page-style.js';
import { limitText, processLimits, resolutionText, withUnit } from './units.js';

export { escapeHtml } from './escape.js';
export type { HtmlPictures } from './figures.js';

const e = escapeHtml;

function kv(rows: readonly (readonly [string, string])[]): string {
  return `<table class="kv">${rows.map(([k, v]) => `<tr><th>${e(k)}</th><td>${e(v)}</td></tr>`).join('')}</table>`;
}

function settingValue(v: unknown): string {
  if (v === null || v === undefined) return '— (not set)';
  if (Array.isArray(v)) return v.map((x) => String(x)).join(', ');
  if (typeof v === 'object') return JSON.stringify(v);
  return String(v);
}

const STATUS_WORD = { pass: 'PASS', warn: 'WARN', fail: 'FAIL' } as const;

function badge(status: CheckResult['status']): string {
  return `<span class="badge ${status}">${STATUS_WORD[status]}</span>`;
}

/** " — after repair (before: 2 failed, 0 warned)" when the checks are those of repaired geometry; else empty. */
function repairNote(r: Report): string {
  const b = r.checksBeforeRepair;
  if (!b) return '';
  const fail = b.filter((c) => c.status === 'fail').length;
  const warn = b.filter((c) => c.status === 'warn').length;
  return ` — after <a href="#repairs">repair</a> (before: ${fail} failed, ${warn} warned)`;
}

function header(r: Report, findings: readonly NumberedFinding[]): string {
  const s = r.summary;
  const result =
    r.checks.length === 0
      ? '<p class="result"><span class="badge none">NO CHECKS</span> Geometry and report written; no manufacturability checks ran.</p>'
      : `<p class="result">${badge(s.status)} ${r.checks.length} check${r.checks.length === 1 ? '' : 's'}: ${s.pass} passed, ${s.warn} warned, ${s.fail} failed` +
        `${findings.length > 0 ? `; ${findings.length} located finding${findings.length === 1 ? '' : 's'}` : ''}${repairNote(r)}.</p>`;
  const t = r.threshold;
  const g = r.geometry;
  const [hx, hy] = r.input.cellSize;
  const nodes = r.settings.values === 'nodes';
  const cells = nodes ? [r.input.nx - 1, r.input.ny - 1] : [r.input.nx, r.input.ny];
  const key: [string, string][] = [
    ['grid', `${r.input.nx} × ${r.input.ny} ${nodes ? 'nodes' : 'cells'}`],
    ['cell', hx === hy ? `${fmt(hx)} mm${r.settings.cellSizeDefaulted === true ? ' (default)' : ''}` : `${fmt(hx)} × ${fmt(hy)} mm`],
    ['domain', `${fmt(cells[0] * hx)} × ${fmt(cells[1] * hy)} mm`],
    ['level', t.level === null ? '–' : fmt(t.level, 5)],
    ['volume target', pct(t.targetFraction, 2)],
    ['achieved', pct(t.achievedFraction, 2)],
    // after repair the part written holds another volume: its tile beside the threshold's (docs/output-formats.md)
    ...(r.checksBeforeRepair ? [['final (after repair)', pct(g.finalFraction, 2)] as [string, string]] : []),
    ['pieces / holes', `${g.polygons} / ${g.holes}`],
    ['area', `${fmt(g.area, 5)} mm²`],
    ['grey level M_nd', `${fmt(r.input.greyLevel, 3)} %`],
  ];
  return (
    `<header><h1>rhoform report <span class="file">${e(r.input.file)}</span></h1>${result}` +
    `<dl class="keys">${key.map(([k, v]) => `<div><dt>${e(k)}</dt><dd>${e(v)}</dd></div>`).join('')}</dl></header>`
  );
}

function cautionsBox(r: Report): string {
  const proc = r.settings.process;
  const preset =
    typeof proc === 'string' && proc !== ''
      ? `<p><strong>Process preset ${e(proc)}:</strong> limits used ${e(processLimits(r.settings))}. These are generic starting values; the limits of your fabricator, machine and material govern.</p>`
      : '';
  return `<section class="cautions"><h2>Cautions</h2>${preset}<ul>${r.cautions.map((c) => `<li>${e(c)}</li>`).join('')}</ul></section>`;
}

function checksTable(r: Report): string {
  if (r.checks.length === 0) return '<h2 id="checks">Checks</h2><p>No manufacturability checks were requested for this run.</p>';
  const before = r.checksBeforeRepair ? new Map(r.checksBeforeRepair.map((c) => [c.id, c] as const)) : null;
  const rows = r.checks.map((c) => {
    const b = before?.get(c.id);
    const beforeCell = before ? `<td class="n">${b ? `${badge(b.status)} ${e(withUnit(b.measured, b.unit))}` : '–'}</td>` : '';
    return (
      `<tr class="${c.status}"><td>${badge(c.status)}</td><td class="id">${e(c.id)}</td>${beforeCell}<td class="n">${e(withUnit(c.measured, c.unit))}</td>` +
      `<td class="n">${e(limitText(c))}</td><td class="n">${e(resolutionText(c))}</td><td>${e(c.method)}</td><td>${e(c.message)}</td></tr>`
    );
  });
  const intro = before
    ? '<p>The checks of the repaired geometry (the files written); the column <em>before repair</em> gives each check on the outline before <code>--repair</code>.</p>'
    : '';
  return (
    `<h2 id="checks">Checks</h2>${intro}<table class="grid checks"><thead><tr><th>status</th><th>check</th>${before ? '<th>before repair</th>' : ''}<th>measured</th><th>limit</th>` +
    `<th>resolution</th><th>method</th><th>message</th></tr></thead><tbody>${rows.join('')}</tbody></table>`
  );
}

function findingsTable(r: Report, findings: readonly NumberedFinding[]): string {
  if (findings.length === 0) return '';
  const unitOf = new Map(r.checks.map((c) => [c.id, c.unit] as const));
  const rows = findings.map((f) => {
    const L = f.location;
    return (
      `<tr id="finding-${f.n}" class="${f.status}"><td class="n">${f.n}</td><td>${badge(f.status)} ${e(f.checkId)}</td>` +
      `<td class="n">${e(fmt(L.x))}</td><td class="n">${e(fmt(L.y))}</td><td class="n">${L.fileRow} / ${L.fileCol}</td>` +
      `<td class="n">${e(withUnit(L.measured, unitOf.get(f.checkId) ?? '1'))}</td></tr>`
    );
  });
  const more = r.checks
    .filter((c) => c.status !== 'pass' && c.locationsTotal > c.locations.length)
    .map((c) => `<li>${e(c.id)}: ${c.locationsTotal - c.locations.length} more place${c.locationsTotal - c.locations.length === 1 ? '' : 's'} not listed (the ${c.locations.length} worst are)</li>`);
  return (
    '<h2 id="findings">Findings</h2><p>Worst first within each check; x, y in mm (y up, origin at the lower-left corner of the grid); ' +
    'row / column as in the input file, counted from 1.</p>' +
    '<table class="grid findings"><thead><tr><th>#</th><th>check</th><th>x mm</th><th>y mm</th><th>file row / col</th><th>measured</th></tr></thead>' +
    `<tbody>${rows.join('')}</tbody></table>${more.length > 0 ? `<ul class="more">${more.join('')}</ul>` : ''}`
  );
}

function repairsSection(r: Report): string {
  if (r.repairs.length === 0) return '';
  const rows = r.repairs.map(
    (p, k) =>
      `<tr id="repair-${k + 1}"><td class="n">R${k + 1}</td><td class="id">${e(p.id)}</td><td>${e(p.checks.join(', '))}</td>` +
      `<td class="n">${p.skipped === null ? `${e(fmt(p.area, 5))} mm²` : '–'}</td><td class="n">${p.skipped === null ? p.locationsTotal : 0}</td>` +
      `<td>${p.skipped !== null ? e(`did nothing: ${p.skipped}`) : p.unresolved ? e(`not repaired: ${p.unresolved}`) : 'repaired'}</td></tr>`,
  );
  const f = r.finishing;
  const note = f
    ? `<p>Final area ${e(fmt(r.geometry.area, 6))} mm² (${e(fmt(f.areaChange, 5))} mm² after smoothing; volume fraction ${e(pct(r.geometry.finalFraction))}); ` +
      `largest distance of the final outline from the raw contour ${f.maxDeviation === null ? '–' : `${e(fmt(f.maxDeviation, 3))} mm`}. These are reported, not checked: repair changes stiffness and mass — re-analyse the final geometry.</p>`
    : '';
  return (
    '<h2 id="repairs">Repairs</h2><table class="grid repairs"><thead><tr><th>#</th><th>repair</th><th>for checks</th><th>area change</th><th>places</th><th>result</th></tr></thead>' +
    `<tbody>${rows.join('')}</tbody></table>${note}`
  );
}

/** Symmetry, passive regions and the change after smoothing, when any of them applied. */
function finishingSection(r: Report): string {
  const rows: [string, string][] = [];
  if (r.symmetry && r.symmetry.length > 0) {
    rows.push(['symmetry planes', r.symmetry.map((p) => `${p.axis} = ${fmt(p.at)} mm (${p.edge} edge)`).join('; ')]);
  }
  if (r.passive) {
    const p = r.passive;
    rows.push(['passive regions', `${p.file}: ${p.solid} solid, ${p.void} void`]);
    rows.push(['passive samples set', `${p.solidSamples} to 1, ${p.voidSamples} to 0`]);
    rows.push(['passive area change', `${fmt(p.area, 5)} mm²`]);
    rows.push(['true circles written', String(p.circles)]);
  }
  if (r.finishing) {
    rows.push(['area change after smoothing', `${fmt(r.finishing.areaChange, 5)} mm²`]);
    rows.push(['volume fraction change', `${fmt(100 * r.finishing.fractionChange, 4)} points`]);
    rows.push(['final deviation from the raw contour', `${r.finishing.maxDeviation === null ? '–' : `${fmt(r.finishing.maxDeviation, 3)} mm`} (reported, not checked)`]);
  }
  return rows.length > 0 ? `<section><h2>After smoothing</h2>${kv(rows)}</section>` : '';
}

function details(r: Report): string {
  const t = r.threshold;
  const g = r.geometry;
  const s = r.smoothing;
  const dA = s.rawArea > 0 ? (s.area - s.rawArea) / s.rawArea : 0;
  return (
    `<div class="cols"><section><h2>Threshold</h2>${kv([
      ['mode', t.mode],
      ['level', t.level === null ? '–' : fmt(t.level, 6)],
      ['target volume fraction', pct(t.targetFraction)],
      ['achieved (polygon area)', pct(t.achievedFraction)],
      ['cells at or above the level', pct(t.pixelFraction)],
      ['final fraction', pct(g.finalFraction)],
    ])}</section><section><h2>Geometry</h2>${kv([
      ['polygons / holes', `${g.polygons} / ${g.holes}`],
      ['area', `${fmt(g.area, 6)} mm²`],
      ['perimeter', `${fmt(g.perimeter, 6)} mm`],
      ['vertices', String(g.vertices)],
      ['bounding box', `${g.bbox.map((v) => fmt(v)).join(', ')} mm`],
    ])}</section><section><h2>Smoothing</h2>${kv([
      ['largest deviation from the raw contour', `${fmt(s.maxDeviation, 3)} mm`],
      ['deviation budget', `${fmt(s.tolerance, 3)} mm`],
      ['area raw → final', `${fmt(s.rawArea, 6)} → ${fmt(s.area, 6)} mm² (${(100 * dA).toFixed(3)} %)`],
      ['vertices raw → final', `${s.rawVertices} → ${s.vertices}`],
    ])}</section>${finishingSection(r)}<section><h2>Input</h2>${kv([
      ['file', r.input.file],
      ['format', r.input.format],
      ['size', `${r.input.nx} × ${r.input.ny}`],
      ['cell size', `${r.input.cellSize.map((v) => fmt(v)).join(' × ')} mm`],
      ['range', `${fmt(r.input.min)} … ${fmt(r.input.max)}`],
      ['mean', fmt(r.input.mean, 6)],
      ['grey level M_nd', `${fmt(r.input.greyLevel, 3)} %`],
      ['non-finite values', String(r.input.nonFinite)],
      ['sha256', r.input.sha256],
    ])}</section></div>`
  );
}

function listSection(title: string, items: readonly string[]): string {
  return items.length > 0 ? `<h2>${e(title)}</h2><ul>${items.map((w) => `<li>${e(w)}</li>`).join('')}</ul>` : '';
}

/**
 * The HTML report of `r`. `pictures` adds the figures (density with outline and numbered findings, local
 * thickness, volume-vs-level curve); each is left out when its data is missing. Finding numbers are those
 * of numberFindings (the same in the figures, the findings table, the text report and the DXF/SVG).
 */
export function formatHtml(r: Report, pictures: HtmlPictures = {}): string {
  const findings = numberFindings(r);
  const title = `rhoform report — ${r.input.file}`;
  return `<!DOCTYPE html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>${e(title)}</title>
<style>${PAGE_CSS}</style></head><body>
${header(r, findings)}
${cautionsBox(r)}
${figuresHtml(r, pictures, findings)}
${checksTable(r)}
${findingsTable(r, findings)}
${repairsSection(r)}
${details(r)}
<h2 id="settings">Settings</h2>
${kv(Object.entries(r.settings).map(([k, v]) => [k, settingValue(v)] as const))}
${listSection('Warnings', r.warnings)}
${listSection('Outputs', r.outputs.map((o) => `${o.file} (${o.format})`))}
<footer>${e(r.tool.name)} ${e(r.tool.version)} · lengths in mm, y up, origin at the lower-left corner of the grid</footer>
</body></html>
`;
}
