// Analysis edits: the fit range of the shown file and the shared settings.
import { applyOverrides, settingsProblem, type SettingsOverrides } from '../../core/settings';
import { withEdits } from './fileEdits';
import type { ActionOutcome, EditorState } from './types';

/** Narrowest fit range accepted, x/EL (a fit of three parameters needs several bins). */
export const MIN_FIT_WIDTH_EL = 0.05;

/** Sort, clamp to [0, 1] and round a fit range to 1e-4 x/EL; null when narrower than MIN_FIT_WIDTH_EL. */
export function normaliseFitRange(rangeEl: readonly [number, number]): [number, number] | null {
  const clamp = (v: number) => Math.round(Math.min(1, Math.max(0, v)) * 1e4) / 1e4;
  const lo = clamp(Math.min(rangeEl[0], rangeEl[1]));
  const hi = clamp(Math.max(rangeEl[0], rangeEl[1]));
  if (!Number.isFinite(lo) || !Number.isFinite(hi) || hi - lo < MIN_FIT_WIDTH_EL) return null;
  return [lo, hi];
}

/** Set the shown file's fit range (x/EL); ranges too narrow or not finite are ignored. */
export function setFitRange(state: EditorState, rangeEl: readonly [number, number], coalesce = false): ActionOutcome {
  const range = normaliseFitRange(rangeEl);
  if (range === null || state.current === null) return { state, history: 'none' };
  return { state: withEdits(state, { fitRangeEl: range }), history: coalesce ? 'none' : 'push' };
}

/** Set which side of A→P is dorsal for the shown file (null: follow the shared setting); saved in its project entry. */
export function setDorsalSide(state: EditorState, side: 'left' | 'right' | null): ActionOutcome {
  if (state.current === null) return { state, history: 'none' };
  return { state: withEdits(state, { dorsalSide: side }), history: 'push' };
}

/** Merge `patch` into the analysis settings (shared by every file of the project); nested groups merge key by key.
 *  Settings that break a rule of the settings table are not taken (the fields refuse them first, with the message).
 *  A time point given here is also the one shown (the window has one time point). */
export function setSetting(state: EditorState, patch: SettingsOverrides): ActionOutcome {
  const settings = applyOverrides(state.doc.settings, patch);
  if (settingsProblem(settings) !== null) return { state, history: 'none' };
  const shownTimeIndex = patch.timeIndex === undefined ? state.shownTimeIndex : settings.timeIndex;
  return { state: { ...state, shownTimeIndex, doc: { ...state.doc, settings } }, history: 'push' };
}
