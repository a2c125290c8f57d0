// The editor reducer: runs one named action and keeps the undo history of the document.
import { resetAxis, setAxisHandle, swapPoles } from './axisActions';
import { addLandmark, deleteLandmark, moveLandmark, renameLandmark } from './landmarkActions';
import { setDorsalSide, setFitRange, setSetting } from './settingsActions';
import { withMovieTime, withoutTimePointEdits } from './fileEdits';
import { entriesForChange, entryApplies, restoreEntry, sameScope, snapshotLike } from './history';
import type { ActionOutcome, EditorAction, EditorState } from './types';
import {
  initChannelDisplay, openDoc, selectFile, selectLandmark, setChannelDisplay, setDisplayMode, setEditScope, setTool, setView, showTimePoint,
} from './viewActions';

/** Most undo steps kept (older ones are dropped). */
export const HISTORY_LIMIT = 200;

/** Run one action without touching history. */
export function perform(state: EditorState, action: EditorAction): ActionOutcome {
  switch (action.type) {
    case 'openDoc': return openDoc(state, action.doc);
    case 'setCohortOptions': return { state: { ...state, doc: { ...state.doc, cohort: action.cohort } }, history: 'push' };
    case 'selectFile': return selectFile(state, action.key, action.autoAxis);
    case 'showTimePoint': return showTimePoint(state, action.tIndex);
    case 'setEditScope': return setEditScope(state, action.scope);
    case 'clearTimePointEdits': return { state: withoutTimePointEdits(state), history: 'push' };
    case 'setMovieTime': return { state: withMovieTime(state, action.time, action.timeStepS), history: 'push' };
    case 'setAxisHandle': return setAxisHandle(state, action.end, action.point, action.coalesce);
    case 'swapPoles': return swapPoles(state);
    case 'resetAxis': return resetAxis(state);
    case 'addLandmark': return addLandmark(state, action.point, action.name);
    case 'moveLandmark': return moveLandmark(state, action.index, action.point, action.coalesce);
    case 'renameLandmark': return renameLandmark(state, action.index, action.name);
    case 'deleteLandmark': return deleteLandmark(state, action.index);
    case 'selectLandmark': return selectLandmark(state, action.index);
    case 'setFitRange': return setFitRange(state, action.rangeEl, action.coalesce);
    case 'setDorsalSide': return setDorsalSide(state, action.side);
    case 'setSetting': return setSetting(state, action.patch);
    case 'setChannelDisplay': return setChannelDisplay(state, action.index, action.patch);
    case 'initChannelDisplay': return initChannelDisplay(state, action.channels);
    case 'setDisplayMode': return setDisplayMode(state, action.mode, action.active);
    case 'setView': return setView(state, action.view);
    case 'setTool': return setTool(state, action.tool);
    case 'undo': return { state: undo(state), history: 'none' };
    case 'redo': return { state: redo(state), history: 'none' };
  }
}

/** Index of the last undo step that acts on the shown file or the settings (-1: none). */
function undoIndex(state: EditorState): number {
  for (let i = state.past.length - 1; i >= 0; i -= 1) if (entryApplies(state.past[i], state.current)) return i;
  return -1;
}

/** Index of the next redo step that acts on the shown file or the settings (-1: none). */
const redoIndex = (state: EditorState): number => state.future.findIndex((e) => entryApplies(e, state.current));

/** Whether undo would change anything for the shown file (its edits or the settings). */
export const canUndo = (state: EditorState): boolean => undoIndex(state) >= 0;

/** Whether redo would change anything for the shown file (its edits or the settings). */
export const canRedo = (state: EditorState): boolean => redoIndex(state) >= 0;

/** Step back the last edit of the shown file or the settings; other files' edits are never touched. */
export function undo(state: EditorState): EditorState {
  const i = undoIndex(state);
  if (i < 0) return state;
  const entry = state.past[i];
  const past = [...state.past.slice(0, i), ...state.past.slice(i + 1)];
  const future = [snapshotLike(state.doc, entry), ...state.future];
  return { ...state, doc: restoreEntry(state.doc, entry), past, future, selectedLandmark: null, revision: state.revision + 1 };
}

/** Re-apply the last undone edit of the shown file or the settings (no-op when there is none). */
export function redo(state: EditorState): EditorState {
  const i = redoIndex(state);
  if (i < 0) return state;
  const entry = state.future[i];
  const future = [...state.future.slice(0, i), ...state.future.slice(i + 1)];
  const past = [...state.past, snapshotLike(state.doc, entry)];
  return { ...state, doc: restoreEntry(state.doc, entry), past, future, selectedLandmark: null, revision: state.revision + 1 };
}

/** The React reducer: perform, record the previous document when the action enters history, and count changes of the
 *  comparison options (an edit, undo or redo; opening a project is not one). */
export function editorReducer(state: EditorState, action: EditorAction): EditorState {
  const next = withHistory(state, action);
  return action.type !== 'openDoc' && next.doc.cohort !== state.doc.cohort ? { ...next, cohortRevision: state.cohortRevision + 1 } : next;
}

/** Perform, then record the previous document when the action enters history. */
function withHistory(state: EditorState, action: EditorAction): EditorState {
  const { state: next, history } = perform(state, action);
  if (action.type === 'undo' || action.type === 'redo' || action.type === 'openDoc') return next;
  const docChanged = next.doc !== state.doc;
  if (!docChanged) return next;
  const revision = state.revision + 1;
  if (history === 'none') return { ...next, revision };
  // A new edit drops the redo steps of what it changed; redo steps of other files and the settings stay valid.
  const entries = entriesForChange(state.doc, next.doc);
  const past = [...state.past, ...entries].slice(-HISTORY_LIMIT);
  const future = state.future.filter((f) => !entries.some((e) => sameScope(e, f)));
  return { ...next, past, future, revision };
}
