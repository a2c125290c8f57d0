import { describe, expect, it } from 'vitest';
import { lowerPaneLayout, MIN_IMAGE_PX, MIN_PROFILE_PANE_PX, profilePaneHeightPx, SPLITTER_PX } from './splitLayout';

// Demo data: window heights of the sizes the layout must serve (1280×720 leaves about 620 px for the view).
describe('embryo view split', () => {
  it('gives the lower pane its share and leaves the image the rest', () => {
    expect(profilePaneHeightPx(620, 0.5)).toBe(Math.round((620 - SPLITTER_PX) * 0.5));
  });
  it('keeps both panes at their minimum', () => {
    expect(profilePaneHeightPx(620, 0.15)).toBe(MIN_PROFILE_PANE_PX);
    expect(620 - SPLITTER_PX - profilePaneHeightPx(620, 0.85)).toBeGreaterThanOrEqual(MIN_IMAGE_PX);
    // Too small for both: the image keeps its minimum.
    expect(profilePaneHeightPx(300, 0.5)).toBe(300 - SPLITTER_PX - MIN_IMAGE_PX);
  });
  it('splits the lower pane into strip and plot', () => {
    expect(lowerPaneLayout(300)).toEqual({ stripPx: 90, plotPx: 210 });
    expect(lowerPaneLayout(100).stripPx).toBe(60);
    expect(lowerPaneLayout(1000)).toEqual({ stripPx: 130, plotPx: 870 });
  });
});
