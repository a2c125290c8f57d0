// Panning: the image follows the pointer.
import { panBy } from '../geometry';
import type { PointerInput, ToolStep } from './types';
import { IDLE } from './types';

/** Pointer moved while panning: shift the view by the screen delta. */
export function panningPointerMove(last: { x: number; y: number }, input: PointerInput): ToolStep {
  const view = panBy(input.state.view, input.screen.x - last.x, input.screen.y - last.y);
  return { gesture: { kind: 'panning', last: input.screen }, actions: [{ type: 'setView', view }] };
}

/** Pointer released while panning. */
export const panningPointerUp = (): ToolStep => ({ gesture: IDLE, actions: [] });
