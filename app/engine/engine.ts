// What the shell needs from the analysis side (decoding, pipeline, batch, demo data), as one replaceable interface:
// the app wires the real modules; tests pass small fakes so shell behaviour is tested on its own.
import type { BatchProgress, BatchSummary, ProjectDoc, StackPreview, StackTimeOptions } from '../../core/contract';
import type { Detection, ProjectedStack, StackInfo } from '../../core/model';
import type { AnalysisSettings } from '../../core/settings';

/** What loadStack shows: tags, projected channels and automatic detection. */
export interface ViewData {
  readonly info: StackInfo;
  readonly projected: ProjectedStack;
  readonly detection: Detection;
}

/** One raw slice as floats, row-major (x = column, y = row). */
export interface SliceData {
  readonly width: number;
  readonly height: number;
  readonly data: Float32Array;
}

/** Arguments of a batch run (the batch engine's own options). */
export interface BatchRunOptions {
  readonly folder: string;
  readonly outDir: string;
  readonly settings: AnalysisSettings;
  readonly doc: ProjectDoc;
  readonly jobs: number;
  readonly onProgress: (p: BatchProgress) => void;
  readonly signal: AbortSignal;
  /** Sample sheet for the cohort step after the batch (conditions, dosages); null or absent = no cohort step. */
  readonly sampleSheetPath?: string | null;
  /** Node flags and environment added to the worker processes' own (app/batch/worker-tuning). */
  readonly workerExecArgv?: readonly string[];
  readonly workerEnv?: Readonly<Record<string, string>>;
}

/** The analysis services the handlers call. `label` is the file's display name used in messages. */
export interface AnalysisEngine {
  /** Read tags, project over Z and detect the embryo; with `time`, a movie's time point in the movie's embryo (see
   *  EgglineApi.loadStack). Rejects with an AbortError naming the file once `signal` is aborted. */
  loadForView(path: string, label: string, settings: AnalysisSettings, time?: StackTimeOptions | null, signal?: { readonly aborted: boolean } | null): Promise<ViewData>;
  /** The middle slice of the first channel as floats (the first picture while loadForView runs). */
  readPreview?(path: string, label: string): Promise<StackPreview>;
  /** Decode one plane (z, c, t: 0-based) as floats; rejects with a message naming the file when out of range. */
  readSlice(path: string, label: string, z: number, c: number, t: number): Promise<SliceData>;
  /** Run a batch to completion or cancellation. */
  runBatch(options: BatchRunOptions): Promise<BatchSummary>;
  /** Write the synthetic demo data set into `dir` (which must be empty or missing). */
  writeDemoDataSet(dir: string, options?: { subset?: number }): Promise<{ files: string[]; samplesPath: string; projectPath: string }>;
}
