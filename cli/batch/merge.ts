/**
 * Reading and joining shard summaries (`rhoform merge`, docs/scale.md). Each summary is validated
 * (schemaVersion 1, a files array of well-formed rows); the join is sorted by file, its totals and exit code
 * are recomputed, and a file that appears in two summaries is refused, naming both.
 */
import { RhoformError } from '../../src/errors.js';
import { jsonParseMessage, lineCol, scanJson } from '../../src/json/scan.js';
import { comparePaths } from './shard.js';
import { makeSummary, ROW_STATUSES, type BatchSummary, type SummaryRow } from './summary.js';

export interface LoadedSummary {
  /** The summary file as named on the command line. */
  readonly name: string;
  readonly summary: BatchSummary;
}

function bad(name: string, what: string): RhoformError {
  return new RhoformError('E_SUMMARY_FORMAT', what, { file: name });
}

/** `line:col` of a JSON.parse failure: from its message when it gives a position, else from our own scanner. */
function jsonWhere(text: string, err: unknown): { line?: number; col?: number } {
  const m = /position (\d+)/.exec(err instanceof Error ? err.message : '');
  if (m) return lineCol(text, Number(m[1]));
  const scan = scanJson(text);
  return scan.ok ? {} : lineCol(text, scan.offset);
}

/** A value from the file as a message shows it: JSON, cut to 60 characters. */
function brief(v: unknown): string {
  const t = v === undefined ? 'nothing' : JSON.stringify(v);
  return t.length > 60 ? `${t.slice(0, 60)}…` : t;
}

const NUMERIC: readonly (keyof SummaryRow)[] = ['level', 'achievedFraction', 'finalFraction', 'thinnestMember', 'smallestHole', 'findings'];

function checkRow(name: string, k: number, r: unknown): SummaryRow {
  const at = `files[${k}]`;
  if (r === null || typeof r !== 'object' || Array.isArray(r)) throw bad(name, `${at}: expected an object (a summary row), found ${brief(r)}`);
  const o = r as Record<string, unknown>;
  if (typeof o.file !== 'string' || o.file === '') throw bad(name, `${at}.file: expected the input's path, found ${brief(o.file)}`);
  if (!ROW_STATUSES.includes(o.status as SummaryRow['status'])) {
    throw bad(name, `${at}.status: expected one of ${ROW_STATUSES.join(', ')}, found ${brief(o.status)}`);
  }
  if (!(o.exitCode === 0 || o.exitCode === 1 || o.exitCode === 2)) throw bad(name, `${at}.exitCode: expected 0, 1 or 2, found ${brief(o.exitCode)}`);
  if (o.status === 'error' && o.exitCode !== 2) throw bad(name, `${at}.exitCode: expected 2 for a file with status error, found ${o.exitCode}`);
  if (!(typeof o.timeMs === 'number' && o.timeMs >= 0)) throw bad(name, `${at}.timeMs: expected a time in ms ≥ 0, found ${brief(o.timeMs)}`);
  for (const c of NUMERIC) {
    const v = o[c];
    if (!(v === null || v === undefined || (typeof v === 'number' && Number.isFinite(v)))) throw bad(name, `${at}.${c}: expected a number or null, found ${brief(v)}`);
  }
  for (const c of ['errorCode', 'error'] as const) {
    const v = o[c];
    if (!(v === null || v === undefined || typeof v === 'string')) throw bad(name, `${at}.${c}: expected text or null, found ${brief(v)}`);
  }
  const num = (v: unknown) => (typeof v === 'number' ? v : null);
  const str = (v: unknown) => (typeof v === 'string' ? v : null);
  return {
    file: o.file,
    status: o.status as SummaryRow['status'],
    level: num(o.level),
    achievedFraction: num(o.achievedFraction),
    finalFraction: num(o.finalFraction),
    thinnestMember: num(o.thinnestMember),
    smallestHole: num(o.smallestHole),
    findings: num(o.findings),
    exitCode: o.exitCode,
    timeMs: o.timeMs,
    errorCode: str(o.errorCode),
    error: str(o.error),
  };
}

/** Parse and validate one summary's text; throws RhoformError (E_SUMMARY_FORMAT) naming `name`. */
export function parseSummary(name: string, text: string): BatchSummary {
  let data: unknown;
  try {
    data = JSON.parse(text);
  } catch (e) {
    throw new RhoformError('E_SUMMARY_FORMAT', `expected a batch summary (JSON), found text that is not JSON (${jsonParseMessage(e)})`, {
      file: name,
      ...jsonWhere(text, e),
    });
  }
  if (data === null || typeof data !== 'object' || Array.isArray(data)) throw bad(name, `expected a batch summary (a JSON object), found ${Array.isArray(data) ? 'an array' : brief(data)}`);
  const o = data as Record<string, unknown>;
  if (o.schemaVersion !== 1) throw bad(name, `schemaVersion: expected 1, found ${brief(o.schemaVersion)}`);
  if (!Array.isArray(o.files)) throw bad(name, `files: expected an array of rows, found ${brief(o.files)}`);
  const settings = o.settings;
  if (settings === null || typeof settings !== 'object' || Array.isArray(settings)) throw bad(name, `settings: expected an object, found ${brief(settings)}`);
  const shard = o.shard as { k?: unknown; n?: unknown } | null | undefined;
  const shardOk = shard === null || shard === undefined || (Number.isInteger(shard.k) && Number.isInteger(shard.n));
  if (!shardOk) throw bad(name, `shard: expected {k, n} or null, found ${brief(shard)}`);
  const tool = o.tool as BatchSummary['tool'];
  const files = o.files.map((r, k) => checkRow(name, k, r));
  return makeSummary(
    tool && typeof tool === 'object' ? tool : { name: 'rhoform', version: 'unknown' },
    settings as Record<string, unknown>,
    shard ? { k: shard.k as number, n: shard.n as number } : null,
    files,
  );
}

/** The first key whose value differs between two settings objects (for the message), or null. */
function firstDifference(a: Record<string, unknown>, b: Record<string, unknown>): string | null {
  const keys = [...new Set([...Object.keys(a), ...Object.keys(b)])].sort();
  for (const k of keys) if (JSON.stringify(a[k]) !== JSON.stringify(b[k])) return k;
  return null;
}

/**
 * Join shard summaries into one: rows sorted by file, totals and exit code recomputed, `shard` null.
 * Refuses a file present in two summaries and summaries built with different settings
 * (E_SUMMARY_FORMAT). Returns notes for stderr (shards of an n-way split that were not given).
 */
export function mergeSummaries(loaded: readonly LoadedSummary[], tool: BatchSummary['tool']): { summary: BatchSummary; notes: string[] } {
  const owner = new Map<string, string>();
  const rows: SummaryRow[] = [];
  for (const { name, summary } of loaded) {
    for (const r of summary.files) {
      const first = owner.get(r.file);
      if (first !== undefined) {
        throw new RhoformError('E_SUMMARY_FORMAT', `expected each file in one summary only, found ${r.file} in both ${first} and ${name}`, { file: name });
      }
      owner.set(r.file, name);
      rows.push(r);
    }
  }
  const base = loaded[0];
  for (const l of loaded.slice(1)) {
    const key = firstDifference(base.summary.settings, l.summary.settings);
    if (key !== null) {
      throw new RhoformError('E_SUMMARY_FORMAT', `expected the settings of ${base.name}, found a different ${key}: the shards were built with different options`, { file: l.name });
    }
  }
  const notes: string[] = [];
  const ns = new Set(loaded.map((l) => l.summary.shard?.n).filter((n): n is number => n !== undefined));
  for (const n of ns) {
    const have = new Set(loaded.filter((l) => l.summary.shard?.n === n).map((l) => l.summary.shard?.k));
    const missing: number[] = [];
    for (let k = 1; k <= n; k++) if (!have.has(k)) missing.push(k);
    if (missing.length > 0) notes.push(`merge: shard${missing.length === 1 ? '' : 's'} ${missing.map((k) => `${k}/${n}`).join(', ')} not given; the merged summary covers only the shards given`);
  }
  rows.sort((a, b) => comparePaths(a.file, b.file));
  return { summary: makeSummary(tool, base.summary.settings, null, rows), notes };
}
