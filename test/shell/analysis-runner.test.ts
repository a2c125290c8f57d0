import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { createAnalysisRunner } from '../../app/main/analysis-runner';
import { DEFAULT_SETTINGS } from '../../core/settings';

// A stand-in worker speaking the runner's protocol (demo data): answers by file name.
const WORKER = `
import { parentPort } from 'node:worker_threads';
parentPort.on('message', (m) => {
  if (m.label === 'crash.tif') process.exit(3);
  if (m.label === 'slow.tif') return;
  if (m.kind === 'slice') {
    if (m.z > 0) parentPort.postMessage({ id: m.id, ok: false, error: { name: 'ApiFailure', code: 'bad-argument', message: m.label + ': z=' + m.z + ' is out of range' } });
    else parentPort.postMessage({ id: m.id, ok: true, value: { width: 1, height: 1, data: new Float32Array([m.c]) } });
    return;
  }
  if (m.label === 'bad.tif') {
    parentPort.postMessage({ id: m.id, ok: false, error: { name: 'TiffError', code: 'not-tiff', message: 'bad.tif: not a TIFF file' } });
    return;
  }
  const data = new Float32Array([1, 2, 3]);
  parentPort.postMessage({ id: m.id, ok: true, value: { info: { label: m.label }, projected: { channels: [{ width: 3, height: 1, data }] }, detection: { projection: m.settings.projection } } }, [data.buffer]);
});
`;

let dir: string;
let workerPath: string;
beforeAll(async () => {
  dir = await mkdtemp(join(tmpdir(), 'eggline-runner-'));
  workerPath = join(dir, 'worker.mjs');
  await writeFile(workerPath, WORKER);
});
afterAll(async () => { await rm(dir, { recursive: true, force: true }); });

describe('analysis worker runner', () => {
  it('returns the worker result with its typed arrays', async () => {
    const runner = createAnalysisRunner(workerPath);
    const view = await runner.run('/x/a.tif', 'a.tif', DEFAULT_SETTINGS) as unknown as {
      info: { label: string }; projected: { channels: { data: Float32Array }[] }; detection: { projection: string };
    };
    expect(view.info.label).toBe('a.tif');
    expect(view.projected.channels[0].data).toEqual(new Float32Array([1, 2, 3]));
    expect(view.detection.projection).toBe(DEFAULT_SETTINGS.projection);
    await runner.close();
  });

  it('reads slices through the same worker, keeping ApiFailure codes', async () => {
    const runner = createAnalysisRunner(workerPath);
    expect(await runner.readSlice('/x/a.tif', 'a.tif', 0, 2, 0)).toEqual({ width: 1, height: 1, data: new Float32Array([2]) });
    await expect(runner.readSlice('/x/a.tif', 'a.tif', 4, 0, 0)).rejects.toMatchObject({ name: 'ApiFailure', code: 'bad-argument', message: 'a.tif: z=4 is out of range' });
    await runner.close();
  });

  it('rebuilds worker errors with name and code', async () => {
    const runner = createAnalysisRunner(workerPath);
    await expect(runner.run('/x/bad.tif', 'bad.tif', DEFAULT_SETTINGS)).rejects.toMatchObject({ name: 'TiffError', code: 'not-tiff', message: 'bad.tif: not a TIFF file' });
    await runner.close();
  });

  it('survives a crashing worker: the call fails naming the file, the next call works', async () => {
    const runner = createAnalysisRunner(workerPath);
    await expect(runner.run('/x/crash.tif', 'crash.tif', DEFAULT_SETTINGS)).rejects.toThrow('crash.tif: analysis stopped unexpectedly (exit code 3)');
    await expect(runner.run('/x/ok.tif', 'ok.tif', DEFAULT_SETTINGS)).resolves.toBeDefined();
    await runner.close();
  });

  it('stops a call that hangs and restarts the worker', async () => {
    const runner = createAnalysisRunner(workerPath, 1500);
    await expect(runner.run('/x/slow.tif', 'slow.tif', DEFAULT_SETTINGS)).rejects.toThrow('slow.tif: analysis took longer than 1.5 s and was stopped');
    await expect(runner.run('/x/ok.tif', 'ok.tif', DEFAULT_SETTINGS)).resolves.toBeDefined();
    await runner.close();
  });
});
