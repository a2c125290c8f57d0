// The x/EL scale shared by the straightened view and the profile plot, so their features line up exactly.

/** Left and right plot margins, CSS px (room for the y axis labels on the left). */
export const PLOT_MARGIN = { left: 60, right: 20 } as const;

/** Screen x (CSS px) of a position in x/EL for a panel `widthPx` wide. */
export function elToPx(xEl: number, widthPx: number): number {
  return PLOT_MARGIN.left + xEl * Math.max(1, widthPx - PLOT_MARGIN.left - PLOT_MARGIN.right);
}

/** Position in x/EL of screen x (CSS px) for a panel `widthPx` wide (not clamped). */
export function pxToEl(xPx: number, widthPx: number): number {
  return (xPx - PLOT_MARGIN.left) / Math.max(1, widthPx - PLOT_MARGIN.left - PLOT_MARGIN.right);
}
