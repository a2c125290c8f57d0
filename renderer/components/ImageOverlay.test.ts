import { describe, expect, it } from 'vitest';
import { boundaryColour, BOUNDARY_COLOURS, staggerLabels } from './ImageOverlay';

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
