// Public surface of the pointer tools.
export type { Gesture, PointerInput, ToolStep } from './types';
export { IDLE } from './types';
export { pointerDown, pointerMove, pointerUp } from './machine';
export { hitTest, HIT_RADIUS_PX } from './hitTest';
export type { Hit } from './hitTest';
