// The last batch of a project, read back from its output folder (results.json, run.json and the cohort step over
// the folder's sample sheet), and its report opened in the system's browser: results stay after a restart.
import { promises as fs } from 'node:fs';
import { basename, join } from 'node:path';
import { embryoResults, resultsDocFromJson } from '../../core/batch';
import type { BatchSummary, CohortSummary } from '../../core/contract';
import type { EmbryoResult, MovieRecord } from '../../core/model';
import { requireAllowed } from './args';
import { cohortSummaryFor, findSampleSheet } from '../engine/cohort-summary';
import { cohortChoices, type CohortChoices } from '../cohort/cohort-choices';
import { checkProjectCohort, ProjectFormatError, type ProjectCohortOptions } from '../../core/settings';
import type { ShellContext } from './context';
import { ApiFailure, labelOf } from './result';

/** Allow a batch output folder named by a project (when it exists) for reading its results and for new runs. */
export async function allowRecordedOutput(ctx: ShellContext, outDir: string | null | undefined): Promise<void> {
  if (typeof outDir !== 'string' || outDir === '') return;
  const isDir = await fs.stat(outDir).then((s) => s.isDirectory(), () => false);
  if (!isDir) return;
  ctx.allow.allowTree('results', outDir);
  ctx.allow.allowTree('output', outDir);
}

/** What run.json says about the end of the run (absent fields: a finished run). */
async function readRunEnd(outDir: string): Promise<{ runId: string; cancelled: boolean }> {
  try {
    const run = JSON.parse(await fs.readFile(join(outDir, 'run.json'), 'utf8')) as { runId?: unknown; cancelled?: unknown };
    return { runId: typeof run.runId === 'string' ? run.runId : 'saved', cancelled: run.cancelled === true };
  } catch {
    return { runId: 'saved', cancelled: false };
  }
}

/** The cohort step over the saved results, as after a run (nothing when there is no sheet or the run was cancelled). */
async function savedCohort(results: readonly EmbryoResult[], folder: string, outDir: string, cancelled: boolean, choices: CohortChoices):
  Promise<{ cohort: CohortSummary | null; cohortError: string | null }> {
  const sheet = await findSampleSheet(folder);
  if (sheet === null || cancelled) return { cohort: null, cohortError: null };
  try {
    return { cohort: await cohortSummaryFor(results, sheet, choices, outDir), cohortError: null };
  } catch (e) {
    return { cohort: null, cohortError: (e instanceof Error ? e.message : String(e)).split(/\r?\n/)[0] };
  }
}

/** The project's cohort options as sent by the renderer (absent or null: the defaults), or a 'bad-argument' failure. */
function requireCohortOptions(value: unknown): ProjectCohortOptions | null {
  if (value === undefined || value === null) return null;
  try {
    return checkProjectCohort(value);
  } catch (e) {
    if (e instanceof ProjectFormatError) throw new ApiFailure('bad-argument', e.message);
    throw e;
  }
}

/** The batch summary saved in `outDir` for the images in `folder`, its cohort step run with the project's cohort
 *  options (`cohortArg`; absent: the defaults); null when the folder holds no results.json. */
export async function loadBatchResults(ctx: ShellContext, outArg: unknown, folderArg: unknown, cohortArg?: unknown): Promise<BatchSummary | null> {
  const outDir = requireAllowed(ctx.allow, 'results', outArg, 'outDir');
  const folder = requireAllowed(ctx.allow, 'read', folderArg, 'folder');
  const choices = cohortChoices(requireCohortOptions(cohortArg));
  let text: string;
  try {
    text = await fs.readFile(join(outDir, 'results.json'), 'utf8');
  } catch (e) {
    if ((e as NodeJS.ErrnoException).code === 'ENOENT') return null;
    throw new ApiFailure('io', `${labelOf(outDir)}/results.json: cannot be read (${(e as NodeJS.ErrnoException).code ?? (e as Error).message})`);
  }
  let results: readonly EmbryoResult[];
  let movies: readonly MovieRecord[];
  try {
    ({ results, movies } = resultsDocFromJson(text));
  } catch (e) {
    throw new ApiFailure('bad-file', `${labelOf(outDir)}/${(e as Error).message.split('\n')[0]}`);
  }
  const run = await readRunEnd(outDir);
  // Counts and the cohort are per file (a movie's last analysed time point); the results keep every time point.
  const embryos = embryoResults(results);
  const ok = embryos.filter((r) => r.status === 'ok').length;
  return {
    runId: run.runId, outDir, ok, failed: embryos.length - ok, cancelled: run.cancelled, results, movies,
    ...await savedCohort(embryos, folder, outDir, run.cancelled, choices),
  };
}

/** Open a batch report (an .html file in a batch output folder of the project) in the system's default browser. */
export async function openReport(ctx: ShellContext, pathArg: unknown): Promise<null> {
  const path = requireAllowed(ctx.allow, 'results', pathArg, 'path');
  if (!basename(path).toLowerCase().endsWith('.html')) throw new ApiFailure('bad-argument', `${labelOf(path)}: only .html reports can be opened`);
  const isFile = await fs.stat(path).then((s) => s.isFile(), () => false);
  if (!isFile) throw new ApiFailure('not-found', `${labelOf(path)}: the report is missing (run the batch again to write it)`);
  const open = ctx.deps.openPath;
  if (open === undefined) throw new ApiFailure('internal', `${labelOf(path)}: opening files in the browser is not available here`);
  const problem = await open(path);
  if (problem !== '') throw new ApiFailure('io', `${labelOf(path)}: could not be opened (${problem})`);
  return null;
}
