// What lies under the pointer: an axis handle, a landmark, or nothing (distances in screen CSS px).
import { imageToScreen, imagePt } from '../geometry';
import type { ScreenPt, ViewTransform } from '../geometry';
import { currentEdits, effectiveAxis } from '../state';
import type { AxisEnd, EditorState } from '../state';

/** Grab distance for handles and landmarks, screen CSS px. */
export const HIT_RADIUS_PX = 9;

/** A thing the pointer can grab. */
export type Hit = { kind: 'handle'; end: AxisEnd } | { kind: 'landmark'; index: number } | null;

const near = (view: ViewTransform, p: { x: number; y: number }, s: ScreenPt) => {
  const q = imageToScreen(view, imagePt(p.x, p.y));
  return Math.hypot(q.x - s.x, q.y - s.y) <= HIT_RADIUS_PX;
};

/** The grabbable item nearest the top under screen point s: landmarks first (drawn on top), then handles. */
export function hitTest(state: EditorState, s: ScreenPt): Hit {
  const landmarks = currentEdits(state).landmarks;
  for (let i = landmarks.length - 1; i >= 0; i -= 1) {
    if (near(state.view, landmarks[i].point, s)) return { kind: 'landmark', index: i };
  }
  const axis = effectiveAxis(state);
  if (axis === null) return null;
  if (near(state.view, axis.posterior, s)) return { kind: 'handle', end: 'posterior' };
  if (near(state.view, axis.anterior, s)) return { kind: 'handle', end: 'anterior' };
  return null;
}
