// Worker thread of the batch pool: analyses one file per message and replies with its EmbryoResult and memory use.
import { parentPort, workerData } from 'node:worker_threads';
import { analyzeFile } from '../batch/analyze-file';
import { limitDecoderThreads } from '../batch/decoder-threads';
import type { BatchTask, WorkerReply } from '../batch/task';

const port = parentPort;
if (!port) throw new Error('batch-worker must run as a worker thread');
limitDecoderThreads((workerData as { decoderThreads?: number } | undefined)?.decoderThreads ?? 1);

port.on('message', (task: BatchTask) => {
  void analyzeFile(task).then((result) => {
    port.postMessage({ type: 'result', index: task.index, result } satisfies WorkerReply);
    const m = process.memoryUsage();
    port.postMessage({ type: 'memory', rssBytes: m.rss, heapUsedBytes: m.heapUsed, externalBytes: m.external + m.arrayBuffers } satisfies WorkerReply);
  });
});
