import { describe, expect, it } from 'vitest';
import { chooseScaleBar } from './scaleBar';

// Source: worked by hand; 1-2-5 steps are common practice for scale bars.
describe('chooseScaleBar', () => {
  it('picks 50 µm when 120 screen px cover 60 µm (0.5 µm/px at zoom 1)', () => {
    expect(chooseScaleBar(0.5, 1, 120)).toEqual({ lengthUm: 50, screenPx: 100 });
  });
  it('picks 100 µm when the space allows exactly 100 µm', () => {
    expect(chooseScaleBar(1, 1, 100)).toEqual({ lengthUm: 100, screenPx: 100 });
  });
  it('returns null without a pixel size', () => {
    expect(chooseScaleBar(0, 1, 100)).toBeNull();
  });
});
