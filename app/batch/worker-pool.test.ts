import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { DEFAULT_SETTINGS } from '../../core/settings';
import type { BatchTask } from './task';
import { openPool, runPool } from './worker-pool';

// A stand-in worker (demo data): behaves by file name so crashes, exits and hangs can be provoked on purpose.
const dir = mkdtempSync(join(tmpdir(), 'eggline-pool-'));
const workerPath = join(dir, 'fake-worker.mjs');
writeFileSync(workerPath, `const require = (await import('node:module')).createRequire(import.meta.url);
process.on('disconnect', () => process.exit(0));
if (process.env.PID_FILE) require('node:fs').appendFileSync(process.env.PID_FILE, JSON.stringify({ pid: process.pid, execArgv: process.execArgv }) + '\\n');
const keep = [];
process.on('message', (task) => {
  if (task.file.includes('crash')) throw new Error('boom in ' + task.file);
  if (task.file.includes('exit')) process.exit(3);
  if (task.file.includes('hang')) { for (;;) {} }
  if (task.file.includes('abort')) process.abort();
  if (task.file.includes('grow')) { const a = []; for (;;) a.push(new Array(1e6).fill(1.5)); }
  if (task.file.includes('big')) { for (let i = 0; i < 40; i++) keep.push(new Uint8Array(16 << 20).fill(1)); setTimeout(() => {}, 60000); return; }
  process.send({ type: 'result', index: task.index, result: { file: task.file, status: 'ok', error: null } });
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
    const results = await runPool(tasks(names), { jobs: 2, workerPath, timeoutMs: 4000, onResult: (t) => seen.push(t.file) });
    expect(results.map((r) => r?.status)).toEqual(['ok', 'error', 'ok', 'error', 'error', 'ok']);
    expect(results[1]?.error).toBe('crash.tif: the analysis crashed (exit code 1: Error: boom in crash.tif)');
    expect(results[3]?.error).toBe('exit.tif: the analysis crashed (exit code 3)');
    expect(results[4]?.error).toBe('hang.tif: timed out after 4 s (the file may be damaged or too large)');
    expect(seen.sort()).toEqual([...names].sort());
  });
  it('a worker that aborts, runs out of heap or over its memory limit gives its file an error row; the pool goes on', async () => {
    const names = ['abort.tif', 'grow.tif', 'big.tif', 'a.tif'];
    const results = await runPool(tasks(names), { jobs: 1, workerPath, timeoutMs: 60_000, maxMemoryBytes: 400 * 2 ** 20 });
    // SIGABRT is what abort(3) raises (from memory: POSIX abort()).
    expect(results[0]?.error).toBe('abort.tif: the analysis crashed (ended by SIGABRT)');
    expect(results[1]?.error).toBe('grow.tif: the analysis ran out of memory and was stopped (the file may be damaged, or raise the limit with --max-memory)');
    expect(results[2]?.error).toBe('big.tif: used more than 400 MiB of memory and was stopped (the file may be damaged, or raise the limit with --max-memory)');
    expect(results[3]?.status).toBe('ok');
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

/** True while a process with this id exists (signal 0 only checks; from memory: POSIX kill(2)). */
const alive = (pid: number): boolean => { try { process.kill(pid, 0); return true; } catch { return false; } };
const until = async (ok: () => boolean): Promise<void> => { for (let i = 0; i < 400 && !ok(); i++) await new Promise((r) => setTimeout(r, 25)); };
/** The workers that started with PID_FILE = `file`: their pids and node flags. */
const startedIn = (file: string): { pid: number; execArgv: string[] }[] =>
  (existsSync(file) ? readFileSync(file, 'utf8').trim().split('\n').filter(Boolean) : []).map((l) => JSON.parse(l) as { pid: number; execArgv: string[] });

describe('openPool', () => {
  it('starts its workers with the given flags and environment before the files are known, and stops those it has no file for', async () => {
    const file = join(dir, 'pids-early');
    const pool = openPool({ jobs: 3, workerPath, execArgv: ['--max-semi-space-size=2'], env: { PID_FILE: file } });
    await until(() => startedIn(file).length === 3);
    const started = startedIn(file);
    expect(started.map((w) => w.execArgv.includes('--max-semi-space-size=2'))).toEqual([true, true, true]);
    expect((await pool.run(tasks(['a.tif']), { timeoutMs: 10_000 })).map((r) => r?.status)).toEqual(['ok']);
    await until(() => started.every((w) => !alive(w.pid)));
    expect(started.filter((w) => alive(w.pid))).toEqual([]);
  });
  it('close() before run stops every worker, and the closed pool runs nothing', async () => {
    const file = join(dir, 'pids-closed');
    const pool = openPool({ jobs: 2, workerPath, env: { PID_FILE: file } });
    await until(() => startedIn(file).length === 2);
    pool.close();
    await until(() => startedIn(file).every((w) => !alive(w.pid)));
    expect(startedIn(file).filter((w) => alive(w.pid))).toEqual([]);
    expect(await pool.run(tasks(['a.tif']), { timeoutMs: 1000 })).toEqual([undefined]);
  });
});
