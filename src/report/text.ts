/**
 * The terminal report: a short header, one row per check (status, id, measured / limit, message) with the
 * first numbered findings under a warned or failed check, a summary line, then the cautions and the files
 * written. Pure function of one Report; fits an 80–100 column terminal (long text wraps at 100 columns);
 * ANSI colour only when asked (the CLI decides: a TTY, no NO_COLOR, no --no-color).
 * Lengths in mm, report frame y up with the origin at the lower-left corner of the grid.
 */
import type { CheckResult, Report } from '../types.js';
import { numberFindings, type NumberedFinding } from '../check/findings.js';
import { fmt, pct } from './number.js';
import { structureLines } from './structure-text.js';
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
    `level ${t.level === null ? '–' : fmt(t.level, 6)} (${how}); volume target ${pct(t.targetFraction)}, achieved ${pct(t.achievedFraction)}` +
      `${r.checksBeforeRepair ? `, final ${pct(r.geometry.finalFraction)} (after repair)` : ''}, cells ${pct(t.pixelFraction)}`,
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
  if (r.symmetry && r.symmetry.length > 0) {
    const planes = r.symmetry.map((p) => `${p.axis} = ${fmt(p.at)} mm (${p.edge} edge)`).join(' and ');
    rows.push(['symmetry', `unfolded about ${planes}; the outline is exactly symmetric`]);
  }
  if (r.passive) {
    const p = r.passive;
    rows.push([
      'passive',
      `${p.file}: ${p.solid} solid and ${p.void} void region${p.solid + p.void === 1 ? '' : 's'} (cells set: ${p.solidSamples} solid, ${p.voidSamples} void); exact booleans changed the area by ${signed(p.area)} mm²${p.circles > 0 ? `; ${p.circles} true circle${p.circles === 1 ? '' : 's'} written` : ''}`,
    ]);
  }
  if (r.finishing) {
    const f = r.finishing;
    rows.push([
      'final',
      `area ${fmt(g.area, 6)} mm² (${signed(f.areaChange)} mm² after smoothing), fraction ${pct(g.finalFraction)} (${signed(100 * f.fractionChange, 3)} points); largest deviation from the raw contour ${f.maxDeviation === null ? '–' : `${fmt(f.maxDeviation, 3)} mm`} — reported, not checked`,
    ]);
  }
  const proc = r.settings.process;
  if (typeof proc === 'string' && proc !== '') {
    rows.push(['process', `${proc}: limits used ${processLimits(r.settings)}. Generic values; your fabricator's limits govern.`]);
  }
  return rows;
}

/** A signed number: "+12.5", "−3.1", "0". */
function signed(v: number, sig = 4): string {
  const t = fmt(Math.abs(v), sig);
  return v > 0 && t !== '0' ? `+${t}` : v < 0 && t !== '0' ? `−${t}` : t;
}

function keyValueLines(rows: readonly (readonly [string, string])[], keyWidth: number): string[] {
  const out: string[] = [];
  const indent = ' '.repeat(keyWidth + 2);
  for (const [k, v] of rows) out.push(...wrap(v, TEXT_WIDTH, indent, pad(k, keyWidth) + '  '));
  return out;
}

/** A location without a finding number (the findings before repair are not numbered: they are gone). */
function plainLocationLine(L: CheckResult['locations'][number], unit: CheckResult['unit']): string {
  return `· x ${fmt(L.x)} y ${fmt(L.y)} mm (row ${L.fileRow}, col ${L.fileCol}) ${withUnit(L.measured, unit)}`;
}

/**
 * One row per check with its first findings. `numbered`: the findings carry the numbers of numberFindings
 * (the final checks); otherwise they are listed without numbers (the checks before repair).
 */
function checkRows(r: Report, checks: readonly CheckResult[], c: boolean, numbered: boolean): string[] {
  const findings = numbered ? numberFindings(r) : [];
  const idW = Math.max(...checks.map((ch) => ch.id.length));
  const vals = checks.map((ch) => `${withUnit(ch.measured, ch.unit)} / ${limitText(ch)}`);
  const valW = Math.max(...vals.map((v) => v.length));
  const out: string[] = [];
  let k = 0; // next unread finding: numberFindings walks the checks in this same order
  checks.forEach((ch, i) => {
    const head = `  ${statusWord(c, ch.status)}  ${pad(ch.id, idW)}  ${pad(vals[i], valW)}  `;
    const indent = ' '.repeat(8);
    if (visible(head) + Math.min(ch.message.length, 30) <= TEXT_WIDTH) out.push(...wrap(ch.message, TEXT_WIDTH, ' '.repeat(visible(head)), head));
    else out.push(head.trimEnd(), ...wrap(ch.message, TEXT_WIDTH, indent, indent));
    if (ch.status === 'pass') return;
    const shownLines = numbered
      ? findings.slice(k, k + ch.locations.length).slice(0, TEXT_FINDINGS_PER_CHECK).map((f) => findingLine(f, ch.unit))
      : ch.locations.slice(0, TEXT_FINDINGS_PER_CHECK).map((L) => plainLocationLine(L, ch.unit));
    k += ch.locations.length;
    for (const line of shownLines) out.push(`${indent}${paint(c, '2', line)}`);
    const more = Math.max(ch.locationsTotal, ch.locations.length) - shownLines.length;
    if (more > 0) out.push(`${indent}${paint(c, '2', `… and ${more} more`)}`);
  });
  return out;
}

/** The repairs: one row each (what it answered, area change, places) or why it did nothing. */
function repairRows(r: Report, c: boolean): string[] {
  const idW = Math.max(...r.repairs.map((x) => x.id.length));
  const out: string[] = [];
  for (const x of r.repairs) {
    const head = `  ${paint(c, '36', 'REPAIR')}  ${pad(x.id, idW)}  `;
    const text =
      x.skipped !== null
        ? `did nothing: ${x.skipped}`
        : `${x.locationsTotal} place${x.locationsTotal === 1 ? '' : 's'}, area ${signed(x.area)} mm² (for ${x.checks.join(', ')})`;
    out.push(...wrap(text, TEXT_WIDTH, ' '.repeat(visible(head)), head));
    if (x.unresolved) out.push(...wrap(`not repaired: ${x.unresolved}`, TEXT_WIDTH, ' '.repeat(visible(head) + 2), ' '.repeat(visible(head))));
  }
  return out;
}

function checkLines(r: Report, c: boolean): string[] {
  if (r.checks.length === 0) return ['No manufacturability checks ran (none were requested).'];
  if (!r.checksBeforeRepair) return checkRows(r, r.checks, c, true);
  const before = r.checksBeforeRepair;
  const s = { pass: 0, warn: 0, fail: 0 };
  for (const ch of before) s[ch.status]++;
  return [
    paint(c, '1', 'Before repair'),
    ...checkRows(r, before, c, false),
    `  (${s.pass} passed, ${s.warn} warned, ${s.fail} failed)`,
    '',
    paint(c, '1', 'Repairs (--repair)'),
    ...repairRows(r, c),
    '',
    paint(c, '1', 'After repair (the geometry written)'),
    ...checkRows(r, r.checks, c, true),
  ];
}

/** The summary line: status and counts, or that no checks ran. */
export function summaryLine(r: Report, color: boolean): string {
  if (r.checks.length === 0) return 'result     no manufacturability checks ran; geometry and report written';
  const s = r.summary;
  const n = numberFindings(r).length;
  return (
    `result     ${statusWord(color, s.status, true)}  ${r.checks.length} check${r.checks.length === 1 ? '' : 's'}: ` +
    `${s.pass} passed, ${s.warn} warned, ${s.fail} failed${n > 0 ? `; ${n} located finding${n === 1 ? '' : 's'}` : ''}` +
    (r.checksBeforeRepair ? ' (after repair)' : '')
  );
}

/** The terminal report of `r` (ends with a newline). Finding numbers are those of numberFindings. */
export function formatText(r: Report, opts: TextOptions): string {
  const c = opts.color;
  const head = headerRows(r);
  const keyW = Math.max(...head.map(([k]) => k.length), 'result'.length + 3);
  const lines = keyValueLines(head, keyW);
  lines.push('', ...checkLines(r, c), '');
  const st = structureLines(r);
  if (st.length > 0) lines.push(paint(c, '1', st[0]), ...st.slice(1), '');
  lines.push(summaryLine(r, c), '');
  for (const caution of r.cautions) lines.push(...wrap(caution, TEXT_WIDTH, '         ', paint(c, '33', 'caution') + '  '));
  if (r.outputs.length > 0) {
    lines.push('');
    lines.push(...keyValueLines(r.outputs.map((o) => ['wrote', o.file] as const), keyW));
  }
  return `${lines.join('\n')}\n`;
}
