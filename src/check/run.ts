/** The check runner: applies limit, resolution band and severity (verdict rules: docs/notes/check.md). */
import type { CheckResult, Location, Report, Status } from '../types.js';
import { formatValue } from './format.js';
import type { CheckContext, CheckDefinition, RawLocation } from './types.js';

/** Locations per check in the report (docs/report-schema.md). */
export const MAX_LOCATIONS = 100;

export interface PlannedCheck {
  readonly def: CheckDefinition;
  readonly limit: number;
  readonly severity: 'warn' | 'fail';
  /** Message words: the measured value ("thinnest member"), one location ("thin place"), nothing ("no island"). */
  readonly label: string;
  readonly place: string;
  readonly none: string;
}

/** Point (mm, y up) → 1-based row and column of the input file. */
export type LocateInFile = (x: number, y: number) => { fileRow: number; fileCol: number };

/** Limits are inclusive; within ± resolution of the limit is a warning (docs/notes/check.md). */
export function verdict(measured: number | null, limit: number, resolution: number, comparison: '>=' | '<=', severity: 'warn' | 'fail'): Status {
  if (measured === null) return 'pass';
  if (resolution > 0 && Math.abs(measured - limit) <= resolution) return 'warn';
  const broken = comparison === '>=' ? measured < limit : measured > limit;
  return broken ? severity : 'pass';
}


const UNIT_TEXT: Record<CheckResult['unit'], string> = { mm: ' mm', mm2: ' mm²', '%': ' %', '1': '', MPa: ' MPa' };

function message(p: PlannedCheck, status: Status, measured: number | null, resolution: number, total: number): string {
  if (measured === null) return `nothing to measure: ${p.none}`;
  const u = UNIT_TEXT[p.def.unit];
  const broken = p.def.comparison === '>=' ? measured < p.limit : measured > p.limit;
  const side = p.def.comparison === '>=' ? 'below' : 'above';
  const places = `${total} ${p.place}${total === 1 ? '' : 's'}`;
  if (status === 'warn' && resolution > 0 && Math.abs(measured - p.limit) <= resolution) {
    return `${p.label} within ± ${formatValue(resolution)}${u} of the limit: too close to call${total > 0 ? ` (${places})` : ''}`;
  }
  if (!broken) return `${p.label} within the limit`;
  return total > 0 ? `${places} ${side} the limit` : `${p.label} ${side} the limit`;
}

/** A check's exception propagates: it is a bug, not a verdict. */
export function runChecks(planned: readonly PlannedCheck[], ctx: CheckContext, locate: LocateInFile): CheckResult[] {
  return planned.map((p) => {
    const m = p.def.measure(ctx, p.limit);
    const status = verdict(m.measured, p.limit, m.resolution, p.def.comparison, m.atMost === 'warn' ? 'warn' : p.severity);
    const worse = p.def.comparison === '>=' ? (a: RawLocation, b: RawLocation) => a.measured - b.measured : (a: RawLocation, b: RawLocation) => b.measured - a.measured;
    const sorted = [...m.locations].sort((a, b) => worse(a, b) || a.x - b.x || a.y - b.y);
    const locations: Location[] = sorted.slice(0, MAX_LOCATIONS).map((l) => ({ x: l.x, y: l.y, measured: l.measured, ...locate(l.x, l.y) }));
    return {
      id: p.def.id,
      status,
      measured: m.measured,
      limit: p.limit,
      unit: p.def.unit,
      comparison: p.def.comparison,
      resolution: m.resolution,
      method: m.method,
      message: message(p, status, m.measured, m.resolution, sorted.length) + (m.note ? `: ${m.note}` : ''),
      locations,
      locationsTotal: sorted.length,
    };
  });
}

/** With no checks the run passes. */
export function summarize(results: readonly CheckResult[]): Report['summary'] {
  let pass = 0;
  let warn = 0;
  let fail = 0;
  for (const r of results) {
    if (r.status === 'pass') pass++;
    else if (r.status === 'warn') warn++;
    else fail++;
  }
  return { status: fail > 0 ? 'fail' : warn > 0 ? 'warn' : 'pass', pass, warn, fail };
}
