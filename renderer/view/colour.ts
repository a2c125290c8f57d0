// Channel colours.

/** Default channel colours (CSS hex), chosen to stay distinct when merged. */
export const CHANNEL_COLOURS: readonly string[] = ['#40e070', '#e040c0', '#40a0ff', '#ffb030'];

/** '#rrggbb' → [r, g, b] in 0..255; anything else gives white. */
export function parseHexColour(hex: string): [number, number, number] {
  const m = /^#([0-9a-f]{2})([0-9a-f]{2})([0-9a-f]{2})$/i.exec(hex);
  if (m === null) return [255, 255, 255];
  return [parseInt(m[1], 16), parseInt(m[2], 16), parseInt(m[3], 16)];
}
