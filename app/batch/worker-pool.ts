// A pool of worker threads that analyses batch tasks. A worker that crashes or overruns its time is replaced,
// and its file gets an error row; the batch always goes on to the next file.
import { Worker } from 'node:worker_threads';
import { errorResult } from '../../core/model';
import type { EmbryoResult } from '../../core/model';
import type { BatchTask, InputDigest, WorkerReply } from './task';

/** How the pool runs. */
export interface PoolOptions {
  /** Number of worker threads (≥ 1). */
  readonly jobs: number;
  /** Path of the built worker script (dist/batch-worker.mjs). */
  readonly workerPath: string;
  /** Per-file limit in milliseconds; the worker is terminated and replaced when exceeded. */
  readonly timeoutMs: number;
  readonly signal?: AbortSignal;
  /** Data handed to each worker at start (e.g. libvips threads per worker). */
  readonly workerData?: unknown;
  readonly onStart?: (task: BatchTask) => void;
  /** `input` is the file's digest when the worker computed it from the bytes it decoded. */
  readonly onResult?: (task: BatchTask, result: EmbryoResult, input?: InputDigest | null) => void;
  /** Memory reports from workers (bytes), sent after each file. */
  readonly onMemory?: (report: Extract<WorkerReply, { type: 'memory' }>) => void;
}

/** A one-line reason from anything a worker may throw or exit with. */
function reason(e: unknown): string {
  const text = e instanceof Error ? e.message : String(e);
  return text.split(/\r?\n/)[0];
}

/** Run every task on the pool; resolves with results by task index (missing entries = not run because cancelled). */
export function runPool(tasks: readonly BatchTask[], opts: PoolOptions): Promise<(EmbryoResult | undefined)[]> {
  const results: (EmbryoResult | undefined)[] = new Array(tasks.length);
  let next = 0;
  let active = 0;
  const slots = new Set<{ worker: Worker; timer: NodeJS.Timeout | null; task: BatchTask | null }>();
  return new Promise((resolveAll) => {
    let finished = false;
    const finish = (): void => {
      if (finished) return;
      finished = true;
      opts.signal?.removeEventListener('abort', onAbort);
      for (const s of slots) {
        if (s.timer) clearTimeout(s.timer);
        void s.worker.terminate();
      }
      slots.clear();
      resolveAll(results);
    };
    const onAbort = (): void => finish();
    const settle = (slot: { task: BatchTask | null; timer: NodeJS.Timeout | null }, result: EmbryoResult, input: InputDigest | null = null): void => {
      const task = slot.task;
      if (!task || finished) return;
      slot.task = null;
      if (slot.timer) clearTimeout(slot.timer);
      slot.timer = null;
      results[task.index] = result;
      active -= 1;
      opts.onResult?.(task, result, input);
    };
    const spawn = (): void => {
      const slot = { worker: new Worker(opts.workerPath, { workerData: opts.workerData }), timer: null as NodeJS.Timeout | null, task: null as BatchTask | null };
      slots.add(slot);
      const replace = (message: string): void => {
        if (!slots.has(slot)) return;
        slots.delete(slot);
        if (slot.task) settle(slot, errorResult(slot.task.file, `${slot.task.file}: ${message}`));
        void slot.worker.terminate();
        if (!finished && next < tasks.length) spawn();
        else if (active === 0) finish();
      };
      slot.worker.on('message', (msg: WorkerReply) => {
        if (msg.type === 'memory') { opts.onMemory?.(msg); return; }
        if (msg.type !== 'result' || slot.task?.index !== msg.index) return;
        settle(slot, msg.result, msg.input ?? null);
        feed();
      });
      slot.worker.on('error', (e) => replace(`the analysis crashed (${reason(e)})`));
      slot.worker.on('exit', (code) => replace(`the analysis stopped unexpectedly (worker exit code ${code})`));
      const feed = (): void => {
        if (finished) return;
        if (next >= tasks.length) {
          if (active === 0) finish();
          return;
        }
        const task = tasks[next];
        next += 1;
        active += 1;
        slot.task = task;
        opts.onStart?.(task);
        slot.timer = setTimeout(() => replace(`timed out after ${Math.round(opts.timeoutMs / 1000)} s (the file may be damaged or too large)`), opts.timeoutMs);
        slot.worker.postMessage(task);
      };
      feed();
    };
    if (opts.signal?.aborted) { finish(); return; }
    opts.signal?.addEventListener('abort', onAbort);
    if (tasks.length === 0) { finish(); return; }
    for (let i = 0; i < Math.min(opts.jobs, tasks.length); i += 1) spawn();
  });
}
