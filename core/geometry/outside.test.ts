import { describe, expect, it } from 'vitest';
import { distanceOutsideMaskPx } from './outside';

// Demo data: a 10×6 mask with a 3×2 block at columns 4–6, rows 2–3; distances worked by hand (Euclidean).
const width = 10, height = 6;
const data = new Uint8Array(width * height);
for (let y = 2; y <= 3; y += 1) for (let x = 4; x <= 6; x += 1) data[y * width + x] = 1;
const mask = { width, height, data };

describe('distanceOutsideMaskPx', () => {
  it('is 0 for a point whose nearest pixel is in the mask', () => {
    expect(distanceOutsideMaskPx(mask, { x: 5, y: 2 }, 10)).toBe(0);
    expect(distanceOutsideMaskPx(mask, { x: 6.4, y: 3.4 }, 10)).toBe(0);
  });
  it('is the distance to the nearest mask pixel centre outside it', () => {
    expect(distanceOutsideMaskPx(mask, { x: 1, y: 2 }, 10)).toBe(3); // to (4, 2)
    expect(distanceOutsideMaskPx(mask, { x: 9, y: 5 }, 10)).toBeCloseTo(Math.hypot(3, 2), 12); // to (6, 3)
    expect(distanceOutsideMaskPx(mask, { x: 5, y: 0.5 }, 10)).toBe(1.5); // to (5, 2)
  });
  it('finds points beyond the image edge, and gives Infinity past the search limit', () => {
    expect(distanceOutsideMaskPx(mask, { x: -4, y: 2 }, 10)).toBe(8);
    expect(distanceOutsideMaskPx(mask, { x: -4, y: 2 }, 7.9)).toBe(Infinity);
  });
});
