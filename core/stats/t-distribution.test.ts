import { describe, expect, it } from 'vitest';
import { tConfidenceInterval, tQuantile } from './t-distribution';

describe('tQuantile', () => {
  it('matches printed t-table values', () => {
    // Source: from memory — standard two-sided t table values (10 significant digits).
    expect(tQuantile(0.975, 1)).toBeCloseTo(12.70620474, 7);
    expect(tQuantile(0.975, 2)).toBeCloseTo(4.30265273, 7);
    expect(tQuantile(0.975, 4)).toBeCloseTo(2.776445105, 8);
    expect(tQuantile(0.975, 10)).toBeCloseTo(2.228138852, 8);
    expect(tQuantile(0.975, 30)).toBeCloseTo(2.042272456, 8);
    expect(tQuantile(0.95, 5)).toBeCloseTo(2.015048373, 8);
    expect(tQuantile(0.995, 10)).toBeCloseTo(3.169272673, 8);
    expect(tQuantile(0.025, 10)).toBeCloseTo(-2.228138852, 8);
    // Source: from memory — the normal limit Φ⁻¹(0.975) = 1.959963985.
    expect(tQuantile(0.975, 1e9)).toBeCloseTo(1.959963985, 6);
  });
  it('rejects bad arguments with exact messages', () => {
    expect(() => tQuantile(1, 5)).toThrow('tQuantile: p must be between 0 and 1 (exclusive), got 1');
    expect(() => tQuantile(0.5, 0)).toThrow('tQuantile: degrees of freedom must be positive, got 0');
  });
});

describe('tConfidenceInterval', () => {
  it('matches a hand-computed interval', () => {
    // Source: hand computation — mean 3, sd √2.5, sem √0.5, t(0.975, 4) = 2.776445105 (from memory).
    const ci = tConfidenceInterval([1, 2, 3, 4, 5]);
    const halfWidth = 2.776445105 * Math.sqrt(0.5);
    expect(ci.mean).toBe(3);
    expect(ci.sem).toBeCloseTo(Math.sqrt(0.5), 14);
    expect(ci.halfWidth).toBeCloseTo(halfWidth, 8);
    expect(ci.low).toBeCloseTo(3 - halfWidth, 8);
    expect(ci.high).toBeCloseTo(3 + halfWidth, 8);
    expect(ci).toMatchObject({ n: 5, dof: 4, level: 0.95 });
  });
  it('gives NaN bounds for a single value', () => {
    const ci = tConfidenceInterval([2]);
    expect(ci.mean).toBe(2);
    expect(ci.low).toBeNaN();
    expect(ci.dof).toBe(0);
  });
  it('rejects bad level and empty input', () => {
    expect(() => tConfidenceInterval([1, 2], 1)).toThrow('tConfidenceInterval: level must be between 0 and 1 (exclusive), got 1');
    expect(() => tConfidenceInterval([])).toThrow('tConfidenceInterval: no values');
  });
});
