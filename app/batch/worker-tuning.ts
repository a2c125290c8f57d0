// The batch's worker processes are started tuned for long, core-saturating batches; these settings can only be made
// when a process starts, so they are given to each worker at its start (the batch process itself only hands out
// files and writes tables, and no longer restarts itself: a restart cost a second load of the command line, about
// 0.3 s of CPU before the first worker could start).
// - glibc's malloc arenas capped: libvips decodes on several threads and glibc gives each thread its own arena; the
//   pixel buffers freed there stayed in those arenas, so a worker's resident memory kept growing over a batch (one
//   worker over 12 stacks: ~2.0× the raw stack with the default, ~1.6× with 2 arenas, same speed; `npm run bench`).
// - V8 compiles optimised code on the thread that runs it (BATCH_V8_FLAGS): a batch already keeps every core busy
//   with its workers and the decoder's threads, and V8's background compiler threads only took CPU time from them
//   (12 stacks, 2 workers on 2 cores, four alternating runs: 13% less wall time, the same peak memory;
//   `npm run bench`). Collecting garbage on one thread as well saved a further ~6% but raised one worker's peak by
//   20–40 MiB, to about 2× the raw stack, so it is not used.

/** Arenas allowed (common practice for libvips on glibc: 2). */
export const ARENA_LIMIT = '2';

/** V8 flags of every batch worker process. */
export const BATCH_V8_FLAGS: readonly string[] = ['--no-concurrent-recompilation'];

/** The message a parent process holding an IPC channel to `eggline batch` sends to stop the batch cleanly. */
export const STOP_MESSAGE = 'eggline:stop';

/** How the command line starts its batch workers: node flags and environment added to the worker processes'. On
 *  Linux (where both were measured) the V8 flags and MALLOC_ARENA_MAX (unless the user set it); elsewhere nothing. */
export function workerTuning(platform: string, env: Readonly<Record<string, string | undefined>>): { execArgv: readonly string[]; env: Readonly<Record<string, string>> } {
  if (platform !== 'linux') return { execArgv: [], env: {} };
  return { execArgv: BATCH_V8_FLAGS, env: { MALLOC_ARENA_MAX: env.MALLOC_ARENA_MAX ?? ARENA_LIMIT } };
}
