import { describe, expect, it } from 'vitest';
import type { Profile } from '../model';
import { findBoundaries } from './boundary';

// Demo data: a boundary channel with 100 bins over a 500 µm egg.
function makeProfile(mean: Float64Array): Profile {
  const xEl = Float64Array.from({ length: mean.length }, (_, i) => (i + 0.5) / mean.length);
  return { channel: 'boundary', xEl, xUm: xEl.map((v) => v * 500), mean, sd: new Float64Array(mean.length), n: new Float64Array(mean.length).fill(10) };
}
const xEl = Float64Array.from({ length: 100 }, (_, i) => (i + 0.5) / 100);

describe('findBoundaries', () => {
  it('returns one boundary per method with µm positions', () => {
    // Source: demo data — symmetric logistic about 0.5 (lower 10, upper 100, w 0.03): every method gives 0.5.
    const profile = makeProfile(xEl.map((x) => 10 + 90 / (1 + Math.exp((x - 0.5) / 0.03))));
    const found = findBoundaries(profile, ['logistic', 'half-max', 'threshold'], 0.5, 500);
    expect(found.map((b) => b.method)).toEqual(['logistic', 'half-max', 'threshold']);
    for (const b of found) {
      expect(b.channel).toBe('boundary');
      expect(b.positionEl).toBeCloseTo(0.5, 9);
      expect(b.positionUm).toBeCloseTo(250, 6);
      expect(b.direction).toBe('falling');
    }
    expect(found[0].widthEl).toBeCloseTo(0.03, 9);
    expect(found[0].positionSeEl).not.toBeNull();
    expect(found[1].widthEl).toBeNull();
    expect(found[1].positionSeEl).toBeNull();
  });
  it('gives null µm positions when the egg length is unknown', () => {
    const profile = makeProfile(xEl.map((x) => (x < 0.3 ? 50 : 5)));
    const [b] = findBoundaries(profile, ['half-max'], 0.5, null);
    expect(b.positionEl).toBeCloseTo(0.3, 12);
    expect(b.positionUm).toBeNull();
  });
  it('uses the threshold fraction for the threshold method', () => {
    // Source: hand computation — linear ramp 100 → 0 over x/EL; level 0.2 of the robust range.
    const profile = makeProfile(xEl.map((x) => 100 * (1 - x)));
    const [b] = findBoundaries(profile, ['threshold'], 0.2, 500);
    // 5th/95th percentiles of the bin values are 5.45 and 94.55 (type 7 on 0.5..99.5); level = 5.45 + 0.2·89.1 = 23.27.
    expect(b.positionEl).toBeCloseTo(1 - 0.2327, 10);
  });
  it('never throws for a profile without a boundary: null positions with notes', () => {
    const found = findBoundaries(makeProfile(new Float64Array(100).fill(4)), ['logistic', 'half-max', 'threshold'], 0.5, 500);
    for (const b of found) {
      expect(b.positionEl).toBeNull();
      expect(b.positionUm).toBeNull();
      expect(b.note).not.toBeNull();
    }
    expect(found[0].note).toBe('fitLogisticBoundary: the profile has no step (it never crosses its half-maximum)');
    expect(found[1].note).toBe('the profile never crosses the level 4.000');
  });
  it('turns mismatched profile arrays into notes', () => {
    const bad = { ...makeProfile(new Float64Array(10).fill(1)), mean: new Float64Array(3) };
    const [b] = findBoundaries(bad, ['half-max'], 0.5, 500);
    expect(b.positionEl).toBeNull();
    expect(b.note).toBe('halfMaxCrossing: xEl and y differ in length (10 vs 3)');
  });
  it('rejects invalid arguments with exact messages', () => {
    const profile = makeProfile(xEl.map((x) => 100 * (1 - x)));
    expect(() => findBoundaries(profile, ['threshold'], 1, 500)).toThrow(
      'findBoundaries: thresholdFraction must be between 0 and 1 (exclusive), got 1');
    expect(() => findBoundaries(profile, ['bogus' as never], 0.5, 500)).toThrow('findBoundaries: unknown method "bogus"');
    expect(findBoundaries(profile, ['half-max'], 7, 500)).toHaveLength(1); // fraction unused without 'threshold'
  });
});
