import { describe, expect, it } from 'vitest';
import { ciDecimals, fixed, plainNumber, sigFig, valueWithCi } from './number-format';

// Source: hand-computed expected strings; "two significant digits of the uncertainty" is common practice.
describe('number formatting for people', () => {
  it('ciDecimals: two significant digits of the half-width, at least three of the value', () => {
    expect(ciDecimals(0.2, 0.0002)).toBe(5); // 0.00020
    expect(ciDecimals(0.2, 0.05)).toBe(3); // 3 significant digits of 0.2 win over 2 of 0.050
    expect(ciDecimals(466, 3.3)).toBe(1);
    expect(ciDecimals(1870, 8)).toBe(1);
    expect(ciDecimals(1870, 80)).toBe(0);
    expect(ciDecimals(0.2, 0)).toBe(3);
  });
  it('an interval whose ends round to the same 3 digits is shown with enough digits to differ', () => {
    const r = valueWithCi(0.19974961539523864, 0.19962715037811748, 0.1998720804123598);
    expect(r).toEqual({ value: '0.19975', ci: '[0.19963, 0.19987]', decimals: 5 });
    expect(valueWithCi(-0.1384, -0.1391, -0.1377, { signed: true, style: 'words' }).ci).toBe('-0.13910 to -0.13770');
    expect(valueWithCi(0.9970, 0.9921, 1.0019).ci).toBe('[0.9921, 1.0019]');
    expect(valueWithCi(0.5, 0.25, 0.75, { signed: true })).toEqual({ value: '+0.500', ci: '[+0.250, +0.750]', decimals: 3 });
  });
  it('missing or zero-width intervals fall back to 4 significant digits', () => {
    expect(valueWithCi(0.2, NaN, NaN)).toEqual({ value: '0.2000', ci: 'n/a', decimals: 4 });
    expect(valueWithCi(0.2, 0.2, 0.2).ci).toBe('[0.2000, 0.2000]');
    expect(valueWithCi(0.2, null, null).ci).toBe('n/a');
  });
  it('fixed, sigFig and plainNumber', () => {
    expect([fixed(-0.00001, 3), fixed(0.5, 2, true), fixed(NaN, 2), fixed(null, 1)]).toEqual(['0.000', '+0.50', 'n/a', 'n/a']);
    expect([sigFig(0.2), sigFig(1870), sigFig(0.000274, 2), sigFig(0), sigFig(-0.5, 3, true)]).toEqual(['0.200', '1870', '0.00027', '0', '-0.500']);
    expect([plainNumber(0.5), plainNumber(4), plainNumber(-0.693147), plainNumber(undefined)]).toEqual(['0.5', '4', '-0.6931', 'n/a']);
  });
});
