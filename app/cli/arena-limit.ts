// The batch command runs with glibc's malloc arenas capped. Why: libvips decodes on several threads and glibc gives
// each thread its own arena; the pixel buffers freed there stay in those arenas, so a worker's resident memory kept
// growing over a batch (one worker over 12 stacks: ~2.0× the raw stack with the default, ~1.6× with 2 arenas, same
// speed; `npm run bench`). The cap must be set before the process starts, so the command restarts itself once.
import { spawn as nodeSpawn } from 'node:child_process';
import type { ChildProcess, SpawnOptions } from 'node:child_process';

/** Arenas allowed (common practice for libvips on glibc: 2). */
export const ARENA_LIMIT = '2';

/** Whether `eggline <command>` should restart itself with the arena cap: the batch command on Linux, cap not set. */
export function needsArenaLimit(command: string | undefined, platform: string, env: Readonly<Record<string, string | undefined>>): boolean {
  return command === 'batch' && platform === 'linux' && env.MALLOC_ARENA_MAX === undefined;
}

type Spawn = (file: string, args: readonly string[], options: SpawnOptions) => ChildProcess;

/**
 * Run this command again as a child with MALLOC_ARENA_MAX set, writing to the same terminal; resolves with its exit
 * code. The child leads its own process group, so a Ctrl+C reaches it once, passed on by this process (in one group,
 * the terminal's SIGINT and a passed-on one would both arrive, and a second SIGINT stops a batch at once). SIGINT,
 * SIGTERM and SIGHUP are passed on.
 */
export function runWithArenaLimit(args: readonly string[], env: NodeJS.ProcessEnv, spawn: Spawn = nodeSpawn): Promise<number> {
  return new Promise((resolve) => {
    const child = spawn(process.execPath, [...process.execArgv, ...args], { stdio: 'inherit', detached: true, env: { ...env, MALLOC_ARENA_MAX: ARENA_LIMIT } });
    const forward = (signal: NodeJS.Signals): void => { child.kill(signal); };
    const signals: NodeJS.Signals[] = ['SIGINT', 'SIGTERM', 'SIGHUP'];
    for (const s of signals) process.on(s, forward);
    const done = (code: number): void => {
      for (const s of signals) process.removeListener(s, forward);
      resolve(code);
    };
    child.once('error', (e) => { process.stderr.write(`eggline: cannot restart the command: ${e.message}\n`); done(1); });
    child.once('exit', (code, signal) => done(code ?? (signal ? 128 + signalNumber(signal) : 1)));
  });
}

/** Number of a signal a batch may end by (Linux numbering), for the shell convention of exit status 128 + n. */
function signalNumber(signal: NodeJS.Signals): number {
  return ({ SIGHUP: 1, SIGINT: 2, SIGKILL: 9, SIGTERM: 15 } as Partial<Record<NodeJS.Signals, number>>)[signal] ?? 1;
}
