// Pixel size from XResolution/YResolution/ResolutionUnit (TIFF 6.0 §8).

/** µm per pixel from a resolution (pixels per unit) and ResolutionUnit (2 inch, 3 cm); null when unknown. */
export function micrometresPerPixel(resolution: number | null, unit: number): number | null {
  if (resolution === null || !(resolution > 0)) return null;
  if (unit === 3) return 10000 / resolution;
  // 72 per inch is a screen default that says nothing about the sample (our rule, not the spec's).
  if (unit === 2 && resolution !== 72) return 25400 / resolution;
  return null;
}
