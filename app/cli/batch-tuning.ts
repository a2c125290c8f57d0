// The batch command runs in a process tuned for long, core-saturating batches; these settings can only be made
// before a process starts, so the command restarts itself once (on Linux, where both were measured).
// - glibc's malloc arenas capped: libvips decodes on several threads and glibc gives each thread its own arena; the
//   pixel buffers freed there stayed in those arenas, so a worker's resident memory kept growing over a batch (one
//   worker over 12 stacks: ~2.0× the raw stack with the default, ~1.6× with 2 arenas, same speed; `npm run bench`).
// - V8 compiles optimised code on the thread that runs it (BATCH_V8_FLAGS): a batch already keeps every core busy
//   with its workers and the decoder's threads, and V8's background compiler threads only took CPU time from them
//   (12 stacks, 2 workers on 2 cores, four alternating runs: 13% less wall time, the same peak memory;
//   `npm run bench`). Collecting garbage on one thread as well saved a further ~6% but raised one worker's peak by
//   20–40 MiB, to about 2× the raw stack, so it is not used.
import { spawn as nodeSpawn } from 'node:child_process';
import type { ChildProcess, SpawnOptions } from 'node:child_process';

/** Arenas allowed (common practice for libvips on glibc: 2). */
export const ARENA_LIMIT = '2';

/** V8 flags of the batch process (they apply to its worker threads too). */
export const BATCH_V8_FLAGS: readonly string[] = ['--no-concurrent-recompilation'];

/** Set in the restarted process's environment, so it does not restart again. */
export const TUNED_MARK = 'EGGLINE_BATCH_TUNED';

/** Whether `eggline <command>` should restart itself tuned: the batch command on Linux, not restarted yet. */
export function needsBatchTuning(command: string | undefined, platform: string, env: Readonly<Record<string, string | undefined>>): boolean {
  return command === 'batch' && platform === 'linux' && env[TUNED_MARK] === undefined;
}

type Spawn = (file: string, args: readonly string[], options: SpawnOptions) => ChildProcess;

/** The message the launching process sends its tuned child to stop the batch cleanly. */
export const STOP_MESSAGE = 'eggline:stop';

/**
 * Run this command again as a child with BATCH_V8_FLAGS and MALLOC_ARENA_MAX (unless the user set it), writing to the
 * same terminal; resolves with its exit code (0, 1 or 2). The child stays in this process's group, so whatever ends
 * the group ends the batch, and it holds an IPC channel to this process: when this process dies, even by SIGKILL, the
 * channel closes and the child stops its batch ("killed" in run.json). SIGINT, SIGTERM and SIGHUP sent to this process
 * are passed on as a stop message; the child counts a stop message and a terminal's SIGINT that arrive together as
 * one request.
 */
export function runTunedBatch(args: readonly string[], env: NodeJS.ProcessEnv, spawn: Spawn = nodeSpawn): Promise<number> {
  return new Promise((resolve) => {
    const childEnv = { ...env, MALLOC_ARENA_MAX: env.MALLOC_ARENA_MAX ?? ARENA_LIMIT, [TUNED_MARK]: '1' };
    const child = spawn(process.execPath, [...BATCH_V8_FLAGS, ...process.execArgv, ...args], {
      stdio: ['inherit', 'inherit', 'inherit', 'ipc'], env: childEnv,
    });
    const forward = (): void => {
      if (child.connected) child.send?.(STOP_MESSAGE, () => undefined);
    };
    const signals: NodeJS.Signals[] = ['SIGINT', 'SIGTERM', 'SIGHUP'];
    for (const s of signals) process.on(s, forward);
    const done = (code: number): void => {
      for (const s of signals) process.removeListener(s, forward);
      resolve(code);
    };
    child.once('error', (e) => { process.stderr.write(`eggline: cannot restart the command: ${e.message}\n`); done(1); });
    child.once('exit', (code, signal) => {
      if (signal) process.stderr.write(`eggline: the batch process was ended by ${signal}; run.json in the output folder says what was written\n`);
      done(code === 0 || code === 2 ? code : 1);
    });
  });
}
