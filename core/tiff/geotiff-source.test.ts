import { describe, expect, it } from 'vitest';
import type { PixelArray } from '../model';
import { memoryByteSource } from './byte-source';
import { createGeotiffPlaneSource } from './geotiff-source';
import { readStackInfo } from './stack-info';
import { tinyTiff } from './tiny-tiff';
import { writeOmeTiff, writePlainTiff } from './write';

// Demo data: 3×2 planes spanning each type's range.
const DATA: PixelArray[] = [
  new Uint8Array([0, 1, 127, 128, 254, 255]), new Int8Array([-128, -1, 0, 1, 126, 127]),
  new Uint16Array([0, 1, 256, 32768, 65534, 65535]), new Int16Array([-32768, -1, 0, 1, 256, 32767]),
  new Uint32Array([0, 1, 65536, 2 ** 31, 2 ** 32 - 2, 2 ** 32 - 1]), new Int32Array([-(2 ** 31), -1, 0, 1, 65536, 2 ** 31 - 1]),
  new Float32Array([-3.5, -0, 0, 1e-30, 6.25e10, 0.1]), new Float64Array([-3.5, 0, 1e-300, 1e300, Math.PI, -Math.E]),
];

describe('createGeotiffPlaneSource', () => {
  it('decodes every sample type exactly, with the matching typed array', async () => {
    for (const data of DATA) {
      const bytes = writePlainTiff([{ width: 3, height: 2, data }], { compression: 'deflate' });
      const info = await readStackInfo(memoryByteSource(bytes), 'g.tif');
      const plane = await createGeotiffPlaneSource(bytes, info, 'g.tif').readPlane(0, 0, 0);
      expect(plane.width).toBe(3);
      expect(plane.data.constructor).toBe(data.constructor);
      expect(plane.data).toEqual(data);
    }
  });

  it('reads (z, c, t) through the plane map and samples as channels', async () => {
    const planes = Array.from({ length: 4 }, (_, n) => ({ width: 2, height: 1, data: new Uint16Array([n, n + 100]) }));
    const bytes = writeOmeTiff(planes, { sizeZ: 2, sizeC: 2, sizeT: 1, dimensionOrder: 'XYCZT', channelNames: ['a', 'b'], physicalSizeXUm: 1 });
    const info = await readStackInfo(memoryByteSource(bytes), 'm.ome.tif');
    const source = createGeotiffPlaneSource(memoryByteSource(bytes), info, 'm.ome.tif');
    // Source: OME-TIFF specification: XYCZT file order is (c0z0, c1z0, c0z1, c1z1).
    expect(Array.from((await source.readPlane(1, 0, 0)).data)).toEqual([2, 102]);
    expect(Array.from((await source.readPlane(0, 1, 0)).data)).toEqual([1, 101]);
    await expect(source.readPlane(2, 0, 0)).rejects.toThrow('plane (z=2, c=0, t=0) is outside the stack (Z 2, C 2, T 1)');

    const rgb = writePlainTiff([{ width: 2, height: 1, data: new Uint8Array([1, 2, 3, 4, 5, 6]), samplesPerPixel: 3 }]);
    const rgbInfo = await readStackInfo(memoryByteSource(rgb), 's.tif');
    const rgbSource = createGeotiffPlaneSource(rgb, rgbInfo, 's.tif');
    expect(Array.from((await rgbSource.readPlane(0, 2, 0)).data)).toEqual([3, 6]);
  });

  // Source: TIFF 6.0 §8 (StripOffsets + StripByteCounts locate each strip's bytes).
  it('reports a file cut mid-strip and a strip offset past the end, naming file and plane', async () => {
    // Demo data: a 4×4 uint16 image, IFD first, then 32 bytes of pixels of which only 16 remain.
    const entries = (stripOffset: number) => [
      { tag: 256, type: 3, values: [4] }, { tag: 257, type: 3, values: [4] }, { tag: 258, type: 3, values: [16] },
      { tag: 259, type: 3, values: [1] }, { tag: 262, type: 3, values: [1] }, { tag: 273, type: 4, values: [stripOffset] },
      { tag: 277, type: 3, values: [1] }, { tag: 278, type: 3, values: [4] }, { tag: 279, type: 4, values: [32] },
    ];
    const dataAt = 8 + 2 + 9 * 12 + 4;
    const cut = tinyTiff(entries(dataAt), { tail: new Uint8Array(16).fill(1) });
    const info = await readStackInfo(memoryByteSource(cut), 'cut.tif');
    await expect(createGeotiffPlaneSource(cut, info, 'cut.tif').readPlane(0, 0, 0)).rejects.toMatchObject({
      code: 'truncated', message: `cut.tif: plane z=0 c=0 t=0: strip 0 of IFD 0 runs past the end of the file (${dataAt + 32} > ${dataAt + 16} bytes)`,
    });
    const far = tinyTiff(entries(99999), { tail: new Uint8Array(32) });
    await expect(createGeotiffPlaneSource(far, info, 'far.tif').readPlane(0, 0, 0)).rejects.toMatchObject({
      code: 'bad-offset', message: `far.tif: plane z=0 c=0 t=0: strip 0 of IFD 0 starts at 99999, past the end of the file (${dataAt + 32} bytes)`,
    });
    const whole = tinyTiff(entries(dataAt), { tail: new Uint8Array(32).fill(1) });
    expect(Array.from((await createGeotiffPlaneSource(whole, info, 'ok.tif').readPlane(0, 0, 0)).data)).toEqual(new Array(16).fill(257));
  }, 1000);
});
