// The pixel layout of one IFD (TIFF 6.0 §8 baseline fields, §14 Predictor, §15 tiles, §19 SampleFormat).
import type { ByteSource } from './byte-source';
import { TiffError } from './errors';
import type { TiffHeader } from './header';
import type { Ifd } from './ifd';
import { readNumber, readNumbers, readTag } from './tag-value';
import { Tag } from './tags';

/** What one IFD says about its pixels; defaults follow the spec when a tag is missing. */
export interface ImageLayout {
  readonly widthPx: number;
  readonly heightPx: number;
  readonly bitsPerSample: readonly number[];
  readonly samplesPerPixel: number;
  /** 1 unsigned int, 2 signed int, 3 IEEE float (TIFF 6.0 §19); default 1. */
  readonly sampleFormat: number;
  readonly compression: number;
  readonly predictor: number;
  /** 1 chunky, 2 planar (one plane per sample). */
  readonly planarConfiguration: number;
  readonly photometric: number | null;
  readonly newSubfileType: number;
  readonly tiled: boolean;
  /** Pixels per resolution unit; null when absent. */
  readonly xResolution: number | null;
  readonly yResolution: number | null;
  /** 1 none, 2 inch (default), 3 cm. */
  readonly resolutionUnit: number;
  /** Number of strip or tile offsets the IFD declares. */
  readonly chunkCount: number;
}

/** Reads the layout tags of one IFD; throws TiffError when width or length is missing or zero. */
export async function readImageLayout(source: ByteSource, header: TiffHeader, ifd: Ifd, fileLabel: string): Promise<ImageLayout> {
  const num = (tag: number, fallback: number) => readNumber(source, header, ifd, tag, fileLabel, fallback);
  const widthPx = await num(Tag.ImageWidth, 0);
  const heightPx = await num(Tag.ImageLength, 0);
  if (widthPx <= 0 || heightPx <= 0) {
    throw new TiffError('unsupported', fileLabel, `IFD ${ifd.index} has no image size (width ${widthPx}, length ${heightPx})`);
  }
  const samplesPerPixel = await num(Tag.SamplesPerPixel, 1);
  const bits = (await readNumbers(source, header, ifd, Tag.BitsPerSample, fileLabel)) ?? [1];
  const formats = (await readNumbers(source, header, ifd, Tag.SampleFormat, fileLabel)) ?? [1];
  const tiled = ifd.entries.has(Tag.TileOffsets);
  const offsetsEntry = ifd.entries.get(tiled ? Tag.TileOffsets : Tag.StripOffsets);
  return {
    widthPx, heightPx, samplesPerPixel, tiled,
    bitsPerSample: bits,
    sampleFormat: formats[0],
    compression: await num(Tag.Compression, 1),
    predictor: await num(Tag.Predictor, 1),
    planarConfiguration: await num(Tag.PlanarConfiguration, 1),
    photometric: ifd.entries.has(Tag.PhotometricInterpretation) ? await num(Tag.PhotometricInterpretation, 1) : null,
    newSubfileType: await num(Tag.NewSubfileType, 0),
    xResolution: await readResolution(source, header, ifd, Tag.XResolution, fileLabel),
    yResolution: await readResolution(source, header, ifd, Tag.YResolution, fileLabel),
    resolutionUnit: await num(Tag.ResolutionUnit, 2),
    chunkCount: offsetsEntry ? offsetsEntry.count : 0,
  };
}

/** A resolution RATIONAL as float64 (numerators above 2³¹ are read unsigned); null when absent or invalid. */
async function readResolution(source: ByteSource, header: TiffHeader, ifd: Ifd, tag: number, fileLabel: string): Promise<number | null> {
  const value = await readTag(source, header, ifd, tag, fileLabel);
  if (!value || (value.kind !== 'rationals' && value.kind !== 'numbers')) return null;
  const v = value.values[0];
  return Number.isFinite(v) && v > 0 ? v : null;
}
