/**
 * Progress on stderr (docs/scale.md): never on stdout, nothing under --quiet.
 *
 * - On a terminal: one line redrawn in place with `\r` — a bar, the count, failures so far, the time left
 *   (average so far × files left) and the last file.
 * - Otherwise (a log file, a cluster job): one terse line per file, `rhoform: [12/200] path: pass (0.8 s)`.
 */
import { statSync } from 'node:fs';
import type { RowStatus } from './summary.js';

export type ProgressMode = 'bar' | 'lines' | 'off';

/** The mode for a run: off under --quiet, a bar when stderr is a terminal, else lines. */
export function progressMode(quiet: boolean, stderrIsTTY: boolean): ProgressMode {
  return quiet ? 'off' : stderrIsTTY ? 'bar' : 'lines';
}

function seconds(ms: number): string {
  return `${(ms / 1000).toFixed(1)} s`;
}

function clock(ms: number): string {
  const s = Math.max(0, Math.round(ms / 1000));
  const h = Math.floor(s / 3600);
  const m = Math.floor((s % 3600) / 60);
  const ss = String(s % 60).padStart(2, '0');
  return h > 0 ? `${h}:${String(m).padStart(2, '0')}:${ss}` : `${m}:${ss}`;
}

export class BatchProgress {
  private done = 0;
  private bad = 0;
  private drawn = false;
  private readonly t0: number;
  private readonly now: () => number;
  private readonly columns: number;

  /** `write` is stderr; `total` the number of files of this run. */
  constructor(
    private readonly write: (text: string) => void,
    private readonly total: number,
    private readonly mode: ProgressMode,
    opts: { now?: () => number; columns?: number } = {},
  ) {
    this.now = opts.now ?? (() => performance.now());
    this.columns = Math.max(40, opts.columns ?? 80);
    this.t0 = this.now();
    if (mode === 'bar' && total > 0) this.draw('');
  }

  /** One file finished. `detail` (an error's code and message) is shown in line mode. */
  fileDone(file: string, status: RowStatus, ms: number, detail?: string): void {
    this.done++;
    if (status === 'fail' || status === 'error') this.bad++;
    if (this.mode === 'lines') {
      const n = String(this.total);
      this.write(`rhoform: [${String(this.done).padStart(n.length)}/${n}] ${file}: ${status}${detail ? ` ${detail}` : ''} (${seconds(ms)})\n`);
    } else if (this.mode === 'bar') this.draw(file);
  }

  /** A line of text (a warning) that must not be garbled by the bar: the bar is cleared, then redrawn. */
  note(text: string): void {
    const line = text.endsWith('\n') ? text : `${text}\n`;
    if (this.mode === 'bar' && this.drawn) {
      this.write(`\r\x1b[K${line}`);
      this.draw('');
    } else this.write(line);
  }

  /** End of the run: the bar's line is ended so the next output starts on a fresh line. */
  finish(): void {
    if (this.mode === 'bar' && this.drawn) this.write('\n');
    this.drawn = false;
  }

  private draw(file: string): void {
    const width = 20;
    const filled = this.total > 0 ? Math.round((width * this.done) / this.total) : width;
    const elapsed = this.now() - this.t0;
    const left = this.done > 0 && this.done < this.total ? ` ${clock((elapsed / this.done) * (this.total - this.done))} left` : '';
    const bad = this.bad > 0 ? ` ${this.bad} failed` : '';
    let line = `rhoform [${'#'.repeat(filled)}${'.'.repeat(width - filled)}] ${this.done}/${this.total}${bad}${left}`;
    if (file) {
      const room = this.columns - 1 - line.length - 2;
      if (room >= 8) line += `  ${file.length > room ? `…${file.slice(file.length - room + 1)}` : file}`;
    }
    this.write(`\r${line.slice(0, this.columns - 1)}\x1b[K`);
    this.drawn = true;
  }
}

/** Inputs at least this large get a start notice in a single build (about 1 M samples of float64 NPY or CSV). */
export const BUILD_NOTICE_BYTES = 8 * 1024 * 1024;

/**
 * A single build cannot show a running bar (it runs synchronously), so a large input gets one start line
 * on stderr: `rhoform: building <file> (64 MB)…`. On a terminal the line is erased again when the build ends
 * (call the returned function); elsewhere it stays as a log line. Small inputs (fast builds) get nothing.
 */
export function buildNotice(write: (text: string) => void, mode: ProgressMode, file: string, bytes: number): () => void {
  if (mode === 'off' || !(bytes >= BUILD_NOTICE_BYTES)) return () => {};
  const text = `rhoform: building ${file} (${Math.round(bytes / (1024 * 1024))} MB)…`;
  if (mode === 'lines') {
    write(`${text}\n`);
    return () => {};
  }
  write(text);
  return () => write('\r\x1b[K');
}

/** Size of an input file in bytes; 0 when it cannot be read (the build then reports the error itself). */
export function inputBytes(path: string): number {
  try {
    return statSync(path).size;
  } catch {
    return 0;
  }
}
