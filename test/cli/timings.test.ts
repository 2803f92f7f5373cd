/**
 * `--timings` and the report's run figures (docs/cli.md, docs/report-schema.md): the stage times go to stderr,
 * stdout stays the product, and the report's `timings` and `peakMemory` are where the schema says. The peak
 * resident set is checked against the operating system's own figure for a Node process (Node's
 * process.resourceUsage().maxRSS, which reports getrusage(2) ru_maxrss in KiB; a Node process holds at least
 * its heap, ≥ 10 MiB — common practice, no source).
 */
import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { formatTimings } from '../../cli/timings.js';
import { cli, tempDir } from './harness.js';

function gridCsv(): string {
  const rows: string[] = [];
  for (let r = 0; r < 10; r++) rows.push(Array.from({ length: 14 }, (_, c) => (Math.hypot(c - 7, r - 5) < 3.5 ? '1' : '0')).join(','));
  return `${rows.join('\n')}\n`;
}

describe('--timings and the report\'s run figures', () => {
  it('prints every stage on stderr and leaves stdout as it was; the report carries timings and peakMemory last', () => {
    const dir = tempDir();
    writeFileSync(join(dir, 'g.csv'), gridCsv());
    const plain = cli(['build', 'g.csv', '--json', '--out-dir', 'a'], dir);
    const timed = cli(['build', 'g.csv', '--json', '--timings', '--out-dir', 'b'], dir);
    expect(plain.stderr).toBe('');
    expect(timed.stderr).toMatch(/^rhoform: timings\n/);
    for (const stage of ['read', 'prepare', 'threshold', 'contour', 'smooth', 'checks', 'dxf', 'svg', 'html', 'json', 'files', 'whole process', 'peak memory']) {
      expect(timed.stderr).toMatch(new RegExp(`^  ${stage} +[0-9.]+ (ms|MiB)`, 'm'));
    }
    const a = JSON.parse(plain.stdout);
    const b = JSON.parse(timed.stdout);
    expect(Object.keys(b).slice(-2)).toEqual(['timings', 'peakMemory']);
    expect(Object.keys(b.timings).slice(0, 5)).toEqual(['read', 'prepare', 'threshold', 'contour', 'smooth']);
    expect(b.peakMemory).toBeGreaterThan(10 * 2 ** 20);
    // the file written and stdout are the same report
    expect(JSON.parse(readFileSync(join(dir, 'b/g.report.json'), 'utf8'))).toEqual(b);
    // apart from the run figures and the output folder, the two runs' reports are equal
    const strip = (r: Record<string, unknown>) => ({ ...r, timings: 0, peakMemory: 0, outputs: 0 });
    expect(strip(b)).toEqual(strip(a));
  });

  it('formatTimings sums the stages and aligns the names', () => {
    const text = formatTimings({ read: 1.25, prepare: 2 }, { files: 0.75 }, 50 * 2 ** 20, 123.4);
    expect(text).toBe(
      'rhoform: timings\n' +
        '  read             1.3 ms\n' +
        '  prepare          2.0 ms\n' +
        '  files            0.8 ms\n' +
        '  stages together  4.0 ms\n' +
        '  whole process    123.4 ms (start-up and module loading included)\n' +
        '  peak memory      50.0 MiB (resident set)\n',
    );
  });
});
