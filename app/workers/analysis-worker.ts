// Worker thread for the desktop app: projects and detects one stack, decodes one slice, or analyses a movie over
// time (with progress messages), per request.
import { parentPort } from 'node:worker_threads';
import type { MovieView } from '../../core/contract';
import type { AnalysisReply, AnalysisRequest } from '../engine/analysis-protocol';
import { readPreviewPlane } from '../decode';
import { createDefaultEngine } from '../engine/default-engine';
import type { SliceData, ViewData } from '../engine/engine';
import { buildMovieView } from '../engine/movie-view';

const engine = createDefaultEngine();

/** The typed arrays' buffers, moved (not copied) back to the main thread. */
function transferList(reply: AnalysisReply): ArrayBuffer[] {
  if (reply.ok !== true) return [];
  const movie = reply.value as Partial<MovieView>;
  if (movie.frames !== undefined) {
    return [...new Set(movie.frames.flatMap((f) => (f === null ? [] : f.channels.map((c) => c.buffer)))
      .filter((b): b is ArrayBuffer => b instanceof ArrayBuffer))];
  }
  const value = reply.value as Partial<ViewData & SliceData>;
  const arrays = value.projected === undefined || value.detection === undefined
    ? [value.data].filter((a) => a !== undefined)
    : [...value.projected.channels.map((c) => c.data), value.detection.mask.data];
  const buffers = arrays.map((a) => a.buffer).filter((b): b is ArrayBuffer => b instanceof ArrayBuffer);
  return [...new Set(buffers)];
}

/** Requests being answered, and those of them the main process no longer wants (their loads stop before the next
 *  plane); a cancel for a request already answered is dropped. */
const answering = new Set<number>();
const stopped = new Set<number>();

/** Answer one request; errors travel as name, code and message. */
async function answer(request: Exclude<AnalysisRequest, { kind: 'cancel' }>): Promise<AnalysisReply> {
  try {
    const value = request.kind === 'slice'
      ? await engine.readSlice(request.path, request.label, request.z, request.c, request.t)
      : request.kind === 'preview'
        ? await readPreviewPlane(request.path, request.label)
        : request.kind === 'movie'
          ? await buildMovieView(request.path, request.label, request.doc, request.options, {
            onTimePoint: (done, total) => parentPort?.postMessage({ id: request.id, ok: null, progress: { done, total } } satisfies AnalysisReply),
          })
          : await engine.loadForView(request.path, request.label, request.settings, request.time ?? null, { get aborted() { return stopped.has(request.id); } });
    return { id: request.id, ok: true, value };
  } catch (e) {
    const err: Error & { code?: unknown } = e instanceof Error ? e : new Error(String(e));
    return { id: request.id, ok: false, error: { name: err.name, code: typeof err.code === 'string' ? err.code : null, message: err.message } };
  }
}

parentPort?.on('message', (request: AnalysisRequest) => {
  if (request.kind === 'cancel') { if (answering.has(request.target)) stopped.add(request.target); return; }
  answering.add(request.id);
  void answer(request).then((reply) => {
    answering.delete(request.id);
    stopped.delete(request.id);
    parentPort?.postMessage(reply, transferList(reply));
  });
});
