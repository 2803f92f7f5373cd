/**
 * One command in a fresh process, measured: wall time, CPU time (user + system) and peak resident set.
 * CPU time comes from GNU time (`/usr/bin/time -f`) when it is installed — on a machine shared with other work,
 * wall time grows with the load while CPU time barely moves, so the bench prints both and says which is which.
 */
import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';

export interface Measured {
  readonly wallMs: number;
  /** User + system CPU time, ms; NaN without GNU time. */
  readonly cpuMs: number;
  /** Peak resident set, bytes; NaN without GNU time. */
  readonly maxRss: number;
  readonly status: number | null;
  readonly stderr: string;
}

const GNU_TIME = '/usr/bin/time';
const HAVE_TIME = existsSync(GNU_TIME);
const MARK = '@@bench';

export function measure(args: readonly string[]): Measured {
  const t = performance.now();
  const r = HAVE_TIME
    ? spawnSync(GNU_TIME, ['-f', `${MARK} %U %S %M`, process.execPath, ...args], { encoding: 'utf8', maxBuffer: 1 << 26 })
    : spawnSync(process.execPath, args, { encoding: 'utf8', maxBuffer: 1 << 26 });
  const wallMs = performance.now() - t;
  let cpuMs = NaN, maxRss = NaN;
  let stderr = r.stderr ?? '';
  const line = stderr.split('\n').find((l) => l.startsWith(MARK));
  if (line) {
    const [, u, s, m] = line.split(' ');
    cpuMs = (Number(u) + Number(s)) * 1000;
    maxRss = Number(m) * 1024;
    stderr = stderr.split('\n').filter((l) => !l.startsWith(MARK)).join('\n');
  }
  return { wallMs, cpuMs, maxRss, status: r.status, stderr };
}

export function median(xs: readonly number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)];
}
