// Pointer tools as a small state machine: each gesture state answers pointer events with a next state and actions.
import type { ImagePt, ScreenPt } from '../geometry';
import type { AxisEnd, EditorAction, EditorState } from '../state';

/** The states of the image-view pointer machine. */
export type Gesture =
  | { readonly kind: 'idle' }
  | { readonly kind: 'panning'; readonly last: ScreenPt }
  | { readonly kind: 'draggingHandle'; readonly end: AxisEnd; readonly moved: boolean }
  | { readonly kind: 'draggingLandmark'; readonly index: number; readonly moved: boolean };

/** One pointer event as the machine sees it. */
export interface PointerInput {
  readonly state: EditorState;
  readonly screen: ScreenPt;
  readonly image: ImagePt;
  /** Space bar held: any tool pans. */
  readonly spaceHeld: boolean;
}

/** The machine's answer: next gesture state and editor actions to dispatch, in order. */
export interface ToolStep {
  readonly gesture: Gesture;
  readonly actions: readonly EditorAction[];
}

/** The resting state. */
export const IDLE: Gesture = { kind: 'idle' };
