// Read and replace the hand edits of the shown file, at the shown time point of a movie: an edit goes to the file
// (every time point) or to the shown time point alone, as the edit scope says.
import type { FileEdits, TimePointEdits } from '../../core/contract';
import type { ApAxis } from '../../core/model';
import { fileEditsAt, settingsInForce } from '../../core/settings';
import type { EditorState } from './types';

/** Hand edits of a file that has none yet. */
export const EMPTY_EDITS: FileEdits = Object.freeze({ axis: null, landmarks: [], fitRangeEl: null });

/** The fields a time point may hold of its own (project file version 2). */
const TIME_POINT_FIELDS = ['axis', 'landmarks', 'fitRangeEl'] as const;

/** The shown file's stored edits as the project keeps them (the file's own, with every time point's); EMPTY_EDITS
 *  when it has none or no file is shown. */
export function storedEdits(state: EditorState): FileEdits {
  if (state.current === null) return EMPTY_EDITS;
  return state.doc.files[state.current] ?? EMPTY_EDITS;
}

/** The shown file's edits in force at the shown time point (that time point's own fields over the file's), as the
 *  batch applies them there (EMPTY_EDITS when it has none or no file is shown). */
export function currentEdits(state: EditorState): FileEdits {
  return fileEditsAt(storedEdits(state), state.shownTimeIndex) ?? EMPTY_EDITS;
}

/** The shown time point's own edits (null: it has none, the file's hold there). */
export function timePointEdits(state: EditorState): TimePointEdits | null {
  const own = storedEdits(state).timePoints?.[String(state.shownTimeIndex)];
  return own === undefined || Object.keys(own).length === 0 ? null : own;
}

/** The axis in force for the shown file: the hand axis, else the automatic one. */
export function effectiveAxis(state: EditorState): ApAxis | null {
  return currentEdits(state).axis ?? state.autoAxis;
}

/** The fit range in force for the shown file, x/EL: its own override, else the settings' (core's rule). */
export function effectiveFitRange(state: EditorState): readonly [number, number] {
  return settingsInForce(state.doc.settings, currentEdits(state)).fitRangeEl;
}

/** `edits` with the time point `key` replaced by `own` (removed when empty); no timePoints field when none is left. */
function withTimePoint(edits: FileEdits, key: string, own: TimePointEdits): FileEdits {
  const { timePoints, ...rest } = edits;
  const others = Object.fromEntries(Object.entries(timePoints ?? {}).filter(([k]) => k !== key));
  const all = Object.keys(own).length > 0 ? { ...others, [key]: own } : others;
  return Object.keys(all).length > 0 ? { ...rest, timePoints: all } : rest;
}

/**
 * New state with `patch` applied to the shown file's edits (no-op without a shown file). With the edit scope 'timePoint'
 * the axis, landmarks and fit range go to the shown time point alone; otherwise to the file (every time point), and the
 * shown time point's own value of a field set here is dropped, so that the change shows where it was made.
 */
export function withEdits(state: EditorState, patch: Partial<FileEdits>): EditorState {
  if (state.current === null) return state;
  const stored = storedEdits(state);
  const key = String(state.shownTimeIndex);
  const own: Record<string, unknown> = { ...(stored.timePoints?.[key] ?? {}) };
  const fileLevel: Record<string, unknown> = {};
  for (const [k, v] of Object.entries(patch)) {
    const perTime = (TIME_POINT_FIELDS as readonly string[]).includes(k);
    if (perTime && state.editScope === 'timePoint') own[k] = v;
    else {
      fileLevel[k] = v;
      if (perTime) delete own[k];
    }
  }
  const next = withTimePoint({ ...stored, ...fileLevel }, key, own as TimePointEdits);
  return { ...state, doc: { ...state.doc, files: { ...state.doc.files, [state.current]: next } } };
}

/** New state without the shown time point's own edits (the file's hold there again). */
export function withoutTimePointEdits(state: EditorState): EditorState {
  if (state.current === null || timePointEdits(state) === null) return state;
  const next = withTimePoint(storedEdits(state), String(state.shownTimeIndex), {});
  return { ...state, doc: { ...state.doc, files: { ...state.doc.files, [state.current]: next } } };
}

/** New state with the shown movie's own time points to analyse and time step (null: the run's own; 'all' is stored
 *  as no value, so the batch's --time still governs the file). */
export function withMovieTime(state: EditorState, time: string | null, timeStepS: number | null): EditorState {
  if (state.current === null) return state;
  const { time: _t, timeStepS: _s, ...rest } = storedEdits(state);
  const next: FileEdits = { ...rest, ...(time !== null && time !== 'all' ? { time } : {}), ...(timeStepS !== null ? { timeStepS } : {}) };
  return { ...state, doc: { ...state.doc, files: { ...state.doc.files, [state.current]: next } } };
}
