// Batches: one at a time, each with its own AbortController; progress is re-labelled with our run id.
import { availableParallelism } from 'node:os';
import { randomUUID } from 'node:crypto';
import type { BatchSummary } from '../../core/contract';
import { requireAllowed, requireProjectDoc, requireText } from './args';
import { workerTuning } from '../batch/worker-tuning';
import { findSampleSheet } from '../engine/cohort-summary';
import type { ShellContext } from './context';
import { ApiFailure } from './result';

/** Worker count when the deps do not say: leave one core for the window. */
export function defaultBatchJobs(): number {
  return Math.max(1, availableParallelism() - 1);
}

/** Run a batch over an allowed folder into a chosen output folder; resolves when it ends. */
export async function runBatch(ctx: ShellContext, folderArg: unknown, outArg: unknown, docArg: unknown): Promise<BatchSummary> {
  const folder = requireAllowed(ctx.allow, 'read', folderArg, 'folder');
  const outDir = requireAllowed(ctx.allow, 'output', outArg, 'outDir');
  const doc = requireProjectDoc(docArg);
  // Conditions come from samples.csv in the folder (the demo writes one); without it there is no cohort step.
  const sampleSheetPath = await findSampleSheet(folder);
  // Checked and claimed with no await in between. Two batches would compete for the same cores and could write into the same folder.
  if (ctx.batches.size > 0) throw new ApiFailure('busy', 'a batch is already running; cancel it or wait for it to finish');
  const runId = randomUUID();
  const controller = new AbortController();
  ctx.batches.set(runId, controller);
  // The worker processes start tuned as the command line's do (V8 flags, MALLOC_ARENA_MAX on Linux).
  const tuning = workerTuning(process.platform, process.env);
  try {
    const summary = await ctx.engine.runBatch({
      folder, outDir, settings: doc.settings, doc: { ...doc, folder }, jobs: ctx.deps.batchJobs ?? defaultBatchJobs(),
      onProgress: (p) => ctx.deps.emitBatchProgress({ ...p, runId }),
      signal: controller.signal, sampleSheetPath, workerExecArgv: tuning.execArgv, workerEnv: tuning.env,
    });
    // Its results may be read back later (and its report opened) from this window.
    ctx.allow.allowTree('results', outDir);
    return { ...summary, runId };
  } finally {
    ctx.batches.delete(runId);
  }
}

/** Ask a running batch to stop; it resolves soon after with cancelled: true. */
export function cancelBatch(ctx: ShellContext, runIdArg: unknown): null {
  const runId = requireText(runIdArg, 'runId', 100);
  const controller = ctx.batches.get(runId);
  if (controller === undefined) throw new ApiFailure('not-found', `batch ${runId}: not running`);
  controller.abort();
  return null;
}
