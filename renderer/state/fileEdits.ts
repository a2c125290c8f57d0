// Read and replace the hand edits of the shown file.
import type { FileEdits } from '../../core/contract';
import type { ApAxis } from '../../core/model';
import { settingsInForce } from '../../core/settings';
import type { EditorState } from './types';

/** Hand edits of a file that has none yet. */
export const EMPTY_EDITS: FileEdits = Object.freeze({ axis: null, landmarks: [], fitRangeEl: null });

/** The shown file's edits (EMPTY_EDITS when it has none or no file is shown). */
export function currentEdits(state: EditorState): FileEdits {
  if (state.current === null) return EMPTY_EDITS;
  return state.doc.files[state.current] ?? EMPTY_EDITS;
}

/** The axis in force for the shown file: the hand axis, else the automatic one. */
export function effectiveAxis(state: EditorState): ApAxis | null {
  return currentEdits(state).axis ?? state.autoAxis;
}

/** The fit range in force for the shown file, x/EL: its own override, else the settings' (core's rule). */
export function effectiveFitRange(state: EditorState): readonly [number, number] {
  return settingsInForce(state.doc.settings, currentEdits(state)).fitRangeEl;
}

/** New state with the shown file's edits replaced by `patch` merged over them (no-op without a shown file). */
export function withEdits(state: EditorState, patch: Partial<FileEdits>): EditorState {
  if (state.current === null) return state;
  const files = { ...state.doc.files, [state.current]: { ...currentEdits(state), ...patch } };
  return { ...state, doc: { ...state.doc, files } };
}
