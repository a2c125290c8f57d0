// Human-readable names for TIFF Compression and Predictor codes (TIFF 6.0 §3, §9, §13, §14; Adobe TIFF Technical Notes).

const COMPRESSION_NAMES: Record<number, string> = {
  1: 'none', 2: 'CCITT RLE', 3: 'CCITT Group 3', 4: 'CCITT Group 4', 5: 'LZW', 6: 'old-style JPEG', 7: 'JPEG',
  8: 'Deflate', 32946: 'Deflate', 32773: 'PackBits', 34712: 'JPEG 2000', 34887: 'LERC', 34925: 'LZMA',
  50000: 'Zstandard', 50001: 'WebP',
};

/** Compression codes some decoder of Eggline reads (the direct path, or sharp/geotiff for JPEG). */
const READABLE = new Set([1, 5, 7, 8, 32946, 32773, 34925, 50000]);

/** Null when Eggline can decode `compression`, else the reason: "compression 34712 (JPEG 2000) is not supported". */
export function unsupportedCompression(compression: number): string | null {
  if (READABLE.has(compression)) return null;
  const name = COMPRESSION_NAMES[compression];
  return `compression ${compression}${name ? ` (${name})` : ''} is not supported (Eggline reads none, LZW, PackBits, Deflate, LZMA, Zstandard and JPEG)`;
}

/** "LZW + horizontal predictor", "none", "Deflate + floating-point predictor", "compression 12345". */
export function describeCompression(compression: number, predictor: number): string {
  const name = COMPRESSION_NAMES[compression] ?? `compression ${compression}`;
  if (predictor === 2) return `${name} + horizontal predictor`;
  if (predictor === 3) return `${name} + floating-point predictor`;
  return name;
}

/** True for compressions that cannot hold grey-level microscope data (bilevel fax codes). */
export function isBilevelCompression(compression: number): boolean {
  return compression >= 2 && compression <= 4;
}
