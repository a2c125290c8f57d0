import { describe, it, expect } from 'vitest';
import type { ProjectedStack } from '../../core/model';
import { placeholderDetection } from './placeholder-detection';

// Demo data: a blank 11 × 5 frame at 2 µm per pixel.
const projected = {
  channels: [{ width: 11, height: 5, data: new Float32Array(55) }], channelNames: ['c1'], pixelSizeUm: 2,
  pixelSizeSource: 'ome', projection: 'max', sliceIndex: null, warnings: [],
} as ProjectedStack;

describe('placeholderDetection', () => {
  it('covers the frame with a horizontal axis from 10% to 90% of the width (exact values)', () => {
    const d = placeholderDetection(projected, 'blank.tif', 'no region stands out from the background');
    expect(d.axis).toEqual({ anterior: { x: 1, y: 2 }, posterior: { x: 9, y: 2 }, source: 'auto' });
    expect(d.eggLengthUm).toBe(16);
    expect(d.eggWidthUm).toBe(10);
    expect(d.mask.data.every((v) => v === 1)).toBe(true);
    expect(d.outline).toEqual([{ x: -0.5, y: -0.5 }, { x: 10.5, y: -0.5 }, { x: 10.5, y: 4.5 }, { x: -0.5, y: 4.5 }]);
    expect(d.warnings).toEqual(['blank.tif: no embryo found automatically (no region stands out from the background); the axis shown is a placeholder, set it by hand']);
  });

  it('gives NaN lengths in µm when the pixel size is unknown, as detection does', () => {
    expect(placeholderDetection({ ...projected, pixelSizeUm: null }, 'a.tif', 'x').eggLengthUm).toBeNaN();
  });
});
