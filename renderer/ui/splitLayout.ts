// Sizes of the embryo view's vertical split: image above, straightened strip and profile plot below.

/** Smallest image pane and smallest profile pane, CSS px. */
export const MIN_IMAGE_PX = 160;
export const MIN_PROFILE_PANE_PX = 190;
/** Height of the splitter bar between the panes, CSS px. */
export const SPLITTER_PX = 6;

/** Height of the lower pane for a view `totalPx` high when the lower pane should take `fraction` of it; clamped so
 *  both panes keep their minimum (the image wins when there is not room for both). */
export function profilePaneHeightPx(totalPx: number, fraction: number): number {
  const room = totalPx - SPLITTER_PX;
  const wanted = Math.round(room * Math.min(0.85, Math.max(0.15, fraction)));
  const upper = room - MIN_IMAGE_PX;
  return Math.max(0, Math.min(Math.max(MIN_PROFILE_PANE_PX, wanted), upper));
}

/** Strip and plot heights inside the lower pane: the strip takes about 30% (60–130 px), the plot the rest. */
export function lowerPaneLayout(paneHeightPx: number): { stripPx: number; plotPx: number } {
  const stripPx = Math.round(Math.min(130, Math.max(60, paneHeightPx * 0.3)));
  return { stripPx, plotPx: Math.max(0, paneHeightPx - stripPx) };
}
