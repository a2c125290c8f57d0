import { describe, expect, it } from 'vitest';
import { parseImageJDescription } from './imagej';

describe('parseImageJDescription', () => {
  // Source: ImageJ TIFF description keys (images, channels, slices, frames, unit, spacing) — from memory.
  it('reads hyperstack sizes and calibration', () => {
    const d = parseImageJDescription('ImageJ=1.54f\nimages=12\nchannels=2\nslices=3\nframes=2\nhyperstack=true\nunit=micron\nspacing=1.5\n');
    expect(d).toEqual({ images: 12, channels: 2, slices: 3, frames: 2, unitUm: 1, spacingUm: 1.5, frameIntervalS: null });
  });

  // Source: the description tifffile 2023.2.3 writes for imagej=True with metadata finterval=0.75, tunit='min'
  // (test/tiff/time-axis.test.ts reads such a file).
  it('reads the frame interval in its time unit', () => {
    const d = 'ImageJ=1.11a\nimages=6\nchannels=2\nframes=3\nhyperstack=true\nmode=grayscale\nloop=false\nfinterval=0.75\ntunit=min';
    expect(parseImageJDescription(d)?.frameIntervalS).toBeCloseTo(45, 12);
    expect(parseImageJDescription('ImageJ=1.5\nfinterval=2')?.frameIntervalS).toBe(2);
    expect(parseImageJDescription('ImageJ=1.5\nfinterval=2\ntunit=parsec')?.frameIntervalS).toBeNull();
  });

  it('accepts the escaped micro sign and ignores unknown units', () => {
    expect(parseImageJDescription('ImageJ=1.5\nunit=\\u00B5m')?.unitUm).toBe(1);
    expect(parseImageJDescription('ImageJ=1.5\nunit=inch\nspacing=2')).toMatchObject({ unitUm: null, spacingUm: null });
  });

  it('returns null for other text', () => {
    expect(parseImageJDescription('<OME/>')).toBeNull();
  });
});
