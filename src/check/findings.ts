/**
 * Finding numbers shared by every output: the HTML report, the text report and the `finding` layer of the
 * DXF and SVG number the same findings the same way — checks in report order, each check's locations worst
 * first, counted from 1.
 */
import type { CheckResult, Location } from '../types.js';

export interface NumberedFinding {
  /** 1-based finding number. */
  readonly n: number;
  readonly checkId: string;
  readonly status: 'warn' | 'fail';
  readonly location: Location;
}

/** Every located finding of the report's warned or failed checks, numbered. */
export function numberFindings(report: { readonly checks: readonly CheckResult[] }): NumberedFinding[] {
  const out: NumberedFinding[] = [];
  for (const c of report.checks) {
    if (c.status === 'pass') continue;
    for (const location of c.locations) out.push({ n: out.length + 1, checkId: c.id, status: c.status, location });
  }
  return out;
}
