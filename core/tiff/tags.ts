// TIFF tag numbers and field types used by the reader (TIFF 6.0 §2, §8, §15, §19; BigTIFF design).

/** Tag numbers the reader understands. */
export const Tag = {
  NewSubfileType: 254,
  ImageWidth: 256,
  ImageLength: 257,
  BitsPerSample: 258,
  Compression: 259,
  PhotometricInterpretation: 262,
  ImageDescription: 270,
  StripOffsets: 273,
  SamplesPerPixel: 277,
  RowsPerStrip: 278,
  StripByteCounts: 279,
  XResolution: 282,
  YResolution: 283,
  PlanarConfiguration: 284,
  ResolutionUnit: 296,
  Predictor: 317,
  TileWidth: 322,
  TileLength: 323,
  TileOffsets: 324,
  TileByteCounts: 325,
  SubIFDs: 330,
  SampleFormat: 339,
} as const;

/** Size in bytes of one value of each TIFF field type (0 = unknown type). */
export function fieldTypeSize(type: number): number {
  switch (type) {
    case 1: case 2: case 6: case 7: return 1; // BYTE ASCII SBYTE UNDEFINED
    case 3: case 8: return 2; // SHORT SSHORT
    case 4: case 9: case 11: case 13: return 4; // LONG SLONG FLOAT IFD
    case 5: case 10: case 12: case 16: case 17: case 18: return 8; // RATIONAL SRATIONAL DOUBLE LONG8 SLONG8 IFD8
    default: return 0;
  }
}
