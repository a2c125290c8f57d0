import { describe, expect, it } from 'vitest';
import { elToPx, pxToEl, PLOT_MARGIN } from './plotLayout';

// Source: worked by hand from the margins (60 left, 20 right).
describe('plot x scale', () => {
  it('maps 0 and 1 EL to the plot edges and round-trips', () => {
    expect(elToPx(0, 580)).toBe(PLOT_MARGIN.left);
    expect(elToPx(1, 580)).toBe(560);
    expect(pxToEl(elToPx(0.37, 580), 580)).toBeCloseTo(0.37, 12);
  });
});
