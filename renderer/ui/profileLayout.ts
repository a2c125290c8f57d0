// Layout of the window's profile plot for a given height: legend rows, the main panel and the residual panel.

/** One legend entry: label, colour and swatch. */
export interface LegendEntry {
  readonly label: string;
  readonly colour: string;
  readonly shape: 'line' | 'dash' | 'band';
}

/** Legend entries placed in rows between `leftPx` and `rightPx` (swatch 16 px, gap, ~5.6 px per character). */
export function legendRows(entries: readonly LegendEntry[], leftPx: number, rightPx: number, rowPx = 14):
  { items: { entry: LegendEntry; x: number; y: number }[]; heightPx: number } {
  const items: { entry: LegendEntry; x: number; y: number }[] = [];
  let xPx = leftPx, row = 0;
  for (const entry of entries) {
    const w = 20 + entry.label.length * 5.6 + 14;
    if (xPx > leftPx && xPx + w > rightPx) { row += 1; xPx = leftPx; }
    items.push({ entry, x: xPx, y: 9 + row * rowPx });
    xPx += w;
  }
  return { items, heightPx: entries.length === 0 ? 0 : (row + 1) * rowPx + 4 };
}

/** A panel's top and height, CSS px. */
export interface Panel { readonly top: number; readonly height: number }

/** Main and residual panels for a plot `heightPx` high under a legend `legendPx` high; 34 px below for the x axis. */
export function profilePanels(heightPx: number, legendPx: number): { main: Panel; res: Panel } {
  const bottomPx = 34, gapPx = 10;
  const resH = Math.round(Math.min(70, Math.max(24, heightPx * 0.18)));
  const top = legendPx + 6;
  const mainH = Math.max(20, heightPx - top - bottomPx - gapPx - resH);
  return { main: { top, height: mainH }, res: { top: top + mainH + gapPx, height: resH } };
}
