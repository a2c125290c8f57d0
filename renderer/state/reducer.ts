// The editor reducer: runs one named action and keeps the undo history of the document.
import { resetAxis, setAxisHandle, swapPoles } from './axisActions';
import { addLandmark, deleteLandmark, moveLandmark, renameLandmark } from './landmarkActions';
import { setFitRange, setSetting } from './settingsActions';
import type { ActionOutcome, EditorAction, EditorState } from './types';
import {
  initChannelDisplay, openDoc, selectFile, selectLandmark, setChannelDisplay, setDisplayMode, setTool, setView,
} from './viewActions';

/** Most undo steps kept (older ones are dropped). */
export const HISTORY_LIMIT = 200;

/** Run one action without touching history. */
export function perform(state: EditorState, action: EditorAction): ActionOutcome {
  switch (action.type) {
    case 'openDoc': return openDoc(state, action.doc);
    case 'selectFile': return selectFile(state, action.key, action.autoAxis);
    case 'setAxisHandle': return setAxisHandle(state, action.end, action.point, action.coalesce);
    case 'swapPoles': return swapPoles(state);
    case 'resetAxis': return resetAxis(state);
    case 'addLandmark': return addLandmark(state, action.point, action.name);
    case 'moveLandmark': return moveLandmark(state, action.index, action.point, action.coalesce);
    case 'renameLandmark': return renameLandmark(state, action.index, action.name);
    case 'deleteLandmark': return deleteLandmark(state, action.index);
    case 'selectLandmark': return selectLandmark(state, action.index);
    case 'setFitRange': return setFitRange(state, action.rangeEl, action.coalesce);
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

/** Step back one document edit (no-op with empty history). */
export function undo(state: EditorState): EditorState {
  if (state.past.length === 0) return state;
  const doc = state.past[state.past.length - 1];
  return { ...state, doc, past: state.past.slice(0, -1), future: [state.doc, ...state.future], selectedLandmark: null, revision: state.revision + 1 };
}

/** Re-apply the last undone edit (no-op when there is none). */
export function redo(state: EditorState): EditorState {
  if (state.future.length === 0) return state;
  const [doc, ...future] = state.future;
  return { ...state, doc, past: [...state.past, state.doc], future, selectedLandmark: null, revision: state.revision + 1 };
}

/** The React reducer: perform, then record the previous document when the action enters history. */
export function editorReducer(state: EditorState, action: EditorAction): EditorState {
  const { state: next, history } = perform(state, action);
  if (action.type === 'undo' || action.type === 'redo' || action.type === 'openDoc') return next;
  const docChanged = next.doc !== state.doc;
  if (!docChanged) return next;
  const revision = state.revision + 1;
  if (history === 'none') return { ...next, revision };
  const past = [...state.past, state.doc].slice(-HISTORY_LIMIT);
  return { ...next, past, future: [], revision };
}
