// Runs a batch through the API and follows its progress events.
import { useEffect, useMemo, useState } from 'react';
import type { BatchProgress, BatchSummary, EgglineApi, ProjectDoc } from '../../core/contract';
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
}

const START: BatchState = { outDir: null, running: false, runId: null, done: 0, total: 0, files: [], summary: null, error: null };

/** Fold one progress event into the state (pure). */
export function applyProgress(s: BatchState, p: BatchProgress): BatchState {
  const files = p.file === null ? s.files : [...s.files.filter((f) => f.file !== p.file), { file: p.file, status: p.status, message: p.message }];
  return { ...s, runId: p.runId, done: p.done, total: p.total, files };
}

/** Batch state, its results keyed by (file, time point), plus commands: choose output, run, cancel. */
export function useBatch(api: EgglineApi | null) {
  const [state, setState] = useState<BatchState>(START);
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
    setState((s) => (r.ok ? { ...s, running: false, summary: r.value } : { ...s, running: false, error: r.error.message }));
    return r.ok ? r.value.outDir : null;
  };
  /** Show the batch saved in a project's output folder (after a restart); forget it when there is none. */
  const restore = async (outDir: string | null, folder: string | null) => {
    if (api === null) return;
    if (outDir === null || folder === null) { setState(START); return; }
    const r = await api.loadBatchResults(outDir, folder);
    if (!r.ok) { setState({ ...START, outDir, error: `The last batch's results could not be read: ${r.error.message}` }); return; }
    const summary = r.value;
    const files = summary === null ? 0 : embryoResults(summary.results).length;
    setState({ ...START, outDir, summary, done: files, total: files });
  };
  const cancel = async () => {
    if (api !== null && state.runId !== null) await api.cancelBatch(state.runId);
  };
  const results: ResultIndex = useMemo(() => (state.summary === null ? NO_RESULTS : indexResults(state.summary.results)), [state.summary]);
  return { batch: state, results, chooseOutput, run, cancel, restore };
}
