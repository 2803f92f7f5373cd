/**
 * Lanes on Node worker threads (lanes.ts), installed by the CLI; unreferenced, so they never keep the process
 * alive. The caller blocks on a shared counter (Atomics.wait), then takes the answer from the port
 * (receiveMessageOnPort): the pipeline stays synchronous. A failed task is rerun by the caller and the lanes are
 * removed for the rest of the process, so the output never depends on the threads.
 */
import { existsSync } from 'node:fs';
import { availableParallelism } from 'node:os';
import { fileURLToPath } from 'node:url';
import { MessageChannel, receiveMessageOnPort, Worker, type MessagePort } from 'node:worker_threads';
import { installLanes, type LaneHost, type LaneTask, type Pending } from './lanes.js';

/** Environment variable that sets the number of lanes (1 = every pass on the calling thread). */
export const LANES_ENV = 'RHOFORM_THREADS';

interface Lane {
  readonly worker: Worker;
  readonly port: MessagePort;
  /** Tasks posted, answers taken, and answers taken before their own join (task number → answer). */
  posted: number;
  taken: number;
  readonly early: Map<number, { value?: unknown; error?: string }>;
}

/** Lanes to use: `RHOFORM_THREADS` when a positive integer, else os.availableParallelism(), at most 8. */
export function laneTarget(env: Record<string, string | undefined>): number {
  const v = env[LANES_ENV];
  if (v !== undefined && /^[1-9][0-9]*$/.test(v.trim())) return Number(v.trim());
  return Math.max(1, Math.min(8, availableParallelism()));
}

/**
 * Installs worker-thread lanes for this process when more than one is wanted and the compiled worker script is
 * present (it is not when the sources run untranspiled, as under the test runner: then nothing is installed).
 * The threads start at the first task, or now with `warm` (for a run known to be large). Returns the lane count
 * in use (1 = none installed).
 */
export function startLanes(count: number, warm = false): number {
  if (count === started) return Math.max(1, started);
  stopLanes?.();
  stopLanes = null;
  started = count;
  const script = new URL('./worker.js', import.meta.url);
  if (!(count >= 2) || script.protocol !== 'file:' || !existsSync(fileURLToPath(script))) {
    installLanes(null);
    return 1;
  }
  const done = new Int32Array(new SharedArrayBuffer(4 * (count - 1)));
  let lanes: Lane[] | null = null;
  let next = 0;
  const open = (): Lane[] =>
    Array.from({ length: count - 1 }, (_, slot) => {
      const { port1, port2 } = new MessageChannel();
      const worker = new Worker(script, { workerData: { port: port2, done, slot }, transferList: [port2] });
      worker.unref();
      port1.unref();
      return { worker, port: port1, posted: 0, taken: 0, early: new Map() };
    });
  const host: LaneHost = {
    count,
    submit(task: LaneTask): Pending<unknown> | null {
      lanes ??= open();
      const slot = next++ % lanes.length;
      const lane = lanes[slot];
      const n = lane.posted++;
      lane.worker.postMessage(task);
      return {
        join(): unknown {
          const answer = take(lane, slot, n, done);
          if (answer.error !== undefined) {
            stop();
            throw new Error(answer.error);
          }
          return answer.value;
        },
      };
    },
  };
  const stop = (): void => {
    installLanes(null);
    for (const l of lanes ?? []) void l.worker.terminate();
  };
  installLanes(host);
  stopLanes = stop;
  // a large run starts its threads now, so that they load while this thread reads and contours
  if (warm) lanes = open();
  return count;
}

/** The lane count of the last startLanes call (0 before any), and how to stop those lanes. */
let started = 0;
let stopLanes: (() => void) | null = null;

/** Longest wait for a lane without any answer (ms) before it counts as failed (a thread that never started). */
const STALL_MS = 300_000;

/** Blocks until answer `n` of `lane` has arrived and returns it. */
function take(lane: Lane, slot: number, n: number, done: Int32Array): { value?: unknown; error?: string } {
  let since = performance.now();
  for (;;) {
    const early = lane.early.get(n);
    if (early) {
      lane.early.delete(n);
      return early;
    }
    const counted = Atomics.load(done, slot);
    if (counted > lane.taken) {
      const m = receiveMessageOnPort(lane.port);
      if (!m) continue;
      const k = lane.taken++;
      const answer = m.message as { value?: unknown; error?: string };
      since = performance.now();
      if (k === n) return answer;
      lane.early.set(k, answer);
      continue;
    }
    if (performance.now() - since > STALL_MS) return { error: 'the lane did not answer' };
    Atomics.wait(done, slot, counted, 1000);
  }
}
