import { describe, expect, it } from 'vitest';
import { memoryByteSource } from './byte-source';
import { chunkPlanReader, readChunkPlan } from './direct-source';
import { encodeTiff, type EncodeImage } from './encode';
import { readTiffHeader } from './header';
import { readIfdChain } from './ifd';
import { tinyTiff } from './tiny-tiff';

/** Demo data: a ramp of n values in the given array type. */
function ramp<T extends Uint8Array | Uint16Array>(Ctor: new (n: number) => T, n: number): T {
  const a = new Ctor(n);
  for (let i = 0; i < n; i++) a[i] = (i * 7) % 200;
  return a;
}

describe('chunkPlanReader', () => {
  // Source: TIFF 6.0 §8 (StripOffsets, StripByteCounts, RowsPerStrip per IFD) and §3 (ImageWidth, ImageLength,
  // BitsPerSample, Compression in every IFD): every IFD carries its own layout, so a kept plan may be reused only
  // for an IFD whose layout tags are the same.
  it('gives the same plan as readChunkPlan for every IFD of a file whose IFDs change shape', async () => {
    const image = (w: number, h: number, data: Uint8Array | Uint16Array, compression: 1 | 8): EncodeImage =>
      ({ widthPx: w, heightPx: h, samplesPerPixel: 1, data, compression });
    // Demo data: runs of equal shapes, then a change of size, of compression, of sample type and back.
    const bytes = encodeTiff([
      image(8, 4, ramp(Uint16Array, 32), 1), image(8, 4, ramp(Uint16Array, 32), 1), image(6, 3, ramp(Uint16Array, 18), 8),
      image(6, 3, ramp(Uint16Array, 18), 8), image(6, 3, ramp(Uint8Array, 18), 8), image(8, 4, ramp(Uint16Array, 32), 1),
      image(300, 300, ramp(Uint8Array, 90_000), 1),
    ]);
    const source = memoryByteSource(bytes);
    const header = await readTiffHeader(source, 'shapes.tif');
    const ifds = await readIfdChain(source, header, 'shapes.tif');
    const read = chunkPlanReader(source, header, 'shapes.tif');
    for (const ifd of ifds) expect(await read(ifd)).toEqual(await readChunkPlan(source, header, ifd, 'shapes.tif'));
    // The 300×300 8-bit plane is written as several strips; the others as one.
    expect((await read(ifds[6])).offsets.length).toBeGreaterThan(1);
  });

  it('checks the offsets of a reused shape as readChunkPlan does (same message)', async () => {
    // Demo data: two IFDs with the same layout; the second declares no StripByteCounts.
    const layout = [{ tag: 256, type: 3, values: [4] }, { tag: 257, type: 3, values: [2] }, { tag: 258, type: 3, values: [8] }, { tag: 273, type: 4, values: [8] }];
    const one = tinyTiff([...layout, { tag: 279, type: 4, values: [8] }]);
    const source = memoryByteSource(one);
    const header = await readTiffHeader(source, 'm.tif');
    const [ifd] = await readIfdChain(source, header, 'm.tif');
    const read = chunkPlanReader(source, header, 'm.tif');
    await read(ifd);
    const lacking = { ...ifd, index: 1, entries: new Map([...ifd.entries].filter(([tag]) => tag !== 279)) };
    await expect(read(lacking)).rejects.toMatchObject({ message: 'm.tif: IFD 1 lacks strip offsets or byte counts' });
    await expect(readChunkPlan(source, header, lacking, 'm.tif')).rejects.toMatchObject({ message: 'm.tif: IFD 1 lacks strip offsets or byte counts' });
  });
});
