// The batch engine: analyse every stack of a folder on a pool of worker threads, then write the tables and the run
// record. Used by the command line and by the desktop app's main process (cancel with an AbortSignal).
import { randomUUID } from 'node:crypto';
import { existsSync, promises as fs } from 'node:fs';
import { availableParallelism } from 'node:os';
import { join, resolve } from 'node:path';
import {
  BatchOptionError, editsForFile, errorResult, settingsForFile, toHandEdits, type RunInput, type RunRecord,
} from '../../core/batch';
import type { BatchProgress, BatchSummary, ProjectDoc } from '../../core/contract';
import type { EmbryoResult } from '../../core/model';
import type { AnalysisSettings } from '../../core/settings';
import type { ShardSpec } from '../../core/shard';
import { analyzeFile } from './analyze-file';
import { runCohort } from './cohort-adapter';
import { sha256File } from './hash-file';
import { isInside, listStackFiles } from './list-stacks';
import { partDir, selectPart } from './shard';
import type { BatchTask } from './task';
import { softwareVersions } from './versions';
import { runPool } from './worker-pool';
import { writeBatchOutputs } from './write-outputs';

/** Default per-file time limit, seconds: generous, a 2 GB stack on a slow disk must not be cut off. */
export const DEFAULT_TIMEOUT_PER_FILE_S = 900;

/** Everything a batch needs. */
export interface RunBatchOptions {
  readonly folder: string;
  readonly outDir: string;
  readonly settings: AnalysisSettings;
  /** Project whose per-file hand edits (axis, landmarks, fit range) are applied; null = none. */
  readonly doc: ProjectDoc | null;
  /** Worker threads; 0 = analyse in this thread (tests, or where workers are unavailable). */
  readonly jobs: number;
  readonly onProgress?: (p: BatchProgress) => void;
  readonly signal?: AbortSignal;
  readonly timeoutPerFileS?: number;
  /** Built worker script; default: batch-worker.mjs next to the running bundle. */
  readonly workerPath?: string;
  /** In-process analysis function (jobs = 0); default: the real decoder + pipeline. */
  readonly analyzeInProcess?: (task: BatchTask) => Promise<EmbryoResult>;
  /** Recorded in run.json. */
  readonly commandLine?: readonly string[];
  readonly projectFile?: string | null;
  readonly configFile?: string | null;
  /** Run the cohort step afterwards with this sample sheet. */
  readonly cohort?: { readonly sampleSheetPath: string; readonly reference: string | null } | null;
  /** Analyse only this part of the sorted, size-balanced file list, writing to `<outDir>/parts/K-of-N`. */
  readonly shard?: ShardSpec | null;
}

/** A batch summary plus the files written and warnings (folder listing, cohort step). */
export interface BatchRunResult extends BatchSummary {
  readonly written: readonly string[];
  readonly warnings: readonly string[];
  /** Why the cohort step failed (the batch tables are written regardless); null when it ran or was not asked for. */
  readonly cohortError: string | null;
  readonly record: RunRecord;
}

/** batch-worker.mjs beside the running CommonJS bundle (dist/main.cjs), else dist/ under the working folder.
 *  ESM entries (the CLI, the benchmark) pass workerPath from their own import.meta.url. */
export function defaultWorkerPath(): string {
  return typeof __dirname !== 'undefined' ? join(__dirname, 'batch-worker.mjs') : resolve('dist', 'batch-worker.mjs');
}

/** Default number of jobs: the cores this process may use. */
export function defaultJobs(): number {
  return Math.max(1, availableParallelism());
}

async function checkFolders(folder: string, outDir: string): Promise<void> {
  const stat = await fs.stat(folder).catch(() => null);
  if (!stat) throw new BatchOptionError(`input folder not found: ${folder}`);
  if (!stat.isDirectory()) throw new BatchOptionError(`input is not a folder: ${folder}`);
  if (resolve(folder) === resolve(outDir)) throw new BatchOptionError(`the output folder must not be the input folder (${outDir})`);
  if (isInside(outDir, folder)) throw new BatchOptionError(`the output folder must not contain the input folder (${outDir})`);
  const out = await fs.stat(outDir).catch(() => null);
  if (out && !out.isDirectory()) throw new BatchOptionError(`the output path exists and is not a folder: ${outDir}`);
}

/** Analyse tasks one after another in this thread, with the same per-file time limit (the late work is abandoned). */
async function runInProcess(
  tasks: readonly BatchTask[], analyze: (t: BatchTask) => Promise<EmbryoResult>, timeoutMs: number, signal: AbortSignal | undefined,
  onStart: (t: BatchTask) => void, onResult: (t: BatchTask, r: EmbryoResult) => void,
): Promise<(EmbryoResult | undefined)[]> {
  const results: (EmbryoResult | undefined)[] = new Array(tasks.length);
  for (const task of tasks) {
    if (signal?.aborted) break;
    onStart(task);
    let timer: NodeJS.Timeout | undefined;
    const late = new Promise<EmbryoResult>((res) => {
      timer = setTimeout(() => res(errorResult(task.file, `${task.file}: timed out after ${Math.round(timeoutMs / 1000)} s`)), timeoutMs);
    });
    const result = await Promise.race([analyze(task).catch((e: unknown) => errorResult(task.file, `${task.file}: ${String(e)}`)), late]);
    clearTimeout(timer);
    results[task.index] = result;
    onResult(task, result);
  }
  return results;
}

/** Run a batch over `folder`, writing outputs to `outDir`. Rejects only for unusable options (BatchOptionError) or I/O on the output. */
export async function runBatch(opts: RunBatchOptions): Promise<BatchRunResult> {
  const folder = resolve(opts.folder);
  const outDir = resolve(opts.outDir);
  await checkFolders(folder, outDir);
  const runId = randomUUID();
  const startedAt = new Date().toISOString();
  const warnings: string[] = [];
  const listed = await listStackFiles(folder, [outDir], warnings);
  const part = opts.shard ? await selectPart(listed, opts.shard, opts.projectFile ?? null) : null;
  const files = part ? part.files : listed;
  const writeDir = opts.shard ? partDir(outDir, opts.shard) : outDir;
  const workerPath = opts.workerPath ?? defaultWorkerPath();
  if (opts.jobs > 0 && !existsSync(workerPath)) throw new Error(`the batch worker ${workerPath} is missing; build it with "npm run build"`);
  const tasks: BatchTask[] = files.map((f, index) => {
    const edits = editsForFile(opts.doc, f.file, f.path);
    return { index, path: f.path, file: f.file, settings: settingsForFile(opts.settings, edits), handEdits: toHandEdits(edits) };
  });
  const progress = (p: Omit<BatchProgress, 'runId' | 'total'>): void => opts.onProgress?.({ runId, total: tasks.length, ...p });
  let done = 0;
  const hashes = new Map<number, Promise<{ sha256: string; bytes: number } | null>>();
  const onStart = (t: BatchTask): void => {
    hashes.set(t.index, sha256File(t.path).catch(() => null));
    progress({ done, file: t.file, status: 'running', message: null });
  };
  const onResult = (t: BatchTask, r: EmbryoResult): void => {
    done += 1;
    progress({ done, file: t.file, status: r.status, message: r.error });
  };
  const timeoutMs = (opts.timeoutPerFileS ?? DEFAULT_TIMEOUT_PER_FILE_S) * 1000;
  const slots = opts.jobs <= 0
    ? await runInProcess(tasks, opts.analyzeInProcess ?? analyzeFile, timeoutMs, opts.signal, onStart, onResult)
    : await runPool(tasks, {
      jobs: opts.jobs, workerPath, timeoutMs, signal: opts.signal, onStart, onResult,
      workerData: { decoderThreads: Math.max(1, Math.floor(defaultJobs() / opts.jobs)) },
    });
  const cancelled = opts.signal?.aborted === true || slots.some((r) => r === undefined);
  const results = slots.filter((r): r is EmbryoResult => r !== undefined);
  const inputs: RunInput[] = [];
  for (const t of tasks) {
    const h = await (hashes.get(t.index) ?? Promise.resolve(null));
    const r = slots[t.index];
    inputs.push({ file: t.file, bytes: h?.bytes ?? null, sha256: h?.sha256 ?? null, status: r?.status ?? 'not-run', error: r?.error ?? null });
  }
  const ok = results.filter((r) => r.status === 'ok').length;
  const record: RunRecord = {
    schema: 'eggline-run', version: 1, runId, software: await softwareVersions(), startedAt, endedAt: new Date().toISOString(),
    commandLine: opts.commandLine ?? null, folder, outDir: writeDir, projectFile: opts.projectFile ?? null, configFile: opts.configFile ?? null,
    settings: opts.settings, jobs: opts.jobs, timeoutPerFileS: timeoutMs / 1000, cancelled, ok, failed: results.length - ok, inputs, warnings: [...warnings],
    ...(part ? { shard: part.info } : {}),
  };
  const written = await writeBatchOutputs(writeDir, results, record);
  let cohortError: string | null = null;
  if (opts.cohort && !cancelled) {
    const failures = results.filter((r) => r.status === 'error').map((r) => ({ file: r.file, error: r.error ?? 'error' }));
    const step = await runCohort({
      results, failures, sampleSheetPath: opts.cohort.sampleSheetPath, reference: opts.cohort.reference, outDir, runRecord: record,
    });
    written.push(...step.written);
    warnings.push(...step.warnings);
    cohortError = step.error;
  }
  progress({ done, file: null, status: cancelled ? 'cancelled' : 'finished', message: null });
  return { runId, outDir: writeDir, ok, failed: results.length - ok, cancelled, results, written, warnings, cohortError, record };
}
