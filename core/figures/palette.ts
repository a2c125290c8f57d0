// Colour-blind-safe categorical colours (Okabe–Ito set, ordered for contrast on white; yellow is left out).

/** Series colours in the order they are assigned. */
export const SERIES_COLOURS: readonly string[] = ['#0072B2', '#D55E00', '#009E73', '#CC79A7', '#E69F00', '#56B4E9', '#000000'];

/** Colour of series i (cycles when there are more series than colours). */
export function seriesColour(i: number): string {
  return SERIES_COLOURS[((i % SERIES_COLOURS.length) + SERIES_COLOURS.length) % SERIES_COLOURS.length];
}

/** Neutral colours for axes, grid lines and annotations. */
export const INK = { axis: '#333333', grid: '#e3e3e3', muted: '#777777', shade: '#f0f0f0' } as const;
