// The batch engine: analyse every stack of a folder on a pool of worker threads, then (when asked) every movie per
// time point, then write the tables and the run record. Used by the command line and by the desktop app's main
// process (cancel with an AbortSignal).
import { randomUUID } from 'node:crypto';
import { existsSync, promises as fs } from 'node:fs';
import { availableParallelism } from 'node:os';
import { basename, dirname, join, resolve } from 'node:path';
import {
  BatchOptionError, editsForFile, embryoResults, JOURNAL_FILE_NAME, normalizeResult, runRecordToJson, storedFileEdits, toHandEdits,
  type ParsedJournal, type RunEndReason, type RunInput, type RunRecord,
} from '../../core/batch';
import type { BatchProgress, BatchSummary, ProjectDoc } from '../../core/contract';
import { errorResult, type EmbryoResult, type MovieRecord } from '../../core/model';
import type { CohortAnalysis } from '../../core/cohort';
import type { CohortRequest } from './cohort-adapter';
import type { NamedFigure } from '../../core/figures';
import { settingsInForce, type AnalysisSettings } from '../../core/settings';
import type { ShardSpec } from '../../core/shard';
import { sha256File } from './hash-file';
import { openJournal, readJournal, settingsKey } from './journal-file';
import { isInside, listStackFiles } from './list-stacks';
import { partDir, selectPart } from './shard';
import type { BatchTask, InputDigest } from './task';
import { TIMELAPSE_FILES, timePassNeeds, type MovieFailure, type MovieOutcome, type TimelapseOptions, type TimeShape } from './timelapse-options';
import { softwareVersions } from './versions';
import { openPool, type WorkerPool } from './worker-pool';
import { OUTPUT_FILES, writeBatchOutputs } from './write-outputs';
import { writeFileAtomic } from '../project';
import { mark } from './timeline';

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
  /** Memory one file's analysis may use, bytes: files whose estimate exceeds it are refused, workers that use more are
   *  stopped. Absent = no limit. */
  readonly maxMemoryBytes?: number;
  /** Built worker script; default: batch-worker.mjs next to the running bundle. */
  readonly workerPath?: string;
  /** Node flags and environment added to the worker processes' own (the command line's tuning, app/batch/worker-tuning). */
  readonly workerExecArgv?: readonly string[];
  readonly workerEnv?: Readonly<Record<string, string>>;
  /** In-process analysis function (jobs = 0); default: the real decoder + pipeline. */
  readonly analyseInProcess?: (task: BatchTask) => Promise<EmbryoResult>;
  /** Recorded in run.json. */
  readonly commandLine?: readonly string[];
  readonly projectFile?: string | null;
  readonly configFile?: string | null;
  /** Reuse the results the journal in outDir holds for files whose bytes and settings are unchanged. */
  readonly resume?: boolean;
  /** Run the cohort step afterwards with this sample sheet. */
  readonly cohort?: CohortRequest | null;
  /** Analyse only this part of the sorted, size-balanced file list, writing to `<outDir>/parts/K-of-N`. */
  readonly shard?: ShardSpec | null;
  /** Analyse every file with more than one time point per time point after the main pass (absent or null: not). */
  readonly timelapse?: TimelapseOptions | null;
  /** Called when the time pass has analysed a movie (its file, and how many so far). */
  readonly onMovie?: (file: string, done: number) => void;
}

/** A batch summary plus the files written and warnings (folder listing, cohort step). */
export interface BatchRunResult extends BatchSummary {
  readonly written: readonly string[];
  readonly warnings: readonly string[];
  /** Why the cohort step failed (the batch tables are written regardless); null when it ran or was not asked for. */
  readonly cohortError: string | null;
  /** The cohort step's analysis and figures when it ran (the window shows these; it never runs the step again). */
  readonly cohortStep: { readonly analysis: CohortAnalysis; readonly figures: readonly NamedFigure[] } | null;
  readonly record: RunRecord;
  /** Every file has its row; else why not. */
  readonly complete: boolean;
  readonly reason: RunEndReason | null;
  /** Results taken over from the journal (--resume). */
  readonly reused: number;
  /** The movies of the time pass, summarised, and those it could not analyse (empty when it did not run). */
  readonly timelapse: { readonly movies: readonly MovieOutcome[]; readonly failures: readonly MovieFailure[] };
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

/** `path` with symlinks resolved; for a path that does not exist yet, its nearest existing parent resolved. */
export async function realPathOf(path: string): Promise<string> {
  const abs = resolve(path);
  const real = await fs.realpath(abs).catch(() => null);
  if (real !== null) return real;
  const parent = dirname(abs);
  return parent === abs ? abs : join(await realPathOf(parent), basename(abs));
}

async function checkFolders(folder: string, outDir: string): Promise<void> {
  const stat = await fs.stat(folder).catch(() => null);
  if (!stat) throw new BatchOptionError(`input folder not found: ${folder}`);
  if (!stat.isDirectory()) throw new BatchOptionError(`input is not a folder: ${folder}`);
  const [realIn, realOut] = [await realPathOf(folder), await realPathOf(outDir)];
  if (realIn === realOut) throw new BatchOptionError(`the output folder must not be the input folder (${outDir})`);
  if (isInside(realIn, realOut)) {
    throw new BatchOptionError(`the output folder must not be inside the input folder (${outDir} is in ${folder}${realOut !== resolve(outDir) ? ` through a symlink: ${realOut}` : ''})`);
  }
  if (isInside(realOut, realIn)) throw new BatchOptionError(`the output folder must not contain the input folder (${outDir})`);
  const out = await fs.stat(outDir).catch(() => null);
  if (out && !out.isDirectory()) throw new BatchOptionError(`the output path exists and is not a folder: ${outDir}`);
}

/** Analyse tasks one after another in this thread, with the same per-file time limit (the late work is abandoned). */
async function runInProcess(
  tasks: readonly BatchTask[], analyse: (t: BatchTask) => Promise<EmbryoResult>, timeoutMs: number, signal: AbortSignal | undefined,
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
    const result = await Promise.race([analyse(task).catch((e: unknown) => errorResult(task.file, `${task.file}: ${String(e)}`)), late]);
    clearTimeout(timer);
    results[task.index] = result;
    onResult(task, result);
  }
  return results;
}

/** Hashes of the batch's files: the digest a worker made from the bytes it decoded (`know`), else computed here
 *  once when first asked for (null when the file cannot be read). */
function fileHashes(): ((t: BatchTask) => Promise<InputDigest | null>) & { know(t: BatchTask, d: InputDigest): void } {
  const memo = new Map<number, Promise<InputDigest | null>>();
  const hashOf = (t: BatchTask): Promise<InputDigest | null> => {
    let h = memo.get(t.index);
    if (!h) { h = sha256File(t.path).catch(() => null); memo.set(t.index, h); }
    return h;
  };
  return Object.assign(hashOf, { know: (t: BatchTask, d: InputDigest) => { if (!memo.has(t.index)) memo.set(t.index, Promise.resolve(d)); } });
}

/** Results of an earlier run's journal that still hold: same file bytes (SHA-256) and the same settings key. */
async function reusable(
  journal: ParsedJournal, tasks: readonly BatchTask[], keys: readonly string[], hashOf: ReturnType<typeof fileHashes>,
): Promise<Map<number, EmbryoResult>> {
  const out = new Map<number, EmbryoResult>();
  for (const t of tasks) {
    const entry = journal.entries.get(t.file);
    if (!entry || entry.settingsKey !== keys[t.index]) continue;
    const size = await fs.stat(t.path).then((st) => st.size, () => -1);
    if (size !== entry.bytes) continue;
    if ((await hashOf(t))?.sha256 === entry.sha256) out.set(t.index, entry.result);
  }
  return out;
}

/** Delete the tables of an earlier run in `outDir` (a new run without --resume replaces them; until it ends,
 *  run.json says the folder holds no finished run). */
async function removeOldTables(outDir: string): Promise<void> {
  for (const name of [...OUTPUT_FILES, ...TIMELAPSE_FILES]) if (name !== 'run.json') await fs.rm(join(outDir, name), { force: true });
}

/** The one-line meaning of a run record's end state. */
function endNote(reason: RunEndReason | null, done: number, total: number): string | null {
  if (reason === null) return null;
  const tables = `the tables hold the ${done} of ${total} files that finished; rerun with --resume to analyse the rest`;
  if (reason === 'cancelled') return `stopped before every file was analysed: ${tables}`;
  if (reason === 'killed') return `the batch was killed before every file was analysed: ${tables}`;
  return `an error stopped the batch: ${tables}`;
}

/** The correction images' record for run.json, after reading them once (a file that cannot be read or used stops
 *  the run before any stack is analysed, with one line); null when the settings name none. */
async function checkedCorrections(settings: RunBatchOptions['settings'], folder: string): Promise<RunRecord['corrections'] | null> {
  // The reader (the decoder and the pipeline's projection) is loaded only when a correction image is named.
  if (settings.flatFieldFile === null && settings.backgroundImageFile === null) return null;
  const { correctionRecord, loadImageCorrections } = await import('./correction-images');
  const loading = loadImageCorrections(settings, folder);
  if (loading === null) return null;
  try {
    await loading;
    return await correctionRecord(settings, folder);
  } catch (e) {
    throw new BatchOptionError(e instanceof Error ? e.message : String(e));
  }
}

/** For a file with edits of single time points in the project: the edits in force at each and at any other time
 *  point, which the worker takes when the file has fewer time points than settings.timeIndex; else nothing. */
function timePointEditsOf(opts: RunBatchOptions, f: { file: string; path: string }): Pick<BatchTask, 'timePointEdits'> {
  const keys = Object.keys(storedFileEdits(opts.doc, f.file, f.path)?.timePoints ?? {});
  if (keys.length === 0) return {};
  const edits = (t: number | null) => {
    const e = editsForFile(opts.doc, f.file, f.path, t);
    return { settings: settingsInForce(opts.settings, e), handEdits: toHandEdits(e) };
  };
  return { timePointEdits: { own: edits(null), at: Object.fromEntries(keys.map((k) => [k, edits(Number(k))])) } };
}

/** Run a batch over `folder`, writing outputs to `outDir`. Rejects only for unusable options (BatchOptionError) or I/O on the output. */
export async function runBatch(opts: RunBatchOptions): Promise<BatchRunResult> {
  mark('batch started');
  const folder = resolve(opts.folder);
  const root = resolve(opts.outDir);
  await checkFolders(folder, root);
  const runId = randomUUID();
  const startedAt = new Date().toISOString();
  const warnings: string[] = [];
  const listed = await listStackFiles(folder, [root], warnings);
  mark('folder listed');
  const part = opts.shard ? await selectPart(listed, opts.shard, opts.projectFile ?? null) : null;
  const files = part ? part.files : listed;
  const outDir = opts.shard ? partDir(root, opts.shard) : root;
  const workerPath = opts.workerPath ?? defaultWorkerPath();
  if (opts.jobs > 0 && !existsSync(workerPath)) throw new Error(`the batch worker ${workerPath} is missing; build it with "npm run build"`);
  const tasks: BatchTask[] = files.map((f, index) => {
    const edits = editsForFile(opts.doc, f.file, f.path, opts.settings.timeIndex);
    const task = { index, path: f.path, file: f.file, settings: settingsInForce(opts.settings, edits), handEdits: toHandEdits(edits), ...timePointEditsOf(opts, f) };
    return opts.maxMemoryBytes === undefined ? task : { ...task, maxMemoryBytes: opts.maxMemoryBytes };
  });
  // The workers start now and load their code while this process writes run.json, opens the journal and orders the
  // files; whatever stops the batch before its files are handed out stops them too.
  const pool = opts.jobs > 0 && tasks.length > 0 ? openPool({
    jobs: Math.min(opts.jobs, tasks.length), workerPath, maxMemoryBytes: opts.maxMemoryBytes, execArgv: opts.workerExecArgv, env: opts.workerEnv,
    workerData: { decoderThreads: Math.max(1, Math.floor(defaultJobs() / opts.jobs)) },
  }) : null;
  try {
    return await runListed(opts, { folder, outDir, runId, startedAt, warnings, tasks, part, pool });
  } finally {
    pool?.close();
  }
}

/** What runBatch found before the run record is written: the files as tasks, the part, and the started workers. */
interface ListedRun {
  readonly folder: string;
  readonly outDir: string;
  readonly runId: string;
  readonly startedAt: string;
  readonly warnings: string[];
  readonly tasks: readonly BatchTask[];
  readonly part: Awaited<ReturnType<typeof selectPart>> | null;
  readonly pool: WorkerPool | null;
}

/** Largest file first, so that no worker is left with a big file while the others have finished (equal sizes keep
 *  their order; a file that cannot be read counts as empty). */
async function largestFirst(tasks: readonly BatchTask[]): Promise<BatchTask[]> {
  const sizes = await Promise.all(tasks.map((t) => fs.stat(t.path).then((s) => s.size, () => 0)));
  const order = tasks.map((_, i) => i).sort((a, b) => sizes[b] - sizes[a] || a - b);
  return order.map((i) => tasks[i]);
}

/** The batch after listing: run record, journal, the files (on the pool, or here when it is null), the tables. */
async function runListed(opts: RunBatchOptions, listed: ListedRun): Promise<BatchRunResult> {
  const { folder, outDir, runId, startedAt, warnings, tasks, part, pool } = listed;
  const software = await softwareVersions();
  const corrections = await checkedCorrections(opts.settings, folder);
  const timeoutMs = (opts.timeoutPerFileS ?? DEFAULT_TIMEOUT_PER_FILE_S) * 1000;
  // The cohort options are recorded when the project's cohort entry gave any (the command line alone says the rest).
  const c = opts.cohort;
  const cohortOptions: RunRecord['cohortOptions'] | null = c && opts.doc?.cohort !== undefined && Object.keys(opts.doc.cohort).length > 0 ? {
    reference: c.reference, backgroundCondition: c.backgroundCondition ?? null, backgroundConditionNamedBy: c.backgroundConditionNamedBy ?? '--background-condition',
    normalisation: c.normalisation ?? 'scale-offset', lambdaPosteriorEl: c.lambdaPosteriorEl ?? null, equivalenceMargin: c.equivalenceMargin ?? null, covariates: c.covariates ?? [],
  } : null;
  const record = (over: Partial<RunRecord>): RunRecord => ({
    schema: 'eggline-run', version: 2, runId, software, startedAt, endedAt: new Date().toISOString(),
    commandLine: opts.commandLine ?? null, folder, outDir, projectFile: opts.projectFile ?? null, configFile: opts.configFile ?? null,
    settings: opts.settings, jobs: opts.jobs, timeoutPerFileS: timeoutMs / 1000, maxMemoryBytes: opts.maxMemoryBytes ?? null, cancelled: false, complete: false, reason: 'killed',
    note: 'written when the run started; no later record replaced it, so the run was killed (or is still running) and the tables here are not a finished run',
    reused: 0, ok: 0, failed: 0, inputs: [], warnings: [...warnings], ...(corrections ? { corrections } : {}), ...(cohortOptions ? { cohortOptions } : {}), ...(part ? { shard: part.info } : {}), ...over,
  });
  await fs.mkdir(outDir, { recursive: true });
  const earlier = opts.resume === true ? await readJournal(outDir) : null;
  if (opts.resume === true && earlier === null) warnings.push(`--resume: no ${JOURNAL_FILE_NAME} in ${outDir}, so every file is analysed`);
  if (opts.resume !== true) await removeOldTables(outDir);
  await writeFileAtomic(join(outDir, 'run.json'), runRecordToJson(record({})));
  const journal = await openJournal(outDir, { runId, startedAt, eggline: software.eggline, resume: opts.resume === true });
  mark('run.json written, journal open');
  const hashOf = fileHashes();
  // A correction image changed under the same path must not let --resume reuse results: its SHA-256 joins the key.
  const keyVersion = corrections
    ? `${software.eggline}; flat ${corrections.flatField?.sha256 ?? '-'}; background ${corrections.backgroundImage?.sha256 ?? '-'}`
    : software.eggline;
  const keys = tasks.map((t) => settingsKey(t.settings, t.handEdits, keyVersion));
  const results: (EmbryoResult | undefined)[] = new Array(tasks.length);
  const kept = earlier ? await reusable(earlier, tasks, keys, hashOf) : new Map<number, EmbryoResult>();
  for (const [i, r] of kept) results[i] = r;
  const pending = tasks.filter((t) => results[t.index] === undefined);
  const progress = (p: Omit<BatchProgress, 'runId' | 'total'>): void => opts.onProgress?.({ runId, total: tasks.length, ...p });
  let done = kept.size;
  const appends = new Set<Promise<void>>();
  let journalError: string | null = null;
  const onStart = (t: BatchTask): void => {
    // In-process runs hash here; workers hash the bytes they decode and send the digest with the result.
    if (opts.jobs <= 0) void hashOf(t);
    progress({ done, file: t.file, status: 'running', message: null });
  };
  const shapes = new Map<number, TimeShape>();
  const onResult = (t: BatchTask, raw: EmbryoResult, input?: InputDigest | null, shape?: TimeShape | null): void => {
    if (input) hashOf.know(t, input);
    if (shape) shapes.set(t.index, shape);
    const r = normalizeResult({ ...raw, file: t.file });
    results[t.index] = r;
    done += 1;
    progress({ done, file: t.file, status: r.status, message: r.error });
    const append = hashOf(t).then(async (h) => {
      if (h) await journal.append({ file: t.file, sha256: h.sha256, bytes: h.bytes, settingsKey: keys[t.index], result: r });
    }).catch((e: unknown) => { journalError ??= `the journal could not be written (${String(e)}); --resume will analyse those files again`; });
    appends.add(append);
    void append.then(() => appends.delete(append));
  };
  const failed = async (e: unknown): Promise<never> => {
    const line = `an error stopped the batch: ${String(e).split('\n')[0]}`;
    await writeFileAtomic(join(outDir, 'run.json'), runRecordToJson(record({ reason: 'failed', note: line }))).catch(() => undefined);
    throw e;
  };
  mark('files handed out');
  try {
    if (pool) await pool.run(await largestFirst(pending), { timeoutMs, signal: opts.signal, onStart, onResult });
    else if (opts.jobs <= 0) await runInProcess(pending, opts.analyseInProcess ?? (await import('./analyse-file')).analyseFile, timeoutMs, opts.signal, onStart, onResult);
  } catch (e) {
    await failed(e);
  } finally {
    await Promise.all([...appends]);
    await journal.close();
  }
  mark('last file done, journal closed');
  if (journalError !== null) warnings.push(journalError);
  const complete = results.filter((r) => r !== undefined).length === tasks.length;
  const reason: RunEndReason | null = complete ? null : opts.signal?.reason === 'killed' ? 'killed' : opts.signal?.aborted ? 'cancelled' : 'failed';
  const finished = results.filter((r): r is EmbryoResult => r !== undefined);
  const inputs: RunInput[] = [];
  for (const t of tasks) {
    const r = results[t.index];
    const h = r ? await hashOf(t) : null;
    inputs.push({ file: t.file, bytes: h?.bytes ?? null, sha256: h?.sha256 ?? null, status: r?.status ?? 'not-run', error: r?.error ?? null });
  }
  const ok = finished.filter((r) => r.status === 'ok').length;
  const final = record({
    cancelled: !complete, complete, reason, note: endNote(reason, finished.length, tasks.length), reused: kept.size,
    ok, failed: finished.length - ok, inputs, warnings: [...warnings],
  });
  // The time pass: movies per time point; their results replace the main pass's one result of each movie.
  // A stop request during it ends the time pass before the next movie; movies not reached keep their main-pass row.
  // Files a worker found to have one time point are not opened again, and the pass's code (and the pipeline's) is
  // loaded only when some file may be a movie.
  const timeOptions = opts.timelapse;
  const movieFiles = timeOptions && complete
    ? tasks.filter((t) => { const s = shapes.get(t.index); return !s || timePassNeeds(opts.doc, t.file, timeOptions, s); }).map((t) => t.file)
    : [];
  const pass = movieFiles.length > 0 ? await import('./timelapse-pass') : null;
  const runs = pass && timeOptions ? await pass.analyseMovies(folder, movieFiles, opts.settings, opts.doc, timeOptions, opts.onMovie, opts.signal) : [];
  if (complete && opts.timelapse && opts.signal?.aborted) warnings.push('stopped during the time analysis: movies after the last one analysed keep one row (their main-pass time point); rerun to analyse them over time');
  const keyed = pass ? pass.withMovieResults(finished, runs) : [...finished];
  const movies: MovieRecord[] = runs.map((r) => r.record);
  const written = await writeBatchOutputs(outDir, keyed, final, movies).catch(failed);
  written.push(journal.path);
  mark('tables written');
  const timelapse: { movies: MovieOutcome[]; failures: MovieFailure[] } = pass ? pass.movieOutcomes(movies, keyed) : { movies: [], failures: [] };
  if (pass && movies.length > 0) written.push(...await pass.writeTimelapseOutputs(outDir, timelapse.movies, timelapse.failures).catch(failed));
  let cohortError: string | null = null;
  let cohortStep: BatchRunResult['cohortStep'] = null;
  if (opts.cohort && complete) {
    const failures = finished.filter((r) => r.status === 'error').map((r) => ({ file: r.file, error: r.error ?? 'error' }));
    const { runRequestedCohort } = await import('./cohort-adapter');
    const step = await runRequestedCohort(opts.cohort, {
      results: embryoResults(keyed), failures, outDir, runRecord: final, movies: timelapse.movies, movieFailures: timelapse.failures,
    });
    written.push(...step.written);
    warnings.push(...step.warnings);
    cohortError = step.error;
    if (step.error === null) cohortStep = { analysis: step.analysis, figures: step.figures };
  }
  mark('batch done');
  progress({ done, file: null, status: complete ? 'finished' : 'cancelled', message: null });
  return {
    runId, outDir, ok, failed: finished.length - ok, cancelled: !complete, complete, reason, reused: kept.size,
    results: keyed, movies, written, warnings, cohortError, cohortStep, record: final, timelapse,
  };
}
