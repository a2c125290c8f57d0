// The built batch worker as a child process: a terminal's Ctrl+C, a hang-up or a SIGTERM sent to the whole process
// group must not end it (the batch stops cleanly and ends its workers itself); its parent going away does.
import { fork } from 'node:child_process';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { ensureBuilt, ROOT } from './helpers';

const alive = (pid: number): boolean => { try { process.kill(pid, 0); return true; } catch { return false; } };
const sleep = (ms: number): Promise<void> => new Promise((r) => setTimeout(r, ms));

describe('batch worker process and signals', () => {
  it('outlives SIGINT, SIGHUP and SIGTERM, and exits when its IPC channel closes', async () => {
    ensureBuilt();
    const child = fork(join(ROOT, 'dist', 'batch-worker.mjs'), [], { stdio: ['ignore', 'ignore', 'ignore', 'ipc'], serialization: 'advanced' });
    const exited = new Promise<number | null>((r) => child.once('exit', (code) => r(code)));
    const pid = child.pid as number;
    // The worker has set its handlers once its code is loaded: wait until it answers a file it cannot open.
    const answered = new Promise((r) => child.once('message', r));
    child.send({ index: 0, path: join(ROOT, 'no-such-file.tif'), file: 'no-such-file.tif', settings: {}, handEdits: null });
    await answered;
    for (const signal of ['SIGINT', 'SIGHUP', 'SIGTERM'] as const) process.kill(pid, signal);
    await sleep(300);
    expect(alive(pid)).toBe(true);
    child.disconnect();
    await expect(exited).resolves.toBe(0);
  }, 60_000);
});
