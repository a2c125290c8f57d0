// The state before anything is open.
import { DEFAULT_SETTINGS } from '../../core/settings';
import type { EditorState } from './types';

/** Empty editor: default settings, no file, axis tool. */
export function initialState(): EditorState {
  return {
    doc: { settings: DEFAULT_SETTINGS, files: {} },
    current: null,
    shownTimeIndex: 0,
    editScope: 'file',
    autoAxis: null,
    display: { mode: 'merged', active: 0, channels: [] },
    view: { zoom: 1, offsetX: 0, offsetY: 0 },
    tool: 'axis',
    selectedLandmark: null,
    past: [],
    future: [],
    revision: 0,
    cohortRevision: 0,
  };
}
