// Worker thread for the desktop app: projects and detects one stack, or decodes one slice, per request.
import { parentPort } from 'node:worker_threads';
import type { AnalysisReply, AnalysisRequest } from '../engine/analysis-protocol';
import { createDefaultEngine } from '../engine/default-engine';
import type { SliceData, ViewData } from '../engine/engine';

const engine = createDefaultEngine();

/** The typed arrays' buffers, moved (not copied) back to the main thread. */
function transferList(reply: AnalysisReply): ArrayBuffer[] {
  if (!reply.ok) return [];
  const value = reply.value as Partial<ViewData & SliceData>;
  const arrays = value.projected === undefined || value.detection === undefined
    ? [value.data].filter((a) => a !== undefined)
    : [...value.projected.channels.map((c) => c.data), value.detection.mask.data];
  const buffers = arrays.map((a) => a.buffer).filter((b): b is ArrayBuffer => b instanceof ArrayBuffer);
  return [...new Set(buffers)];
}

/** Answer one request; errors travel as name, code and message. */
async function answer(request: AnalysisRequest): Promise<AnalysisReply> {
  try {
    const value = request.kind === 'slice'
      ? await engine.readSlice(request.path, request.label, request.z, request.c, request.t)
      : await engine.loadForView(request.path, request.label, request.settings);
    return { id: request.id, ok: true, value };
  } catch (e) {
    const err: Error & { code?: unknown } = e instanceof Error ? e : new Error(String(e));
    return { id: request.id, ok: false, error: { name: err.name, code: typeof err.code === 'string' ? err.code : null, message: err.message } };
  }
}

parentPort?.on('message', (request: AnalysisRequest) => {
  void answer(request).then((reply) => parentPort?.postMessage(reply, transferList(reply)));
});
