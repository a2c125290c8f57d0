// The analysis thread's side of the chunk thread (app/workers/zarr-chunk-worker.ts): one worker per process, started
// on first use, kept out of the way of the process's exit while idle, restarted if it dies.
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { Worker } from 'node:worker_threads';

/** A request to the chunk thread: read and decode the file at `path`, at most `maxBytes` decoded. */
export interface ChunkRequest {
  readonly id: number;
  readonly path: string;
  readonly maxBytes: number;
}

/** Its answer: the decoded bytes, no such file, a stream it leaves to zarrita, or a one-line error. */
export type ChunkReply =
  | { readonly id: number; readonly kind: 'bytes'; readonly buffer: ArrayBuffer }
  | { readonly id: number; readonly kind: 'missing' | 'other' }
  | { readonly id: number; readonly kind: 'error'; readonly message: string };

/** Where the built worker lies: beside the bundle that imports this module (dist/), or null when run from source. */
function builtWorkerPath(): string | null {
  try {
    // The Electron main bundle is CommonJS (__dirname); the others are ES modules (import.meta.url).
    const path = typeof __dirname === 'string' ? join(__dirname, 'zarr-chunk-worker.mjs') : fileURLToPath(new URL('./zarr-chunk-worker.mjs', import.meta.url));
    return existsSync(path) ? path : null;
  } catch {
    return null;
  }
}

interface Pending { resolve(v: Uint8Array | undefined | null): void; reject(e: Error): void }

/**
 * A function reading and decoding Blosc chunk files on a worker thread, or null when the built worker is not there
 * (tests run from source; chunks are then decoded on the calling thread by zarrita's codecs). It answers null (use
 * zarrita) for every request once the thread has failed to start or died.
 */
export function bloscChunkThread(workerPath: string | null = builtWorkerPath()): ((path: string, maxBytes: number) => Promise<Uint8Array | undefined | null>) | null {
  if (workerPath === null) return null;
  let worker: Worker | null = null;
  let broken = false;
  let nextId = 0;
  const pending = new Map<number, Pending>();
  const start = (): Worker => {
    const w = new Worker(workerPath);
    w.on('message', (reply: ChunkReply) => {
      const p = pending.get(reply.id);
      if (!p) return;
      pending.delete(reply.id);
      if (pending.size === 0) w.unref();
      if (reply.kind === 'bytes') p.resolve(new Uint8Array(reply.buffer));
      else if (reply.kind === 'error') p.reject(new Error(reply.message));
      else p.resolve(reply.kind === 'missing' ? undefined : null);
    });
    // A thread that cannot start or dies (e.g. a packaged app that cannot load the worker file) is not the chunk's
    // fault: its requests, and all later ones, go to zarrita's codecs on the calling thread instead.
    const fail = (): void => {
      worker = null;
      broken = true;
      for (const p of pending.values()) p.resolve(null);
      pending.clear();
    };
    w.on('error', fail);
    w.on('exit', () => { if (worker === w) fail(); });
    w.unref();
    return w;
  };
  return (path, maxBytes) => new Promise((resolve, reject) => {
    if (broken) { resolve(null); return; }
    worker ??= start();
    const id = nextId++;
    pending.set(id, { resolve, reject });
    // Referenced while a request is out, so the process waits for the answer.
    worker.ref();
    worker.postMessage({ id, path, maxBytes } satisfies ChunkRequest);
  });
}

let shared: ReturnType<typeof bloscChunkThread> | undefined;

/** The process's one chunk thread (created on first call), or null when the built worker is missing. */
export function sharedBloscChunkThread(): ReturnType<typeof bloscChunkThread> {
  if (shared === undefined) shared = bloscChunkThread();
  return shared;
}
