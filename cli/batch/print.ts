/**
 * The batch table for stdout (the product of `batch` and `merge` without --json): one line per file —
 * status, level, final fraction, thinnest member and smallest hole (mm), findings, time, file — then the
 * totals. Errors show their code and message instead of the numbers. Pure; colour only when asked.
 */
import { fmt } from '../../src/report/number.js';
import type { BatchSummary, RowStatus } from './summary.js';

const COLOR: Record<RowStatus, string> = { pass: '32', warn: '33', fail: '31', error: '31;1' };

function statusCell(s: RowStatus, color: boolean): string {
  const word = s.toUpperCase().padEnd(5);
  return color ? `\u001b[${COLOR[s]}m${word}\u001b[0m` : word;
}

/** The table and totals; `written` lists the summary files to name on the last line. */
export function formatBatchTable(s: BatchSummary, opts: { color: boolean; written: readonly string[] }): string {
  const lines: string[] = [];
  lines.push(`${'status'.padEnd(6)} ${'level'.padStart(7)} ${'final'.padStart(7)} ${'member'.padStart(7)} ${'hole'.padStart(7)} ${'finds'.padStart(6)} ${'time'.padStart(8)}  file`);
  for (const r of s.files) {
    const st = statusCell(r.status, opts.color);
    if (r.status === 'error') {
      lines.push(`${st}  ${r.errorCode ?? ''}  ${r.error ?? ''}`);
      continue;
    }
    const mm = (x: number | null) => (x === null ? '–' : fmt(x, 3));
    lines.push(
      `${st}  ${fmt(r.level, 4).padStart(7)} ${fmt(r.finalFraction, 4).padStart(7)} ${mm(r.thinnestMember).padStart(7)} ${mm(r.smallestHole).padStart(7)} ` +
        `${String(r.findings ?? '–').padStart(6)} ${`${(r.timeMs / 1000).toFixed(1)} s`.padStart(8)}  ${r.file}`,
    );
  }
  const t = s.totals;
  const shard = s.shard ? ` (shard ${s.shard.k}/${s.shard.n})` : '';
  lines.push(`${t.files} file${t.files === 1 ? '' : 's'}${shard}: ${t.pass} pass, ${t.warn} warn, ${t.fail} fail, ${t.error} error; exit code ${s.exitCode}`);
  if (opts.written.length > 0) lines.push(`summary    ${opts.written.join(', ')}`);
  return `${lines.join('\n')}\n`;
}
