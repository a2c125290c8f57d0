// Strip or tile byte ranges of an IFD must lie inside the file (TIFF 6.0 §8 StripOffsets/StripByteCounts, §15 tiles).
import type { ByteSource } from './byte-source';
import { TiffError } from './errors';
import type { TiffHeader } from './header';
import type { Ifd } from './ifd';
import { readNumbers } from './tag-value';
import { Tag } from './tags';

/** Throws TiffError('truncated') when any strip or tile of the IFD runs past the end of the file. */
export async function checkChunkExtents(source: ByteSource, header: TiffHeader, ifd: Ifd, fileLabel: string, what: string): Promise<void> {
  const tiled = ifd.entries.has(Tag.TileOffsets);
  const offsets = await readNumbers(source, header, ifd, tiled ? Tag.TileOffsets : Tag.StripOffsets, fileLabel);
  const counts = await readNumbers(source, header, ifd, tiled ? Tag.TileByteCounts : Tag.StripByteCounts, fileLabel);
  if (!offsets || !counts || counts.length < offsets.length) {
    throw new TiffError('unsupported', fileLabel, `${what}: IFD ${ifd.index} lacks ${tiled ? 'tile' : 'strip'} offsets or byte counts`);
  }
  for (let i = 0; i < offsets.length; i++) {
    if (offsets[i] >= source.size) {
      throw new TiffError('bad-offset', fileLabel,
        `${what}: ${tiled ? 'tile' : 'strip'} ${i} of IFD ${ifd.index} starts at ${offsets[i]}, past the end of the file (${source.size} bytes)`);
    }
    if (offsets[i] + counts[i] > source.size) {
      throw new TiffError('truncated', fileLabel,
        `${what}: ${tiled ? 'tile' : 'strip'} ${i} of IFD ${ifd.index} runs past the end of the file (${offsets[i] + counts[i]} > ${source.size} bytes)`);
    }
  }
}
