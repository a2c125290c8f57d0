import { describe, expect, it } from 'vitest';
import { buttonWidthPx, groupWidthPx, inlineGroups } from './toolbarFit';

// Demo data: made-up groups; the expected sets follow from the width estimates by hand.
const groups = [
  { id: 'open', collapseRank: 1, labels: ['Open folder…'] }, // 18 + 6.8·12 = 99.6 → 100; + 4 + 9 = 113
  { id: 'tools', collapseRank: 3, labels: ['Pan', 'Axis'] }, // 39 + 46 + 8 + 9 = 102
  { id: 'view', collapseRank: 2, labels: ['Fit'] }, // 39 + 4 + 9 = 52
];

describe('toolbar overflow', () => {
  it('estimates button and group widths', () => {
    expect(buttonWidthPx('Fit')).toBe(39);
    expect(groupWidthPx(groups[0])).toBe(113);
  });
  it('keeps every group when they fit', () => {
    expect(inlineGroups(groups, 267)).toEqual(new Set(['open', 'tools', 'view']));
  });
  it('collapses the lowest rank first, then the next, until the rest fits', () => {
    expect(inlineGroups(groups, 266)).toEqual(new Set(['tools', 'view']));
    expect(inlineGroups(groups, 154)).toEqual(new Set(['tools', 'view']));
    expect(inlineGroups(groups, 153)).toEqual(new Set(['tools']));
    expect(inlineGroups(groups, 102)).toEqual(new Set(['tools']));
    expect(inlineGroups(groups, 101)).toEqual(new Set());
  });
});
