import { EventEmitter } from 'node:events';
import type { ChildProcess } from 'node:child_process';
import { describe, expect, it, vi } from 'vitest';
import { ARENA_LIMIT, BATCH_V8_FLAGS, needsBatchTuning, runTunedBatch, STOP_MESSAGE, TUNED_MARK } from './batch-tuning';

/** A stand-in child process: records messages sent to it; the test emits 'exit' itself. */
function fakeChild(): ChildProcess & { sent: unknown[] } {
  const child = new EventEmitter() as ChildProcess & { sent: unknown[] };
  child.sent = [];
  Object.defineProperty(child, 'connected', { value: true });
  child.send = ((message: unknown) => { child.sent.push(message); return true; }) as ChildProcess['send'];
  return child;
}

describe('needsBatchTuning', () => {
  it('asks for a restart only for the batch command on Linux, once', () => {
    expect(needsBatchTuning('batch', 'linux', {})).toBe(true);
    expect(needsBatchTuning('batch', 'linux', { MALLOC_ARENA_MAX: '4' })).toBe(true);
    expect(needsBatchTuning('batch', 'linux', { [TUNED_MARK]: '1' })).toBe(false);
    expect(needsBatchTuning('batch', 'darwin', {})).toBe(false);
    expect(needsBatchTuning('batch', 'win32', {})).toBe(false);
    expect(needsBatchTuning('inspect', 'linux', {})).toBe(false);
    expect(needsBatchTuning(undefined, 'linux', {})).toBe(false);
  });
});

describe('runTunedBatch', () => {
  it('runs the same command as a child with the V8 flags and MALLOC_ARENA_MAX set and returns its exit code', async () => {
    // MALLOC_ARENA_MAX is read by glibc's malloc at start (from memory: glibc manual, "Memory Allocation Tunables").
    const child = fakeChild();
    const spawn = vi.fn(() => child);
    const done = runTunedBatch(['/x/cli.mjs', 'batch', 'in', '--out', 'o'], { HOME: '/h' }, spawn);
    expect(spawn).toHaveBeenCalledTimes(1);
    const [file, args, options] = spawn.mock.calls[0] as unknown as [string, string[], { stdio: string[]; detached?: boolean; env: Record<string, string> }];
    expect(file).toBe(process.execPath);
    expect(args.slice(-5)).toEqual(['/x/cli.mjs', 'batch', 'in', '--out', 'o']);
    // V8 flags go before the script (from memory: node's command-line syntax, `node [options] script [arguments]`).
    expect(args.slice(0, BATCH_V8_FLAGS.length)).toEqual(BATCH_V8_FLAGS);
    // Same process group as the launcher (no `detached`), and an IPC channel whose closing tells the child its
    // launcher is gone (from memory: Node.js child_process docs, 'disconnect' event and `detached`).
    expect(options.stdio).toEqual(['inherit', 'inherit', 'inherit', 'ipc']);
    expect(options.detached).toBeUndefined();
    expect(options.env).toEqual({ HOME: '/h', MALLOC_ARENA_MAX: ARENA_LIMIT, [TUNED_MARK]: '1' });
    child.emit('exit', 1, null);
    await expect(done).resolves.toBe(1);
  });

  it('keeps an arena count the user set', async () => {
    const child = fakeChild();
    const spawn = vi.fn(() => child);
    const done = runTunedBatch(['/x/cli.mjs', 'batch'], { MALLOC_ARENA_MAX: '8' }, spawn);
    const options = (spawn.mock.calls[0] as unknown as [string, string[], { env: Record<string, string> }])[2];
    expect(options.env).toEqual({ MALLOC_ARENA_MAX: '8', [TUNED_MARK]: '1' });
    child.emit('exit', 0, null);
    await expect(done).resolves.toBe(0);
  });

  it('passes SIGINT and SIGTERM on as stop messages, exits 0/1/2 only, and removes its handlers afterwards', async () => {
    const child = fakeChild();
    const before = { int: process.listenerCount('SIGINT'), term: process.listenerCount('SIGTERM') };
    const write = vi.spyOn(process.stderr, 'write').mockImplementation(() => true);
    const done = runTunedBatch(['/x/cli.mjs', 'batch'], {}, () => child);
    process.emit('SIGTERM', 'SIGTERM');
    process.emit('SIGINT', 'SIGINT');
    expect(child.sent).toEqual([STOP_MESSAGE, STOP_MESSAGE]);
    child.emit('exit', null, 'SIGKILL');
    await expect(done).resolves.toBe(1);
    expect(write).toHaveBeenCalledWith('eggline: the batch process was ended by SIGKILL; run.json in the output folder says what was written\n');
    write.mockRestore();
    expect(process.listenerCount('SIGINT')).toBe(before.int);
    expect(process.listenerCount('SIGTERM')).toBe(before.term);
  });

  it('reports a child that cannot start as exit status 1 with a message', async () => {
    const child = fakeChild();
    const write = vi.spyOn(process.stderr, 'write').mockImplementation(() => true);
    const done = runTunedBatch(['/x/cli.mjs', 'batch'], {}, () => child);
    child.emit('error', new Error('spawn ENOENT'));
    await expect(done).resolves.toBe(1);
    expect(write).toHaveBeenCalledWith('eggline: cannot restart the command: spawn ENOENT\n');
    write.mockRestore();
  });
});
