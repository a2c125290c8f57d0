import { describe, expect, it } from 'vitest';
import { micrometresPerSpaceUnit, secondsPerTimeUnit } from './units';

describe('NGFF units', () => {
  it('converts the space units NGFF lists (UDUNITS-2 names) to µm', () => {
    // Source: NGFF 0.4 specification §axes — space units are UDUNITS-2 names such as "micrometer", "nanometer".
    expect(micrometresPerSpaceUnit('micrometer')).toBe(1);
    expect(micrometresPerSpaceUnit('nanometer')).toBe(1e-3);
    expect(micrometresPerSpaceUnit('millimeter')).toBe(1e3);
    expect(micrometresPerSpaceUnit('angstrom')).toBe(1e-4);
    expect(micrometresPerSpaceUnit('meter')).toBe(1e6);
    expect(micrometresPerSpaceUnit('µm')).toBe(1); // common practice, not an NGFF name
    expect(micrometresPerSpaceUnit('parsec')).toBeNull();
    expect(micrometresPerSpaceUnit(null)).toBeNull();
  });

  it('converts the time units to seconds', () => {
    // Source: NGFF 0.4 specification §axes — time units such as "millisecond", "second", "minute", "hour".
    expect(secondsPerTimeUnit('millisecond')).toBe(1e-3);
    expect(secondsPerTimeUnit('second')).toBe(1);
    expect(secondsPerTimeUnit('minute')).toBe(60);
    expect(secondsPerTimeUnit('hour')).toBe(3600);
    expect(secondsPerTimeUnit('fortnight')).toBeNull();
  });
});
