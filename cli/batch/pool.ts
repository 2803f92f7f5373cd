/**
 * A fixed pool of worker threads that takes tasks from one queue (docs/scale.md). Workers are started once
 * and reused for many tasks (module loading and warm-up are paid once per worker, not per file); a worker
 * that stops while holding a task (an uncaught exception, running out of memory, process.exit) costs that task
 * only: its result is `crashed(task, reason)` and a fresh worker takes over the rest of the queue.
 *
 * Protocol: the pool posts `{ id, task }`; the worker answers `{ id, result }` once per task. The main thread
 * only passes messages: all the work happens in the workers.
 */
import { Worker } from 'node:worker_threads';

export interface PoolOptions<Task, Result> {
  /** The worker script (an ES module answering the protocol above). */
  readonly workerUrl: URL;
  /** Passed to every worker as `workerData` (structured-cloned). */
  readonly workerData: unknown;
  /** Number of workers; never more than there are tasks. */
  readonly jobs: number;
  /** The result recorded for a task whose worker stopped before answering. */
  crashed(task: Task, reason: string): Result;
  /** Called in the main thread as each result arrives (completion order). */
  onResult?(index: number, task: Task, result: Result): void;
  /** Text the workers wrote to their stdout or stderr (never forwarded to the process's stdout). */
  onOutput?(text: string): void;
}

/** Run every task on the pool; the results come back in task order. */
export function runPool<Task, Result>(tasks: readonly Task[], opts: PoolOptions<Task, Result>): Promise<Result[]> {
  const jobs = Math.max(1, Math.min(Math.floor(opts.jobs), tasks.length));
  const results: Result[] = new Array<Result>(tasks.length);
  if (tasks.length === 0) return Promise.resolve(results);
  return new Promise((resolveAll) => {
    let next = 0;
    let done = 0;
    let live = 0;
    const finishOne = (index: number, result: Result) => {
      results[index] = result;
      done++;
      opts.onResult?.(index, tasks[index], result);
    };
    const start = () => {
      const worker = new Worker(opts.workerUrl, { workerData: opts.workerData, stdout: true, stderr: true });
      live++;
      let current = -1;
      let failure: string | null = null;
      const forward = (chunk: Buffer | string) => opts.onOutput?.(String(chunk));
      worker.stdout.on('data', forward);
      worker.stderr.on('data', forward);
      const feed = () => {
        if (next < tasks.length) {
          current = next++;
          worker.postMessage({ id: current, task: tasks[current] });
        } else {
          current = -1;
          void worker.terminate();
        }
      };
      worker.on('message', (m: { id: number; result: Result }) => {
        if (m === null || typeof m !== 'object' || m.id !== current) return;
        finishOne(current, m.result);
        feed();
      });
      worker.on('messageerror', (e) => (failure = `a message could not be read (${e.message})`));
      worker.on('error', (e: Error & { code?: string }) => (failure = e.code ? `${e.code}: ${e.message}` : e.message || String(e)));
      worker.on('exit', (code) => {
        live--;
        if (current >= 0) {
          const index = current;
          current = -1;
          finishOne(index, opts.crashed(tasks[index], failure ?? `the worker thread stopped (exit code ${code})`));
          if (next < tasks.length) start();
        }
        if (done === tasks.length && live === 0) resolveAll(results);
      });
      feed();
    };
    for (let k = 0; k < jobs; k++) start();
  });
}
