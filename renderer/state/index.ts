// Public surface of the editor state: types, the reducer, and selectors.
export type { EditorState, EditorAction, EditScope, DocState, ChannelDisplay, DisplayState, ToolName, AxisEnd, ActionOutcome } from './types';
export { editorReducer, perform, undo, redo, canUndo, canRedo, HISTORY_LIMIT } from './reducer';
export type { HistoryEntry } from './types';
export { initialState } from './initial';
export { currentEdits, storedEdits, timePointEdits, effectiveAxis, effectiveFitRange, EMPTY_EDITS } from './fileEdits';
export { nextLandmarkName } from './landmarkActions';
export { normaliseFitRange, MIN_FIT_WIDTH_EL } from './settingsActions';
export { indexResults, resultAt, timePointsOf, fileResult, NO_RESULTS, type ResultIndex } from './results';
