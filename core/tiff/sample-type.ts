// SampleFormat × BitsPerSample → the sample types Eggline reads (TIFF 6.0 §19).
import type { SampleType } from '../model';
import { TiffError } from './errors';
import type { ImageLayout } from './layout';

/** Bytes per sample of each sample type. */
export function bytesPerSample(type: SampleType): number {
  switch (type) {
    case 'uint8': case 'int8': return 1;
    case 'uint16': case 'int16': return 2;
    case 'uint32': case 'int32': case 'float32': return 4;
    default: return 8;
  }
}

/** The sample type of an IFD, or a TiffError ('unsupported') naming what the file holds. */
export function sampleTypeOf(layout: ImageLayout, fileLabel: string): SampleType {
  const bits = layout.bitsPerSample[0];
  if (layout.bitsPerSample.some((b) => b !== bits)) {
    throw new TiffError('unsupported', fileLabel, `samples of different bit depths (${layout.bitsPerSample.join(', ')}) are not supported`);
  }
  const format = layout.sampleFormat;
  if (bits === 1) throw new TiffError('unsupported', fileLabel, '1-bit (bilevel) images are not supported');
  const name = format === 1 ? 'unsigned' : format === 2 ? 'signed' : format === 3 ? 'float' : null;
  if (name === null) {
    const what = format === 5 || format === 6 ? 'complex samples' : `SampleFormat ${format}`;
    throw new TiffError('unsupported', fileLabel, `${what} (${bits}-bit) not supported`);
  }
  const table: Record<string, SampleType> = {
    'unsigned 8': 'uint8', 'signed 8': 'int8', 'unsigned 16': 'uint16', 'signed 16': 'int16',
    'unsigned 32': 'uint32', 'signed 32': 'int32', 'float 32': 'float32', 'float 64': 'float64',
  };
  const type = table[`${name} ${bits}`];
  if (!type) throw new TiffError('unsupported', fileLabel, `${bits}-bit ${name} samples are not supported`);
  return type;
}
