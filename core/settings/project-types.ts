// What a project file holds: the shared settings and every file's hand edits (axis, landmarks, fit range).
import type { ApAxis, Landmark, Normalisation } from '../model';
import type { AnalysisSettings } from './types';

/** Hand edits of one time point of a movie (project version 2): each field given replaces the file's at that time
 *  point; a field left out keeps the file's (a hand axis set for the file applies to every time point). */
export interface TimePointEdits {
  readonly axis?: ApAxis | null;
  readonly landmarks?: readonly Landmark[];
  readonly fitRangeEl?: readonly [number, number] | null;
}

/** Per-file hand work kept in the project. */
export interface FileEdits {
  readonly axis: ApAxis | null;
  readonly landmarks: readonly Landmark[];
  /** Per-file fit range override, x/EL. */
  readonly fitRangeEl: readonly [number, number] | null;
  /** Per-file dorsal side of the A→P line (which side the edge band's "dorsal" and "ventral" mean); absent or null:
   *  the shared setting. A flipped or mirrored embryo needs its own. */
  readonly dorsalSide?: 'left' | 'right' | null;
  /** Edits of single time points of a movie, keyed by the time point (0-based, as decimal text: "0", "12"); absent
   *  or empty: the file's edits hold at every time point. */
  readonly timePoints?: Readonly<Record<string, TimePointEdits>>;
  /** Time points of a movie to analyse over time, as the --time flag takes them ("all", "K" or "A:B", 0-based); absent:
   *  the run's own (--time, default all). */
  readonly time?: string;
  /** Seconds between time points for a movie whose file gives no times, as --time-step; absent: the run's own. */
  readonly timeStepS?: number;
}

/** How the cohort step compares conditions, kept with the project (the window's options; the command line uses them
 *  unless a flag says otherwise). Every field is optional: absent means the cohort step's default. */
export interface ProjectCohortOptions {
  /** Reference condition; absent: the one with dosage 1. */
  readonly reference?: string;
  /** Condition of null or secondary-only stainings subtracted as background, or `none` (subtract nothing, even when the
   *  sheet's role column marks a condition); absent: the sheet's role column, else none. */
  readonly backgroundCondition?: string;
  /** Profile normalisation before averaging; absent: scale-offset. */
  readonly normalisation?: Normalisation;
  /** Equivalence margin M of observed/predicted (0 < M < 1); absent: no equivalence test. */
  readonly equivalenceMargin?: number;
  /** Decay length of an opposing posterior gradient, x/EL; absent: no two-gradient prediction. */
  readonly lambdaPosteriorEl?: number;
  /** Sample-sheet columns adjusting the dosage regression (`column`, `column:numeric`, `column:categorical`); absent
   *  or empty: none. */
  readonly covariates?: readonly string[];
}

/** The project file's content (JSON, versioned). Version 2 adds per-time-point edits (FileEdits.timePoints); a
 *  version 1 file reads as version 2 with none. Files are always written as version 2. */
export interface ProjectDoc {
  readonly schema: 'eggline-project';
  readonly version: 1 | 2;
  /** Folder the project's files are in (absolute). */
  readonly folder: string | null;
  readonly settings: AnalysisSettings;
  /** Keyed by path relative to `folder` (or absolute when there is no folder). */
  readonly files: Readonly<Record<string, FileEdits>>;
  /** Output folder of the last batch run from the window (absolute), so its results reopen with the project;
   *  null or absent when there is none. */
  readonly batchOutDir?: string | null;
  /** The cohort step's options; absent in older files (then every default holds). */
  readonly cohort?: ProjectCohortOptions;
}
