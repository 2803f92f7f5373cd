/**
 * One command in a fresh process, measured: wall time, CPU time (user + system), peak resident set and minor page
 * faults. The last three come from GNU time (`/usr/bin/time -f`) when it is installed — on a machine shared with
 * other work, wall time grows with the load while CPU time barely moves, so the bench prints both and says which is
 * which. Minor faults count the fresh 4 KB pages the process touched (docs/performance.md, "fresh memory"): they
 * do not depend on the load at all.
 */
import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';

export interface Measured {
  readonly wallMs: number;
  /** User + system CPU time, ms; NaN without GNU time. */
  readonly cpuMs: number;
  /** Peak resident set, bytes; NaN without GNU time. */
  readonly maxRss: number;
  /** Minor page faults (fresh pages touched); NaN without GNU time. */
  readonly faults: number;
  readonly status: number | null;
  readonly stderr: string;
}

const GNU_TIME = '/usr/bin/time';
const HAVE_TIME = existsSync(GNU_TIME);
const MARK = '@@bench';

export function measure(args: readonly string[]): Measured {
  const t = performance.now();
  const r = HAVE_TIME
    ? spawnSync(GNU_TIME, ['-f', `${MARK} %U %S %M %R`, process.execPath, ...args], { encoding: 'utf8', maxBuffer: 1 << 26 })
    : spawnSync(process.execPath, args, { encoding: 'utf8', maxBuffer: 1 << 26 });
  const wallMs = performance.now() - t;
  let cpuMs = NaN, maxRss = NaN, faults = NaN;
  let stderr = r.stderr ?? '';
  const line = stderr.split('\n').find((l) => l.startsWith(MARK));
  if (line) {
    const [, u, s, m, f] = line.split(' ');
    cpuMs = (Number(u) + Number(s)) * 1000;
    maxRss = Number(m) * 1024;
    faults = Number(f);
    stderr = stderr.split('\n').filter((l) => !l.startsWith(MARK)).join('\n');
  }
  return { wallMs, cpuMs, maxRss, faults, status: r.status, stderr };
}

export function median(xs: readonly number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)];
}
