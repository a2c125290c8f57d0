// Idle: a press grabs a handle or landmark, places a landmark, or starts panning.
import { hitTest } from './hitTest';
import type { PointerInput, ToolStep } from './types';
import { IDLE } from './types';

/** Pointer pressed while idle. */
export function idlePointerDown(input: PointerInput): ToolStep {
  const { state, screen, image, spaceHeld } = input;
  if (spaceHeld || state.tool === 'pan') return { gesture: { kind: 'panning', last: screen }, actions: [] };
  const hit = hitTest(state, screen);
  if (hit?.kind === 'handle') return { gesture: { kind: 'draggingHandle', end: hit.end, moved: false }, actions: [] };
  if (hit?.kind === 'landmark') {
    return { gesture: { kind: 'draggingLandmark', index: hit.index, moved: false }, actions: [{ type: 'selectLandmark', index: hit.index }] };
  }
  if (state.tool === 'landmark') return { gesture: IDLE, actions: [{ type: 'addLandmark', point: { x: image.x, y: image.y } }] };
  // The axis tool on empty image pans, so the view can always be moved without switching tools.
  return { gesture: { kind: 'panning', last: screen }, actions: [{ type: 'selectLandmark', index: null }] };
}
