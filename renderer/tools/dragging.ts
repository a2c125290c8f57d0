// Dragging an axis handle or a landmark: the first move enters undo history, later moves coalesce into it.
import type { AxisEnd } from '../state';
import type { PointerInput, ToolStep } from './types';
import { IDLE } from './types';

/** Pointer moved while dragging an axis pole. */
export function handlePointerMove(end: AxisEnd, moved: boolean, input: PointerInput): ToolStep {
  const point = { x: input.image.x, y: input.image.y };
  return { gesture: { kind: 'draggingHandle', end, moved: true }, actions: [{ type: 'setAxisHandle', end, point, coalesce: moved }] };
}

/** Pointer moved while dragging a landmark. */
export function landmarkPointerMove(index: number, moved: boolean, input: PointerInput): ToolStep {
  const point = { x: input.image.x, y: input.image.y };
  return { gesture: { kind: 'draggingLandmark', index, moved: true }, actions: [{ type: 'moveLandmark', index, point, coalesce: moved }] };
}

/** Pointer released after a drag. */
export const dragPointerUp = (): ToolStep => ({ gesture: IDLE, actions: [] });
