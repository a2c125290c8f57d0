// Axis edits: move one pole, swap the poles, go back to the automatic axis.
import type { ImagePoint } from '../../core/model';
import { currentEdits, effectiveAxis, withEdits } from './fileEdits';
import type { ActionOutcome, AxisEnd, EditorState } from './types';

const unchanged = (state: EditorState): ActionOutcome => ({ state, history: 'none' });

/** Move the anterior or posterior pole to `point` (image px); the axis becomes a hand axis. */
export function setAxisHandle(state: EditorState, end: AxisEnd, point: ImagePoint, coalesce = false): ActionOutcome {
  const axis = effectiveAxis(state);
  if (axis === null || state.current === null) return unchanged(state);
  const next = { ...axis, [end]: { x: point.x, y: point.y }, source: 'hand' as const };
  return { state: withEdits(state, { axis: next }), history: coalesce ? 'none' : 'push' };
}

/** Exchange anterior and posterior (x/EL 0 ↔ 1); the axis becomes a hand axis. */
export function swapPoles(state: EditorState): ActionOutcome {
  const axis = effectiveAxis(state);
  if (axis === null || state.current === null) return unchanged(state);
  const next = { anterior: axis.posterior, posterior: axis.anterior, source: 'hand' as const };
  return { state: withEdits(state, { axis: next }), history: 'push' };
}

/** Drop the hand axis so the automatic axis applies again. */
export function resetAxis(state: EditorState): ActionOutcome {
  if (currentEdits(state).axis === null) return unchanged(state);
  return { state: withEdits(state, { axis: null }), history: 'push' };
}
