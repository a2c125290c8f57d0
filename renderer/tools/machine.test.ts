// Pointer machine tests on a demo state: 100×100 image at zoom 1, axis from (10,50) to (90,50).
import { describe, expect, it } from 'vitest';
import type { ApAxis } from '../../core/model';
import { imagePt, imageToScreen, screenPt } from '../geometry';
import { editorReducer, initialState } from '../state';
import type { EditorAction, EditorState } from '../state';
import { hitTest } from './hitTest';
import { pointerDown, pointerMove, pointerUp } from './machine';
import { IDLE } from './types';

const AUTO: ApAxis = { anterior: { x: 10, y: 50 }, posterior: { x: 90, y: 50 }, source: 'auto' };
const base = (tool: EditorState['tool'] = 'axis'): EditorState =>
  [{ type: 'selectFile', key: 'a.tif', autoAxis: AUTO } as EditorAction, { type: 'setTool', tool } as EditorAction].reduce(editorReducer, initialState());
const at = (state: EditorState, x: number, y: number, spaceHeld = false) => {
  const screen = imageToScreen(state.view, imagePt(x, y));
  return { state, screen, image: imagePt(x, y), spaceHeld };
};

describe('hitTest', () => {
  it('finds the posterior handle within 9 screen px and nothing farther away', () => {
    const s = base();
    expect(hitTest(s, screenPt(90.5 + 8, 50.5))).toEqual({ kind: 'handle', end: 'posterior' });
    expect(hitTest(s, screenPt(90.5 + 10, 50.5))).toBeNull();
  });
});

describe('pointer machine', () => {
  it('drags the posterior handle: first move pushes history, later moves coalesce', () => {
    const s = base();
    const down = pointerDown(IDLE, at(s, 90, 50));
    expect(down.gesture).toEqual({ kind: 'draggingHandle', end: 'posterior', moved: false });
    const m1 = pointerMove(down.gesture, at(s, 80, 50));
    expect(m1.actions).toEqual([{ type: 'setAxisHandle', end: 'posterior', point: { x: 80, y: 50 }, coalesce: false }]);
    const m2 = pointerMove(m1.gesture, at(s, 70, 50));
    expect(m2.actions[0]).toMatchObject({ coalesce: true });
    expect(pointerUp(m2.gesture).gesture).toBe(IDLE);
  });
  it('places a landmark with the landmark tool on empty image', () => {
    const step = pointerDown(IDLE, at(base('landmark'), 40, 30));
    expect(step.actions).toEqual([{ type: 'addLandmark', point: { x: 40, y: 30 } }]);
    expect(step.gesture).toBe(IDLE);
  });
  it('grabs and moves an existing landmark', () => {
    const s = editorReducer(base('landmark'), { type: 'addLandmark', point: { x: 40, y: 30 } });
    const down = pointerDown(IDLE, at(s, 40, 30));
    expect(down.gesture).toEqual({ kind: 'draggingLandmark', index: 0, moved: false });
    const mv = pointerMove(down.gesture, at(s, 45, 30));
    expect(mv.actions).toEqual([{ type: 'moveLandmark', index: 0, point: { x: 45, y: 30 }, coalesce: false }]);
  });
  it('pans with the pan tool, and with space held in any tool', () => {
    const s = base('pan');
    const down = pointerDown(IDLE, at(s, 20, 20));
    expect(down.gesture.kind).toBe('panning');
    const mv = pointerMove(down.gesture, { ...at(s, 20, 20), screen: screenPt(30.5, 15.5) });
    expect(mv.actions).toEqual([{ type: 'setView', view: { zoom: 1, offsetX: 10, offsetY: -5 } }]);
    expect(pointerDown(IDLE, at(base('landmark'), 20, 20, true)).gesture.kind).toBe('panning');
  });
  it('ignores moves while idle', () => {
    expect(pointerMove(IDLE, at(base(), 1, 1))).toEqual({ gesture: IDLE, actions: [] });
  });
});
