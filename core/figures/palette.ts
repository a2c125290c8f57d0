// Colour-blind-safe categorical colours (Okabe–Ito set, ordered for contrast on white; yellow is left out).

/** Series colours in the order they are assigned. */
export const SERIES_COLOURS: readonly string[] = ['#0072B2', '#D55E00', '#009E73', '#CC79A7', '#E69F00', '#56B4E9', '#000000'];

/** Colour of series i (cycles when there are more series than colours). */
export function seriesColour(i: number): string {
  return SERIES_COLOURS[((i % SERIES_COLOURS.length) + SERIES_COLOURS.length) % SERIES_COLOURS.length];
}

/** Neutral colours for axes, grid lines and annotations. */
export const INK = { axis: '#333333', grid: '#e3e3e3', muted: '#777777', shade: '#f0f0f0' } as const;

/** Colours of the profile's roles, the same in the window, exported figures and the report (Okabe–Ito hues that
 *  read on the window's dark background and on white paper alike). */
export const PROFILE_COLOURS = { data: '#56B4E9', fit: '#E69F00' } as const;

/** Colours of the dorsal and the ventral side's own profiles and fits (--edge-side each), apart from the pooled
 *  profile's blue and orange; drawn thin and dashed so they do not read as boundary channels. */
export const SIDE_COLOURS = { dorsal: '#009E73', ventral: '#CC79A7' } as const;

/** Boundary colours by the channel's place among the boundary channels (kept apart from the fit's orange). */
export const BOUNDARY_COLOURS: readonly string[] = ['#CC79A7', '#009E73', '#D55E00'];

/** Colour of a boundary: by its channel's place in `channels` (the boundary channels in order); the first colour
 *  for a channel not in the list. */
export function boundaryColour(channel: string, channels: readonly string[]): string {
  return BOUNDARY_COLOURS[Math.max(0, channels.indexOf(channel)) % BOUNDARY_COLOURS.length];
}

/** The shown time point of a movie (the window's slider) on λ over time and the kymograph: vermillion, apart from
 *  the data's blue, the fit's orange and the kymograph's blue-to-black ramp. */
export const TIME_MARKER_COLOUR = '#D55E00';
