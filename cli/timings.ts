/**
 * `--timings`: where a build spent its time, printed on stderr (stdout stays the product). The stage figures are
 * the report's `timings`; the lines after them are what came after the report was formatted, and the process as a
 * whole (Node start-up and module loading included) up to the moment of printing.
 */

/** The lines printed by `--timings`; milliseconds in, text out. */
export function formatTimings(
  timings: Readonly<Record<string, number>>,
  after: Readonly<Record<string, number>>,
  peakMemory: number | undefined,
  processMs: number,
): string {
  const rows: [string, string][] = [];
  for (const [k, v] of Object.entries(timings)) rows.push([k, `${v.toFixed(1)} ms`]);
  for (const [k, v] of Object.entries(after)) rows.push([k, `${v.toFixed(1)} ms`]);
  const sum = [...Object.values(timings), ...Object.values(after)].reduce((a, b) => a + b, 0);
  rows.push(['stages together', `${sum.toFixed(1)} ms`]);
  rows.push(['whole process', `${processMs.toFixed(1)} ms (start-up and module loading included)`]);
  if (peakMemory !== undefined) rows.push(['peak memory', `${(peakMemory / 2 ** 20).toFixed(1)} MiB (resident set)`]);
  const w = Math.max(...rows.map((r) => r[0].length));
  return `rhoform: timings\n${rows.map(([k, v]) => `  ${k.padEnd(w)}  ${v}`).join('\n')}\n`;
}
