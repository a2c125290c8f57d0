import { describe, expect, it } from 'vitest';
import { DEFAULT_SETTINGS } from '../../core/settings';
import { measureLive, prepareLive } from './measure';
import { SMALL_EMBRYO, syntheticStack } from './syntheticStack';

// Demo data: a synthetic embryo built from known λ = 90 µm, background 100, egg length 450 µm, boundary at 0.45 EL.
describe('measureLive on a synthetic embryo', () => {
  const stack = syntheticStack(SMALL_EMBRYO);
  const settings = { ...DEFAULT_SETTINGS, gradientChannel: 1, boundaryChannels: [2] };
  const prep = prepareLive(stack, settings);

  it('estimates the background outside the embryo', () => {
    expect(prep.backgrounds[0]).toBeCloseTo(100, 0);
  });
  it('recovers λ (µm and EL) within 5% with the edge band', () => {
    const m = measureLive(prep, stack.detection.axis, settings, [], [0.1, 0.6]);
    expect(m.eggLengthUm).toBeCloseTo(450, 6);
    expect(m.fit).not.toBeNull();
    expect(Math.abs((m.fit?.lambdaUm ?? 0) / 90 - 1)).toBeLessThan(0.05);
    expect(m.fit?.lambdaEl).toBeCloseTo((m.fit?.lambdaUm ?? 0) / 450, 12);
    expect(m.bandOutlines).toHaveLength(2);
  });
  it('finds the boundary near 0.45 EL', () => {
    const m = measureLive(prep, stack.detection.axis, settings, [], [0.1, 0.6]);
    expect(Math.abs((m.boundaries[0].positionEl ?? 0) - 0.45)).toBeLessThan(0.02);
    expect(m.boundaries[0].direction).toBe('falling');
  });
  it('gives a much longer apparent λ when the poles are swapped (gradient rises)', () => {
    const a = stack.detection.axis;
    const m = measureLive(prep, { anterior: a.posterior, posterior: a.anterior, source: 'hand' }, settings, [], [0.1, 0.6]);
    expect(m.fit === null || m.fit.lambdaUm < 0 || Math.abs(m.fit.lambdaUm - 90) > 20).toBe(true);
  });
  it('warns about a channel the file does not have', () => {
    const p = prepareLive(stack, { ...settings, gradientChannel: 'absent' });
    expect(p.warnings).toContain('gradient channel absent is not in this file (channels: gradient, boundary)');
    expect(measureLive(p, stack.detection.axis, settings, [], [0.1, 0.6]).profile).toBeNull();
  });
});
