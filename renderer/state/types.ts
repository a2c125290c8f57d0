// Editor state: the undoable document (settings + per-file hand edits) and the non-undoable view state.
import type { ApAxis, ImagePoint } from '../../core/model';
import type { AnalysisSettings, ProjectCohortOptions, SettingsOverrides } from '../../core/settings';
import type { FileEdits } from '../../core/contract';
import type { ViewTransform } from '../geometry';

/** Where hand edits go: the whole file (every time point of a movie) or the shown time point alone. */
export type EditScope = 'file' | 'timePoint';

/** Pointer tools in the image view. */
export type ToolName = 'pan' | 'axis' | 'landmark';

/** How one channel is shown: colour (CSS hex) and display range in image intensity units. */
export interface ChannelDisplay {
  readonly colour: string;
  readonly low: number;
  readonly high: number;
}

/** Channel display: one channel at a time ('single', the active one) or all merged additively. */
export interface DisplayState {
  readonly mode: 'single' | 'merged';
  readonly active: number;
  readonly channels: readonly ChannelDisplay[];
}

/** One undo/redo step: the value to put back for the settings, the comparison options (undefined = none kept) or one
 *  file's edits (undefined = no edits). */
export type HistoryEntry =
  | { readonly kind: 'settings'; readonly settings: AnalysisSettings }
  | { readonly kind: 'cohort'; readonly cohort: ProjectCohortOptions | undefined }
  | { readonly kind: 'file'; readonly key: string; readonly edits: FileEdits | undefined };

/** The part of the state that undo/redo restores and the project file stores. */
export interface DocState {
  readonly settings: AnalysisSettings;
  readonly files: Readonly<Record<string, FileEdits>>;
  /** How the cohort step compares conditions (the Cohort tab's options); absent: the defaults. Undoable like the
   *  settings; each change (an edit, undo or redo) recomputes the comparison (see cohortRevision) and is saved. */
  readonly cohort?: ProjectCohortOptions;
}

/** Everything the editor needs to draw; large pixel data lives outside (see app/useStack). */
export interface EditorState {
  readonly doc: DocState;
  /** Key of the shown file in doc.files (its path relative to the folder). */
  readonly current: string | null;
  /** Time point of the shown file whose result is shown (0-based; 0 for a file with one time point). Back to 0 when
   *  another file is shown. */
  readonly shownTimeIndex: number;
  /** Where hand edits of the axis, landmarks and fit range go: the file ('file': every time point) or the shown time
   *  point alone ('timePoint', movies only). Back to 'file' when another file is shown. */
  readonly editScope: EditScope;
  /** The automatically found axis of the shown file (used when there is no hand axis). */
  readonly autoAxis: ApAxis | null;
  readonly display: DisplayState;
  readonly view: ViewTransform;
  readonly tool: ToolName;
  readonly selectedLandmark: number | null;
  /** Undo steps, oldest first; each acts on the settings or on one file (see history.ts). */
  readonly past: readonly HistoryEntry[];
  /** Redo steps, next first. */
  readonly future: readonly HistoryEntry[];
  /** Bumped whenever doc changes, so the autosave effect can debounce on it. */
  readonly revision: number;
  /** Bumped whenever the comparison options change by an edit, undo or redo (not when a project opens), so the window
   *  compares the conditions again with them. */
  readonly cohortRevision: number;
}

/** Which end of the AP axis a handle moves. */
export type AxisEnd = 'anterior' | 'posterior';

/** Every named edit. `coalesce` marks the continuation of a drag that already entered history. */
export type EditorAction =
  | { type: 'openDoc'; doc: DocState }
  | { type: 'setCohortOptions'; cohort: ProjectCohortOptions }
  | { type: 'selectFile'; key: string; autoAxis: ApAxis | null }
  | { type: 'showTimePoint'; tIndex: number }
  | { type: 'setEditScope'; scope: EditScope }
  | { type: 'clearTimePointEdits' }
  | { type: 'setMovieTime'; time: string | null; timeStepS: number | null }
  | { type: 'setAxisHandle'; end: AxisEnd; point: ImagePoint; coalesce?: boolean }
  | { type: 'swapPoles' }
  | { type: 'resetAxis' }
  | { type: 'addLandmark'; point: ImagePoint; name?: string }
  | { type: 'moveLandmark'; index: number; point: ImagePoint; coalesce?: boolean }
  | { type: 'renameLandmark'; index: number; name: string }
  | { type: 'deleteLandmark'; index: number }
  | { type: 'selectLandmark'; index: number | null }
  | { type: 'setFitRange'; rangeEl: readonly [number, number]; coalesce?: boolean }
  | { type: 'setDorsalSide'; side: 'left' | 'right' | null }
  | { type: 'setSetting'; patch: SettingsOverrides }
  | { type: 'setChannelDisplay'; index: number; patch: Partial<ChannelDisplay> }
  | { type: 'initChannelDisplay'; channels: readonly ChannelDisplay[] }
  | { type: 'setDisplayMode'; mode: 'single' | 'merged'; active?: number }
  | { type: 'setView'; view: ViewTransform }
  | { type: 'setTool'; tool: ToolName }
  | { type: 'undo' }
  | { type: 'redo' };

/** What an action does: the new state and whether the previous document enters undo history. */
export interface ActionOutcome {
  readonly state: EditorState;
  readonly history: 'push' | 'none';
}
