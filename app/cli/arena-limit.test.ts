import { EventEmitter } from 'node:events';
import type { ChildProcess } from 'node:child_process';
import { describe, expect, it, vi } from 'vitest';
import { ARENA_LIMIT, needsArenaLimit, runWithArenaLimit } from './arena-limit';

/** A stand-in child process: records kill() calls; the test emits 'exit' itself. */
function fakeChild(): ChildProcess & { sent: string[] } {
  const child = new EventEmitter() as ChildProcess & { sent: string[] };
  child.sent = [];
  child.kill = ((signal: NodeJS.Signals) => { child.sent.push(signal); return true; }) as ChildProcess['kill'];
  return child;
}

describe('needsArenaLimit', () => {
  it('asks for a restart only for the batch command on Linux when the cap is not set', () => {
    expect(needsArenaLimit('batch', 'linux', {})).toBe(true);
    expect(needsArenaLimit('batch', 'linux', { MALLOC_ARENA_MAX: '4' })).toBe(false);
    expect(needsArenaLimit('batch', 'darwin', {})).toBe(false);
    expect(needsArenaLimit('batch', 'win32', {})).toBe(false);
    expect(needsArenaLimit('inspect', 'linux', {})).toBe(false);
    expect(needsArenaLimit(undefined, 'linux', {})).toBe(false);
  });
});

describe('runWithArenaLimit', () => {
  it('runs the same command as a child with MALLOC_ARENA_MAX set and returns its exit code', async () => {
    // MALLOC_ARENA_MAX is read by glibc's malloc at start (from memory: glibc manual, "Memory Allocation Tunables").
    const child = fakeChild();
    const spawn = vi.fn(() => child);
    const done = runWithArenaLimit(['/x/cli.mjs', 'batch', 'in', '--out', 'o'], { HOME: '/h' }, spawn);
    expect(spawn).toHaveBeenCalledTimes(1);
    const [file, args, options] = spawn.mock.calls[0] as unknown as [string, string[], { stdio: string; detached: boolean; env: Record<string, string> }];
    expect(file).toBe(process.execPath);
    expect(args.slice(-5)).toEqual(['/x/cli.mjs', 'batch', 'in', '--out', 'o']);
    expect(options.stdio).toBe('inherit');
    expect(options).toMatchObject({ detached: true });
    expect(options.env).toEqual({ HOME: '/h', MALLOC_ARENA_MAX: ARENA_LIMIT });
    child.emit('exit', 1, null);
    await expect(done).resolves.toBe(1);
  });

  it('passes SIGINT and SIGTERM on once each and removes its handlers afterwards', async () => {
    const child = fakeChild();
    const before = { int: process.listenerCount('SIGINT'), term: process.listenerCount('SIGTERM') };
    const done = runWithArenaLimit(['/x/cli.mjs', 'batch'], {}, () => child);
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
    const done = runWithArenaLimit(['/x/cli.mjs', 'batch'], {}, () => child);
    child.emit('error', new Error('spawn ENOENT'));
    await expect(done).resolves.toBe(1);
    expect(write).toHaveBeenCalledWith('eggline: cannot restart the command: spawn ENOENT\n');
    write.mockRestore();
  });
});
