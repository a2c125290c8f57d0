// The real analysis services: sharp decoding (app/decode), the core pipeline, the batch engine and the demo writer.
import { cohortChoices } from '../cohort/cohort-choices';
import type { BatchSummary, CohortSummary } from '../../core/contract';
import { defaultWorkerPath, runBatch, type BatchRunResult } from '../batch/run-batch';
import { DEFAULT_TIMELAPSE_OPTIONS } from '../batch/timelapse-pass';
import { writeDemoDataSet } from '../batch/write-demo';
import { openStackForAnalysis, readPreviewPlane } from '../decode';
import { ApiFailure } from './api-failure';
import { summariseCohort } from './cohort-summary';
import type { AnalysisEngine, BatchRunOptions, SliceData } from './engine';
import { createViewLoader } from './view-loader';

/** Check a plane index against the stack's size. */
function checkIndex(label: string, name: string, value: number, size: number, unit: string): void {
  if (value >= size) throw new ApiFailure('bad-argument', `${label}: ${name}=${value} is out of range (the stack has ${size} ${unit})`);
}

/** Decode plane (z, c, t) as floats. */
async function readSlice(path: string, label: string, z: number, c: number, t: number): Promise<SliceData> {
  const opened = await openStackForAnalysis(path, label);
  try {
    checkIndex(label, 'z', z, opened.info.sizeZ, 'slices');
    checkIndex(label, 'c', c, opened.info.sizeC, 'channels');
    checkIndex(label, 't', t, opened.info.sizeT, 'time points');
    const plane = await opened.source.readPlane(z, c, t);
    return { width: plane.width, height: plane.height, data: Float32Array.from(plane.data) };
  } finally {
    await opened.source.close();
  }
}

/** The cohort step's tables and figures for the window (from the batch's one run of the step), or why they are missing. */
function cohortOutcome(r: BatchRunResult, sheet: string | null): { cohort: CohortSummary | null; cohortError: string | null } {
  if (sheet === null || r.cancelled) return { cohort: null, cohortError: null };
  if (r.cohortError !== null || r.cohortStep === null) return { cohort: null, cohortError: r.cohortError };
  return { cohort: summariseCohort(r.cohortStep.analysis, sheet, r.outDir, r.cohortStep.figures), cohortError: null };
}

/** Run the batch engine (with the cohort step when there is a sample sheet) and keep what the renderer needs. */
async function runBatchSummary(options: BatchRunOptions): Promise<BatchSummary> {
  const sheet = options.sampleSheetPath ?? null;
  // Movies are analysed per time point as on the command line's defaults (every time point, axis once per movie).
  const r = await runBatch({ ...options, doc: options.doc, cohort: sheet === null ? null : { sampleSheetPath: sheet, ...cohortChoices(options.doc?.cohort) }, timelapse: DEFAULT_TIMELAPSE_OPTIONS });
  const outcome = cohortOutcome(r, sheet);
  return { runId: r.runId, outDir: r.outDir, ok: r.ok, failed: r.failed, cancelled: r.cancelled, results: r.results, movies: r.movies ?? [], ...outcome };
}

/** The engine backed by app/decode, core/pipeline and app/batch. */
export function createDefaultEngine(): AnalysisEngine {
  return {
    // Read, project over Z and detect (a placeholder axis when none is found); decoder fallbacks join the warnings.
    loadForView: createViewLoader(),
    readSlice,
    readPreview: (path, label) => readPreviewPlane(path, label),
    runBatch: runBatchSummary,
    // The built batch worker generates demo embryos in parallel (the writer falls back to this thread without it).
    writeDemoDataSet: (dir, options) => writeDemoDataSet(dir, { ...options, workerPath: defaultWorkerPath() }),
  };
}
