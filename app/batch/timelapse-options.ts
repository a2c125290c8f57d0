// The time pass's options, outcome types and file names: what the batch command and the batch engine need before
// (or without) the time pass itself, kept apart so that a batch without movies never loads the pass's code.
import { editsForFile } from '../../core/batch';
import type { ProjectDoc } from '../../core/contract';
import type { EmbryoResult } from '../../core/model';
import type { MovieSummary, TimeSelection } from '../../core/timelapse';

/** Options of the time analysis (flags --time, --axis-per-time, --time-step, --tau-range, --baseline-frames). */
export interface TimelapseOptions {
  readonly selection: TimeSelection;
  readonly axisPerTime: boolean;
  /** Seconds between time points when the file does not say; plain multi-page files are then read as frames. */
  readonly timeStepS: number | null;
  readonly tauRangeEl: readonly [number, number];
  readonly baselineFrames: number;
}

/** Defaults: every time point, axis once per movie, no time step, τ model over 0.1–0.4 EL, one baseline frame. */
export const DEFAULT_TIMELAPSE_OPTIONS: TimelapseOptions = Object.freeze({
  selection: { kind: 'all' as const }, axisPerTime: false, timeStepS: null, tauRangeEl: [0.1, 0.4] as const, baselineFrames: 1,
});

/** One analysed movie: its per-time-point results with their indices and times, and the summary. */
export interface MovieOutcome {
  readonly file: string;
  readonly timeIndices: readonly number[];
  readonly timesS: Float64Array | null;
  /** Where the times came from (ome-plane, ome-increment, imagej, ome-zarr, user), or null. */
  readonly timeSource?: string | null;
  readonly results: readonly EmbryoResult[];
  readonly summary: MovieSummary;
}

/** A movie the time pass did not analyse, with a one-line reason naming the file. */
export interface MovieFailure {
  readonly file: string;
  readonly error: string;
  /** True when nothing failed: the time points chosen for it all lie past its end (`error` is then a warning, and
   *  the batch does not count the movie as failed). */
  readonly warningOnly?: boolean;
}

/** Files of the time pass: tables, figures and the page. */
export const TIMELAPSE_FILES = ['timecourse.csv', 'timecourse_profiles.csv', 'timecourse_boundaries.csv', 'timecourse_landmarks.csv', 'accumulation.csv', 'model_fit.csv', 'timelapse.html'] as const;

/** What the time pass needs to know of a file to tell whether it is a movie: its time points, slices, and whether
 *  it is an OME file (as the batch worker opened it). */
export interface TimeShape {
  readonly sizeT: number;
  readonly sizeZ: number;
  readonly isOme: boolean;
}

/**
 * False when the time pass would find that a file of this shape has one time point and skip it: the pass then need
 * not open it again. A file is a movie when it has several time points, or when it is a plain (not OME) multi-page
 * file and a time step is given for it (its pages are then read as frames; core/tiff pagesAsTimePoints). A file
 * with time points of its own in the project is always handed to the pass (it reports a bad selection).
 */
export function timePassNeeds(doc: ProjectDoc | null, file: string, options: TimelapseOptions, shape: TimeShape): boolean {
  const own = editsForFile(doc, file, undefined, null);
  if (own?.time !== undefined) return true;
  const timeStepS = own?.timeStepS ?? options.timeStepS;
  return shape.sizeT > 1 || (timeStepS !== null && !shape.isOme && shape.sizeZ > 1);
}
