// Batch worker: analyses one file per message and replies with its EmbryoResult and memory use. It runs as a child
// process of the batch (the pool's usual mode: a fatal error here ends only this process) or as a worker thread
// (demo generation, which also uses it to write demo files on every core).
import { parentPort, workerData } from 'node:worker_threads';
import { analyseFileWithDigest } from '../batch/analyse-file';
import { limitDecoderThreads } from '../batch/decoder-threads';
import type { BatchTask, DemoRequest, WorkerReply } from '../batch/task';
import { mark, markProcessStart } from '../batch/timeline';
import { workerBuffers } from '../batch/worker-buffers';

/** The two ways this worker talks to its parent. */
interface Channel {
  on(listener: (msg: BatchTask | DemoRequest) => void): void;
  post(msg: WorkerReply, transfer?: ArrayBuffer[]): void;
}

function threadChannel(port: NonNullable<typeof parentPort>): Channel {
  return { on: (l) => port.on('message', l), post: (m, t) => port.postMessage(m, t ?? []) };
}

function processChannel(): Channel {
  if (typeof process.send !== 'function') throw new Error('batch-worker must run as a worker thread or a child process with IPC');
  // The batch went away (killed, even by SIGKILL): its IPC channel closed, so stop at once rather than run on.
  process.on('disconnect', () => process.exit(0));
  // A terminal's Ctrl+C (and a hang-up or a SIGTERM sent to the whole process group, as job schedulers do) reaches
  // the batch and its workers at once. The batch stops cleanly and ends its workers itself; a worker that died of
  // the signal first would give its file an error row in the journal, which --resume would then keep.
  for (const signal of ['SIGINT', 'SIGHUP', 'SIGTERM'] as const) process.on(signal, () => undefined);
  return { on: (l) => process.on('message', l), post: (m) => { process.send?.(m); } };
}

markProcessStart();
mark('worker loaded');
const channel = parentPort ? threadChannel(parentPort) : processChannel();
const data = (parentPort ? workerData : JSON.parse(process.env.EGGLINE_WORKER_DATA ?? 'null')) as { decoderThreads?: number } | null;
limitDecoderThreads(data?.decoderThreads ?? 1);
// Arrays lent to each file in turn (planes decoded into them, the projection written into them): the worker
// analyses one file at a time and keeps nothing of a file once its result is sent.
const buffers = workerBuffers();

channel.on((msg) => {
  if ('kind' in msg && msg.kind === 'demo') {
    // The demo writer (synthetic embryos, the OME-TIFF writer) is loaded only by workers that write demo files.
    const request = msg;
    void import('../batch/write-demo').then(({ demoFile }) => {
      const { bytes, furrow } = demoFile(request.item);
      channel.post({ type: 'demo', index: request.index, bytes, furrow }, [bytes.buffer as ArrayBuffer]);
    });
    return;
  }
  const task = msg as BatchTask;
  mark(`file started ${task.file}`);
  void analyseFileWithDigest(task, true, buffers).then(({ result, input, shape }) => {
    mark(`file done ${task.file}`);
    channel.post({ type: 'result', index: task.index, result, input, shape });
    const m = process.memoryUsage();
    channel.post({ type: 'memory', rssBytes: m.rss, heapUsedBytes: m.heapUsed, externalBytes: m.external + m.arrayBuffers });
  });
});
