// Runs a batch through the API and follows its progress events.
import { useEffect, useMemo, useRef, useState } from 'react';
import type { BatchProgress, BatchSummary, EgglineApi, ProjectCohortOptions, ProjectDoc } from '../../core/contract';
import { embryoResults } from '../../core/batch';
import { indexResults, NO_RESULTS, type ResultIndex } from '../state';

/** One file's line in the batch panel. */
export interface BatchFileLine { readonly file: string; readonly status: BatchProgress['status']; readonly message: string | null }

/** Batch panel state. */
export interface BatchState {
  readonly outDir: string | null;
  readonly running: boolean;
  readonly runId: string | null;
  readonly done: number;
  readonly total: number;
  readonly files: readonly BatchFileLine[];
  readonly summary: BatchSummary | null;
  readonly error: string | null;
  /** The sample sheet's conditions as last compared (the background condition included), so the comparison's
   *  options stay offered when a choice makes the cohort step fail. */
  readonly sheetConditions: readonly string[];
  /** The sample sheet's free columns as last compared (offered as covariates; kept when a choice makes the step fail). */
  readonly sheetColumns: readonly string[];
  /** True while the comparison is recomputed after an option changed. */
  readonly recomputing: boolean;
}

const START: BatchState = { outDir: null, running: false, runId: null, done: 0, total: 0, files: [], summary: null, error: null, sheetConditions: [], sheetColumns: [], recomputing: false };

/** The sheet's conditions a summary compared (the background condition, or the one set aside with `none`, both left
 *  out of the comparison, last). */
export function sheetConditionsOf(summary: BatchSummary | null, previous: readonly string[]): readonly string[] {
  const c = summary?.cohort;
  if (!c) return previous;
  const names = c.conditions.map((r) => r.name);
  const aside = [c.backgroundCondition, c.backgroundSetAside].filter((n): n is string => typeof n === 'string' && n !== '');
  return [...names, ...aside];
}

/** The sheet's free columns a summary compared, or the previous ones when it has no comparison. */
export function sheetColumnsOf(summary: BatchSummary | null, previous: readonly string[]): readonly string[] {
  const c = summary?.cohort;
  return c ? c.sheetColumns ?? [] : previous;
}

/** Fold one progress event into the state (pure). */
export function applyProgress(s: BatchState, p: BatchProgress): BatchState {
  const files = p.file === null ? s.files : [...s.files.filter((f) => f.file !== p.file), { file: p.file, status: p.status, message: p.message }];
  return { ...s, runId: p.runId, done: p.done, total: p.total, files };
}

/** Batch state, its results keyed by (file, time point), plus commands: choose output, run, cancel. */
export function useBatch(api: EgglineApi | null) {
  const [state, setState] = useState<BatchState>(START);
  // Only the newest recomputation is shown (options may change again before an earlier one answers).
  const recomputeSeq = useRef(0);
  useEffect(() => (api === null ? undefined : api.onBatchProgress((p) => setState((s) => applyProgress(s, p)))), [api]);
  const chooseOutput = async () => {
    if (api === null) return;
    const r = await api.chooseOutputFolder();
    if (r.ok && r.value !== null) setState((s) => ({ ...s, outDir: r.value }));
    if (!r.ok) setState((s) => ({ ...s, error: r.error.message }));
  };
  /** Run over `folder` into the chosen output folder; resolves with the output folder when the run wrote results. */
  const run = async (folder: string, doc: ProjectDoc): Promise<string | null> => {
    if (api === null || state.outDir === null || state.running) return null;
    setState((s) => ({ ...START, outDir: s.outDir, running: true }));
    const r = await api.runBatch(folder, state.outDir, doc);
    setState((s) => (r.ok ? { ...s, running: false, summary: r.value, sheetConditions: sheetConditionsOf(r.value, s.sheetConditions), sheetColumns: sheetColumnsOf(r.value, s.sheetColumns) } : { ...s, running: false, error: r.error.message }));
    return r.ok ? r.value.outDir : null;
  };
  /** Show the batch saved in a project's output folder (after a restart); forget it when there is none. */
  const restore = async (outDir: string | null, folder: string | null, cohort: ProjectCohortOptions | null = null) => {
    if (api === null) return;
    if (outDir === null || folder === null) { setState(START); return; }
    recomputeSeq.current += 1;
    const r = await api.loadBatchResults(outDir, folder, cohort);
    if (!r.ok) { setState({ ...START, outDir, error: `The last batch's results could not be read: ${r.error.message}` }); return; }
    const summary = r.value;
    const files = summary === null ? 0 : embryoResults(summary.results).length;
    setState({ ...START, outDir, summary, done: files, total: files, sheetConditions: sheetConditionsOf(summary, []), sheetColumns: sheetColumnsOf(summary, []) });
  };
  /** Compare the shown batch's conditions again with other options (the same cohort step as `eggline cohort`, in the
   *  main process, over the batch's saved results); only its cohort part of the summary changes. */
  const recomputeCohort = async (folder: string | null, cohort: ProjectCohortOptions) => {
    const outDir = state.summary?.outDir ?? null;
    if (api === null || outDir === null || folder === null || state.running) return;
    const seq = ++recomputeSeq.current;
    setState((s) => ({ ...s, recomputing: true }));
    const r = await api.loadBatchResults(outDir, folder, cohort);
    if (seq !== recomputeSeq.current) return;
    setState((s) => {
      if (s.summary === null) return { ...s, recomputing: false };
      if (!r.ok) return { ...s, recomputing: false, summary: { ...s.summary, cohort: null, cohortError: r.error.message } };
      const fresh = r.value;
      const summary = { ...s.summary, cohort: fresh?.cohort ?? null, cohortError: fresh?.cohortError ?? null };
      return { ...s, recomputing: false, summary, sheetConditions: sheetConditionsOf(summary, s.sheetConditions), sheetColumns: sheetColumnsOf(summary, s.sheetColumns) };
    });
  };
  const cancel = async () => {
    if (api !== null && state.runId !== null) await api.cancelBatch(state.runId);
  };
  const results: ResultIndex = useMemo(() => (state.summary === null ? NO_RESULTS : indexResults(state.summary.results)), [state.summary]);
  return { batch: state, results, chooseOutput, run, cancel, restore, recomputeCohort };
}
