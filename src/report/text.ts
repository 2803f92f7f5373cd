/**
 * The terminal report: a short header, one row per check (status, id, measured / limit, message) with the
 * first numbered findings under a warned or failed check, a summary line, then the cautions and the files
 * written. Pure function of one Report; fits an 80–100 column terminal (long text wraps at 100 columns);
 * ANSI colour only when asked (the CLI decides: a TTY, no NO_COLOR, no --no-color).
 * Lengths in mm, report frame y up with the origin at the lower-left corner of the grid.
 */
import type { CheckResult, Report } from '../types.js';
import { numberFindings, type NumberedFinding } from './findings.js';
import { fmt, pct } from './number.js';
import { limitText, processLimits, withUnit } from './units.js';

export interface TextOptions {
  /** ANSI colour escapes; when false the text holds no ESC byte at all. */
  readonly color: boolean;
}

/** Findings listed under each warned or failed check; the rest are counted ("… and N more"). */
export const TEXT_FINDINGS_PER_CHECK = 3;
/** Column at which long lines wrap. */
export const TEXT_WIDTH = 100;

const ESC = '\u001b';
const paint = (on: boolean, code: string, s: string): string => (on ? `${ESC}[${code}m${s}${ESC}[0m` : s);
const visible = (s: string): number => s.replace(/\u001b\[[0-9;]*m/g, '').length;
const pad = (s: string, n: number): string => s + ' '.repeat(Math.max(0, n - visible(s)));

/** Word-wraps `text` to `width` columns; continuation lines start with `indent`. */
export function wrap(text: string, width: number, indent: string, first = ''): string[] {
  const lines: string[] = [];
  let line = first;
  let start = visible(first);
  // a number and its unit stay on one line: join them with U+00A0 while splitting, restore after
  const words = text.replace(/(\d) (%|mm²|mm\b)/g, '$1\u00a0$2').split(/[ \t\n]+/);
  for (const w of words.filter((x) => x !== '')) {
    const word = w.replace(/\u00a0/g, ' ');
    const len = visible(line);
    if (len > start && len + 1 + word.length > width) {
      lines.push(line);
      line = indent + word;
      start = indent.length;
    } else line = len > start ? `${line} ${word}` : line + word;
  }
  lines.push(line);
  return lines;
}

const STATUS_COLOR = { pass: '32', warn: '33', fail: '31' } as const;

function statusWord(on: boolean, s: CheckResult['status'], bold = false): string {
  return paint(on, `${STATUS_COLOR[s]}${bold ? ';1' : ''}`, s.toUpperCase());
}

/** The location line of one finding: `#3 x 120.5 y 40.2 mm (row 12, col 61) 1.52 mm`. */
export function findingLine(f: NumberedFinding, unit: CheckResult['unit']): string {
  const L = f.location;
  return `#${f.n} x ${fmt(L.x)} y ${fmt(L.y)} mm (row ${L.fileRow}, col ${L.fileCol}) ${withUnit(L.measured, unit)}`;
}

function headerRows(r: Report): [string, string][] {
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
  const proc = r.settings.process;
  if (typeof proc === 'string' && proc !== '') {
    rows.push(['process', `${proc}: limits used ${processLimits(r.settings)}. Generic values; your fabricator's limits govern.`]);
  }
  return rows;
}

function keyValueLines(rows: readonly (readonly [string, string])[], keyWidth: number): string[] {
  const out: string[] = [];
  const indent = ' '.repeat(keyWidth + 2);
  for (const [k, v] of rows) out.push(...wrap(v, TEXT_WIDTH, indent, pad(k, keyWidth) + '  '));
  return out;
}

function checkLines(r: Report, c: boolean): string[] {
  if (r.checks.length === 0) return ['No manufacturability checks ran (none were requested).'];
  const findings = numberFindings(r);
  const idW = Math.max(...r.checks.map((ch) => ch.id.length));
  const vals = r.checks.map((ch) => `${withUnit(ch.measured, ch.unit)} / ${limitText(ch)}`);
  const valW = Math.max(...vals.map((v) => v.length));
  const out: string[] = [];
  let k = 0; // next unread finding: numberFindings walks the checks in this same order
  r.checks.forEach((ch, i) => {
    const head = `  ${statusWord(c, ch.status)}  ${pad(ch.id, idW)}  ${pad(vals[i], valW)}  `;
    const indent = ' '.repeat(8);
    if (visible(head) + Math.min(ch.message.length, 30) <= TEXT_WIDTH) out.push(...wrap(ch.message, TEXT_WIDTH, ' '.repeat(visible(head)), head));
    else out.push(head.trimEnd(), ...wrap(ch.message, TEXT_WIDTH, indent, indent));
    if (ch.status === 'pass') return;
    const mine = findings.slice(k, k + ch.locations.length);
    k += ch.locations.length;
    const shown = mine.slice(0, TEXT_FINDINGS_PER_CHECK);
    for (const f of shown) out.push(`${indent}${paint(c, '2', findingLine(f, ch.unit))}`);
    const more = Math.max(ch.locationsTotal, ch.locations.length) - shown.length;
    if (more > 0) out.push(`${indent}${paint(c, '2', `… and ${more} more`)}`);
  });
  return out;
}

/** The summary line: status and counts, or that no checks ran. */
export function summaryLine(r: Report, color: boolean): string {
  if (r.checks.length === 0) return 'result     no manufacturability checks ran; geometry and report written';
  const s = r.summary;
  const n = numberFindings(r).length;
  return (
    `result     ${statusWord(color, s.status, true)}  ${r.checks.length} check${r.checks.length === 1 ? '' : 's'}: ` +
    `${s.pass} passed, ${s.warn} warned, ${s.fail} failed${n > 0 ? `; ${n} located finding${n === 1 ? '' : 's'}` : ''}`
  );
}

/** The terminal report of `r` (ends with a newline). Finding numbers are those of numberFindings. */
export function formatText(r: Report, opts: TextOptions): string {
  const c = opts.color;
  const head = headerRows(r);
  const keyW = Math.max(...head.map(([k]) => k.length), 'result'.length + 3);
  const lines = keyValueLines(head, keyW);
  lines.push('', ...checkLines(r, c), '', summaryLine(r, c), '');
  for (const caution of r.cautions) lines.push(...wrap(caution, TEXT_WIDTH, '         ', paint(c, '33', 'caution') + '  '));
  if (r.outputs.length > 0) {
    lines.push('');
    lines.push(...keyValueLines(r.outputs.map((o) => ['wrote', o.file] as const), keyW));
  }
  return `${lines.join('\n')}\n`;
}
