import { describe, expect, it } from 'vitest';
import { micrometresPerPixel } from './resolution';

describe('micrometresPerPixel', () => {
  // Source: TIFF 6.0 §8 (XResolution = pixels per ResolutionUnit; 2 = inch, 3 = centimetre; 1 = no absolute unit).
  it('converts pixels per cm and per inch to µm', () => {
    expect(micrometresPerPixel(20000, 3)).toBe(0.5);
    expect(micrometresPerPixel(25400, 2)).toBe(1);
    expect(micrometresPerPixel(50800, 2)).toBe(0.5);
  });

  // Source: note tiff-ome.md — tifffile stored 0.325 µm as 4294967295/139586 px/cm.
  it('handles a numerator above 2³¹ (0.325 µm to 6 digits)', () => {
    const um = micrometresPerPixel(4294967295 / 139586, 3);
    expect(um).toBeCloseTo((139586 * 10000) / 4294967295, 14);
    expect(um).toBeCloseTo(0.325, 5);
  });

  // Source: our rule (common practice): unit 1 or 72 per inch says nothing about the sample.
  it('treats unit 1, 72 dpi and missing values as unknown', () => {
    expect(micrometresPerPixel(20000, 1)).toBeNull();
    expect(micrometresPerPixel(72, 2)).toBeNull();
    expect(micrometresPerPixel(null, 3)).toBeNull();
    expect(micrometresPerPixel(0, 3)).toBeNull();
  });
});
