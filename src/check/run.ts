/**
 * The check runner (docs/checks/README.md): measures each planned check, applies its limit, the resolution band and its
 * severity, sorts its locations worst first, and maps them to 1-based file rows and columns.
 *
 * Verdict for one check with measured m, limit l, resolution r and severity s:
 * - m null (nothing to measure) → pass;
 * - |m − l| ≤ r with r > 0 → warn (too close to call either way);
 * - m breaks the limit (m < l for '>=', m > l for '<=') → s (warn or fail);
 * - otherwise → pass. Limits are inclusive: m = l passes when r = 0.
 */
import type { CheckResult, Location, Report, Status } from '../types.js';
import { formatValue } from './format.js';
import type { CheckContext, CheckDefinition, RawLocation } from './types.js';

/** At most this many locations per check go into the report (docs/report-schema.md). */
export const MAX_LOCATIONS = 100;

/** One check to run: its definition, the limit in its unit, and the status it gets when the limit is broken. */
export interface PlannedCheck {
  readonly def: CheckDefinition;
  readonly limit: number;
  readonly severity: 'warn' | 'fail';
  /** Words for the message: what the measured value is ("thinnest member") and what one location is ("thin place"). */
  readonly label: string;
  readonly place: string;
  /** What the message says when there is nothing to measure ("no island"). */
  readonly none: string;
}

/** Maps a point (mm, y up) to its 1-based row and column in the input file. */
export type LocateInFile = (x: number, y: number) => { fileRow: number; fileCol: number };

export function verdict(measured: number | null, limit: number, resolution: number, comparison: '>=' | '<=', severity: 'warn' | 'fail'): Status {
  if (measured === null) return 'pass';
  if (resolution > 0 && Math.abs(measured - limit) <= resolution) return 'warn';
  const broken = comparison === '>=' ? measured < limit : measured > limit;
  return broken ? severity : 'pass';
}


const UNIT_TEXT: Record<CheckResult['unit'], string> = { mm: ' mm', mm2: ' mm²', '%': ' %', '1': '', MPa: ' MPa' };

/**
 * One line for people. The measured value and the limit are fields of their own (and columns of the text
 * and HTML tables), so the message says what the value is and what the verdict rests on.
 */
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

/** Runs every planned check in order; a check's exception propagates (it is a bug, not a verdict). */
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

/** The report's summary of a list of results. With no checks the run passes. */
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
