import { describe, expect, it } from 'vitest';
import { DEFAULT_SETTINGS } from '../../core/settings';
import { bandRows, bandSelection } from './bandSelect';

// Demo data: a 1-column straightened mask, rows 1..5 inside (7 rows, centre row 3), 1 µm per row.
const mask = { width: 1, height: 7, data: Float32Array.from([0, 1, 1, 1, 1, 1, 0]) };
const prof = DEFAULT_SETTINGS.profile;

describe('bandRows', () => {
  it('takes edgeDepthUm of rows inward from both edges', () => {
    expect(bandRows(mask, { ...prof, mode: 'edge', edgeSide: 'both', edgeDepthUm: 2 }, 1)).toEqual([{ top: [1, 2], bottom: [4, 5] }]);
  });
  it('takes only the dorsal (left = top) edge', () => {
    expect(bandRows(mask, { ...prof, mode: 'edge', edgeSide: 'dorsal', dorsalSide: 'left', edgeDepthUm: 1 }, 1)).toEqual([{ top: [1, 1], bottom: null }]);
  });
  it('takes the ventral edge at the top when dorsal is right', () => {
    expect(bandRows(mask, { ...prof, mode: 'edge', edgeSide: 'ventral', dorsalSide: 'right', edgeDepthUm: 1 }, 1)).toEqual([{ top: [1, 1], bottom: null }]);
  });
  it('takes a centred strip of axisWidthUm in axis mode', () => {
    expect(bandRows(mask, { ...prof, mode: 'axis', axisWidthUm: 2 }, 1)).toEqual([{ top: [2, 4], bottom: null }]);
  });
  it('selects nothing in a column outside the mask', () => {
    expect(bandRows({ width: 1, height: 3, data: new Float32Array(3) }, { ...prof, mode: 'edge' }, 1)).toEqual([{ top: null, bottom: null }]);
  });
});

describe('bandSelection', () => {
  it('marks the selected rows', () => {
    expect(Array.from(bandSelection(1, 7, [{ top: [1, 2], bottom: [5, 5] }]))).toEqual([0, 1, 1, 0, 0, 1, 0]);
  });
});
