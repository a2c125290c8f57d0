import { describe, expect, it } from 'vitest';
import { DEFAULT_SETTINGS } from '../../core/settings';
import { bandOutlinesLive, measureLive, prepareLive } from './measure';
import { SMALL_EMBRYO, syntheticStack } from './syntheticStack';

// Demo data: a synthetic embryo built from known λ = 90 µm, background 100, egg length 450 µm, boundary at 0.45 EL.
describe('measureLive on a synthetic embryo', () => {
  const stack = syntheticStack(SMALL_EMBRYO);
  const settings = { ...DEFAULT_SETTINGS, gradientChannel: 1, boundaryChannels: [2], boundaryMethods: ['half-max' as const] };
  const prep = prepareLive(stack, settings);
  const axis = stack.detection.axis;

  it('recovers λ (µm and EL) within 5% with the edge band', () => {
    const m = measureLive(prep, axis, settings, [], [0.1, 0.6]);
    expect(m.eggLengthUm).toBeCloseTo(450, 6);
    expect(Math.abs((m.fit?.lambdaUm ?? 0) / 90 - 1)).toBeLessThan(0.05);
    expect(m.fit?.lambdaEl).toBeCloseTo((m.fit?.lambdaUm ?? 0) / 450, 10);
    expect(bandOutlinesLive(prep, axis, settings).length).toBeGreaterThan(0);
  });
  it('uses the given fit range, not the settings one', () => {
    const m = measureLive(prep, axis, settings, [], [0.2, 0.5]);
    expect(m.fit?.fitRangeEl).toEqual([0.2, 0.5]);
  });
  it('finds the boundary near 0.45 EL', () => {
    const m = measureLive(prep, axis, settings, [], [0.1, 0.6]);
    expect(Math.abs((m.boundaries[0]?.positionEl ?? 0) - 0.45)).toBeLessThan(0.02);
  });
  it('places landmarks in x/EL along the axis', () => {
    const m = measureLive(prep, axis, settings, [{ name: 'mid', point: { x: (axis.anterior.x + axis.posterior.x) / 2, y: 30 } }], [0.1, 0.6]);
    expect(m.landmarks[0].xEl).toBeCloseTo(0.5, 10);
  });
  it('straightens every channel and the sampled band to one size, band on both edges only', () => {
    const m = measureLive(prep, axis, settings, [], [0.1, 0.6]);
    const { width, height } = m.strips[0];
    expect(m.strips[1].width).toBe(width);
    expect([m.bandStrip.width, m.bandStrip.height]).toEqual([width, height]);
    const centreRow = (height - 1) / 2;
    const mid = Math.round(width / 2);
    expect(m.bandStrip.data[centreRow * width + mid]).toBe(0);
  });
  it('follows a swapped axis (the profile rises, so the decay fit fails or differs)', () => {
    const m = measureLive(prep, { anterior: axis.posterior, posterior: axis.anterior, source: 'hand' }, settings, [], [0.1, 0.6]);
    expect(m.fit === null || Math.abs(m.fit.lambdaUm - 90) > 20).toBe(true);
  });
});
