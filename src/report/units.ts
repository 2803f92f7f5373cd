/** How check values read in every human-facing report: unit symbols, comparison signs, "measured / limit". */
import type { CheckResult, ReportSettings } from '../types.js';
import { fmt } from './number.js';

/** Unit symbol as printed: mm, mm², % or nothing for a plain ratio ('1'). */
export function unitSymbol(unit: CheckResult['unit']): string {
  return unit === 'mm2' ? 'mm²' : unit === '1' ? '' : unit;
}

/** A value with its unit ("1.52 mm", "31.2 %", "0.0004"); '–' when null or not finite. */
export function withUnit(v: number | null, unit: CheckResult['unit'], sig = 4): string {
  const s = fmt(v, sig);
  const u = unitSymbol(unit);
  return s === '–' || u === '' ? s : `${s} ${u}`;
}

/** The limit as a requirement: "≥ 2 mm" (sizes: measured ≥ limit passes) or "≤ 25 %". */
export function limitText(c: Pick<CheckResult, 'limit' | 'unit' | 'comparison'>): string {
  return `${c.comparison === '>=' ? '≥' : '≤'} ${withUnit(c.limit, c.unit)}`;
}

/** The resolution of a check as "± 0.05 mm". */
export function resolutionText(c: Pick<CheckResult, 'resolution' | 'unit'>): string {
  return `± ${withUnit(c.resolution, c.unit, 2)}`;
}

type LimitKey = 'minMember' | 'minHole' | 'toolRadius' | 'minIslandArea' | 'minHoleArea' | 'thickness';

/** The process-preset limits of `settings` as "min member 2 mm, min hole 3 mm, …" (set values only). */
export function processLimits(settings: Pick<ReportSettings, LimitKey>): string {
  const names: readonly (readonly [LimitKey, string, string])[] = [
    ['minMember', 'min member', 'mm'],
    ['minHole', 'min hole', 'mm'],
    ['toolRadius', 'tool radius', 'mm'],
    ['minIslandArea', 'min island area', 'mm²'],
    ['minHoleArea', 'min hole area', 'mm²'],
    ['thickness', 'thickness', 'mm'],
  ];
  const out: string[] = [];
  for (const [key, label, unit] of names) {
    const v = settings[key];
    if (typeof v === 'number' && Number.isFinite(v)) out.push(`${label} ${fmt(v)} ${unit}`);
  }
  return out.length > 0 ? out.join(', ') : 'none set';
}
