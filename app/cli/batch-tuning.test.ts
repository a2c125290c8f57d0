import { EventEmitter } from 'node:events';
import type { ChildProcess } from 'node:child_process';
import { describe, expect, it, vi } from 'vitest';
import { ARENA_LIMIT, BATCH_V8_FLAGS, needsBatchTuning, runTunedBatch, TUNED_MARK } from './batch-tuning';

/** A stand-in child process: records kill() calls; the test emits 'exit' itself. */
function fakeChild(): ChildProcess & { sent: string[] } {
  const child = new EventEmitter() as ChildProcess & { sent: string[] };
  child.sent = [];
  child.kill = ((signal: NodeJS.Signals) => { child.sent.push(signal); return true; }) as ChildProcess['kill'];
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
    const [file, args, options] = spawn.mock.calls[0] as unknown as [string, string[], { stdio: string; detached: boolean; env: Record<string, string> }];
    expect(file).toBe(process.execPath);
    expect(args.slice(-5)).toEqual(['/x/cli.mjs', 'batch', 'in', '--out', 'o']);
    // V8 flags go before the script (from memory: node's command-line syntax, `node [options] script [arguments]`).
    expect(args.slice(0, BATCH_V8_FLAGS.length)).toEqual(BATCH_V8_FLAGS);
    expect(options.stdio).toBe('inherit');
    expect(options).toMatchObject({ detached: true });
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

  it('passes SIGINT and SIGTERM on once each and removes its handlers afterwards', async () => {
    const child = fakeChild();
    const before = { int: process.listenerCount('SIGINT'), term: process.listenerCount('SIGTERM') };
    const done = runTunedBatch(['/x/cli.mjs', 'batch'], {}, () => child);
    process.emit('SIGTERM', 'SIGTERM');
    process.emit('SIGINT', 'SIGINT');
    expect(child.sent).toEqual(['SIGTERM', 'SIGINT']);
    // Shell convention (common practice): a process ended by signal n exits with status 128 + n; SIGTERM is 15.
    child.emit('exit', null, 'SIGTERM');
    await expect(done).resolves.toBe(143);
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
