import { describe, expect, it } from 'vitest';
import { DIMENSION_ORDERS, planeCoordinates, planeNumber, planeSlot } from './dimension-order';

const counts = { sizeZ: 3, sizeC: 2, sizeT: 4 };

describe('planeNumber', () => {
  // Source: OME-TIFF specification (letters after XY run fastest to slowest; plane = i0 + S0·(i1 + S1·i2)).
  it('follows the formula for each of the six orders at (z=1, c=1, t=2)', () => {
    const expected: Record<string, number> = {
      XYZCT: 1 + 3 * (1 + 2 * 2), // 16
      XYZTC: 1 + 3 * (2 + 4 * 1), // 19
      XYCTZ: 1 + 2 * (2 + 4 * 1), // 13
      XYCZT: 1 + 2 * (1 + 3 * 2), // 15
      XYTCZ: 2 + 4 * (1 + 2 * 1), // 14
      XYTZC: 2 + 4 * (1 + 3 * 1), // 18
    };
    for (const order of DIMENSION_ORDERS) expect(planeNumber(order, counts, 1, 1, 2)).toBe(expected[order]);
    expect(planeNumber('XYZCT', counts, 1, 0, 0)).toBe(1);
    expect(planeNumber('XYCZT', counts, 1, 0, 0)).toBe(2);
    expect(planeNumber('XYTZC', counts, 0, 1, 0)).toBe(12);
  });

  // Source: note tiff-ome.md (checked): tifffile writes ZCYX as XYCZT and IFD 3 holds (z1, c1) for 3 z × 2 c.
  it('puts (z=1, c=1) of a 3z × 2c XYCZT stack at plane 3', () => {
    expect(planeNumber('XYCZT', { sizeZ: 3, sizeC: 2, sizeT: 1 }, 1, 1, 0)).toBe(3);
  });

  it('is inverted by planeCoordinates for every plane and order (a bijection)', () => {
    for (const order of DIMENSION_ORDERS) {
      const seen = new Set<number>();
      for (let n = 0; n < 24; n++) {
        const { z, c, t } = planeCoordinates(order, counts, n);
        expect(planeNumber(order, counts, z, c, t)).toBe(n);
        seen.add(planeSlot(counts, z, c, t));
      }
      expect(seen.size).toBe(24);
    }
  });

  // Source: core/model StackInfo.planeIfd doc ((t·sizeC + c)·sizeZ + z).
  it('planeSlot matches the StackInfo layout', () => {
    expect(planeSlot(counts, 2, 1, 3)).toBe((3 * 2 + 1) * 3 + 2);
  });
});
