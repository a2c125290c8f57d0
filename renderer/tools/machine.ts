// Routes pointer events to the current gesture state.
import { dragPointerUp, handlePointerMove, landmarkPointerMove } from './dragging';
import { idlePointerDown } from './idle';
import { panningPointerMove, panningPointerUp } from './panning';
import type { Gesture, PointerInput, ToolStep } from './types';
import { IDLE } from './types';

const stay = (gesture: Gesture): ToolStep => ({ gesture, actions: [] });

/** Pointer pressed. */
export function pointerDown(g: Gesture, input: PointerInput): ToolStep {
  return g.kind === 'idle' ? idlePointerDown(input) : stay(g);
}

/** Pointer moved (with or without a button). */
export function pointerMove(g: Gesture, input: PointerInput): ToolStep {
  switch (g.kind) {
    case 'idle': return stay(g);
    case 'panning': return panningPointerMove(g.last, input);
    case 'draggingHandle': return handlePointerMove(g.end, g.moved, input);
    case 'draggingLandmark': return landmarkPointerMove(g.index, g.moved, input);
  }
}

/** Pointer released or cancelled. */
export function pointerUp(g: Gesture): ToolStep {
  if (g.kind === 'panning') return panningPointerUp();
  if (g.kind === 'idle') return stay(IDLE);
  return dragPointerUp();
}
