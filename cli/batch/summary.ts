/**
 * The batch summary (docs/scale.md, "Summary"): one row per input file, written as batch-summary.csv
 * (RFC 4180) and batch-summary.json. Lengths in mm, times in ms. Pure: no files here.
 */
import type { Report } from '../../src/types.js';

export type RowStatus = 'pass' | 'warn' | 'fail' | 'error';
export const ROW_STATUSES: readonly RowStatus[] = ['pass', 'warn', 'fail', 'error'];

export interface SummaryRow {
  /** The input as shown to the user (relative to the working folder when inside it). */
  file: string;
  status: RowStatus;
  /** Iso-level used (null: constant field, or the file could not be processed). */
  level: number | null;
  /** Smoothed polygon area / domain area. */
  achievedFraction: number | null;
  /** Area fraction after passive regions and repair. */
  finalFraction: number | null;
  /** mm: the measured value of the min-member-size check, when it ran. */
  thinnestMember: number | null;
  /** mm: the measured value of the min-hole-size check, when it ran. */
  smallestHole: number | null;
  /** Sum of locationsTotal over the checks that failed or warned. */
  findings: number | null;
  /** The file's own exit code (0, 1 — respecting --fail-on — or 2 when it could not be processed). */
  exitCode: number;
  /** Wall time of the file's build and writes, ms. */
  timeMs: number;
  errorCode: string | null;
  error: string | null;
}

/** Columns, in the order of the CSV and of each JSON row. */
export const COLUMNS: readonly (keyof SummaryRow)[] = [
  'file',
  'status',
  'level',
  'achievedFraction',
  'finalFraction',
  'thinnestMember',
  'smallestHole',
  'findings',
  'exitCode',
  'timeMs',
  'errorCode',
  'error',
];

export interface Totals {
  files: number;
  pass: number;
  warn: number;
  fail: number;
  error: number;
}

export interface BatchSummary {
  schemaVersion: 1;
  tool: { name: 'rhoform'; version: string };
  /** Every option of the builds, resolved (as in each report's `settings`). */
  settings: Record<string, unknown>;
  shard: { k: number; n: number } | null;
  files: SummaryRow[];
  totals: Totals;
  exitCode: number;
}

function measuredOf(report: Report, id: string): number | null {
  const c = report.checks.find((x) => x.id === id);
  return c && typeof c.measured === 'number' && Number.isFinite(c.measured) ? c.measured : null;
}

/** The row of a built file. */
export function rowFromReport(file: string, report: Report, exitCode: number, timeMs: number): SummaryRow {
  let findings = 0;
  for (const c of report.checks) if (c.status === 'fail' || c.status === 'warn') findings += c.locationsTotal;
  return {
    file,
    status: report.summary.status,
    level: report.threshold.level,
    achievedFraction: report.threshold.achievedFraction,
    finalFraction: report.geometry.finalFraction,
    thinnestMember: measuredOf(report, 'min-member-size'),
    smallestHole: measuredOf(report, 'min-hole-size'),
    findings,
    exitCode,
    timeMs,
    errorCode: null,
    error: null,
  };
}

/** The row of a file that could not be processed (exit code 2). */
export function errorRow(file: string, code: string, message: string, timeMs = 0): SummaryRow {
  return {
    file,
    status: 'error',
    level: null,
    achievedFraction: null,
    finalFraction: null,
    thinnestMember: null,
    smallestHole: null,
    findings: null,
    exitCode: 2,
    timeMs,
    errorCode: code,
    error: message,
  };
}

export function totalsOf(rows: readonly SummaryRow[]): Totals {
  const t: Totals = { files: rows.length, pass: 0, warn: 0, fail: 0, error: 0 };
  for (const r of rows) t[r.status]++;
  return t;
}

/**
 * The batch's exit code (docs/cli.md): the worst over the files — 2 if any file could not be processed,
 * else 1 if any file's own exit code is 1 (a failed check, or a warning under --fail-on warn), else 0.
 */
export function batchExitCode(rows: readonly SummaryRow[]): number {
  let worst = 0;
  for (const r of rows) {
    const c = r.status === 'error' ? 2 : r.exitCode;
    if (c > worst) worst = c;
  }
  return worst;
}

export function makeSummary(
  tool: BatchSummary['tool'],
  settings: Record<string, unknown>,
  shard: BatchSummary['shard'],
  rows: readonly SummaryRow[],
): BatchSummary {
  return { schemaVersion: 1, tool, settings, shard, files: [...rows], totals: totalsOf(rows), exitCode: batchExitCode(rows) };
}

/** One CSV field (RFC 4180): quoted when it holds a comma, a quote, CR or LF; quotes doubled. Null → empty. */
export function csvField(v: string | number | null): string {
  if (v === null) return '';
  const s = typeof v === 'number' ? (Number.isFinite(v) ? String(v) : '') : v;
  return /[",\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

/** The summary table as CSV (RFC 4180: header row, CRLF line ends, '.' decimal point). */
export function summaryCsv(rows: readonly SummaryRow[]): string {
  const lines = [COLUMNS.join(',')];
  for (const r of rows) lines.push(COLUMNS.map((c) => csvField(r[c])).join(','));
  return `${lines.join('\r\n')}\r\n`;
}

/** The summary as JSON (two-space indented, columns in COLUMNS order). */
export function summaryJson(s: BatchSummary): string {
  const files = s.files.map((r) => Object.fromEntries(COLUMNS.map((c) => [c, r[c]])));
  return `${JSON.stringify({ ...s, files }, (_k, v: unknown) => (typeof v === 'number' && !Number.isFinite(v) ? null : v), 2)}\n`;
}

/** File names of the summary: batch-summary.csv/.json, or batch-summary.shard-k-of-n.csv/.json. */
export function summaryNames(shard: { k: number; n: number } | null): { csv: string; json: string } {
  const base = shard ? `batch-summary.shard-${shard.k}-of-${shard.n}` : 'batch-summary';
  return { csv: `${base}.csv`, json: `${base}.json` };
}
