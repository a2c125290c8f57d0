import { describe, expect, it } from 'vitest';
import { parseField } from './NumberField';

// Exact messages pinned (demo inputs).
describe('parseField', () => {
  const p = { label: 'depth µm', min: 0.5, max: 50 };
  it('accepts numbers in range', () => expect(parseField('12', p)).toBe(12));
  it('rejects with exact messages', () => {
    expect(parseField('', p)).toBe('depth µm: a number is needed');
    expect(parseField('x', p)).toBe('depth µm: "x" is not a number');
    expect(parseField('0.1', p)).toBe('depth µm: must be at least 0.5');
    expect(parseField('99', p)).toBe('depth µm: must be at most 50');
    expect(parseField('2.5', { ...p, integer: true })).toBe('depth µm: must be a whole number');
  });
  it('commits an empty nullable field as null', () => expect(parseField(' ', { ...p, nullable: true })).toBeNull());
});
