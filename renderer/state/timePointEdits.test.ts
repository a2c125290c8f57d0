// Edits of one time point of a movie against edits of the whole file, and the movie's own time points and time step.
// All inputs are demo data; the project-file rule they follow (a time point's field replaces the file's there only)
// is core/settings' fileEditsAt.
import { describe, expect, it } from 'vitest';
import type { ApAxis } from '../../core/model';
import { currentEdits, effectiveAxis, storedEdits, timePointEdits } from './fileEdits';
import { initialState } from './initial';
import { editorReducer as reduce } from './reducer';
import type { EditorAction, EditorState } from './types';

const AUTO: ApAxis = { anterior: { x: 10, y: 50 }, posterior: { x: 90, y: 50 }, source: 'auto' };
const run = (s: EditorState, ...actions: EditorAction[]) => actions.reduce(reduce, s);
const movieAt = (t: number): EditorState => run(initialState(), { type: 'selectFile', key: 'm.tif', autoAxis: AUTO }, { type: 'showTimePoint', tIndex: t });

describe('edits of one time point', () => {
  it('a move at a time point with "this time point" goes to that time point only; other time points keep the file\'s', () => {
    const s = run(movieAt(7), { type: 'setEditScope', scope: 'timePoint' }, { type: 'setAxisHandle', end: 'anterior', point: { x: 14, y: 52 } });
    expect(storedEdits(s).axis).toBeNull();
    expect(storedEdits(s).timePoints).toEqual({ 7: { axis: { anterior: { x: 14, y: 52 }, posterior: { x: 90, y: 50 }, source: 'hand' } } });
    expect(effectiveAxis(s)!.anterior).toEqual({ x: 14, y: 52 });
    const other = run(s, { type: 'showTimePoint', tIndex: 8 });
    expect(effectiveAxis(other)).toBe(AUTO);
    expect(timePointEdits(other)).toBeNull();
  });

  it('landmarks added at a time point start from the file\'s and stay at that time point', () => {
    const s = run(movieAt(0), { type: 'addLandmark', point: { x: 40, y: 50 }, name: 'furrow' }, { type: 'showTimePoint', tIndex: 3 },
      { type: 'setEditScope', scope: 'timePoint' }, { type: 'moveLandmark', index: 0, point: { x: 44, y: 50 } });
    expect(storedEdits(s).landmarks).toEqual([{ name: 'furrow', point: { x: 40, y: 50 } }]);
    expect(currentEdits(s).landmarks).toEqual([{ name: 'furrow', point: { x: 44, y: 50 } }]);
    expect(currentEdits(run(s, { type: 'showTimePoint', tIndex: 4 })).landmarks).toEqual([{ name: 'furrow', point: { x: 40, y: 50 } }]);
  });

  it('an edit for every time point drops the shown time point\'s own value of that field, keeps its other fields, and the dorsal side stays the file\'s', () => {
    let s = run(movieAt(2), { type: 'setEditScope', scope: 'timePoint' }, { type: 'swapPoles' }, { type: 'setFitRange', rangeEl: [0.1, 0.5] },
      { type: 'setDorsalSide', side: 'right' });
    expect(storedEdits(s).dorsalSide).toBe('right');
    expect(Object.keys(timePointEdits(s)!).sort()).toEqual(['axis', 'fitRangeEl']);
    s = run(s, { type: 'setEditScope', scope: 'file' }, { type: 'setAxisHandle', end: 'posterior', point: { x: 95, y: 50 } });
    expect(timePointEdits(s)).toEqual({ fitRangeEl: [0.1, 0.5] });
    expect(storedEdits(s).axis!.posterior).toEqual({ x: 95, y: 50 });
    expect(effectiveAxis(s)!.posterior).toEqual({ x: 95, y: 50 });
  });

  it('clearing a time point\'s edits brings the file\'s back there, and undo takes the clearing back', () => {
    const s = run(movieAt(5), { type: 'setEditScope', scope: 'timePoint' }, { type: 'swapPoles' }, { type: 'clearTimePointEdits' });
    expect(storedEdits(s).timePoints).toBeUndefined();
    expect(effectiveAxis(s)).toBe(AUTO);
    const back = run(s, { type: 'undo' });
    expect(effectiveAxis(back)!.anterior).toEqual(AUTO.posterior);
  });

  it('the scope goes back to the whole file when another file is shown', () => {
    const s = run(movieAt(5), { type: 'setEditScope', scope: 'timePoint' }, { type: 'selectFile', key: 'n.tif', autoAxis: AUTO });
    expect(s.editScope).toBe('file');
    expect(s.shownTimeIndex).toBe(0);
  });
});

describe('a movie\'s own time points and time step', () => {
  it('are stored in its entry, "all" and null as no value, and undo takes them back', () => {
    let s = run(movieAt(0), { type: 'setMovieTime', time: '10:25', timeStepS: null });
    expect(storedEdits(s)).toEqual({ axis: null, landmarks: [], fitRangeEl: null, time: '10:25' });
    s = run(s, { type: 'setMovieTime', time: 'all', timeStepS: 30 });
    expect(storedEdits(s)).toEqual({ axis: null, landmarks: [], fitRangeEl: null, timeStepS: 30 });
    expect(storedEdits(run(s, { type: 'undo' })).time).toBe('10:25');
  });
});

describe('the window\'s one time point', () => {
  it('a time point set in the settings is the one shown, and another file opens at the settings\' time point', () => {
    const s = run(movieAt(12), { type: 'setSetting', patch: { timeIndex: 5 } });
    expect([s.shownTimeIndex, s.doc.settings.timeIndex]).toEqual([5, 5]);
    // Stepping shows another time point without changing the setting (no undo step, nothing saved).
    const stepped = run(s, { type: 'showTimePoint', tIndex: 6 });
    expect([stepped.shownTimeIndex, stepped.doc.settings.timeIndex, stepped.past.length]).toEqual([6, 5, s.past.length]);
    expect(run(stepped, { type: 'selectFile', key: 'other.tif', autoAxis: null }).shownTimeIndex).toBe(5);
    // Another setting leaves the shown time point alone.
    expect(run(stepped, { type: 'setSetting', patch: { projection: 'max' } }).shownTimeIndex).toBe(6);
  });
});
