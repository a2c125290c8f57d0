import { describe, expect, it } from 'vitest';
import { embryosCsv } from '../../core/batch';
import { DEFAULT_SETTINGS } from '../../core/settings';
import { measureLive, prepareLive } from '../live';
import { SMALL_EMBRYO, syntheticStack } from '../live/syntheticStack';
import { fileStem, liveToResult } from './liveResult';

// Demo data: the small synthetic embryo.
describe('liveToResult', () => {
  it('carries the fit and landmarks into a result the batch tables accept', () => {
    const stack = syntheticStack(SMALL_EMBRYO);
    const m = measureLive(prepareLive(stack, DEFAULT_SETTINGS), stack.detection.axis, DEFAULT_SETTINGS, [{ name: 'L1', point: { x: 100, y: 50 } }], [0.1, 0.6]);
    const r = liveToResult('e1.tif', m, stack.detection.axis, 2.5, 'ome', 180);
    expect(r.gradientFit).toBe(m.fit);
    expect(r.landmarks[0].name).toBe('L1');
    const csv = embryosCsv([r]);
    expect(csv.split('\n')[1]).toContain('e1.tif');
  });
});

describe('fileStem', () => {
  it('makes a safe stem', () => {
    expect(fileStem('a/b c.tif')).toBe('a-b-c');
    expect(fileStem('.tif')).toBe('embryo');
  });
});
