import { describe, expect, it } from 'vitest';
import { memoryByteSource } from './byte-source';
import { describeStack } from './describe';
import { readStackInfo } from './stack-info';
import { writeOmeTiff, writePlainTiff } from './write';

describe('describeStack', () => {
  it('lists format, dimensions, channels, pixel size with source, type, compression and plane map', async () => {
    // Demo data: 2 channels × 2 z, XYCZT order.
    const planes = Array.from({ length: 4 }, () => ({ width: 3, height: 2, data: new Uint16Array(6) }));
    const bytes = writeOmeTiff(planes, { sizeZ: 2, sizeC: 2, sizeT: 1, dimensionOrder: 'XYCZT', channelNames: ['dye-a', 'dye-b'], physicalSizeXUm: 0.325, physicalSizeZUm: 1 });
    const lines = describeStack(await readStackInfo(memoryByteSource(bytes), 'd.ome.tif'));
    expect(lines).toEqual([
      'format: OME-TIFF, byte order II, 4 IFDs',
      'dimensions: X 3 × Y 2 × Z 2 × C 2 × T 1 (order XYCZT)',
      'channels: 1=dye-a, 2=dye-b (1-based, as in --gradient-channel)',
      'pixel size: 0.325 µm × 0.325 µm, z step 1 µm (source: ome)',
      'sample type: uint16',
      'compression: none',
      'plane map: t0 c0 z0..1 → IFD 0, 2',
      'plane map: t0 c1 z0..1 → IFD 1, 3',
    ]);
  });

  it('says when the pixel size is unknown and repeats warnings', async () => {
    const bytes = writePlainTiff([{ width: 2, height: 2, data: new Uint8Array(4) }]);
    const lines = describeStack(await readStackInfo(memoryByteSource(bytes), 'p.tif'));
    expect(lines).toContain('pixel size: unknown (source: unknown)');
    expect(lines).toContain('plane map: t0 c0 z0..0 → IFD 0');
    expect(lines[lines.length - 1]).toBe('warning: pixel size unknown (no usable resolution tags)');
  });
});
