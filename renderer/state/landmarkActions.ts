// Landmark edits: named points placed by hand on the shown file.
import type { ImagePoint, Landmark } from '../../core/model';
import { currentEdits, withEdits } from './fileEdits';
import type { ActionOutcome, EditorState } from './types';

const unchanged = (state: EditorState): ActionOutcome => ({ state, history: 'none' });

/** The first free default name "L1", "L2", … among the given landmarks. */
export function nextLandmarkName(landmarks: readonly Landmark[]): string {
  const used = new Set(landmarks.map((l) => l.name));
  let i = 1;
  while (used.has(`L${i}`)) i += 1;
  return `L${i}`;
}

/** Add a landmark at `point` (image px) and select it. */
export function addLandmark(state: EditorState, point: ImagePoint, name?: string): ActionOutcome {
  if (state.current === null) return unchanged(state);
  const landmarks = currentEdits(state).landmarks;
  const added: Landmark = { name: name?.trim() || nextLandmarkName(landmarks), point: { x: point.x, y: point.y } };
  const next = withEdits(state, { landmarks: [...landmarks, added] });
  return { state: { ...next, selectedLandmark: landmarks.length }, history: 'push' };
}

/** Move landmark `index` to `point` (image px). */
export function moveLandmark(state: EditorState, index: number, point: ImagePoint, coalesce = false): ActionOutcome {
  const landmarks = currentEdits(state).landmarks;
  if (index < 0 || index >= landmarks.length) return unchanged(state);
  const moved = landmarks.map((l, i) => (i === index ? { ...l, point: { x: point.x, y: point.y } } : l));
  return { state: withEdits(state, { landmarks: moved }), history: coalesce ? 'none' : 'push' };
}

/** Rename landmark `index`; blank names are refused. */
export function renameLandmark(state: EditorState, index: number, name: string): ActionOutcome {
  const landmarks = currentEdits(state).landmarks;
  const trimmed = name.trim();
  if (index < 0 || index >= landmarks.length || trimmed === '' || landmarks[index].name === trimmed) return unchanged(state);
  const renamed = landmarks.map((l, i) => (i === index ? { ...l, name: trimmed } : l));
  return { state: withEdits(state, { landmarks: renamed }), history: 'push' };
}

/** Remove landmark `index` and clear the selection. */
export function deleteLandmark(state: EditorState, index: number): ActionOutcome {
  const landmarks = currentEdits(state).landmarks;
  if (index < 0 || index >= landmarks.length) return unchanged(state);
  const next = withEdits(state, { landmarks: landmarks.filter((_, i) => i !== index) });
  return { state: { ...next, selectedLandmark: null }, history: 'push' };
}
