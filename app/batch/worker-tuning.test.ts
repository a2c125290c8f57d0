import { describe, expect, it } from 'vitest';
import { ARENA_LIMIT, BATCH_V8_FLAGS, workerTuning } from './worker-tuning';

describe('workerTuning', () => {
  it('gives Linux workers the V8 flags and MALLOC_ARENA_MAX, and other systems nothing', () => {
    // MALLOC_ARENA_MAX is read by glibc's malloc at start (from memory: glibc manual, "Memory Allocation Tunables"),
    // so it goes into the worker's environment, not this process's.
    expect(workerTuning('linux', { HOME: '/h' })).toEqual({ execArgv: BATCH_V8_FLAGS, env: { MALLOC_ARENA_MAX: ARENA_LIMIT } });
    expect(workerTuning('darwin', {})).toEqual({ execArgv: [], env: {} });
    expect(workerTuning('win32', {})).toEqual({ execArgv: [], env: {} });
  });

  it('keeps an arena count the user set', () => {
    expect(workerTuning('linux', { MALLOC_ARENA_MAX: '8' }).env).toEqual({ MALLOC_ARENA_MAX: '8' });
  });
});
