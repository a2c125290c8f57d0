// `eggline batch <folder> --out <dir> …`: resolve settings (defaults < project < config < flags), load hand edits, run the batch.
import { promises as fs } from 'node:fs';
import { join, resolve } from 'node:path';
import { totalmem } from 'node:os';
import {
  BatchOptionError, defaultMaxMemoryBytes, mergeSettings, parseConfigText, parseSettingsFlags, PROJECT_FILE_NAME, type SettingsOverrides,
} from '../../core/batch';
import type { ProjectDoc } from '../../core/contract';
import { DEFAULT_SETTINGS, flagKey, flagValue, RUN_SETTINGS, runSettingSpec, SETTINGS, type AnalysisSettings } from '../../core/settings';
import { MAX_PARTS, parseShardSpec, type ShardSpec } from '../../core/shard';
import { defaultJobs, realPathOf, runBatch, type BatchRunResult, type RunBatchOptions } from '../batch/run-batch';
import { isInside } from '../batch/list-stacks';
import { STOP_MESSAGE } from '../batch/worker-tuning';
import { loadProjectOrBackup } from '../project';
import { BATCH_HELP } from './help';
import { joinNegativeValues, parseCommandArgs } from './parse-command-args';
import { progressPrinter } from './progress';
import { DEFAULT_CPUS_PER_TASK, joinSlurmOptions, partArguments, submitCommands, writeSlurmScripts } from './slurm-scripts';
import { UsageError, type CliIo } from './usage-error';
import { parseTimelapseFlags, reportTimelapse } from './timelapse-step';
import type { TimelapseOptions } from '../batch/timelapse-options';
import { backgroundLine, cohortChoices, parseComparisonFlags, type CohortChoices, type CohortFlags } from '../cohort/cohort-choices';

/** One flag per analysis setting, from the settings table (core/settings SETTINGS). */
const SETTING_OPTIONS = Object.fromEntries(SETTINGS.map((s) => [s.flag.slice(2), s.repeatable ? { type: 'string', multiple: true } : { type: 'string' }])) as
  Record<string, { type: 'string'; multiple?: boolean }>;

/** One flag per run setting (core/settings RUN_SETTINGS: --jobs, --file-timeout, --max-memory). */
const RUN_OPTIONS = Object.fromEntries(RUN_SETTINGS.map((s) => [s.flag.slice(2), { type: 'string' }])) as Record<string, { type: 'string' }>;

const OPTIONS = {
  ...SETTING_OPTIONS, ...RUN_OPTIONS,
  out: { type: 'string' }, config: { type: 'string' },
  project: { type: 'string' }, 'no-project': { type: 'boolean' }, samples: { type: 'string' }, reference: { type: 'string' }, 'background-condition': { type: 'string' },
  normalise: { type: 'string' }, 'lambda-posterior-el': { type: 'string' }, 'equivalence-margin': { type: 'string' }, covariate: { type: 'string', multiple: true },
  resume: { type: 'boolean' }, shard: { type: 'string' },
  slurm: { type: 'string' }, 'slurm-options': { type: 'string' }, help: { type: 'boolean', short: 'h' },
  time: { type: 'string' }, 'axis-per-time': { type: 'boolean' }, 'time-step': { type: 'string' }, 'tau-range': { type: 'string' },
  'baseline-frames': { type: 'string' },
} as const;

/** Everything the batch command resolved from its arguments, before running. */
export interface BatchPlan {
  readonly folder: string;
  readonly outDir: string;
  readonly jobs: number;
  readonly settings: AnalysisSettings;
  readonly doc: ProjectDoc | null;
  readonly projectFile: string | null;
  readonly configFile: string | null;
  readonly samples: string | null;
  /** The cohort step's options: --reference and --background-condition over the project's cohort entry over the
   *  defaults (reference, backgroundCondition, normalisation, lambdaPosteriorEl, equivalenceMargin). */
  readonly cohort: CohortChoices;
  /** The cohort options given as flags (undefined: not given); `--slurm` passes these and the project to the merge. */
  readonly cohortFlags: CohortFlags;
  readonly timeoutS: number | undefined;
  readonly resume: boolean;
  readonly maxMemoryBytes: number;
  readonly notes: readonly string[];
  /** Analyse only this part (--shard K/N). */
  readonly shard: ShardSpec | null;
  /** Write Slurm scripts for this many parts instead of analysing (--slurm N), with --slurm-options. */
  readonly slurm: { readonly parts: number; readonly options: string | null; readonly cpusPerTask: number; readonly partArgs: readonly string[] } | null;
  /** The time analysis of files with more than one time point (--time, --axis-per-time, --time-step, …). */
  readonly timelapse: TimelapseOptions;
}

function wholeNumber(text: string, flag: string, min: number, max: number): number {
  const n = Number(text);
  if (!/^\d+$/.test(text.trim()) || n < min || n > max) throw new UsageError(`${flag} must be a whole number from ${min} to ${max} (got "${text}")`, 'batch');
  return n;
}

/** A run setting's flag text as its value, by its row in RUN_SETTINGS (the row's rule is the message). */
function runFlag(key: string, text: string): number {
  return flagValue(runSettingSpec(key), text) as number;
}

/** The text given for a run setting's flag, or undefined. */
function runText(values: Readonly<Record<string, unknown>>, key: string): string | undefined {
  return values[runSettingSpec(key).flag.slice(2)] as string | undefined;
}

async function readConfig(path: string): Promise<SettingsOverrides> {
  const text = await fs.readFile(path, 'utf8').catch((e: NodeJS.ErrnoException) => {
    throw new UsageError(`cannot read config file ${path} (${e.code ?? e.message})`, 'batch');
  });
  return parseConfigText(text, path);
}

async function readProject(given: string | undefined, folder: string, skip: boolean): Promise<{ doc: ProjectDoc | null; path: string | null; note: string | null }> {
  const path = given !== undefined ? resolve(given) : skip ? null : join(folder, PROJECT_FILE_NAME);
  if (path === null) return { doc: null, path: null, note: null };
  const exists = await fs.stat(path).then((s) => s.isFile(), () => false);
  if (!exists) {
    if (given !== undefined) throw new UsageError(`project file not found: ${given}`, 'batch');
    return { doc: null, path: null, note: null };
  }
  try {
    const loaded = await loadProjectOrBackup(path);
    const note = `using hand edits from ${path}${given === undefined ? ' (found in the input folder; --no-project to ignore)' : ''}`;
    return { doc: loaded.doc, path, note: loaded.warning === null ? note : `warning: ${loaded.warning}` };
  } catch (e) {
    throw new UsageError((e as Error).message.split('\n')[0], 'batch');
  }
}

/** Resolve the batch command's arguments into a plan; throws UsageError / BatchOptionError for bad input. */
export async function planBatch(given: readonly string[]): Promise<BatchPlan | 'help'> {
  const argv = joinNegativeValues(joinSlurmOptions(given), OPTIONS);
  const { values: v, positionals } = parseCommandArgs(argv, OPTIONS, 'batch');
  if (v.help) return 'help';
  if (positionals.length === 0) throw new UsageError('missing the input folder', 'batch');
  if (positionals.length > 1) throw new UsageError(`expected one input folder, got ${positionals.length}: ${positionals.join(' ')}`, 'batch');
  if (v.out === undefined) throw new UsageError('missing --out <dir> (where the tables go)', 'batch');
  const folder = resolve(positionals[0]);
  const stat = await fs.stat(folder).catch(() => null);
  if (!stat?.isDirectory()) throw new UsageError(`${stat ? 'not a folder' : 'input folder not found'}: ${positionals[0]}`, 'batch');
  if (resolve(v.out) === folder) throw new UsageError('--out must not be the input folder (nothing is written next to the inputs)', 'batch');
  const [realIn, realOut] = [await realPathOf(folder), await realPathOf(v.out)];
  if (realIn === realOut || isInside(realIn, realOut)) {
    throw new UsageError(`--out must not be inside the input folder (${v.out}${realOut !== resolve(v.out) ? `, through a symlink, is ${realOut}` : ''}; nothing is written next to the inputs)`, 'batch');
  }
  if (v.reference !== undefined && v.samples === undefined) throw new UsageError('--reference needs --samples', 'batch');
  if (v['background-condition'] !== undefined && v.samples === undefined) throw new UsageError('--background-condition needs --samples', 'batch');
  if (v['background-condition'] !== undefined && v['background-condition'].trim() === '') throw new UsageError('--background-condition needs a condition name', 'batch');
  for (const flag of ['normalise', 'lambda-posterior-el', 'equivalence-margin', 'covariate'] as const) {
    if (v[flag] !== undefined && v.samples === undefined) throw new UsageError(`--${flag} needs --samples`, 'batch');
  }
  const comparison = parseComparisonFlags(v);
  if ('usage' in comparison) throw new UsageError(comparison.usage as string, 'batch');
  if (v.shard !== undefined && v.slurm !== undefined) throw new UsageError('use --shard (analyse one part) or --slurm (write the scripts), not both', 'batch');
  if (v['slurm-options'] !== undefined && v.slurm === undefined) throw new UsageError('--slurm-options needs --slurm N', 'batch');
  if (v.shard !== undefined && v.samples !== undefined) {
    throw new UsageError('--samples goes to "eggline merge" when a batch is split (--shard); the parts are compared once merged', 'batch');
  }
  const shard = v.shard !== undefined ? parseShardSpec(v.shard) : null;
  const slurmParts = v.slurm !== undefined ? wholeNumber(v.slurm, '--slurm', 1, MAX_PARTS) : null;
  if (v.samples !== undefined && !(await fs.stat(v.samples).then((s) => s.isFile(), () => false))) {
    throw new UsageError(`sample sheet not found: ${v.samples}`, 'batch');
  }
  const typed = v as Record<string, string | string[] | boolean | undefined>;
  const parsedFlags = parseSettingsFlags(Object.fromEntries(SETTINGS.map((s) => [flagKey(s.flag), typed[s.flag.slice(2)] as string | string[] | undefined])));
  // Image paths given on the command line are taken from the current folder (in project and config files, from the
  // input folder).
  const flags: SettingsOverrides = {
    ...parsedFlags,
    ...(typeof parsedFlags.flatFieldFile === 'string' ? { flatFieldFile: resolve(parsedFlags.flatFieldFile) } : {}),
    ...(typeof parsedFlags.backgroundImageFile === 'string' ? { backgroundImageFile: resolve(parsedFlags.backgroundImageFile) } : {}),
  };
  const config = v.config !== undefined ? await readConfig(v.config) : {};
  const project = await readProject(v.project, folder, v['no-project'] === true);
  const [jobsText, memoryText, timeoutText] = ['jobs', 'maxMemoryBytes', 'fileTimeoutS'].map((k) => runText(v, k));
  const jobs = jobsText !== undefined ? runFlag('jobs', jobsText) : defaultJobs();
  const maxMemory = memoryText !== undefined ? runFlag('maxMemoryBytes', memoryText) : defaultMaxMemoryBytes(totalmem(), jobs);
  return {
    folder, outDir: resolve(v.out), settings: mergeSettings(DEFAULT_SETTINGS, project.doc?.settings ?? {}, config, flags), doc: project.doc,
    jobs,
    projectFile: project.path, configFile: v.config !== undefined ? resolve(v.config) : null,
    samples: v.samples !== undefined ? resolve(v.samples) : null,
    cohort: cohortChoices(project.doc?.cohort, { ...comparison, reference: v.reference, backgroundCondition: v['background-condition'] }),
    cohortFlags: { ...comparison, reference: v.reference, backgroundCondition: v['background-condition'] },
    timeoutS: timeoutText !== undefined ? runFlag('fileTimeoutS', timeoutText) : undefined,
    resume: v.resume === true, maxMemoryBytes: maxMemory, notes: project.note ? [project.note] : [], shard,
    timelapse: parseTimelapseFlags({ time: v.time, axisPerTime: v['axis-per-time'], timeStep: v['time-step'], tauRange: v['tau-range'], baselineFrames: v['baseline-frames'] }),
    slurm: slurmParts === null ? null : {
      parts: slurmParts, options: v['slurm-options'] ?? null, partArgs: partArguments(argv, OPTIONS, process.cwd()),
      cpusPerTask: jobsText !== undefined ? jobs : DEFAULT_CPUS_PER_TASK,
    },
  };
}

/** Stop requests within this many milliseconds count as one (a terminal's Ctrl+C reaches both the launcher, which
 *  passes it on, and the tuned child in its group). */
const SAME_REQUEST_MS = 1000;

/** Listen for stop requests: Ctrl+C, SIGTERM, SIGHUP, or the launcher's stop message stop the batch cleanly; a
 *  second request ends the process at once; the launcher going away (its IPC channel closing) stops it as killed.
 *  Returns the function that removes the listeners. */
function watchStops(io: CliIo, abort: AbortController): () => void {
  let first = 0;
  const stop = (): void => {
    const now = Date.now();
    if (first === 0) {
      first = now;
      io.stderr.write('\neggline: stopping; finished files are kept (Ctrl+C again to quit at once)\n');
      abort.abort('cancelled');
    } else if (now - first > SAME_REQUEST_MS) {
      io.stderr.write('eggline: quit at once; the journal in the output folder keeps every finished file: rerun with --resume\n');
      process.exit(1);
    }
  };
  const onMessage = (m: unknown): void => { if (m === STOP_MESSAGE) stop(); };
  const onDisconnect = (): void => { if (!abort.signal.aborted) abort.abort('killed'); };
  const signals: NodeJS.Signals[] = ['SIGINT', 'SIGTERM', 'SIGHUP'];
  for (const sig of signals) process.on(sig, stop);
  const ipc = typeof process.send === 'function';
  if (ipc) { process.on('message', onMessage); process.on('disconnect', onDisconnect); }
  return () => {
    for (const sig of signals) process.removeListener(sig, stop);
    if (ipc) { process.removeListener('message', onMessage); process.removeListener('disconnect', onDisconnect); process.channel?.unref(); }
  };
}

/** What the command prints when a batch ends. */
function reportEnd(io: CliIo, summary: BatchRunResult, plan: BatchPlan): void {
  const done = summary.ok + summary.failed;
  const total = summary.record.inputs.length;
  const reused = summary.reused > 0 ? ` (${summary.reused} taken from the journal)` : '';
  if (!summary.complete) {
    io.stdout.write(`Stopped (${summary.reason ?? 'cancelled'}): ${done} of ${total} file${total === 1 ? '' : 's'} analysed${reused}: ${summary.ok} ok, ${summary.failed} failed.\n`);
    io.stdout.write(`Tables for those files written to ${summary.outDir}; run.json there says "complete": false.\n`);
    io.stdout.write('To analyse the rest, run the same command again with --resume.\n');
    return;
  }
  const part = plan.shard ? ` of part ${plan.shard.part} of ${plan.shard.parts}` : '';
  io.stdout.write(`Analysed ${total} file${total === 1 ? '' : 's'}${part}${reused}: ${summary.ok} ok, ${summary.failed} failed.\n`);
  io.stdout.write(`Tables written to ${summary.outDir}\n`);
  if (summary.cohortError) io.stderr.write(`eggline: the cohort step failed: ${summary.cohortError}\n`);
  else if (plan.samples) {
    const background = summary.cohortStep ? backgroundLine(summary.cohortStep.analysis) : null;
    if (background !== null) io.stdout.write(`Cohort: ${background}\n`);
    io.stdout.write(`Cohort report: ${join(summary.outDir, 'report.html')}\n`);
  }
}

/** The merge job's cohort options: with a project that has a cohort entry, `--project` and only the flags given here
 *  (so the merge resolves them as this command did, flag > project > default, and its record names who chose the
 *  background condition); otherwise the options in force as flags. */
export function mergeCohortArgs(plan: Pick<BatchPlan, 'cohort' | 'cohortFlags' | 'projectFile' | 'doc'>): string[] {
  const withProject = plan.projectFile !== null && plan.doc?.cohort !== undefined;
  const c: CohortFlags = withProject ? plan.cohortFlags : plan.cohort;
  return [...(withProject ? ['--project', plan.projectFile as string] : []),
    ...(c.reference != null ? ['--reference', c.reference] : []),
    ...(c.backgroundCondition != null ? ['--background-condition', c.backgroundCondition] : []),
    ...(c.normalisation !== undefined && (withProject || c.normalisation !== 'scale-offset') ? ['--normalise', c.normalisation] : []),
    ...(c.lambdaPosteriorEl != null ? ['--lambda-posterior-el', String(c.lambdaPosteriorEl)] : []),
    ...(c.equivalenceMargin != null ? ['--equivalence-margin', String(c.equivalenceMargin)] : []),
    ...(c.covariates ?? []).flatMap((col) => ['--covariate', col])];
}

/** `--slurm N`: write the two scripts and print how to submit them; analyses nothing. */
async function slurmCommand(plan: BatchPlan, io: CliIo, cliPath: string): Promise<number> {
  const slurm = plan.slurm as NonNullable<BatchPlan['slurm']>;
  const mergeArgs = plan.samples ? ['--samples', plan.samples, ...mergeCohortArgs(plan)] : [];
  const { plan: p, arrayPath, mergePath } = await writeSlurmScripts({
    folder: plan.folder, outDir: plan.outDir, parts: slurm.parts, cpusPerTask: slurm.cpusPerTask, optionsText: slurm.options,
    batchArgs: slurm.partArgs, mergeArgs, nodePath: process.execPath, cliPath,
  });
  const perPart = Math.ceil(p.fileCount / slurm.parts);
  io.stdout.write(`Wrote ${arrayPath} (${slurm.parts} tasks of about ${perPart} file${perPart === 1 ? '' : 's'}, ${slurm.cpusPerTask} cores and ${p.memPerCpuMiB} MiB per core each)\n`);
  io.stdout.write(`  and ${mergePath} (${p.mergeMemMiB} MiB). Submit both, the merge after every task succeeded:\n\n`);
  io.stdout.write(`${submitCommands(plan.outDir).split('\n').map((l) => `  ${l}`).join('\n')}\n\n`);
  if (p.fileCount === 0) io.stderr.write(`eggline: warning: no stacks (.tif, .tiff, .ome.tif, .btf, .tf8) found in ${plan.folder}\n`);
  if (slurm.parts > p.fileCount && p.fileCount > 0) io.stderr.write(`eggline: warning: ${slurm.parts} parts for ${p.fileCount} files: ${slurm.parts - p.fileCount} tasks will have nothing to do\n`);
  return 0;
}

/** Run `eggline batch`; returns the exit code (0 all ok, 1 some failed or stopped, 2 usage error). */
export async function batchCommand(argv: readonly string[], io: CliIo, extra: Partial<RunBatchOptions> = {}, cliPath = resolve(process.argv[1] ?? 'eggline')): Promise<number> {
  let plan: BatchPlan | 'help';
  try {
    plan = await planBatch(argv);
  } catch (e) {
    if (e instanceof BatchOptionError) throw new UsageError(e.message, 'batch');
    throw e;
  }
  if (plan === 'help') { io.stdout.write(BATCH_HELP); return 0; }
  if (plan.slurm) {
    try {
      return await slurmCommand(plan, io, cliPath);
    } catch (e) {
      if (e instanceof BatchOptionError) throw new UsageError(e.message, 'batch');
      throw e;
    }
  }
  for (const note of plan.notes) io.stderr.write(`eggline: ${note}\n`);
  const abort = new AbortController();
  const unwatch = watchStops(io, abort);
  const printer = progressPrinter(io);
  try {
    const summary = await runBatch({
      folder: plan.folder, outDir: plan.outDir, settings: plan.settings, doc: plan.doc, jobs: plan.jobs,
      onProgress: printer.onProgress, signal: abort.signal, timeoutPerFileS: plan.timeoutS, resume: plan.resume, maxMemoryBytes: plan.maxMemoryBytes,
      commandLine: ['eggline', 'batch', ...argv], projectFile: plan.projectFile, configFile: plan.configFile,
      cohort: plan.samples ? { sampleSheetPath: plan.samples, ...plan.cohort } : null, shard: plan.shard,
      timelapse: plan.timelapse, onMovie: (file, done) => io.stderr.write(`eggline: time analysis ${done}: ${file}\n`), ...extra,
    });
    printer.end();
    for (const w of summary.warnings) io.stderr.write(`eggline: warning: ${w}\n`);
    const s = plan.shard;
    if (s && summary.record.inputs.length === 0 && summary.complete) {
      io.stdout.write(`Part ${s.part} of ${s.parts} has no files (${summary.record.shard?.inputCount ?? 0} files in ${s.parts} parts); empty tables written to ${summary.outDir}\n`);
      return 0;
    }
    if (summary.record.inputs.length === 0) {
      io.stderr.write(`eggline: no stacks (.tif, .tiff, .ome.tif, .btf, .tf8) found in ${plan.folder}\n`);
      return 1;
    }
    reportEnd(io, summary, plan);
    const movies = reportTimelapse(summary.timelapse, summary.outDir, io);
    return summary.failed > 0 || movies > 0 || !summary.complete || summary.cohortError ? 1 : 0;
  } catch (e) {
    if (e instanceof BatchOptionError) throw new UsageError(e.message, 'batch');
    throw e;
  } finally {
    printer.end();
    unwatch();
  }
}
