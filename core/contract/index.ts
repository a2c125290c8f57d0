// The one contract between the renderer and the app (main process). Everything crossing it is plain data
// (objects, arrays, typed arrays); errors come back as values, never as thrown exceptions.
import type {
  Detection, EmbryoResult, MovieRecord, ProjectedStack, StackInfo,
} from '../model';
import type { AnalysisSettings, ProjectCohortOptions, ProjectDoc } from '../settings';

export type { FileEdits, ProjectCohortOptions, ProjectDoc, TimePointEdits } from '../settings';
import type { ConditionStat, DosageFit, ReferenceLambda, ShiftRow } from '../model';

/** Error codes the app returns; messages are one line and name the file when there is one. */
export type ApiErrorCode =
  | 'cancelled' | 'not-found' | 'not-allowed' | 'bad-file' | 'bad-argument' | 'io' | 'busy' | 'internal';

/** Result of every API call. */
export type ApiResult<T> = { ok: true; value: T } | { ok: false; error: { code: ApiErrorCode; message: string } };

/** One file of the open folder, with its status in the project. */
export interface FolderEntry {
  /** Absolute path (allowed because it came from a dialog, drop, or project). */
  readonly path: string;
  /** Path relative to the folder, for display. */
  readonly name: string;
  readonly status: 'new' | 'analysed' | 'edited' | 'error';
  readonly message: string | null;
}


/** A stack loaded for viewing and live measurement. */
export interface LoadedStack {
  readonly path: string;
  readonly info: StackInfo;
  /** Projected channels (per the settings' projection) for display and measurement in the renderer. */
  readonly projected: ProjectedStack;
  /** Automatic detection (mask, outline, axis). */
  readonly detection: Detection;
}

/** How loadStack reads a file's time points for the Embryo view, as the batch's time pass does. */
export interface StackTimeOptions {
  /** Seconds between time points for a file that gives no times (the file's `timeStepS`, as `--time-step`): a plain
   *  multi-page file is then read as frames, one time point per page; null: its pages are Z slices. */
  readonly timeStepS: number | null;
  /** Find the embryo in the shown time point alone (as `--axis-per-time`) instead of once for the movie on the
   *  projection over time. */
  readonly axisPerTime: boolean;
}

/** One Z slice of one channel, for the Z slider. */
export interface SliceRequest { readonly path: string; readonly z: number; readonly c: number; readonly t: number }

/** The first picture of a stack while it loads: one raw slice (z of sizeZ, channel c of sizeC), not the projection. */
export interface StackPreview {
  readonly width: number;
  readonly height: number;
  readonly data: Float32Array;
  readonly z: number;
  readonly c: number;
  readonly sizeZ: number;
  readonly sizeC: number;
}

/** Progress of a running batch. */
export interface BatchProgress {
  readonly runId: string;
  readonly done: number;
  readonly total: number;
  readonly file: string | null;
  readonly status: 'ok' | 'error' | 'running' | 'finished' | 'cancelled';
  readonly message: string | null;
}

/** Summary when a batch ends. */
export interface BatchSummary {
  readonly runId: string;
  readonly outDir: string;
  readonly ok: number;
  readonly failed: number;
  readonly cancelled: boolean;
  /** Every result keyed by (file, tIndex): one per file with one time point, one per analysed time point of a movie
   *  (core/batch embryoResults gives one per file). */
  readonly results: readonly EmbryoResult[];
  /** The movies analysed per time point (their time points, times and summary options: core/timelapse summarizeMovie
   *  makes λ(t) and τ(x) from these and the results); absent or empty when there were none. */
  readonly movies?: readonly MovieRecord[];
  /** Per-condition tables and figures of the cohort step (as in report.html); null when the folder has no sample
   *  sheet, the batch was cancelled or the step failed; absent from engines that do not run it. */
  readonly cohort?: CohortSummary | null;
  /** Why the cohort step failed (one line naming the file); null or absent when it ran or was not run. */
  readonly cohortError?: string | null;
}

/** One condition of the cohort: dosage, embryo count and decay length λ (x/EL and µm) with its CI. */
export interface CohortConditionRow {
  readonly name: string;
  /** Dosage as given in the sample sheet; null when not given. */
  readonly dosage: number | null;
  /** f = dosage / dosage(reference); null when unknown. */
  readonly factor: number | null;
  readonly isReference: boolean;
  /** Embryos assigned to the condition (with at least one measured value). */
  readonly n: number;
  /** λ as a fraction of egg length; null when no embryo of the condition has a fit. CI ends are NaN when n < 2. */
  readonly lambdaEl: ConditionStat | null;
  readonly lambdaUm: ConditionStat | null;
}

/** A cohort figure as a standalone SVG string (the same figure report.html and the .svg files hold). */
export interface CohortFigure {
  readonly name: string;
  readonly title: string;
  readonly svg: string;
}

/** What the cohort step found after a batch (plain data: the numbers of conditions.csv, shifts.csv, dosage_fit.csv). */
export interface CohortSummary {
  /** report.html in the batch's output folder. */
  readonly reportPath: string;
  /** The sample sheet the conditions came from. */
  readonly sampleSheetPath: string;
  /** Reference condition (dosage 1), null when none: then there is no dosage test. */
  readonly reference: string | null;
  /** Confidence level of every interval (e.g. 0.95). */
  readonly level: number;
  /** λ (x/EL) of the reference used for the predictions; null without a reference fit. */
  readonly referenceLambda: ReferenceLambda | null;
  readonly conditions: readonly CohortConditionRow[];
  /** Every quantity per condition (conditions.csv). */
  readonly stats: readonly ConditionStat[];
  /** Observed vs predicted shift per position quantity and non-reference condition (shifts.csv). */
  readonly shifts: readonly ShiftRow[];
  /** Position vs ln f regression per quantity: slope λ_eff against λ_ref (dosage_fit.csv). */
  readonly dosageFit: readonly DosageFit[];
  readonly figures: readonly CohortFigure[];
  readonly warnings: readonly string[];
  /** Positional error σx of each condition's mean profile at a few positions (positional_error.csv's rows there),
   *  with the normalisation it was computed after; absent in older summaries. */
  readonly positionalError?: readonly CohortPositionalError[];
  /** The condition subtracted as background (left out of the comparison), when one was; absent or null: none. */
  readonly backgroundCondition?: string | null;
  /** With the background choice `none`: the condition the sheet's role column marks, left out of the comparison and
   *  not subtracted; absent or null: none. */
  readonly backgroundSetAside?: string | null;
  /** The sample sheet's free columns (e.g. stage, batch): what the window offers as covariates; absent in older
   *  summaries. */
  readonly sheetColumns?: readonly string[];
  /** The report's plain reading of the dosage test: per quantity its sentences, then the caveats that apply (the same
   *  text as report.html's *Reading* and *Caveats*); absent in older summaries. */
  readonly reading?: CohortReading;
}

/** The dosage test in words (see CohortSummary.reading). */
export interface CohortReading {
  readonly findings: readonly { readonly quantity: string; readonly label: string; readonly sentences: readonly string[] }[];
  readonly caveats: readonly string[];
}

/** σx of one condition at the positions shown (x/EL, NaN where the slope is not resolved), with its interval. */
export interface CohortPositionalError {
  readonly condition: string;
  readonly normalisation: string;
  readonly points: readonly { readonly xEl: number; readonly sigmaXEl: number; readonly ciLowEl: number; readonly ciHighEl: number }[];
}

/** A value with its confidence interval (NaN where not measured). */
export interface MovieEstimate { readonly value: number; readonly ciLow: number; readonly ciHigh: number }

/** How a movie is analysed over time in the window (the batch's --axis-per-time, --tau-range, --baseline-frames,
 *  --time-step). The time points analysed and a time step of the file's own come from the project's entry for the
 *  file (FileEdits.time, FileEdits.timeStepS), as in the batch; without them every time point is analysed. */
export interface MovieRequestOptions {
  readonly axisPerTime: boolean;
  readonly tauRangeEl: readonly [number, number];
  readonly baselineFrames: number;
  /** Seconds between time points when the file does not say; null = the file's own times. */
  readonly timeStepS: number | null;
}

/** Progress of a movie's analysis over time. */
export interface MovieProgress {
  readonly file: string;
  /** Time points analysed so far, of total. */
  readonly done: number;
  readonly total: number;
}

/** One time point's Z projection, shrunk for the window's slider (every channel, same size). */
export interface MovieFrame {
  readonly width: number;
  readonly height: number;
  /** Image px per frame px (the frame is the image shrunk by this factor). */
  readonly scale: number;
  readonly channels: readonly Float32Array[];
}

/** A movie analysed over time for the window: the batch's numbers, tables and figure data for one file. */
export interface MovieView {
  readonly path: string;
  /** The file's key in the project (path relative to the folder). */
  readonly file: string;
  /** Time points in the movie (all of them, analysed or not). */
  readonly sizeT: number;
  /** The analysed time points (0-based, ascending). */
  readonly timeIndices: readonly number[];
  /** Seconds from the first time point; null when the times are unknown. */
  readonly timesS: readonly number[] | null;
  /** Where the times came from (ome-plane, ome-increment, imagej, ome-zarr, user) or null. */
  readonly timeSource: string | null;
  readonly channelNames: readonly string[];
  /** Per analysed time point (same order as timeIndices). */
  readonly results: readonly EmbryoResult[];
  /** Each time point's projection shrunk (null where the time point could not be read). */
  readonly frames: readonly (MovieFrame | null)[];
  /** The embryo found once for the movie (mask, outline, axis) that every time point was measured in; null when it
   *  was found at every time point (axisPerTime) or could not be found. */
  readonly detection: Detection | null;
  /** λ (x/EL) per time point with its 95% CI; NaN where the fit failed. */
  readonly lambda: readonly { readonly tS: number; readonly lambdaEl: number; readonly ciLowEl: number; readonly ciHighEl: number }[];
  /** λ of the mean profile of the last frames (x/EL), or null. */
  readonly steadyLambdaEl: number | null;
  /** The kymograph's data: values[t][i] at xEl[i] and timesS[t], with boundary and landmark tracks. */
  readonly kymograph: {
    readonly xEl: readonly number[];
    readonly timesS: readonly number[];
    readonly values: readonly (readonly number[])[];
    readonly tracks: readonly { readonly label: string; readonly kind: 'boundary' | 'landmark'; readonly xEl: readonly number[] }[];
  } | null;
  /** τ(x) with its 95% CI (s), and the fitted and model lines. */
  readonly accumulation: {
    readonly xEl: readonly number[];
    readonly tauS: readonly number[];
    readonly ciLowS: readonly number[];
    readonly ciHighS: readonly number[];
    readonly fit: { readonly tau0S: number; readonly lambdaTauEl: number; readonly rangeEl: readonly [number, number]; readonly steadyLambdaEl: number } | null;
  } | null;
  /** The τ(x) model fit: τ₀, k, D, λ_τ beside λ, with intervals and the plain reading; null with `note` saying why. */
  readonly model: {
    readonly rangeEl: readonly [number, number];
    readonly tau0S: MovieEstimate;
    readonly kPerS: MovieEstimate;
    readonly dUm2PerS: MovieEstimate;
    readonly lambdaTauEl: MovieEstimate;
    readonly lambdaEl: MovieEstimate;
    readonly agreement: 'agree' | 'differ' | 'unresolved';
    readonly reading: string;
  } | null;
  readonly note: string | null;
  readonly warnings: readonly string[];
  /** The batch's tables for this movie alone (same columns and bytes as the batch writes). */
  readonly tables: {
    readonly timecourse: string;
    readonly profiles: string;
    readonly boundaries: string;
    readonly landmarks: string;
    readonly accumulation: string;
    readonly modelFit: string;
  };
}

/** What may be exported through a save dialog. */
export type ExportKind = 'svg' | 'png' | 'csv' | 'json';

/** The API object the preload exposes as window.eggline. */
export interface EgglineApi {
  /** Write the built-in demo data set to the app's data folder (once) and open it. */
  openDemo(): Promise<ApiResult<{ folder: string; entries: FolderEntry[]; project: ProjectDoc; projectPath: string }>>;
  /** Native dialog: pick a folder of stacks; null when cancelled. */
  chooseFolder(): Promise<ApiResult<{ folder: string; entries: FolderEntry[]; project: ProjectDoc; projectPath: string } | null>>;
  /** Native dialog: pick stack files; null when cancelled. */
  chooseFiles(): Promise<ApiResult<FolderEntry[] | null>>;
  /** Files dropped on the window (paths resolved by the preload). */
  openDropped(paths: readonly string[]): Promise<ApiResult<FolderEntry[]>>;
  /** Recently opened folders and files. */
  recent(): Promise<ApiResult<string[]>>;
  /** Read, project and detect one stack at the settings' time point (runs off the main thread). With `time`, a movie
   *  (a plain multi-page file too, when a time step is given) is shown at that time point in the embryo found once for
   *  the movie on its projection over time (kept, so another time point reads only its own planes), as the batch
   *  measures it; a newer call with `time` cancels one still under way (code 'cancelled'). */
  loadStack(path: string, settings: AnalysisSettings, time?: StackTimeOptions | null): Promise<ApiResult<LoadedStack>>;
  /** The middle slice of the first channel, shown at once while loadStack projects and detects (desktop app). */
  loadPreview?(path: string): Promise<ApiResult<StackPreview>>;
  /** One raw slice for the Z slider. */
  loadSlice(req: SliceRequest): Promise<ApiResult<{ width: number; height: number; data: Float32Array }>>;
  /** Save the project atomically at its path. */
  saveProject(projectPath: string, doc: ProjectDoc): Promise<ApiResult<{ savedAt: string }>>;
  /** Native dialog: open a project file. */
  openProject(): Promise<ApiResult<{ project: ProjectDoc; projectPath: string; entries: FolderEntry[]; warning?: string | null } | null>>;
  /** Start a batch over a folder with the given settings and hand edits; progress arrives via onBatchProgress. */
  runBatch(folder: string, outDir: string, doc: ProjectDoc): Promise<ApiResult<BatchSummary>>;
  cancelBatch(runId: string): Promise<ApiResult<null>>;
  /** Native dialog: choose an output folder. */
  chooseOutputFolder(): Promise<ApiResult<string | null>>;
  /** The batch saved in an output folder the open project records (results.json, run.json, the cohort step over the
   *  folder's samples.csv with the project's cohort options, default: the step's defaults); null when the folder holds
   *  no results. The window calls it again to recompute the cohort when an option changes. */
  loadBatchResults(outDir: string, folder: string, cohort?: ProjectCohortOptions | null): Promise<ApiResult<BatchSummary | null>>;
  /** Open a batch's report.html in the system's default browser (never inside the app window). */
  openReport(path: string): Promise<ApiResult<null>>;
  /** Subscribe to batch progress; returns an unsubscribe function. */
  onBatchProgress(listener: (p: BatchProgress) => void): () => void;
  /** Save dialog then write: text (svg/csv/json) or bytes (png). */
  exportFile(kind: ExportKind, suggestedName: string, content: string | Uint8Array): Promise<ApiResult<string | null>>;
  /** Render an SVG string to PNG bytes (through sharp). */
  svgToPng(svg: string, scale: number): Promise<ApiResult<Uint8Array>>;
  /** Analyse one allowed movie at every time point as the batch does (project file's hand edits for `file`); progress
   *  arrives via onMovieProgress; rejects with code 'cancelled' after cancelMovie. One movie at a time. */
  analyseMovie(path: string, file: string, doc: ProjectDoc, options: MovieRequestOptions): Promise<ApiResult<MovieView>>;
  /** Stop the running movie analysis (no-op when none runs). */
  cancelMovie(): Promise<ApiResult<null>>;
  /** Subscribe to movie-analysis progress; returns an unsubscribe function. */
  onMovieProgress(listener: (p: MovieProgress) => void): () => void;
  /** Subscribe to application-menu commands (e.g. 'open-folder', 'save', 'undo'); returns an unsubscribe function. */
  onMenuCommand(listener: (command: string) => void): () => void;
  /** Reopen a folder or stack file from the recent list (only paths on that list are accepted). */
  openRecent?(path: string): Promise<ApiResult<OpenedRecent>>;
  /** The file-system path of a file dropped on the window (desktop app only; '' when it has none). */
  pathForDroppedFile?(file: File): string;
}

/** A folder opened through a dialog, the demo or the recent list, with its project. */
export interface OpenedFolder {
  readonly folder: string;
  readonly entries: FolderEntry[];
  readonly project: ProjectDoc;
  readonly projectPath: string;
  /** Shown to the user when set: e.g. the project file was unreadable and its backup was opened instead. */
  readonly warning?: string | null;
}

/** What reopening a recent path gives: a folder with its project, or loose stack files. */
export type OpenedRecent = ({ readonly kind: 'folder' } & OpenedFolder) | { readonly kind: 'files'; readonly entries: FolderEntry[] };

/** Prefix of every IPC channel between preload and main. */
export const API_CHANNEL_PREFIX = 'eggline:';

/** Methods the preload forwards with ipcRenderer.invoke on `eggline:<name>` (everything but the subscriptions). */
export const API_INVOKE_METHODS = [
  'openDemo', 'chooseFolder', 'chooseFiles', 'openDropped', 'recent', 'loadStack', 'loadPreview', 'loadSlice', 'saveProject',
  'openProject', 'runBatch', 'cancelBatch', 'chooseOutputFolder', 'exportFile', 'svgToPng', 'openRecent',
  'loadBatchResults', 'openReport', 'analyseMovie', 'cancelMovie',
] as const satisfies readonly (keyof EgglineApi)[];

/** Commands the application menu sends through onMenuCommand (plus `open-recent:<path>`, see below). */
export const MENU_COMMANDS = Object.freeze([
  'open-folder', 'open-files', 'open-project', 'open-demo', 'save', 'export', 'undo', 'redo',
  'fit-to-window', 'zoom-in', 'zoom-out', 'swap-poles', 'show-help',
] as const);

/** A menu command name. */
export type MenuCommand = (typeof MENU_COMMANDS)[number];

/** Prefix of the command sent by File ▸ Recent: `open-recent:` + a path to pass to openRecent. */
export const MENU_OPEN_RECENT_PREFIX = 'open-recent:';

/** Main → renderer event channels. */
export const API_EVENT_CHANNELS = Object.freeze({
  batchProgress: 'eggline:batch-progress',
  menuCommand: 'eggline:menu-command',
  movieProgress: 'eggline:movie-progress',
} as const);
