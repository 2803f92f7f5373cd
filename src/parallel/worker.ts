/**
 * A lane's thread (node.ts): imports the task's module, calls the named export, posts the value (or the
 * error's message) on its port, then counts the task done in the shared counter and wakes the waiting thread.
 */
import { parentPort, workerData, type MessagePort } from 'node:worker_threads';

interface Setup {
  readonly port: MessagePort;
  readonly done: Int32Array;
  readonly slot: number;
}
interface Task {
  readonly module: string;
  readonly name: string;
  readonly args: readonly unknown[];
}

const { port, done, slot } = workerData as Setup;

function finish(answer: { value?: unknown; error?: string }): void {
  try {
    port.postMessage(answer);
  } catch (e) {
    port.postMessage({ error: `the value could not be sent back: ${(e as Error).message}` });
  }
  Atomics.add(done, slot, 1);
  Atomics.notify(done, slot);
}

parentPort?.on('message', (task: Task) => {
  import(task.module)
    .then((m: Record<string, unknown>) => {
      const f = m[task.name];
      if (typeof f !== 'function') throw new Error(`${task.module} has no function ${task.name}`);
      finish({ value: (f as (...a: unknown[]) => unknown)(...task.args) });
    })
    .catch((e: unknown) => finish({ error: e instanceof Error ? e.message : String(e) }));
});
