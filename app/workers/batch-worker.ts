// Worker thread of the batch pool: analyses one file per message and replies with its EmbryoResult and memory use.
// It also generates demo files on request, so writing the demo set uses every core.
import { parentPort, workerData } from 'node:worker_threads';
import { analyseFile } from '../batch/analyse-file';
import { limitDecoderThreads } from '../batch/decoder-threads';
import type { BatchTask, DemoRequest, WorkerReply } from '../batch/task';
import { demoFile } from '../batch/write-demo';

const port = parentPort;
if (!port) throw new Error('batch-worker must run as a worker thread');
limitDecoderThreads((workerData as { decoderThreads?: number } | undefined)?.decoderThreads ?? 1);

port.on('message', (msg: BatchTask | DemoRequest) => {
  if ('kind' in msg && msg.kind === 'demo') {
    const { bytes, furrow } = demoFile(msg.item);
    port.postMessage({ type: 'demo', index: msg.index, bytes, furrow } satisfies WorkerReply, [bytes.buffer as ArrayBuffer]);
    return;
  }
  const task = msg as BatchTask;
  void analyseFile(task).then((result) => {
    port.postMessage({ type: 'result', index: task.index, result } satisfies WorkerReply);
    const m = process.memoryUsage();
    port.postMessage({ type: 'memory', rssBytes: m.rss, heapUsedBytes: m.heapUsed, externalBytes: m.external + m.arrayBuffers } satisfies WorkerReply);
  });
});
