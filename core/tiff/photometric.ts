// Which PhotometricInterpretation values hold measurable intensities (TIFF 6.0 §3–§6, §16, §21).

const COLOUR_MODELS: Record<number, string> = {
  2: 'RGB colour', 3: 'palette colour', 4: 'transparency mask', 5: 'CMYK colour', 6: 'YCbCr colour', 8: 'CIE L*a*b* colour',
};

/**
 * Null for grey-level data (0 WhiteIsZero, 1 BlackIsZero, or absent); otherwise the name of the colour model.
 * Colour images carry display values, not measured intensities, so they are refused for analysis.
 */
export function colourModelOf(photometric: number | null): string | null {
  if (photometric === null || photometric === 0 || photometric === 1) return null;
  return COLOUR_MODELS[photometric] ?? `PhotometricInterpretation ${photometric}`;
}
