import { describe, expect, it } from 'vitest';
import { parseImageJDescription } from './imagej';

describe('parseImageJDescription', () => {
  // Source: ImageJ TIFF description keys (images, channels, slices, frames, unit, spacing) — from memory.
  it('reads hyperstack sizes and calibration', () => {
    const d = parseImageJDescription('ImageJ=1.54f\nimages=12\nchannels=2\nslices=3\nframes=2\nhyperstack=true\nunit=micron\nspacing=1.5\n');
    expect(d).toEqual({ images: 12, channels: 2, slices: 3, frames: 2, unitUm: 1, spacingUm: 1.5 });
  });

  it('accepts the escaped micro sign and ignores unknown units', () => {
    expect(parseImageJDescription('ImageJ=1.5\nunit=\\u00B5m')?.unitUm).toBe(1);
    expect(parseImageJDescription('ImageJ=1.5\nunit=inch\nspacing=2')).toMatchObject({ unitUm: null, spacingUm: null });
  });

  it('returns null for other text', () => {
    expect(parseImageJDescription('<OME/>')).toBeNull();
  });
});
