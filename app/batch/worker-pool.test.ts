import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { DEFAULT_SETTINGS } from '../../core/settings';
import type { BatchTask } from './task';
import { runPool } from './worker-pool';

// A stand-in worker (demo data): behaves by file name so crashes, exits and hangs can be provoked on purpose.
const dir = mkdtempSync(join(tmpdir(), 'eggline-pool-'));
const workerPath = join(dir, 'fake-worker.mjs');
writeFileSync(workerPath, `
import { parentPort } from 'node:worker_threads';
parentPort.on('message', (task) => {
  if (task.file.includes('crash')) throw new Error('boom in ' + task.file);
  if (task.file.includes('exit')) process.exit(3);
  if (task.file.includes('hang')) { for (;;) {} }
  parentPort.postMessage({ type: 'result', index: task.index, result: { file: task.file, status: 'ok', error: null } });
});
`);
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const tasks = (names: string[]): BatchTask[] =>
  names.map((file, index) => ({ index, file, path: join(dir, file), settings: DEFAULT_SETTINGS, handEdits: null }));

describe('runPool', () => {
  it('analyses every task and keeps results in task order', async () => {
    const names = ['a.tif', 'b.tif', 'c.tif', 'd.tif', 'e.tif'];
    const results = await runPool(tasks(names), { jobs: 2, workerPath, timeoutMs: 10_000 });
    expect(results.map((r) => r?.file)).toEqual(names);
  });
  it('survives a crash, an exit and a hang: those files get error rows naming them, the rest are analysed', async () => {
    const names = ['a.tif', 'crash.tif', 'b.tif', 'exit.tif', 'hang.tif', 'c.tif'];
    const seen: string[] = [];
    const results = await runPool(tasks(names), { jobs: 2, workerPath, timeoutMs: 1500, onResult: (t) => seen.push(t.file) });
    expect(results.map((r) => r?.status)).toEqual(['ok', 'error', 'ok', 'error', 'error', 'ok']);
    expect(results[1]?.error).toBe('crash.tif: the analysis crashed (boom in crash.tif)');
    expect(results[3]?.error).toBe('exit.tif: the analysis stopped unexpectedly (worker exit code 3)');
    expect(results[4]?.error).toBe('hang.tif: timed out after 2 s (the file may be damaged or too large)');
    expect(seen.sort()).toEqual([...names].sort());
  });
  it('stops when cancelled, leaving unrun tasks empty', async () => {
    const ctrl = new AbortController();
    const names = ['a.tif', 'hang.tif', 'b.tif', 'c.tif'];
    const pending = runPool(tasks(names), { jobs: 1, workerPath, timeoutMs: 60_000, signal: ctrl.signal, onResult: () => undefined,
      onStart: (t) => { if (t.file === 'hang.tif') setTimeout(() => ctrl.abort(), 50); } });
    const results = await pending;
    expect(results[0]?.status).toBe('ok');
    expect(results.slice(1).every((r) => r === undefined)).toBe(true);
  });
  it('resolves at once for an empty batch', async () => {
    expect(await runPool([], { jobs: 2, workerPath, timeoutMs: 1000 })).toEqual([]);
  });
});
