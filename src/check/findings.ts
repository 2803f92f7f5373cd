/** Finding numbers shared by the HTML and text reports and the `finding` layer: checks in report order, locations worst first, from 1. */
import type { CheckResult, Location } from '../types.js';

export interface NumberedFinding {
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
