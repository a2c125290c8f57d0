import { describe, expect, it } from 'vitest';
import { fixed, fmt } from './format';

// Source: worked by hand.
describe('fmt / fixed', () => {
  it('formats significant digits, exponents for extremes, dashes for missing', () => {
    expect(fmt(91.2345)).toBe('91.2');
    expect(fmt(0.123456, 2)).toBe('0.12');
    expect(fmt(123456)).toBe('1.23e+5');
    expect(fmt(Number.NaN)).toBe('—');
    expect(fixed(0.4567, 3)).toBe('0.457');
    expect(fixed(null)).toBe('—');
  });
});
