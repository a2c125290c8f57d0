// Tag value counts checked when an IFD is read, before any value is loaded: a count the specification does not
// allow for its tag, or values that cannot fit in the file, mean a damaged entry, and reading them would allocate
// whatever the damage says.
import { TiffError } from './errors';
import type { Ifd } from './ifd';
import { fieldTypeSize } from './tags';

/** Largest count TIFF 6.0 allows for the tags whose count is fixed or bounded (tags not listed: bounded by the file). */
const MAX_COUNT: ReadonlyMap<number, { readonly name: string; readonly max: number }> = new Map([
  // Source: TIFF 6.0 §8 (baseline fields) and §14–§21, "N = 1" for each of these.
  ...([
    [254, 'NewSubfileType'], [255, 'SubfileType'], [256, 'ImageWidth'], [257, 'ImageLength'], [259, 'Compression'],
    [262, 'PhotometricInterpretation'], [263, 'Threshholding'], [264, 'CellWidth'], [265, 'CellLength'], [266, 'FillOrder'],
    [274, 'Orientation'], [277, 'SamplesPerPixel'], [278, 'RowsPerStrip'], [282, 'XResolution'], [283, 'YResolution'],
    [284, 'PlanarConfiguration'], [286, 'XPosition'], [287, 'YPosition'], [290, 'GrayResponseUnit'], [292, 'T4Options'],
    [293, 'T6Options'], [296, 'ResolutionUnit'], [317, 'Predictor'], [322, 'TileWidth'], [323, 'TileLength'],
  ] as const).map(([tag, name]) => [tag, { name, max: 1 }] as const),
  // Source: TIFF 6.0 §8, §19: "N = SamplesPerPixel", and SamplesPerPixel is a SHORT, so at most 65535.
  ...([
    [258, 'BitsPerSample'], [280, 'MinSampleValue'], [281, 'MaxSampleValue'], [338, 'ExtraSamples'],
    [339, 'SampleFormat'], [340, 'SMinSampleValue'], [341, 'SMaxSampleValue'],
  ] as const).map(([tag, name]) => [tag, { name, max: 65535 }] as const),
  // Source: TIFF 6.0 §8 (PageNumber N = 2), §17 (HalftoneHints N = 2), §21 (YCbCrSubSampling N = 2).
  [297, { name: 'PageNumber', max: 2 }], [321, { name: 'HalftoneHints', max: 2 }], [530, { name: 'YCbCrSubSampling', max: 2 }],
  // Source: TIFF 6.0 §8, ColorMap N = 3 × 2**BitsPerSample, and BitsPerSample of a palette image is at most 16.
  [320, { name: 'ColorMap', max: 3 * 65536 }],
]);

/** Name of a tag for messages: "Compression (259)", or "tag 50838" for one not listed. */
function tagLabel(tag: number): string {
  const known = MAX_COUNT.get(tag);
  return known ? `${known.name} (${tag})` : `tag ${tag}`;
}

/** Throws TiffError('bad-tag') for an entry whose count exceeds what the specification allows for its tag, or
 *  whose values would not fit in the file (`fileBytes`). Entries of unknown field types are never read and pass. */
export function checkTagCounts(ifd: Ifd, fileBytes: number, fileLabel: string): void {
  for (const entry of ifd.entries.values()) {
    const limit = MAX_COUNT.get(entry.tag);
    if (limit && entry.count > limit.max) {
      throw new TiffError('bad-tag', fileLabel,
        `IFD ${ifd.index}: ${tagLabel(entry.tag)} has ${entry.count} values, TIFF 6.0 allows ${limit.max === 1 ? 'one' : `at most ${limit.max}`} (damaged tag entry)`);
    }
    const bytes = entry.count * fieldTypeSize(entry.type);
    if (bytes > fileBytes) {
      throw new TiffError('bad-tag', fileLabel,
        `IFD ${ifd.index}: ${tagLabel(entry.tag)} has ${entry.count} values (${bytes} bytes), more than the whole file (${fileBytes} bytes; damaged tag entry)`);
    }
  }
}
