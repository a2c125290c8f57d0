// Runs loadStack's analysis and slice decoding in a worker thread so the main process (and with it the window)
// never blocks on decoding or segmentation.
import { Worker } from 'node:worker_threads';
import type { AnalysisSettings } from '../../core/settings';
import type { ApiErrorCode, MovieProgress, MovieRequestOptions, MovieView, ProjectDoc, StackPreview, StackTimeOptions } from '../../core/contract';
import type { SliceData, ViewData } from '../engine/engine';
import type { AnalysisReply, AnalysisRequest } from '../engine/analysis-protocol';
import { ApiFailure } from './result';

export type { AnalysisReply, AnalysisRequest } from '../engine/analysis-protocol';

/** Requests without their id (the runner numbers them). */
type RequestBody = AnalysisRequest extends infer R ? R extends Exclude<AnalysisRequest, { kind: 'cancel' }> ? Omit<R, 'id'> : never : never;


/** A worker-backed runner: `run` fits HandlerDeps.runAnalysisOffThread, `readSlice` HandlerDeps.readSliceOffThread. */
export interface AnalysisRunner {
  /** A view; when `signal` aborts, the call rejects at once and the worker stops reading that stack's planes. */
  run(path: string, label: string, settings: AnalysisSettings, time?: StackTimeOptions | null, signal?: AbortSignal | null): Promise<ViewData>;
  readSlice(path: string, label: string, z: number, c: number, t: number): Promise<SliceData>;
  /** The preview slice (HandlerDeps.readPreviewOffThread). */
  readPreview(path: string, label: string): Promise<StackPreview>;
  /** Analyse a movie over time (label = the file's project key); progress per analysed time point. */
  movie(path: string, label: string, doc: ProjectDoc, options: MovieRequestOptions, onProgress: (p: MovieProgress) => void): Promise<MovieView>;
  /** Stop the worker (pending calls are rejected). */
  close(): Promise<void>;
}

interface Pending {
  resolve(v: unknown): void; reject(e: Error): void; label: string; timer: NodeJS.Timeout; worker: Worker;
  onProgress?: (done: number, total: number) => void; restartTimer?: () => void;
}

/** Rebuild an error from the worker so failureFrom can map it (TiffError → bad-file, ENOENT → not-found). */
function errorFrom(reply: Extract<AnalysisReply, { ok: false }>): Error {
  if (reply.error.name === 'ApiFailure' && reply.error.code !== null) return new ApiFailure(reply.error.code as ApiErrorCode, reply.error.message);
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
      // Progress of a long call (a movie): it is alive, so its time limit starts again.
      if (reply.ok === null) { p.restartTimer?.(); p.onProgress?.(reply.progress.done, reply.progress.total); return; }
      pending.delete(reply.id);
      clearTimeout(p.timer);
      if (reply.ok) p.resolve(reply.value); else p.reject(errorFrom(reply));
    });
    w.on('error', (e) => { if (worker === w) worker = null; failAll((label) => `${label}: analysis stopped unexpectedly (${e.message})`, w); });
    w.on('exit', (code) => { if (worker === w) worker = null; failAll((label) => `${label}: analysis stopped unexpectedly (exit code ${code})`, w); });
    return w;
  };
  const call = <T>(body: RequestBody, onProgress?: (done: number, total: number) => void, signal: AbortSignal | null = null): Promise<T> => new Promise<T>((resolve, reject) => {
    const w = worker ??= start();
    const id = nextId++;
    const expire = () => {
      pending.delete(id);
      reject(new Error(`${body.label}: analysis took longer than ${+(timeoutMs / 1000).toFixed(1)} s and was stopped`));
      // The worker is stuck: its other calls fail with it, and the next call starts a fresh one.
      if (worker === w) void stop();
      failAll((other) => `${other}: analysis stopped (another file hung the analysis thread)`, w);
    };
    const entry: Pending = { resolve: resolve as (v: unknown) => void, reject, label: body.label, timer: setTimeout(expire, timeoutMs), worker: w, onProgress };
    entry.restartTimer = () => { clearTimeout(entry.timer); entry.timer = setTimeout(expire, timeoutMs); };
    pending.set(id, entry);
    w.postMessage({ ...body, id } as AnalysisRequest);
    signal?.addEventListener('abort', () => {
      if (!pending.has(id)) return;
      pending.delete(id);
      clearTimeout(entry.timer);
      reject(Object.assign(new Error(`${body.label}: loading cancelled (another view was asked for)`), { name: 'AbortError' }));
      w.postMessage({ kind: 'cancel', id: nextId++, label: body.label, target: id } satisfies AnalysisRequest);
    }, { once: true });
  });
  return {
    run: (path, label, settings, time = null, signal = null) => call<ViewData>({ kind: 'view', path, label, settings, time }, undefined, signal),
    readSlice: (path, label, z, c, t) => call<SliceData>({ kind: 'slice', path, label, z, c, t }),
    readPreview: (path, label) => call<StackPreview>({ kind: 'preview', path, label }),
    movie: (path, label, doc, options, onProgress) => call<MovieView>({ kind: 'movie', path, label, doc, options },
      (done, total) => onProgress({ file: label, done, total })),
    close: async () => { failAll((label) => `${label}: cancelled`, null); await stop(); },
  };
}
