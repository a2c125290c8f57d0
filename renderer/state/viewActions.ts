// Actions that change only how things are shown; none enter undo history.
import type { ApAxis } from '../../core/model';
import type { ViewTransform } from '../geometry';
import type { ActionOutcome, ChannelDisplay, DocState, EditScope, EditorState, ToolName } from './types';

const shown = (state: EditorState): ActionOutcome => ({ state, history: 'none' });

/** Change one channel's colour or display range; a low above high is swapped. */
export function setChannelDisplay(state: EditorState, index: number, patch: Partial<ChannelDisplay>): ActionOutcome {
  const old = state.display.channels[index];
  if (old === undefined) return shown(state);
  const merged = { ...old, ...patch };
  const fixed = merged.low <= merged.high ? merged : { ...merged, low: merged.high, high: merged.low };
  const channels = state.display.channels.map((c, i) => (i === index ? fixed : c));
  return shown({ ...state, display: { ...state.display, channels } });
}

/** Replace all channel displays (after a file loads). */
export function initChannelDisplay(state: EditorState, channels: readonly ChannelDisplay[]): ActionOutcome {
  const active = Math.min(state.display.active, Math.max(0, channels.length - 1));
  return shown({ ...state, display: { ...state.display, channels, active } });
}

/** Show one channel or all merged; `active` picks the channel for 'single' and the histogram. */
export function setDisplayMode(state: EditorState, mode: 'single' | 'merged', active?: number): ActionOutcome {
  const n = state.display.channels.length;
  const a = active === undefined ? state.display.active : Math.min(Math.max(0, active), Math.max(0, n - 1));
  return shown({ ...state, display: { ...state.display, mode, active: a } });
}

/** Replace the view transform (zoom, pan). */
export const setView = (state: EditorState, view: ViewTransform): ActionOutcome => shown({ ...state, view });

/** Choose the pointer tool. */
export const setTool = (state: EditorState, tool: ToolName): ActionOutcome => shown({ ...state, tool });

/** Select a landmark (or none). */
export const selectLandmark = (state: EditorState, index: number | null): ActionOutcome => shown({ ...state, selectedLandmark: index });

/** Show another file (at the settings' time point): its automatic axis comes from the loaded stack; history is kept
 *  (undo then reaches only this file's edits and the settings). */
export function selectFile(state: EditorState, key: string, autoAxis: ApAxis | null): ActionOutcome {
  const same = key === state.current;
  const shownTimeIndex = same ? state.shownTimeIndex : state.doc.settings.timeIndex;
  return shown({ ...state, current: key, shownTimeIndex, editScope: same ? state.editScope : 'file', autoAxis, selectedLandmark: null });
}

/** Show another time point of the shown file (a whole number ≥ 0; anything else leaves the state as it is). */
export function showTimePoint(state: EditorState, tIndex: number): ActionOutcome {
  if (!(Number.isInteger(tIndex) && tIndex >= 0) || tIndex === state.shownTimeIndex) return shown(state);
  return shown({ ...state, shownTimeIndex: tIndex });
}

/** Send hand edits to the whole file or to the shown time point alone. */
export const setEditScope = (state: EditorState, scope: EditScope): ActionOutcome => shown(state.editScope === scope ? state : { ...state, editScope: scope });

/** Start from a document read from disk: empties undo history. */
export function openDoc(state: EditorState, doc: DocState): ActionOutcome {
  return shown({ ...state, doc, past: [], future: [], selectedLandmark: null, revision: state.revision });
}
