import { describe, expect, it } from 'vitest';
import { arrowStep, boundaryColour, BOUNDARY_COLOURS, labelPlacement, staggerLabels } from './ImageOverlay';

// Demo label positions, worked by hand (6.2 px per character, 14 px lines).
describe('staggerLabels', () => {
  it('leaves separate labels alone and pushes an overlapping one a line down', () => {
    expect(staggerLabels([{ x: 0, y: 0, text: 'abcdef' }, { x: 100, y: 0, text: 'x' }, { x: 10, y: 5, text: 'abc' }])).toEqual([0, 0, 14]);
  });
  it('stacks three labels on one spot', () => {
    expect(staggerLabels([0, 1, 2].map(() => ({ x: 0, y: 0, text: 'L' })))).toEqual([0, 14, 28]);
  });
});

describe('boundaryColour', () => {
  it('colours by channel so both methods of one channel match', () => {
    expect(boundaryColour('b', ['a', 'b'])).toBe(BOUNDARY_COLOURS[1]);
    expect(boundaryColour('zz', ['a'])).toBe(BOUNDARY_COLOURS[0]);
  });
});

describe('labelPlacement', () => {
  // Demo positions, worked by hand (6.2 px per character, 10 px from the point, 8 px above it).
  it('puts a label right of its point, or left of it when it would leave the image', () => {
    expect(labelPlacement(100, 50, 'abcde', 400)).toEqual({ x: 110, y: 42 });
    // 'abcde' is 31 px: at x = 370 it would end at 411 > 398, so it goes to 370 − 10 − 31 = 329.
    expect(labelPlacement(370, 50, 'abcde', 400)).toEqual({ x: 329, y: 42 });
  });
  it('never puts a label above the top edge', () => {
    expect(labelPlacement(100, 3, 'a', 400).y).toBe(12);
  });
});

describe('arrowStep', () => {
  it('maps arrow keys to screen steps, Shift for ten', () => {
    expect(arrowStep('ArrowLeft', false)).toEqual([-1, 0]);
    expect(arrowStep('ArrowDown', true)).toEqual([0, 10]);
    expect(arrowStep('a', false)).toBeNull();
  });
});
