/**
 * Lanes: the threads a pass may split its work over. The library starts no thread and imports no platform
 * module: a host installs lanes (the CLI, with worker threads: node.ts); without one — a browser, a library user
 * who did not opt in, a small pass — everything runs on the calling thread, with the same bytes either way
 * (docs/notes/morph.md, "Both cores"). A task names a module by URL and an export; its arguments are
 * structured-cloned, SharedArrayBuffer-backed arrays shared.
 */

/** One call to run on a lane: `export name` of the ES module at `module` (a file: URL), with `args`. */
export interface LaneTask {
  readonly module: string;
  readonly name: string;
  readonly args: readonly unknown[];
}

/** A task handed to a lane; `join()` blocks until it is done and returns its value (or rethrows its error). */
export interface Pending<R> {
  join(): R;
}

/** What a host installs: how many lanes there are (the calling thread included) and how to start a task. */
export interface LaneHost {
  /** Lanes including the calling thread, ≥ 2. */
  readonly count: number;
  /** Starts `task` on another thread; null when none can take it (then the caller runs it itself). */
  submit(task: LaneTask): Pending<unknown> | null;
}

let host: LaneHost | null = null;

/** Installs (or, with null, removes) the lanes of this process. */
export function installLanes(h: LaneHost | null): void {
  host = h;
}

/** Lanes available for a pass over `work` items (pixels, bytes): 1 below `minWork`, where a thread costs more than it saves. */
export function laneCount(work: number, minWork: number): number {
  return host !== null && work >= minWork ? host.count : 1;
}

/** Starts `task` on another lane, or runs `local` now when there is none (same value either way). */
export function submit<R>(task: LaneTask, local: () => R, work: number, minWork: number): Pending<R> {
  const p = host !== null && work >= minWork ? (host.submit(task) as Pending<R> | null) : null;
  if (p) return { join: () => joinOr(p, local) };
  const value = local();
  return { join: () => value };
}

/** Runs export `name` of `module` once per argument list, the first here through `local` (the same function); values in order. */
export function runSplit<A extends unknown[], R>(module: string, name: string, local: (...args: A) => R, calls: readonly A[]): R[] {
  const pending: (Pending<unknown> | null)[] = calls.map((args, k) => (k === 0 || host === null ? null : host.submit({ module, name, args })));
  const out: R[] = new Array<R>(calls.length);
  out[0] = local(...calls[0]);
  for (let k = 1; k < calls.length; k++) {
    const p = pending[k];
    out[k] = p ? joinOr(p as Pending<R>, () => local(...calls[k])) : local(...calls[k]);
  }
  return out;
}

/** The lane's value, or — when the lane failed (the host then removes itself) — the same value computed here. */
function joinOr<R>(p: Pending<R>, local: () => R): R {
  try {
    return p.join();
  } catch {
    return local();
  }
}

/** [start, end) of `parts` near-equal consecutive bands of 0 … n − 1. */
export function bands(n: number, parts: number): [number, number][] {
  const k = Math.max(1, Math.min(parts, n));
  const out: [number, number][] = [];
  for (let b = 0; b < k; b++) out.push([Math.floor((b * n) / k), Math.floor(((b + 1) * n) / k)]);
  return out;
}

/** A Float64Array of length n that other lanes can write into (shared memory when `shared`). */
export function float64(n: number, shared: boolean): Float64Array {
  return shared ? new Float64Array(new SharedArrayBuffer(8 * n)) : new Float64Array(n);
}

/** An Int32Array of length n, shared when `shared`. */
export function int32(n: number, shared: boolean): Int32Array {
  return shared ? new Int32Array(new SharedArrayBuffer(4 * n)) : new Int32Array(n);
}

/** A Float32Array of length n, shared when `shared`. */
export function float32(n: number, shared: boolean): Float32Array {
  return shared ? new Float32Array(new SharedArrayBuffer(4 * n)) : new Float32Array(n);
}
