import { describe, expect, it } from 'vitest';
import { halfMaxCrossing, steepestSegment, thresholdCrossing } from './crossing';
import { FitError } from './fit-error';

const x5 = [0, 0.25, 0.5, 0.75, 1];
const y5 = [10, 10, 6, 2, 2];

describe('halfMaxCrossing / thresholdCrossing', () => {
  it('finds exact crossings on a tiny profile', () => {
    // Source: hand computation — 5th/95th percentiles (type 7) of [2,2,6,10,10] are 2 and 10, half level 6.
    const half = halfMaxCrossing(x5, y5);
    expect(half).toEqual({ positionEl: 0.5, direction: 'falling', level: 6, crossings: 1, note: null });
    // Level 2 + 0.25·8 = 4: between (0.5, 6) and (0.75, 2) → 0.625.
    expect(thresholdCrossing(x5, y5, 0.25).positionEl).toBeCloseTo(0.625, 15);
    // Absolute level 8: between (0.25, 10) and (0.5, 6) → 0.375.
    expect(thresholdCrossing(x5, y5, { absolute: 8 }).positionEl).toBeCloseTo(0.375, 15);
  });
  it('reports rising profiles', () => {
    const rising = halfMaxCrossing(x5, [...y5].reverse());
    expect(rising.positionEl).toBe(0.5);
    expect(rising.direction).toBe('rising');
  });
  it('puts a sharp step between bins at their midpoint', () => {
    // Source: demo data — 100 bins, 100 anterior of 0.5 and 10 posterior; half level 55 crossed at 0.5.
    const xEl = Float64Array.from({ length: 100 }, (_, i) => (i + 0.5) / 100);
    const y = xEl.map((v) => (v < 0.5 ? 100 : 10));
    expect(halfMaxCrossing(xEl, y).positionEl).toBeCloseTo(0.5, 14);
  });
  it('picks the crossing nearest the steepest change when there are several', () => {
    // Source: hand computation — a bump at 0.1 crosses the level 50 twice, the real step at 0.6 once more.
    const xEl = [0, 0.1, 0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.9, 1.0];
    const y = [100, 100, 100, 100, 100, 100, 0, 0, 0, 0, 0];
    y[8] = 60; // a hot bin posterior of the step: two extra crossings, each of 60 − 0 = 60 < the 100 step
    const c = halfMaxCrossing(xEl, y);
    expect(c.crossings).toBe(3);
    expect(c.positionEl).toBeCloseTo(0.55, 14);
    expect(c.note).toBe('3 crossings; the one nearest the steepest change is reported');
  });
  it('skips non-finite bins and returns null with a note when nothing crosses', () => {
    const withGap = halfMaxCrossing([0, 0.25, 0.5, 0.75, 1], [10, NaN, 6, 2, 2]);
    expect(withGap.positionEl).not.toBeNull();
    const flat = halfMaxCrossing(x5, [3, 3, 3, 3, 3]);
    expect(flat.positionEl).toBeNull();
    expect(flat.note).toBe('the profile never crosses the level 3.000');
    const above = thresholdCrossing(x5, y5, { absolute: 50 });
    expect(above.positionEl).toBeNull();
    expect(above.note).toBe('the profile never crosses the level 50.00');
    expect(halfMaxCrossing([0], [1]).note).toBe('fewer than 2 finite bins in the profile');
  });
  it('smooths when asked (moving average)', () => {
    // Source: hand computation — 3-bin average of [10,10,6,2,2] is [10, 8.667, 6, 3.333, 2]; still crosses 6 at 0.5.
    expect(halfMaxCrossing(x5, y5, { smoothBins: 3 }).positionEl).toBeCloseTo(0.5, 14);
  });
  it('rejects bad arguments with exact messages', () => {
    const messages = [
      [() => thresholdCrossing(x5, y5, 1.5), 'thresholdCrossing: threshold must be a fraction between 0 and 1 (exclusive) or { absolute: number }, got 1.5'],
      [() => thresholdCrossing(x5, y5, { absolute: NaN }), 'thresholdCrossing: threshold must be a fraction between 0 and 1 (exclusive) or { absolute: number }, got {"absolute":null}'],
      [() => halfMaxCrossing(x5, y5, { smoothBins: 2 }), 'halfMaxCrossing: smoothBins must be an odd integer ≥ 1, got 2'],
      [() => halfMaxCrossing(x5, [1, 2]), 'halfMaxCrossing: xEl and y differ in length (5 vs 2)'],
    ] as const;
    for (const [run, message] of messages) {
      expect(run).toThrow(FitError);
      expect(run).toThrow(message);
    }
  });
});

describe('steepest change on a lightly smoothed profile', () => {
  it('is not taken from a single noisy bin', () => {
    // Demo data: a step from 10 to 0 between bins 14 and 16 (two segments of −5), and one dip of −8 at bin 4 (a
    // single-bin change of 8, larger than either half of the real edge).
    const y = Float64Array.from({ length: 24 }, (_, i) => (i < 15 ? 10 : i === 15 ? 5 : 0) - (i === 4 ? 8 : 0));
    // Unsmoothed the dip's segments win; after the 3-bin average the edge does (source: hand arithmetic of the moving
    // average: the edge then changes by 3.33 per bin at most, the dip by 2.67).
    expect(steepestSegment(y)).toBeGreaterThanOrEqual(13);
    expect(steepestSegment(y)).toBeLessThanOrEqual(15);
    const x = Float64Array.from(y, (_, i) => i / 24);
    // Level 8.2 (fraction 0.82 of the 0–10 range) is crossed at the dip's two sides and at the edge.
    const c = thresholdCrossing(x, y, 0.82);
    expect(c.crossings).toBe(3);
    expect(c.positionEl!).toBeGreaterThan(14 / 24);
  });
});
