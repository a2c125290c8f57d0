import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it, vi } from 'vitest';
import type { BatchSummary } from '../../core/contract';
import { BATCH_V8_FLAGS, workerTuning } from '../batch/worker-tuning';
import type { AnalysisEngine, BatchRunOptions } from '../engine/engine';
import { newProject } from '../project';
import { createPathAllowList } from './allow-list';
import { runBatch } from './batch-handlers';
import type { ShellContext } from './context';

// Nothing here may reach Electron: the handlers run in plain Node with a stand-in module.
vi.mock('electron', () => ({}));

describe("the window's batch", () => {
  const dir = mkdtempSync(join(tmpdir(), 'eggline-batch-handlers-'));
  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  /** A context whose engine records the options of each batch it is asked to run. */
  const context = (runs: BatchRunOptions[]): ShellContext => {
    const allow = createPathAllowList();
    allow.allowTree('read', dir);
    allow.allowTree('output', join(dir, 'out'));
    const engine = {
      runBatch: async (o: BatchRunOptions): Promise<BatchSummary> => {
        runs.push(o);
        return { runId: 'r', outDir: o.outDir, ok: 0, failed: 0, cancelled: false, results: [], movies: [], cohort: null, cohortError: null };
      },
    } as unknown as AnalysisEngine;
    return { deps: { dataDir: dir, dialogs: null as never, emitBatchProgress: () => undefined, batchJobs: 2 }, engine, allow, batches: new Map(), movies: new Set(), viewLoads: new Set(), noteRecent: async () => undefined };
  };

  it('starts its worker processes tuned as the command line does (V8 flags and MALLOC_ARENA_MAX on Linux)', async () => {
    const runs: BatchRunOptions[] = [];
    await runBatch(context(runs), dir, join(dir, 'out'), newProject(dir));
    expect(runs).toHaveLength(1);
    const expected = workerTuning(process.platform, process.env);
    expect(runs[0].workerExecArgv).toEqual(expected.execArgv);
    expect(runs[0].workerEnv).toEqual(expected.env);
    if (process.platform === 'linux') {
      expect(runs[0].workerExecArgv).toEqual(BATCH_V8_FLAGS);
      expect(runs[0].workerEnv?.MALLOC_ARENA_MAX).toBe(process.env.MALLOC_ARENA_MAX ?? '2');
    }
  });
});
