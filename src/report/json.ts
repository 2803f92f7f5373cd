/** The JSON report (docs/report-schema.md): one object, two-space indented, non-finite numbers as null. */
import type { Report } from '../types.js';

export function formatJson(report: Report | object): string {
  return `${JSON.stringify(report, (_k, v: unknown) => (typeof v === 'number' && !Number.isFinite(v) ? null : v), 2)}\n`;
}
