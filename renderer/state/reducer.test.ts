// Reducer tests: one block per named action. All inputs are demo data.
import { describe, expect, it } from 'vitest';
import type { ApAxis } from '../../core/model';
import { currentEdits, effectiveAxis, effectiveFitRange } from './fileEdits';
import { initialState } from './initial';
import { canRedo, canUndo, editorReducer as reduce, perform } from './reducer';
import type { EditorAction, EditorState } from './types';

const AUTO: ApAxis = { anterior: { x: 10, y: 50 }, posterior: { x: 90, y: 50 }, source: 'auto' };
const run = (s: EditorState, ...actions: EditorAction[]) => actions.reduce(reduce, s);
const opened = (): EditorState => run(initialState(), { type: 'selectFile', key: 'e1.tif', autoAxis: AUTO });

describe('openDoc', () => {
  it('replaces the document and clears history', () => {
    const s = run(opened(), { type: 'swapPoles' });
    const doc = { settings: { ...s.doc.settings, projection: 'max' as const }, files: {} };
    const next = reduce(s, { type: 'openDoc', doc });
    expect(next.doc).toBe(doc);
    expect(next.past).toEqual([]);
    expect(next.future).toEqual([]);
  });
});

describe('selectFile', () => {
  it('shows a file with its automatic axis and no history entry', () => {
    const s = opened();
    expect(s.current).toBe('e1.tif');
    expect(effectiveAxis(s)).toBe(AUTO);
    expect(s.past).toHaveLength(0);
  });
});

describe('setAxisHandle', () => {
  it('moves one pole, makes the axis a hand axis, and enters history', () => {
    const s = reduce(opened(), { type: 'setAxisHandle', end: 'posterior', point: { x: 80, y: 40 } });
    expect(effectiveAxis(s)).toEqual({ anterior: { x: 10, y: 50 }, posterior: { x: 80, y: 40 }, source: 'hand' });
    expect(s.past).toHaveLength(1);
  });
  it('coalesced moves of a drag add no more history', () => {
    const s = run(opened(),
      { type: 'setAxisHandle', end: 'anterior', point: { x: 11, y: 50 } },
      { type: 'setAxisHandle', end: 'anterior', point: { x: 12, y: 50 }, coalesce: true },
      { type: 'setAxisHandle', end: 'anterior', point: { x: 13, y: 50 }, coalesce: true });
    expect(s.past).toHaveLength(1);
    expect(effectiveAxis(s)?.anterior).toEqual({ x: 13, y: 50 });
  });
  it('does nothing without a file', () => {
    const s0 = initialState();
    expect(reduce(s0, { type: 'setAxisHandle', end: 'anterior', point: { x: 1, y: 1 } })).toBe(s0);
  });
});

describe('swapPoles', () => {
  it('exchanges anterior and posterior', () => {
    const s = reduce(opened(), { type: 'swapPoles' });
    expect(effectiveAxis(s)).toEqual({ anterior: AUTO.posterior, posterior: AUTO.anterior, source: 'hand' });
    expect(s.past).toHaveLength(1);
  });
});

describe('resetAxis', () => {
  it('drops the hand axis', () => {
    const s = run(opened(), { type: 'swapPoles' }, { type: 'resetAxis' });
    expect(effectiveAxis(s)).toBe(AUTO);
    expect(s.past).toHaveLength(2);
  });
  it('is a no-op without a hand axis', () => {
    const s = opened();
    expect(reduce(s, { type: 'resetAxis' })).toBe(s);
  });
});

describe('addLandmark', () => {
  it('adds L1, L2 with default names and selects the new one', () => {
    const s = run(opened(), { type: 'addLandmark', point: { x: 30, y: 40 } }, { type: 'addLandmark', point: { x: 31, y: 41 } });
    expect(currentEdits(s).landmarks).toEqual([
      { name: 'L1', point: { x: 30, y: 40 } }, { name: 'L2', point: { x: 31, y: 41 } }]);
    expect(s.selectedLandmark).toBe(1);
  });
  it('uses a given name, trimmed', () => {
    const s = reduce(opened(), { type: 'addLandmark', point: { x: 1, y: 2 }, name: '  fold ' });
    expect(currentEdits(s).landmarks[0].name).toBe('fold');
  });
});

describe('moveLandmark', () => {
  it('moves one landmark; a coalesced move adds no history', () => {
    const s = run(opened(), { type: 'addLandmark', point: { x: 30, y: 40 } },
      { type: 'moveLandmark', index: 0, point: { x: 35, y: 40 } },
      { type: 'moveLandmark', index: 0, point: { x: 36, y: 41 }, coalesce: true });
    expect(currentEdits(s).landmarks[0].point).toEqual({ x: 36, y: 41 });
    expect(s.past).toHaveLength(2);
  });
  it('ignores a bad index', () => {
    const s = opened();
    expect(reduce(s, { type: 'moveLandmark', index: 3, point: { x: 0, y: 0 } })).toBe(s);
  });
});

describe('renameLandmark', () => {
  it('renames and refuses blank names', () => {
    const s = run(opened(), { type: 'addLandmark', point: { x: 1, y: 1 } }, { type: 'renameLandmark', index: 0, name: 'furrow' });
    expect(currentEdits(s).landmarks[0].name).toBe('furrow');
    expect(reduce(s, { type: 'renameLandmark', index: 0, name: '  ' })).toBe(s);
  });
});

describe('deleteLandmark', () => {
  it('removes the landmark and clears the selection', () => {
    const s = run(opened(), { type: 'addLandmark', point: { x: 1, y: 1 } }, { type: 'addLandmark', point: { x: 2, y: 2 } },
      { type: 'deleteLandmark', index: 0 });
    expect(currentEdits(s).landmarks.map((l) => l.name)).toEqual(['L2']);
    expect(s.selectedLandmark).toBeNull();
  });
});

describe('selectLandmark', () => {
  it('selects without history', () => {
    const s = reduce(opened(), { type: 'selectLandmark', index: 2 });
    expect(s.selectedLandmark).toBe(2);
    expect(s.past).toHaveLength(0);
  });
});

describe('setFitRange', () => {
  it('sets the file override, sorted and clamped', () => {
    const s = reduce(opened(), { type: 'setFitRange', rangeEl: [0.7, -0.1] });
    expect(effectiveFitRange(s)).toEqual([0, 0.7]);
    expect(s.past).toHaveLength(1);
  });
  it('refuses a range narrower than 0.05 EL', () => {
    const s = opened();
    expect(reduce(s, { type: 'setFitRange', rangeEl: [0.3, 0.32] })).toBe(s);
  });
  it('falls back to the settings range without an override', () => {
    expect(effectiveFitRange(opened())).toEqual([0.1, 0.6]);
  });
});

describe('setDorsalSide', () => {
  it('sets the shown file\'s own dorsal side in its project entry, which undo takes back and null clears', () => {
    const s = reduce(opened(), { type: 'setDorsalSide', side: 'right' });
    expect(s.doc.files['e1.tif'].dorsalSide).toBe('right');
    expect(s.past).toHaveLength(1);
    expect(reduce(s, { type: 'undo' }).doc.files['e1.tif']?.dorsalSide ?? null).toBe(null);
    expect(reduce(s, { type: 'setDorsalSide', side: null }).doc.files['e1.tif']?.dorsalSide ?? null).toBe(null);
  });
  it('does nothing without a shown file', () => {
    const s = initialState();
    expect(reduce(s, { type: 'setDorsalSide', side: 'left' })).toBe(s);
  });
});

describe('setSetting', () => {
  it('merges into the settings and enters history', () => {
    const s = reduce(opened(), { type: 'setSetting', patch: { projection: 'max' } });
    expect(s.doc.settings.projection).toBe('max');
    expect(s.doc.settings.fitRangeEl).toEqual([0.1, 0.6]);
    expect(s.past).toHaveLength(1);
  });
  it('merges a nested group key by key', () => {
    const s = reduce(opened(), { type: 'setSetting', patch: { profile: { edgeDepthUm: 8 } } });
    expect([s.doc.settings.profile.edgeDepthUm, s.doc.settings.profile.mode]).toEqual([8, 'edge']);
  });
  it('does not take settings that break a rule (a reversed fit range), so the project stays savable', () => {
    // Source: core/settings' rule for fitRangeEl (0 ≤ a < b ≤ 1); demo values.
    const before = opened();
    const s = reduce(before, { type: 'setSetting', patch: { fitRangeEl: [0.7, 0.6] } });
    expect(s.doc).toBe(before.doc);
    expect(s.past).toHaveLength(0);
  });
});

describe('initChannelDisplay / setChannelDisplay / setDisplayMode', () => {
  const withChannels = () => reduce(opened(), { type: 'initChannelDisplay', channels: [
    { colour: '#00ff00', low: 0, high: 100 }, { colour: '#ff00ff', low: 5, high: 50 }] });
  it('sets channel displays without history', () => {
    const s = withChannels();
    expect(s.display.channels).toHaveLength(2);
    expect(s.past).toHaveLength(0);
  });
  it('changes one channel and swaps low above high', () => {
    const s = reduce(withChannels(), { type: 'setChannelDisplay', index: 1, patch: { low: 80 } });
    expect(s.display.channels[1]).toEqual({ colour: '#ff00ff', low: 50, high: 80 });
  });
  it('switches to one channel, clamping the index', () => {
    const s = reduce(withChannels(), { type: 'setDisplayMode', mode: 'single', active: 7 });
    expect(s.display).toMatchObject({ mode: 'single', active: 1 });
  });
});

describe('setView / setTool', () => {
  it('change without history', () => {
    const s = run(opened(), { type: 'setView', view: { zoom: 2, offsetX: 3, offsetY: 4 } }, { type: 'setTool', tool: 'pan' });
    expect(s.view).toEqual({ zoom: 2, offsetX: 3, offsetY: 4 });
    expect(s.tool).toBe('pan');
    expect(s.past).toHaveLength(0);
  });
});

describe('setCohortOptions', () => {
  // Demo condition names; the options are the project's cohort entry.
  it('is an ordinary undoable edit: undo puts back the previous options (none kept: the entry goes), redo re-applies', () => {
    const s1 = reduce(opened(), { type: 'setCohortOptions', cohort: { backgroundCondition: 'none' } });
    const s2 = reduce(s1, { type: 'setCohortOptions', cohort: { backgroundCondition: 'none', normalisation: 'minmax' } });
    expect([s2.past.length, canUndo(s2)]).toEqual([2, true]);
    const u1 = reduce(s2, { type: 'undo' });
    expect(u1.doc.cohort).toEqual({ backgroundCondition: 'none' });
    const u2 = reduce(u1, { type: 'undo' });
    expect(u2.doc.cohort).toBeUndefined();
    expect('cohort' in u2.doc).toBe(false);
    expect(u2.doc.settings).toBe(s2.doc.settings);
    expect(reduce(u2, { type: 'redo' }).doc.cohort).toEqual({ backgroundCondition: 'none' });
    // Each change, undo and redo counts as a change of the options (the window compares again on it); the revision
    // moves too, so the project is saved.
    expect([s1.cohortRevision, s2.cohortRevision, u1.cohortRevision, u2.cohortRevision]).toEqual([1, 2, 3, 4]);
    expect(u2.revision).toBeGreaterThan(s2.revision);
  });
  it('undo of an option works whichever file is shown, and a settings edit does not count as an option change', () => {
    const s = run(opened(), { type: 'setCohortOptions', cohort: { reference: 'half' } }, { type: 'selectFile', key: 'other.tif', autoAxis: AUTO });
    expect(reduce(s, { type: 'undo' }).doc.cohort).toBeUndefined();
    const t = reduce(s, { type: 'setSetting', patch: { projection: 'max' } });
    expect(t.cohortRevision).toBe(s.cohortRevision);
    // Undo takes the settings edit back first, then the option.
    const back = run(t, { type: 'undo' }, { type: 'undo' });
    expect([back.doc.settings.projection, back.doc.cohort]).toEqual([opened().doc.settings.projection, undefined]);
  });
  it('opening a project does not count as an option change and clears the history', () => {
    const s = reduce(opened(), { type: 'setCohortOptions', cohort: { reference: 'half' } });
    const o = reduce(s, { type: 'openDoc', doc: { settings: s.doc.settings, files: {}, cohort: { normalisation: 'none' } } });
    expect([o.cohortRevision, o.past.length]).toEqual([s.cohortRevision, 0]);
  });
});

describe('undo / redo', () => {
  it('undo restores the previous document; redo re-applies; a new edit clears redo', () => {
    const s1 = run(opened(), { type: 'addLandmark', point: { x: 5, y: 5 } }, { type: 'moveLandmark', index: 0, point: { x: 9, y: 9 } });
    const u = reduce(s1, { type: 'undo' });
    expect(currentEdits(u).landmarks[0].point).toEqual({ x: 5, y: 5 });
    const r = reduce(u, { type: 'redo' });
    expect(currentEdits(r).landmarks[0].point).toEqual({ x: 9, y: 9 });
    const branched = reduce(u, { type: 'swapPoles' });
    expect(branched.future).toHaveLength(0);
  });
  it('keeps view state on undo', () => {
    const s = run(opened(), { type: 'swapPoles' }, { type: 'setView', view: { zoom: 4, offsetX: 0, offsetY: 0 } }, { type: 'undo' });
    expect(s.view.zoom).toBe(4);
    expect(effectiveAxis(s)).toBe(AUTO);
  });
  it('is a no-op with empty history', () => {
    const s = opened();
    expect(perform(s, { type: 'undo' }).state).toBe(s);
    expect(perform(s, { type: 'redo' }).state).toBe(s);
  });
  it('bumps the revision on every document change', () => {
    const s = run(opened(), { type: 'swapPoles' }, { type: 'undo' });
    expect(s.revision).toBe(2);
  });
});

describe('undo / redo act on the shown file only', () => {
  const AUTO2: ApAxis = { anterior: { x: 5, y: 20 }, posterior: { x: 70, y: 20 }, source: 'auto' };
  const toE2 = { type: 'selectFile', key: 'e2.tif', autoAxis: AUTO2 } as const;
  const toE1 = { type: 'selectFile', key: 'e1.tif', autoAxis: AUTO } as const;

  it('undo on another file never changes the file edited before', () => {
    const s = run(opened(), { type: 'swapPoles' }, toE2, { type: 'undo' });
    expect(s.doc.files['e1.tif'].axis?.source).toBe('hand');
    expect(canUndo(s)).toBe(false);
    expect(s.revision).toBe(1);
  });
  it('undo skips other files\' edits and steps back the shown file\'s last edit', () => {
    const s = run(opened(), { type: 'addLandmark', point: { x: 1, y: 1 } }, toE2, { type: 'swapPoles' }, toE1, { type: 'undo' });
    expect(s.doc.files['e1.tif']).toBeUndefined();
    expect(s.doc.files['e2.tif'].axis).toEqual({ anterior: AUTO2.posterior, posterior: AUTO2.anterior, source: 'hand' });
    // Back on e2 its own edit is still undoable, and undoing it leaves e1 alone.
    const back = run(s, toE2, { type: 'undo' });
    expect(back.doc.files['e2.tif']).toBeUndefined();
    expect(back.doc.files['e1.tif']).toBeUndefined();
    expect(canUndo(back)).toBe(false);
  });
  it('redo re-applies only the shown file\'s undone edit', () => {
    const s = run(opened(), { type: 'swapPoles' }, { type: 'undo' }, toE2);
    expect(canRedo(s)).toBe(false);
    expect(reduce(s, { type: 'redo' })).toBe(s);
    const r = run(s, toE1, { type: 'redo' });
    expect(effectiveAxis(r)?.source).toBe('hand');
  });
  it('redo restores the end of a coalesced drag, not its first step', () => {
    const s = run(opened(),
      { type: 'setAxisHandle', end: 'posterior', point: { x: 80, y: 50 } },
      { type: 'setAxisHandle', end: 'posterior', point: { x: 70, y: 45 }, coalesce: true },
      { type: 'undo' }, { type: 'redo' });
    expect(effectiveAxis(s)?.posterior).toEqual({ x: 70, y: 45 });
  });
  it('settings edits apply to every file, so undo reaches them from any file', () => {
    const s = run(opened(), { type: 'setSetting', patch: { projection: 'max' } }, toE2);
    expect(canUndo(s)).toBe(true);
    const u = reduce(s, { type: 'undo' });
    expect(u.doc.settings.projection).toBe(opened().doc.settings.projection);
  });
  it('a new edit clears redo of the same file only', () => {
    const s = run(opened(), { type: 'swapPoles' }, { type: 'undo' }, toE2, { type: 'swapPoles' }, toE1);
    expect(canRedo(s)).toBe(true);
    const t = run(s, { type: 'addLandmark', point: { x: 2, y: 2 } });
    expect(canRedo(t)).toBe(false);
    expect(t.future).toHaveLength(0);
  });
  it('undoing a file\'s first edit removes its entry again (as before any edit)', () => {
    const s = run(opened(), { type: 'swapPoles' }, { type: 'undo' });
    expect('e1.tif' in s.doc.files).toBe(false);
  });
});
