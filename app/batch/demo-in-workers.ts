// Generate demo files on worker threads (each embryo is independent and CPU-bound), in item order.
import { Worker } from 'node:worker_threads';
import type { ImagePoint } from '../../core/model';
import type { DemoItem } from '../../core/synth';
import type { DemoRequest, WorkerReply } from './task';

/** Make every item's OME-TIFF bytes on `jobs` workers; `onFile` is called in item order as files become ready. */
export async function demoFilesInWorkers(
  items: readonly DemoItem[], workerPath: string, jobs: number,
  onFile: (index: number, bytes: Uint8Array, furrow: ImagePoint) => Promise<void>,
): Promise<void> {
  const ready = new Map<number, { bytes: Uint8Array; furrow: ImagePoint }>();
  let next = 0;
  let written = 0;
  let writing = Promise.resolve();
  const workers = Array.from({ length: Math.max(1, Math.min(jobs, items.length)) }, () => new Worker(workerPath, { workerData: { decoderThreads: 1 } }));
  try {
    await new Promise<void>((resolveAll, reject) => {
      const flush = (): void => {
        while (ready.has(written)) {
          const index = written;
          const file = ready.get(index);
          ready.delete(index);
          written += 1;
          if (file) writing = writing.then(() => onFile(index, file.bytes, file.furrow));
        }
        if (written === items.length) writing.then(resolveAll, reject);
      };
      const give = (w: Worker): void => {
        if (next >= items.length) return;
        w.postMessage({ kind: 'demo', index: next, item: items[next] } satisfies DemoRequest);
        next += 1;
      };
      for (const w of workers) {
        w.on('message', (msg: WorkerReply) => {
          if (msg.type !== 'demo') return;
          ready.set(msg.index, { bytes: msg.bytes, furrow: msg.furrow });
          give(w);
          flush();
        });
        w.on('error', (e) => reject(new Error(`demo generation failed (${e.message.split('\n')[0]})`)));
        give(w);
      }
      if (items.length === 0) resolveAll();
    });
  } finally {
    await Promise.all(workers.map((w) => w.terminate()));
  }
}
