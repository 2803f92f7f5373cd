/**
 * The terminal report: a few aligned lines a person reads at a glance. Pure function of one Report;
 * colour only when asked (the CLI decides: a TTY, no NO_COLOR, no --no-color).
 */
import type { Report } from '../types.js';
import { fmt, pct } from './number.js';

export interface TextOptions {
  readonly color: boolean;
}

const paint = (on: boolean, code: string, s: string): string => (on ? `\u001b[${code}m${s}\u001b[0m` : s);

export function formatText(r: Report, opts: TextOptions): string {
  const c = opts.color;
  const rows: [string, string][] = [];
  const [hx, hy] = r.input.cellSize;
  const cell = hx === hy ? `${fmt(hx)} mm` : `${fmt(hx)}×${fmt(hy)} mm`;
  const defaulted = r.settings.cellSizeDefaulted === true ? ' (default; set --cell-size)' : '';
  rows.push(['input', `${r.input.file}: ${r.input.nx}×${r.input.ny} ${r.input.format.toUpperCase()}, cell ${cell}${defaulted}, M_nd ${fmt(r.input.greyLevel, 3)} %`]);
  const t = r.threshold;
  const how = t.mode === 'volume' ? 'volume-preserving' : t.mode === 'level' ? 'fixed by --level' : 'constant field';
  rows.push([
    'threshold',
    `level ${t.level === null ? '–' : fmt(t.level, 6)} (${how}); volume target ${pct(t.targetFraction)}, achieved ${pct(t.achievedFraction)}, cells ${pct(t.pixelFraction)}`,
  ]);
  const g = r.geometry;
  rows.push([
    'geometry',
    `${g.polygons} polygon${g.polygons === 1 ? '' : 's'}, ${g.holes} hole${g.holes === 1 ? '' : 's'}, ${g.vertices} vertices; area ${fmt(g.area, 6)} mm², perimeter ${fmt(g.perimeter, 6)} mm`,
  ]);
  const sm = r.smoothing;
  const dA = sm.rawArea > 0 ? (sm.area - sm.rawArea) / sm.rawArea : 0;
  rows.push([
    'outline',
    `largest deviation from the raw contour ${fmt(sm.maxDeviation, 3)} mm (budget ${fmt(sm.tolerance, 3)} mm); area change ${(100 * dA).toFixed(3)} %; vertices ${sm.rawVertices} → ${sm.vertices}`,
  ]);
  for (const ch of r.checks) {
    const st = ch.status === 'pass' ? paint(c, '32', 'pass') : ch.status === 'warn' ? paint(c, '33', 'warn') : paint(c, '31', 'FAIL');
    rows.push([st, `${ch.id}: ${fmt(ch.measured)} ${ch.comparison} ${fmt(ch.limit)} ${ch.unit} — ${ch.message}`]);
  }
  for (const o of r.outputs) rows.push(['wrote', o.file]);
  const s = r.summary;
  if (r.checks.length === 0) {
    rows.push(['result', 'geometry and report written; no manufacturability checks ran']);
  } else {
    const status = s.status === 'pass' ? paint(c, '32;1', 'PASS') : s.status === 'warn' ? paint(c, '33;1', 'WARN') : paint(c, '31;1', 'FAIL');
    rows.push(['result', `${status}: ${s.pass} passed, ${s.warn} warned, ${s.fail} failed`]);
  }
  const width = Math.max(...rows.map(([k]) => k.replace(/\u001b\[[0-9;]*m/g, '').length));
  const lines = rows.map(([k, v]) => `${k}${' '.repeat(width - k.replace(/\u001b\[[0-9;]*m/g, '').length)}  ${v}`);
  lines.push('');
  for (const caution of r.cautions) lines.push(paint(c, '2', `caution: ${caution}`));
  return `${lines.join('\n')}\n`;
}
