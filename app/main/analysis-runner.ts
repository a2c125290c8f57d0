// Runs loadStack's analysis in a worker thread so the main process (and with it every window) never blocks.
import { Worker } from 'node:worker_threads';
import type { AnalysisSettings } from '../../core/settings';
import type { ViewData } from './engine';

/** A request to the analysis worker. */
export interface AnalysisRequest { readonly id: number; readonly path: string; readonly label: string; readonly settings: AnalysisSettings }

/** The worker's answer: the view data or the error's name, code and message. */
export type AnalysisReply =
  | { readonly id: number; readonly ok: true; readonly value: ViewData }
  | { readonly id: number; readonly ok: false; readonly error: { readonly name: string; readonly code: string | null; readonly message: string } };

/** A worker-backed runner: `run` has the signature of HandlerDeps.runAnalysisOffThread. */
export interface AnalysisRunner {
  run(path: string, label: string, settings: AnalysisSettings): Promise<ViewData>;
  /** Stop the worker (pending calls are rejected). */
  close(): Promise<void>;
}

interface Pending { resolve(v: ViewData): void; reject(e: Error): void; label: string; timer: NodeJS.Timeout; worker: Worker }

/** Rebuild an error from the worker so failureFrom can map it (TiffError → bad-file, ENOENT → not-found). */
function errorFrom(reply: Extract<AnalysisReply, { ok: false }>): Error {
  return Object.assign(new Error(reply.error.message), { name: reply.error.name, code: reply.error.code ?? undefined });
}

/** Start (lazily) one analysis worker from `workerPath`; a call taking longer than `timeoutMs` restarts it. */
export function createAnalysisRunner(workerPath: string, timeoutMs = 180_000): AnalysisRunner {
  let worker: Worker | null = null;
  let nextId = 1;
  const pending = new Map<number, Pending>();
  // Only the calls of the worker that died fail; calls already moved to a new worker carry on.
  const failAll = (why: (label: string) => string, of: Worker | null): void => {
    for (const [id, p] of pending) {
      if (of !== null && p.worker !== of) continue;
      clearTimeout(p.timer); p.reject(new Error(why(p.label))); pending.delete(id);
    }
  };
  const stop = async (): Promise<void> => { const w = worker; worker = null; if (w !== null) await w.terminate(); };
  const start = (): Worker => {
    // workerData must be an object: a dependency of the TIFF decoder (web-worker) reads fields of it when it is
    // loaded inside any worker thread, and throws when it is undefined.
    const w = new Worker(workerPath, { workerData: { role: 'eggline-analysis' } });
    w.on('message', (reply: AnalysisReply) => {
      const p = pending.get(reply.id);
      if (p === undefined) return;
      pending.delete(reply.id);
      clearTimeout(p.timer);
      if (reply.ok) p.resolve(reply.value); else p.reject(errorFrom(reply));
    });
    w.on('error', (e) => { if (worker === w) worker = null; failAll((label) => `${label}: analysis stopped unexpectedly (${e.message})`, w); });
    w.on('exit', (code) => { if (worker === w) worker = null; failAll((label) => `${label}: analysis stopped unexpectedly (exit code ${code})`, w); });
    return w;
  };
  return {
    run: (path, label, settings) => new Promise<ViewData>((resolve, reject) => {
      const w = worker ??= start();
      const id = nextId++;
      const timer = setTimeout(() => {
        pending.delete(id);
        reject(new Error(`${label}: analysis took longer than ${+(timeoutMs / 1000).toFixed(1)} s and was stopped`));
        // The worker is stuck: its other calls fail with it, and the next call starts a fresh one.
        if (worker === w) void stop();
        failAll((other) => `${other}: analysis stopped (another file hung the analysis thread)`, w);
      }, timeoutMs);
      pending.set(id, { resolve, reject, label, timer, worker: w });
      w.postMessage({ id, path, label, settings } satisfies AnalysisRequest);
    }),
    close: async () => { failAll((label) => `${label}: cancelled`, null); await stop(); },
  };
}
